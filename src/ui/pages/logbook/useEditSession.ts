/**
 * Editing a stored record: the form, the version it was loaded from (its rev and values), a draft of unsaved edits,
 * and the save. A save writes only the fields the crew changed since loading, and only if the record is still at
 * the loaded rev; if another tab or a merge changed it meanwhile (StaleRecordError) the form is kept and the crew may
 * apply the same changes to the current version, which keeps the other change in every field they did not touch.
 */
import { useState } from 'react';
import { useGlintmarkDb, withReopen } from '../../../data/index.ts';
import { changedFields } from './siteForm.ts';
import { useFormDraft, type FormDraft } from './useFormDraft.ts';
import { useSaveState } from './useSaveState.ts';

interface Session<F> {
  baseRev: number;
  /** The form as loaded (the version the edits apply to). */
  base: F;
  form: F;
}

export interface EditSession<F> {
  form: F;
  update: (patch: Partial<F>) => void;
  /** Drop unsaved edits and show the stored record. */
  discard: () => Promise<void>;
  /** Save the changed fields; `onto: 'current'` applies them to the record as it is now (after a refused save). */
  save: (onto?: 'current') => Promise<void>;
  /** This screen changed the record itself (a photo added or removed): the loaded rev moves on by one. */
  ownWrite: () => void;
  /** A write outside the form (delete, undelete) left the record at this rev. */
  rebase: (rev: number) => void;
  saved: string | null;
  setSaved: (s: string | null) => void;
  error: string | null;
  setError: (s: string | null) => void;
  /** The last save was refused because the record changed elsewhere. */
  stale: boolean;
  busy: boolean;
  draft: FormDraft<Session<F>>;
}

export function useEditSession<F, P extends object, R extends { rev: number }>(o: {
  draftKey: string;
  rec: R;
  toForm: (r: R) => F;
  isForm: (v: unknown) => v is F;
  parse: (f: F) => P | null;
  /** The record's current editable values, to diff against when the loaded version cannot be parsed. */
  current: (r: R) => P;
  write: (patch: Partial<P>, expectedRev: number) => Promise<R>;
}): EditSession<F> {
  const db = useGlintmarkDb();
  const fresh = (r: R): Session<F> => ({ baseRev: r.rev, base: o.toForm(r), form: o.toForm(r) });
  const [session, setSession] = useState<Session<F>>(() => fresh(o.rec));
  const [saved, setSaved] = useState<string | null>(null);
  const { busy, error, setError, stale, setStale, run } = useSaveState();
  const isSession = (v: unknown): v is Session<F> =>
    typeof v === 'object' && v !== null && typeof (v as Session<F>).baseRev === 'number' && o.isForm((v as Session<F>).base) && o.isForm((v as Session<F>).form);
  const draft = useFormDraft(o.draftKey, isSession, (d) => setSession(d));

  const update = (patch: Partial<F>) => {
    const next = { ...session, form: { ...session.form, ...patch } };
    setSession(next);
    setSaved(null);
    setError(null);
    setStale(false);
    draft.save(next);
  };
  const discard = async () => {
    await draft.clear();
    setSession(fresh(o.rec));
    setStale(false);
    setError(null);
  };
  const save = async (onto?: 'current') => {
    setError(null);
    setSaved(null);
    const fields = o.parse(session.form);
    if (!fields) {
      setError('Nothing saved: check the marked fields.');
      return;
    }
    const patch = changedFields(o.parse(session.base) ?? o.current(o.rec), fields);
    if (Object.keys(patch).length === 0) {
      setSaved('No changes to save: the record on this device is the same.');
      return;
    }
    const expectedRev = onto === 'current' ? o.rec.rev : session.baseRev;
    await run(async () => {
      const next = await withReopen(db, () => o.write(patch, expectedRev));
      await draft.clear();
      setSession(fresh(next));
      setStale(false);
      setSaved('Saved on this device');
    });
  };
  return {
    form: session.form,
    update,
    discard,
    save,
    ownWrite: () => setSession((s) => ({ ...s, baseRev: s.baseRev + 1 })),
    rebase: (rev) => setSession((s) => ({ ...s, baseRev: rev })),
    saved,
    setSaved,
    error,
    setError,
    stale,
    busy,
    draft,
  };
}
