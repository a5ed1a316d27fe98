/** Storage on this phone: persistence, space used, last backup, schema version. */
import { useEffect, useState } from 'react';
import { CURRENT_SCHEMA_VERSION, getMeta, requestPersistentStorage, storageEstimate, useGlintmarkDb } from '../../../data/index.ts';
import { APP_VERSION } from './appInfo.ts';
import { estimateLine, lastBackupLine, persistenceLine, type Line } from './storageView.ts';
import { messageOf } from './uiErrors.ts';

const cls = (l: Line) => (l.level === 'warn' ? 'gm-warn' : l.level === 'ok' ? 'gm-okt' : 'gm-note');
const mark = (l: Line) => (l.level === 'warn' ? '⚠ ' : l.level === 'ok' ? '✓ ' : '');

function Shown(props: { line: Line | null; testId: string }) {
  if (!props.line) return <p className="gm-note" data-testid={props.testId}>Reading…</p>;
  return (
    <p className={cls(props.line)} data-testid={props.testId} data-level={props.line.level}>
      {mark(props.line)}
      {props.line.text}
    </p>
  );
}

export function StorageSection(props: { refreshKey: number }) {
  const db = useGlintmarkDb();
  const [lines, setLines] = useState<{ persistence: Line; estimate: Line; backup: Line } | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [asking, setAsking] = useState(false);
  const [reload, setReload] = useState(0);

  useEffect(() => {
    let live = true;
    (async () => {
      const [persistence, last, estimate] = await Promise.all([getMeta(db, 'persistence'), getMeta(db, 'lastBackupAtMs'), storageEstimate()]);
      if (live) setLines({ persistence: persistenceLine(persistence), backup: lastBackupLine(last, Date.now()), estimate: estimateLine(estimate) });
    })().catch((e: unknown) => live && setError(messageOf(e)));
    return () => {
      live = false;
    };
  }, [db, props.refreshKey, reload]);

  const askAgain = async () => {
    setAsking(true);
    setError(null);
    try {
      await requestPersistentStorage({ db });
      setReload((n) => n + 1);
    } catch (e) {
      setError(messageOf(e));
    } finally {
      setAsking(false);
    }
  };

  return (
    <section className="gm-section" aria-labelledby="storage-h">
      <h2 id="storage-h">Storage on this phone</h2>
      <Shown line={lines?.persistence ?? null} testId="persistence" />
      <button type="button" className="gm-btn" onClick={askAgain} disabled={asking} data-testid="ask-persistence">
        Ask for persistent storage again
      </button>
      <Shown line={lines?.estimate ?? null} testId="storage-estimate" />
      <Shown line={lines?.backup ?? null} testId="last-backup" />
      <p className="gm-note" data-testid="schema-version">
        Logbook schema version {CURRENT_SCHEMA_VERSION}; Glintmark {APP_VERSION}.
      </p>
      {error ? (
        <p className="gm-error" role="alert" data-testid="storage-error">
          {error}
        </p>
      ) : null}
    </section>
  );
}
