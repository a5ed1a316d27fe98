/** The state of a form's save: whether a write runs, its failure in words, and whether it was refused as stale. */
import { useState } from 'react';
import { saveErrorMessage } from './errorWords.ts';

export interface SaveState {
  busy: boolean;
  error: string | null;
  setError: (s: string | null) => void;
  /** The last write was refused because the record changed elsewhere (StaleRecordError). */
  stale: boolean;
  setStale: (s: boolean) => void;
  /**
   * Run `write` with `busy` set. A failure is shown in words (see saveErrorMessage) and sets `stale`; `onError`
   * runs first (e.g. to mark the field a refusal is about). Nothing throws out.
   */
  run: (write: () => Promise<void>, onError?: (e: unknown) => void) => Promise<void>;
}

export function useSaveState(): SaveState {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  const run = async (write: () => Promise<void>, onError?: (e: unknown) => void) => {
    setBusy(true);
    try {
      await write();
    } catch (e) {
      onError?.(e);
      setStale(e instanceof Error && e.name === 'StaleRecordError');
      setError(saveErrorMessage(e));
    } finally {
      setBusy(false);
    }
  };
  return { busy, error, setError, stale, setStale, run };
}
