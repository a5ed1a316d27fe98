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
  writeFile(o: { path: string; data: string; directory: Directory; encoding: Encoding; recursive: boolean }): Promise<{ uri: string }>;
  checkPermissions(): Promise<{ publicStorage: string }>;
  requestPermissions(): Promise<{ publicStorage: string }>;
  /** Web: offer the blob as a download named `name`. */
  download(name: string, blob: Blob): void;
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
  return {
    saveTextFile,
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
  }));

/** Save any text file (exports): native → Documents, web → a download. */
export const saveTextFile = (name: string, text: string, mime: string, opts?: SaveOptions): Promise<SaveFileResult> => saver().saveTextFile(name, text, mime, opts);

/** Save a backup file: native → Documents, web → a download. */
export const saveBackupFile = (name: string, text: string, opts?: SaveOptions): Promise<SaveFileResult> => saver().saveBackupFile(name, text, opts);
