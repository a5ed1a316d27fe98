/* eslint-disable react-hooks/set-state-in-effect -- the object URL is made and revoked with the blob in one effect; a ref-callback rewrite waits for its own change with the logbook browser tests. */
/**
 * Photos, one camera input per suggested view (along the boresight, the four cardinal views, base, foundation).
 * Before a record exists the pictures wait in memory and are added after the text record is saved; on a stored
 * record each picture is added at once. Thumbnails use object URLs, revoked when they change or the screen closes.
 */
import { useEffect, useId, useState } from 'react';
import {
  addPhoto,
  softDeletePhoto,
  storageEstimate,
  SUGGESTED_PHOTO_ROLES,
  useGlintmarkDb,
  usePhotos,
  withReopen,
  type PhotoOwner,
  type PhotoRecord,
} from '../../../data/index.ts';
import { saveErrorMessage } from './errorWords.ts';
import { photoRoleLabel } from './words.ts';

/** An object URL for a blob, revoked when the blob changes or the component goes away. */
function useObjectUrl(blob: Blob | undefined): string | null {
  const [url, setUrl] = useState<string | null>(null);
  useEffect(() => {
    if (!blob) {
      setUrl(null);
      return;
    }
    const u = URL.createObjectURL(blob);
    setUrl(u);
    return () => URL.revokeObjectURL(u);
  }, [blob]);
  return url;
}

function Thumb(props: { blob: Blob | undefined; alt: string }) {
  const url = useObjectUrl(props.blob);
  return url ? <img src={url} alt={props.alt} /> : null;
}

/** A native camera input, visually replaced by a large button-like label (the input stays focusable). */
function CameraInput(props: { role: string; onFile: (f: File | undefined) => void; label: string; action: string }) {
  const id = useId();
  return (
    <>
      <span className="gm-label">{props.label}</span>
      <input
        id={id}
        className="gm-lb-file"
        type="file"
        accept="image/*"
        capture="environment"
        data-testid={`photo-input-${props.role}`}
        onChange={(e) => {
          props.onFile(e.target.files?.[0] ?? undefined);
          e.target.value = '';
        }}
      />
      <label htmlFor={id} className="gm-btn gm-lb-camera">
        {props.action}
        <span className="gm-lb-sr"> ({props.label})</span>
      </label>
    </>
  );
}

/** Warn before taking photos when storage is nearly full. */
function StorageWarning() {
  const [warn, setWarn] = useState(false);
  useEffect(() => {
    let live = true;
    storageEstimate()
      .then((e) => live && setWarn(e.level === 'warn'))
      .catch(() => undefined);
    return () => {
      live = false;
    };
  }, []);
  return warn ? (
    <p className="gm-warn" data-testid="storage-warning">
      ⚠ Storage on this phone is over 80 % full. Make a backup (Settings) before taking many photos.
    </p>
  ) : null;
}

const roleLabel = photoRoleLabel;

/** Pictures chosen before the record exists (kept in memory, not in the draft). */
export function PendingPhotos(props: { files: Partial<Record<string, File>>; onChange: (role: string, f: File | undefined) => void; errors: Partial<Record<string, string>> }) {
  return (
    <section className="gm-section" aria-labelledby="photos-h">
      <h2 id="photos-h">Photos</h2>
      <p className="gm-note">Saved with the record, after its text. Photos are not kept in the draft: take them just before saving.</p>
      <StorageWarning />
      <div className="gm-lb-photos">
        {SUGGESTED_PHOTO_ROLES.map((role) => (
          <div key={role} className="gm-lb-photo" data-testid={`photo-slot-${role}`}>
            <CameraInput role={role} label={roleLabel(role)} action={props.files[role] ? 'Retake' : 'Take photo'} onFile={(f) => props.onChange(role, f)} />
            <Thumb blob={props.files[role]} alt={`${roleLabel(role)} (not saved yet)`} />
            {props.files[role] ? (
              <button type="button" className="gm-btn" onClick={() => props.onChange(role, undefined)}>
                Drop it
              </button>
            ) : null}
            {props.errors[role] ? (
              <p className="gm-error" role="alert" data-testid={`photo-error-${role}`}>
                {props.errors[role]}
              </p>
            ) : null}
          </div>
        ))}
      </div>
    </section>
  );
}

function StoredPhoto(props: { p: PhotoRecord; onRemove: () => void; disabled: boolean }) {
  return (
    <div className="gm-lb-photo" data-testid="stored-photo" data-role={props.p.role}>
      <span className="gm-label">{roleLabel(props.p.role)}</span>
      <Thumb blob={props.p.blob} alt={roleLabel(props.p.role)} />
      <button type="button" className="gm-btn" onClick={props.onRemove} disabled={props.disabled}>
        Remove
      </button>
    </div>
  );
}

/** Photos of a stored record: shown, added and removed at once (each writes a revision of the record). */
export function StoredPhotos(props: { owner: PhotoOwner; by: string; disabled: boolean; onWrite: () => void }) {
  const db = useGlintmarkDb();
  const photos = usePhotos(props.owner);
  const [note, setNote] = useState<Partial<Record<string, { ok: boolean; text: string }>>>({});
  const run = async (key: string, op: () => Promise<unknown>, okText: string) => {
    try {
      await withReopen(db, op);
      props.onWrite();
      setNote((n) => ({ ...n, [key]: { ok: true, text: okText } }));
    } catch (e) {
      setNote((n) => ({ ...n, [key]: { ok: false, text: saveErrorMessage(e, false) } }));
    }
  };
  const add = (role: string, f: File | undefined) => {
    if (f) void run(role, () => addPhoto(db, props.owner, role, f, { by: props.by }), '✓ Photo saved on this device');
  };
  return (
    <section className="gm-section" aria-labelledby="photos-h">
      <h2 id="photos-h">Photos ({photos?.length ?? '…'})</h2>
      <StorageWarning />
      {photos && photos.length ? (
        <div className="gm-lb-photos">
          {photos.map((p) => (
            <StoredPhoto key={p.id} p={p} disabled={props.disabled} onRemove={() => void run('removed', () => softDeletePhoto(db, p.id, { by: props.by }), '✓ Photo removed (it stays in the history)')} />
          ))}
        </div>
      ) : null}
      {note.removed ? <p className={note.removed.ok ? 'gm-okt' : 'gm-error'}>{note.removed.text}</p> : null}
      {props.disabled ? null : (
        <div className="gm-lb-photos">
          {SUGGESTED_PHOTO_ROLES.map((role) => (
            <div key={role} className="gm-lb-photo" data-testid={`photo-slot-${role}`}>
              <CameraInput role={role} label={roleLabel(role)} action="Add photo" onFile={(f) => add(role, f)} />
              {note[role] ? (
                <p className={note[role].ok ? 'gm-okt' : 'gm-error'} role={note[role].ok ? 'status' : 'alert'} data-testid={`photo-note-${role}`}>
                  {note[role].text}
                </p>
              ) : null}
            </div>
          ))}
        </div>
      )}
    </section>
  );
}
