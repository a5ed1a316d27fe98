/**
 * Saving a backup or an export as a file the crew can find and copy off the phone. The only module that imports
 * @capacitor/filesystem.
 *
 * On a phone (native): Filesystem.writeFile to Directory.Documents (iOS: the app's Documents folder, visible in
 * Files; Android: the public Documents folder — on Android 10 and older this needs the storage permission, asked
 * once unless `askPermission` is false). In a browser: an `<a download>` link is clicked, which hands the file to
 * the browser's download handling; it must run from a tap, so the web is never saved to without the crew.
 * Outcomes come back as a Result; nothing throws.
 */
import { Capacitor } from '@capacitor/core';
import { Directory, Encoding, Filesystem } from '@capacitor/filesystem';
import { err, ok, type Result } from '../core/result.ts';

export interface SavedFile {
  /** Where the file went, in words for the crew ("Documents/glintmark-backup-….json", "your browser's downloads"). */
  where: string;
}

export interface SaveFileError {
  message: string;
}

export type SaveFileResult = Result<SavedFile, SaveFileError>;

export interface SaveOptions {
  /** Ask for the storage permission on native when it is not granted (default true). False for silent saves. */
  askPermission?: boolean;
}

/** The platform pieces this module uses; tests pass stubs. */
export interface FileSaverDeps {
  native: boolean;
  /** `encoding` absent: `data` is base64 of the bytes (Capacitor Filesystem). */
  writeFile(o: { path: string; data: string; directory: Directory; encoding?: Encoding; recursive: boolean }): Promise<{ uri: string }>;
  checkPermissions(): Promise<{ publicStorage: string }>;
  requestPermissions(): Promise<{ publicStorage: string }>;
  /** Web: offer the blob as a download named `name`. */
  download(name: string, blob: Blob): void;
  /** Native: add base64 bytes to the end of a file written by writeFile (archives are written in pieces). */
  appendFile?(o: { path: string; data: string; directory: Directory }): Promise<void>;
  /**
   * Web: the File System Access save dialog, when the browser has one (`showSaveFilePicker`). Resolves with a
   * writer whose `write` resolves once the file is written and closed, or null when the crew cancelled.
   */
  pickSaveFile?: ((name: string) => Promise<{ write: (blob: Blob) => Promise<void> } | null>) | null;
}

/** Where a backup archive went, and whether the write is known to have finished. */
export interface SavedArchive extends SavedFile {
  /**
   * True when the file is known to be written (native write resolved, or the save dialog's write resolved).
   * False for a plain browser download, whose end the page cannot see: ask the crew before counting it as saved.
   */
  written: boolean;
}

export type SaveArchiveResult = Result<SavedArchive, SaveFileError>;

/** Bytes per native write: a multiple of 3, so each piece's base64 stands alone (≈4 MB of text per call). */
const NATIVE_CHUNK = 3 * 1024 * 1024;

function bytesToBase64(bytes: Uint8Array): string {
  let bin = '';
  for (let i = 0; i < bytes.length; i += 0x8000) bin += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(bin);
}

const errorText = (e: unknown) => (e instanceof Error ? e.message : String(e));

/** A file name without folders or characters that file systems refuse. */
const SAFE_NAME = /^[A-Za-z0-9][A-Za-z0-9._-]{0,120}$/;

export function createFileSaver(deps: FileSaverDeps) {
  async function saveTextFile(name: string, text: string, mime: string, opts: SaveOptions = {}): Promise<SaveFileResult> {
    if (!SAFE_NAME.test(name)) return err({ message: `The file name ${JSON.stringify(name)} is not allowed (letters, digits, dot, dash and underscore only).` });
    if (!deps.native) {
      try {
        deps.download(name, new Blob([text], { type: mime }));
        return ok({ where: `your browser's downloads (${name})` });
      } catch (e) {
        return err({ message: `The browser did not save the file: ${errorText(e)}` });
      }
    }
    try {
      const perm = await deps.checkPermissions();
      if (perm.publicStorage !== 'granted' && opts.askPermission !== false) await deps.requestPermissions();
    } catch {
      /* some platforms do not report this permission; the write below says whether it worked */
    }
    try {
      await deps.writeFile({ path: name, data: text, directory: Directory.Documents, encoding: Encoding.UTF8, recursive: true });
      return ok({ where: `Documents/${name}` });
    } catch (e) {
      return err({ message: `The file could not be written to the Documents folder: ${errorText(e)}. Check the phone's free space and storage permission for Glintmark.` });
    }
  }
  /**
   * Save a backup archive. `produce` makes the archive; on the web with a save dialog the dialog is shown first
   * (it needs the crew's tap, which a long export would outlast), then the archive is made and written.
   * Native: written to Documents in pieces of 3 MB (writeFile, then appendFile), so the bridge never carries the
   * whole archive at once.
   */
  async function saveArchiveFile(name: string, produce: () => Promise<Blob>, opts: SaveOptions = {}): Promise<SaveArchiveResult> {
    if (!SAFE_NAME.test(name)) return err({ message: `The file name ${JSON.stringify(name)} is not allowed (letters, digits, dot, dash and underscore only).` });
    if (!deps.native) {
      if (deps.pickSaveFile) {
        let target: { write: (blob: Blob) => Promise<void> } | null;
        try {
          target = await deps.pickSaveFile(name);
        } catch (e) {
          return err({ message: `The browser did not open the save dialog: ${errorText(e)}` });
        }
        if (!target) return err({ message: 'No file was chosen, so the backup was not saved.' });
        try {
          await target.write(await produce());
          return ok({ where: `the file you chose (${name})`, written: true });
        } catch (e) {
          return err({ message: `The backup file could not be written: ${errorText(e)}` });
        }
      }
      try {
        deps.download(name, await produce());
        return ok({ where: `your browser's downloads (${name})`, written: false });
      } catch (e) {
        return err({ message: `The browser did not save the file: ${errorText(e)}` });
      }
    }
    try {
      const perm = await deps.checkPermissions();
      if (perm.publicStorage !== 'granted' && opts.askPermission !== false) await deps.requestPermissions();
    } catch {
      /* some platforms do not report this permission; the write below says whether it worked */
    }
    const blob = await produce();
    try {
      for (let at = 0; at === 0 || at < blob.size; at += NATIVE_CHUNK) {
        const data = bytesToBase64(new Uint8Array(await blob.slice(at, at + NATIVE_CHUNK).arrayBuffer()));
        if (at === 0) await deps.writeFile({ path: name, data, directory: Directory.Documents, recursive: true });
        else if (deps.appendFile) await deps.appendFile({ path: name, data, directory: Directory.Documents });
        else throw new Error('appending to a file is not available');
      }
      return ok({ where: `Documents/${name}`, written: true });
    } catch (e) {
      return err({ message: `The file could not be written to the Documents folder: ${errorText(e)}. Check the phone's free space and storage permission for Glintmark.` });
    }
  }
  return {
    saveTextFile,
    saveArchiveFile,
    /** A backup document (JSON text). */
    saveBackupFile: (name: string, text: string, opts?: SaveOptions) => saveTextFile(name, text, 'application/json', opts),
  };
}

/** Click a temporary `<a download>` for the blob; the object URL is released after the browser has taken it. */
function browserDownload(name: string, blob: Blob): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.rel = 'noopener';
  a.style.display = 'none';
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

/** True on a phone build, where files are written to Documents without a tap. */
export const isNativeFiles = (): boolean => Capacitor.isNativePlatform();

let real: ReturnType<typeof createFileSaver> | undefined;
const saver = () =>
  (real ??= createFileSaver({
    native: Capacitor.isNativePlatform(),
    writeFile: (o) => Filesystem.writeFile(o),
    checkPermissions: () => Filesystem.checkPermissions(),
    requestPermissions: () => Filesystem.requestPermissions(),
    download: browserDownload,
    appendFile: async (o) => {
      await Filesystem.appendFile(o);
    },
    pickSaveFile: browserSavePicker(),
  }));

interface SavePickerWindow {
  showSaveFilePicker?: (o: { suggestedName: string; types?: { description: string; accept: Record<string, string[]> }[] }) => Promise<{
    createWritable: () => Promise<{ write: (b: Blob) => Promise<void>; close: () => Promise<void> }>;
  }>;
}

/** The File System Access save dialog where the browser has one (Chromium on desktop), else null. */
function browserSavePicker(): FileSaverDeps['pickSaveFile'] {
  const w = (typeof window === 'undefined' ? {} : window) as SavePickerWindow;
  const show = w.showSaveFilePicker;
  if (typeof show !== 'function') return null;
  return async (name) => {
    try {
      const handle = await show.call(w, { suggestedName: name, types: [{ description: 'Glintmark backup', accept: { 'application/zip': ['.zip'] } }] });
      return {
        write: async (blob) => {
          const out = await handle.createWritable();
          await out.write(blob);
          await out.close(); // resolves once the file is written in place
        },
      };
    } catch (e) {
      if (e instanceof Error && e.name === 'AbortError') return null;
      throw e;
    }
  };
}

/** Save any text file (exports): native → Documents, web → a download. */
export const saveTextFile = (name: string, text: string, mime: string, opts?: SaveOptions): Promise<SaveFileResult> => saver().saveTextFile(name, text, mime, opts);

/** Save a backup archive: native → Documents (in pieces), web → the save dialog where present, else a download. */
export const saveBackupArchive = (name: string, produce: () => Promise<Blob>, opts?: SaveOptions): Promise<SaveArchiveResult> => saver().saveArchiveFile(name, produce, opts);

/** Save a backup file: native → Documents, web → a download. */
export const saveBackupFile = (name: string, text: string, opts?: SaveOptions): Promise<SaveFileResult> => saver().saveBackupFile(name, text, opts);
