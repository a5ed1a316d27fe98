/** Glove-sized form controls: native inputs with visible labels, 48 px targets, and errors marked in place. */
import { useId, type ReactNode } from 'react';

export interface Parsed {
  value?: number;
  error?: string;
}

/**
 * Parse a typed number and run a core validator on it. The validator's RangeError message (which names the
 * field, the value and the allowed range) is shown as is; nothing throws out of a form.
 */
export function parseField(label: string, text: string, validate?: (name: string, v: number) => unknown): Parsed {
  const t = text.trim().replace(',', '.');
  if (t === '') return { error: `${label} is empty` };
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t)) return { error: `${label} must be a number, got "${text}"` };
  const v = Number(t);
  try {
    validate?.(label, v);
  } catch (e) {
    return { error: e instanceof Error ? e.message : String(e) };
  }
  return { value: v };
}

export function NumberField(props: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  error?: string;
  unit?: string;
  testId?: string;
  hint?: ReactNode;
  /** Shown greyed in an empty field; never a value (say "e.g." in it, so it reads as an example). */
  placeholder?: string;
}) {
  const id = useId();
  const errId = `${id}-err`;
  return (
    <div className="gm-field">
      <label htmlFor={id}>
        {props.label}
        {props.unit ? ` (${props.unit})` : ''}
      </label>
      <input
        id={id}
        data-testid={props.testId}
        inputMode="decimal"
        autoComplete="off"
        placeholder={props.placeholder}
        value={props.value}
        aria-invalid={props.error ? 'true' : 'false'}
        aria-describedby={props.error ? errId : undefined}
        onChange={(e) => props.onChange(e.target.value)}
      />
      <FieldNote errId={errId} error={props.error} hint={props.hint} testId={props.testId} />
    </div>
  );
}

/**
 * A text field. With `validated` it takes part in a form check as NumberField does: it always states aria-invalid,
 * browser autofill is off (one-line input), and `error` (else `hint`) is shown under it.
 */
export function TextField(props: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  testId?: string;
  multiline?: boolean;
  error?: string;
  hint?: ReactNode;
  validated?: boolean;
}) {
  const id = useId();
  const errId = `${id}-err`;
  const checked = props.validated === true || Boolean(props.error);
  const common = {
    id,
    'data-testid': props.testId,
    value: props.value,
    onChange: (e: { target: { value: string } }) => props.onChange(e.target.value),
    'aria-invalid': checked ? (props.error ? ('true' as const) : ('false' as const)) : undefined,
    'aria-describedby': props.error ? errId : undefined,
  };
  return (
    <div className="gm-field">
      <label htmlFor={id}>{props.label}</label>
      {props.multiline ? <textarea {...common} /> : <input {...common} autoComplete={props.validated ? 'off' : undefined} />}
      <FieldNote errId={errId} error={props.error} hint={props.hint} testId={props.testId} />
    </div>
  );
}

/** Under a field: its error (announced, and named by the field's aria-describedby), else its hint, else nothing. */
function FieldNote(props: { errId: string; error?: string; hint?: ReactNode; testId?: string }) {
  if (props.error)
    return (
      <p id={props.errId} className="gm-error" role="alert" data-testid={props.testId ? `${props.testId}-error` : undefined}>
        {props.error}
      </p>
    );
  return props.hint ? <p className="gm-note">{props.hint}</p> : null;
}

export function Segmented<T extends string>(props: {
  label: string;
  value: T;
  options: readonly { value: T; label: string }[];
  onChange: (v: T) => void;
  testId?: string;
}) {
  return (
    <div className="gm-field">
      <span className="gm-label" id={`${props.testId ?? props.label}-lbl`}>
        {props.label}
      </span>
      <div className="gm-seg" role="group" aria-labelledby={`${props.testId ?? props.label}-lbl`} data-testid={props.testId}>
        {props.options.map((o) => (
          <button
            key={o.value}
            type="button"
            className="gm-btn"
            aria-pressed={o.value === props.value}
            data-value={o.value}
            onClick={() => props.onChange(o.value)}
          >
            {o.label}
          </button>
        ))}
      </div>
    </div>
  );
}

export function SelectField(props: { label: string; value: string; options: readonly { value: string; label: string }[]; onChange: (v: string) => void; testId?: string }) {
  const id = useId();
  return (
    <div className="gm-field">
      <label htmlFor={id}>{props.label}</label>
      <select id={id} data-testid={props.testId} value={props.value} onChange={(e) => props.onChange(e.target.value)}>
        {props.options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}

/** A large number for reading at arm's length in sunlight. */
export function BigNumber(props: { label: string; value: string; unit?: string; testId?: string; tone?: 'ok' | 'bad'; sub?: ReactNode }) {
  return (
    <div className={`gm-card${props.tone ? ' gm-' + props.tone : ''}`}>
      <div className="gm-label">{props.label}</div>
      <div className="gm-big" data-testid={props.testId}>
        <span className="gm-nowrap">{props.value}</span>
        {/* A word unit (dBsm, mm) may drop to the next line on a narrow card; a degree sign stays with its number. */}
        {props.unit ? (
          <>
            {/^[°′″]/.test(props.unit.trim()) ? '' : ' '}
            <span className="gm-mid gm-nowrap">{props.unit.trim()}</span>
          </>
        ) : null}
      </div>
      {props.sub ? <div className="gm-note">{props.sub}</div> : null}
    </div>
  );
}
