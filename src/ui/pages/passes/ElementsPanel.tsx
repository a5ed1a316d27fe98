/**
 * Orbital element sets kept on the phone: paste or load a file, see what was rejected (line, column, why), keep the
 * good sets, load the invented demo satellite, and see each set's age against the planning window.
 */
import { useId, useState, type ChangeEvent } from 'react';
import { formatTleError, parseTle, type TleError } from '../../../core/orbit/tle.ts';
import { DEMO_TLE } from '../../../demo/elements.ts';
import { fmtNum } from '../../format.ts';
import { elementsAgeDays, elementsAgeWarning, formatUtc, type PassQuery } from './computePasses.ts';
import { addElementSets, removeElementSet, type StoredElementSet } from './elementsStore.ts';

/** Element files are a few kB; anything far larger is not one. */
const MAX_FILE_BYTES = 1_000_000;

function storageMessage(e: unknown): string {
  const name = e instanceof Error || e instanceof DOMException ? e.name : '';
  if (name === 'QuotaExceededError') return 'The phone’s storage for this app is full: remove old element sets and try again.';
  return `The element sets could not be saved: ${e instanceof Error ? e.message : String(e)}`;
}

export function ElementsPanel(props: {
  sets: StoredElementSet[];
  onChange: (sets: StoredElementSet[]) => void;
  query: PassQuery | null;
  nowMs: number;
}) {
  const [text, setText] = useState('');
  const [errors, setErrors] = useState<TleError[]>([]);
  const [message, setMessage] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const fileId = useId();
  const textId = useId();

  const addText = async (input: string, demo = false) => {
    setFailure(null);
    const r = parseTle(input);
    setErrors(r.errors);
    if (r.sets.length === 0) {
      setMessage(r.errors.length ? 'No element set was kept: see the problems below.' : 'There was no element set in the text.');
      return;
    }
    try {
      props.onChange(await addElementSets(r.sets, { demo }));
      const names = r.sets.map((s) => s.name || s.catalogNumber).join(', ');
      setMessage(`Kept ${r.sets.length} element set${r.sets.length > 1 ? 's' : ''}: ${names}.${r.errors.length ? ' Some lines were rejected: see below.' : ''}`);
      if (!demo && r.errors.length === 0) setText('');
    } catch (e) {
      setFailure(storageMessage(e));
    }
  };

  const onFile = async (e: ChangeEvent<HTMLInputElement>) => {
    const file = e.target.files?.[0];
    e.target.value = '';
    if (!file) return;
    if (file.size > MAX_FILE_BYTES) {
      setFailure(`"${file.name}" is ${fmtNum(file.size / 1e6, 1)} MB: too large for an element file.`);
      return;
    }
    try {
      await addText(await file.text());
    } catch (err) {
      setFailure(`"${file.name}" could not be read: ${err instanceof Error ? err.message : String(err)}`);
    }
  };

  const remove = async (catalogNumber: string) => {
    try {
      props.onChange(await removeElementSet(catalogNumber));
    } catch (e) {
      setFailure(storageMessage(e));
    }
  };

  return (
    <section className="gm-section" aria-labelledby="elements-h">
      <h2 id="elements-h">Orbital elements (kept on this phone)</h2>
      {props.sets.length === 0 ? <p className="gm-note">No element sets yet. Paste two-line elements, load a file, or try the demo satellite.</p> : null}
      <ul className="gm-passes-sets" data-testid="element-sets">
        {props.sets.map((s) => {
          const ageDays = elementsAgeDays(s.epochMs, props.nowMs);
          const warn = elementsAgeWarning(s, props.query);
          return (
            <li key={s.catalogNumber} className="gm-card" data-testid={`set-${s.catalogNumber}`}>
              <strong>{s.name || '(no name)'}</strong> · catalogue {s.catalogNumber} {s.demo ? <span className="gm-demo-badge">DEMO — invented satellite</span> : null}
              <div className="gm-note">
                Epoch {formatUtc(s.epochMs)} · age{' '}
                <span data-testid={`set-age-${s.catalogNumber}`}>{ageDays >= 0 ? `${fmtNum(ageDays, 1)} days` : `${fmtNum(-ageDays, 1)} days in the future`}</span>
              </div>
              {warn ? (
                <p className="gm-warn" data-testid={`set-warning-${s.catalogNumber}`}>
                  Warning: {warn}
                </p>
              ) : null}
              <button type="button" className="gm-btn" onClick={() => void remove(s.catalogNumber)} aria-label={`Remove ${s.name || s.catalogNumber}`}>
                Remove
              </button>
            </li>
          );
        })}
      </ul>
      <div className="gm-field">
        <label htmlFor={textId}>Paste two-line elements (name line optional)</label>
        <textarea id={textId} className="gm-tle" data-testid="tle-text" value={text} spellCheck={false} autoCapitalize="off" autoCorrect="off" onChange={(e) => setText(e.target.value)} />
      </div>
      <div className="gm-passes-buttons">
        <button type="button" className="gm-btn gm-primary" disabled={text.trim() === ''} onClick={() => void addText(text)} data-testid="tle-add">
          Keep pasted elements
        </button>
        <label htmlFor={fileId} className="gm-btn gm-file-btn">
          Load a file…
        </label>
        <input id={fileId} type="file" accept=".tle,.txt,text/plain" className="gm-visually-hidden" onChange={(e) => void onFile(e)} data-testid="tle-file" />
        <button type="button" className="gm-btn" onClick={() => void addText(DEMO_TLE, true)} data-testid="load-demo">
          Load demo satellite
        </button>
      </div>
      {message ? (
        <p className="gm-note" role="status" data-testid="tle-message">
          {message}
        </p>
      ) : null}
      {failure ? (
        <p className="gm-error" role="alert" data-testid="tle-failure">
          {failure}
        </p>
      ) : null}
      {errors.length ? (
        <ul className="gm-error-list" data-testid="tle-errors" aria-label="Rejected lines">
          {errors.map((e, i) => (
            <li key={`${e.lineNumber}-${e.column}-${i}`} className="gm-error" data-testid={`tle-error-${i}`}>
              {formatTleError(e)}
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
