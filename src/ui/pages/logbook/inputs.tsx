/** Logbook form inputs: the shared fields with their checks marked in place, and builders bound to one form. */
import type { ReactNode } from 'react';
import { NumberField, TextField } from '../../components/fields.tsx';

/** A checked text field (aria-invalid, no autofill, error or hint under it): the shared TextField, `validated`. */
export function TextInput(props: { label: string; value: string; onChange: (v: string) => void; error?: string; testId?: string; multiline?: boolean; hint?: ReactNode }) {
  return <TextField {...props} validated />;
}

/** The form's keys that hold typed text. */
type TextKey<F> = { [K in keyof F]-?: F[K] extends string ? K : never }[keyof F];

/**
 * Field builders for one form: each field shows `form[k]`, writes `{ [k]: typed }` through `set` and shows
 * `errors[k]` in place, so a page lists only label, unit and test id.
 */
export function formFields<F extends object>(form: F, set: (patch: Partial<F>) => void, errors: Partial<Record<keyof F, string>>) {
  const value = (k: TextKey<F>) => form[k] as string;
  const change = (k: TextKey<F>) => (v: string) => set({ [k]: v } as Partial<F>);
  return {
    num: (k: TextKey<F>, label: string, unit: string, testId: string) => (
      <NumberField label={label} unit={unit} value={value(k)} onChange={change(k)} error={errors[k]} testId={testId} />
    ),
    text: (k: TextKey<F>, label: string, testId: string, more: { hint?: string; multiline?: boolean } = {}) => (
      <TextInput label={label} value={value(k)} onChange={change(k)} error={errors[k]} testId={testId} hint={more.hint} multiline={more.multiline} />
    ),
  };
}

/** Show a field's error once the crew typed into it or tried to save. */
export function shownErrors<K extends string>(errors: Partial<Record<K, string>>, form: Record<K, unknown>, tried: boolean): Partial<Record<K, string>> {
  const out: Partial<Record<K, string>> = {};
  for (const k of Object.keys(errors) as K[]) {
    const v = form[k];
    if (tried || (typeof v === 'string' && v.trim() !== '')) out[k] = errors[k];
  }
  return out;
}
