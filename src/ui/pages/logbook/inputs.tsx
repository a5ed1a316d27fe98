/** A text field with its error marked in place (fields.tsx's TextField has no error slot). */
import { useId } from 'react';

export function TextInput(props: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  error?: string;
  testId?: string;
  multiline?: boolean;
  hint?: string;
  placeholder?: string;
}) {
  const id = useId();
  const errId = `${id}-err`;
  const common = {
    id,
    'data-testid': props.testId,
    value: props.value,
    placeholder: props.placeholder,
    'aria-invalid': props.error ? ('true' as const) : ('false' as const),
    'aria-describedby': props.error ? errId : undefined,
  };
  return (
    <div className="gm-field">
      <label htmlFor={id}>{props.label}</label>
      {props.multiline ? (
        <textarea {...common} onChange={(e) => props.onChange(e.target.value)} />
      ) : (
        <input {...common} autoComplete="off" onChange={(e) => props.onChange(e.target.value)} />
      )}
      {props.error ? (
        <p id={errId} className="gm-error" role="alert" data-testid={props.testId ? `${props.testId}-error` : undefined}>
          {props.error}
        </p>
      ) : props.hint ? (
        <p className="gm-note">{props.hint}</p>
      ) : null}
    </div>
  );
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
