/* eslint-disable react-hooks/refs, react-hooks/set-state-in-effect -- the latest callbacks are kept in refs on purpose and the loaded flag is reset when the key changes; a rewrite to useEffectEvent broke the logbook browser tests, so it waits for its own change. */
/**
 * Draft of an unsaved form, kept in the logbook database so a reload, a crash or a dead battery loses nothing:
 * saved ~300 ms after each change by the crew, restored when the form opens again, cleared once the record's
 * write has resolved. Prefilling a form does not write a draft; only the crew's own edits do.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import { clearDraft, loadDraft, saveDraft, useGlintmarkDb } from '../../../data/index.ts';

export const DRAFT_DEBOUNCE_MS = 300;

export interface FormDraft<T> {
  /** True once the stored draft (if any) was read; edits before that are not saved. */
  loaded: boolean;
  /** When the restored draft had been saved, or null when the form did not come from a draft. */
  restoredAtMs: number | null;
  /** Schedule saving this value (debounced). */
  save: (value: T) => void;
  /** Forget the draft (after a successful save, or "Discard draft"). */
  clear: () => Promise<void>;
  /** A draft write that failed, in plain words (the form itself is unaffected). */
  error: string | null;
}

export function useFormDraft<T>(key: string | null, isShape: (v: unknown) => v is T, onRestore: (value: T, savedAtMs: number) => void): FormDraft<T> {
  const db = useGlintmarkDb();
  const [loaded, setLoaded] = useState(false);
  const [restoredAtMs, setRestoredAtMs] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const pending = useRef<{ key: string; value: T } | null>(null);
  const restore = useRef(onRestore);
  restore.current = onRestore;
  const shape = useRef(isShape);
  shape.current = isShape;

  useEffect(() => {
    if (key === null) return;
    let live = true;
    setLoaded(false);
    loadDraft<unknown>(db, key)
      .then((d) => {
        if (live && d && shape.current(d.value)) {
          restore.current(d.value, d.savedAtMs);
          setRestoredAtMs(d.savedAtMs);
        }
      })
      .catch(() => {
        /* an unreadable draft is the same as none: the form opens fresh */
      })
      .finally(() => live && setLoaded(true));
    return () => {
      live = false;
    };
  }, [db, key]);

  const flush = useCallback(() => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    const p = pending.current;
    pending.current = null;
    if (!p) return;
    saveDraft(db, p.key, p.value)
      .then(() => setError(null))
      .catch((e: unknown) => setError(`The draft could not be kept on this device (${e instanceof Error ? e.message : String(e)}); save the record soon.`));
  }, [db]);

  // Write a pending draft when the form goes away (tab change, navigation).
  useEffect(() => flush, [flush]);

  const save = useCallback(
    (value: T) => {
      if (key === null || !loaded) return;
      pending.current = { key, value };
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(flush, DRAFT_DEBOUNCE_MS);
    },
    [key, loaded, flush],
  );

  const clear = useCallback(async () => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    pending.current = null;
    setRestoredAtMs(null);
    if (key !== null) await clearDraft(db, key).catch(() => undefined);
  }, [db, key]);

  return { loaded, restoredAtMs, save, clear, error };
}
