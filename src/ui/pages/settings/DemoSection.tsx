/** Remove the demo records (and demo element sets), keeping any a real record still uses. */
import { useState } from 'react';
import { removeDemoData, useGlintmarkDb } from '../../../data/index.ts';
import { demoRemovalView, type DemoRemovalView } from './reports.ts';
import { messageOf } from './uiErrors.ts';

export function DemoSection(props: { onChanged: () => void }) {
  const db = useGlintmarkDb();
  const [busy, setBusy] = useState(false);
  const [view, setView] = useState<DemoRemovalView | null>(null);
  const [error, setError] = useState<string | null>(null);
  const remove = async () => {
    setBusy(true);
    setError(null);
    setView(null);
    try {
      setView(demoRemovalView(await removeDemoData(db)));
      props.onChanged();
    } catch (e) {
      setError(messageOf(e));
    } finally {
      setBusy(false);
    }
  };
  return (
    <section className="gm-section" aria-labelledby="demo-h">
      <h2 id="demo-h">Demo data</h2>
      <p className="gm-note">Removes the invented demo sites, records and satellites. Your own records are never touched.</p>
      <button type="button" className="gm-btn" disabled={busy} onClick={() => void remove()} data-testid="remove-demo">
        Remove demo data
      </button>
      {view ? (
        <div role="status" data-testid="demo-report">
          <p className="gm-okt">✓ {view.removed}</p>
          {view.kept.length ? (
            <ul className="gm-settings-list">
              {view.kept.map((k, i) => (
                <li key={i}>{k}</li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      {error ? (
        <p className="gm-error" role="alert" data-testid="demo-error">
          {error}
        </p>
      ) : null}
    </section>
  );
}
