/** Register overview: every site with its latest installation, reflectors due for inspection, open conflicts, exports. */
import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';
import { useState } from 'react';
import { exportInstallationsCsv, exportSitesGeoJson, useGlintmarkDb, useLiveRead } from '../../../data/index.ts';
import { registerOverview } from '../../../sync/index.ts';

const day = (ms: number) => new Date(ms).toISOString().slice(0, 10);

function save(name: string, text: string, type: string) {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export function RegisterPage() {
  const db = useGlintmarkDb();
  const [nowMs] = useState(() => Date.now());
  const o = useLiveRead(() => registerOverview(db, nowMs), [db, nowMs]);
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Register</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main data-testid="register-page">
          <h1 className="gm-label">Team register (as synced to this phone)</h1>
          {!o ? (
            <p>Loading…</p>
          ) : (
            <>
              <section className="gm-section">
                <h2>Exports of the whole register</h2>
                <button type="button" className="gm-btn" onClick={() => void exportSitesGeoJson(db).then((fc) => save('register-sites.geojson', JSON.stringify(fc), 'application/geo+json'))} data-testid="register-geojson">
                  Sites (GeoJSON)
                </button>{' '}
                <button type="button" className="gm-btn" onClick={() => void exportInstallationsCsv(db).then((csv) => save('register-installations.csv', csv, 'text/csv'))} data-testid="register-csv">
                  Installations (CSV)
                </button>
              </section>
              <section className="gm-section">
                <h2>Open conflicts ({o.openConflicts.length})</h2>
                <ul data-testid="register-conflicts">
                  {o.openConflicts.map((c) => (
                    <li key={c.id}>
                      {c.table} {c.recordId}: {c.reason}
                    </li>
                  ))}
                </ul>
                {o.openConflicts.length ? <p className="gm-note">Review them in Settings.</p> : null}
              </section>
              <section className="gm-section">
                <h2>Due for inspection ({o.due.length})</h2>
                <p className="gm-note">No inspection or installation in the last 12 months (yearly inspection: common practice).</p>
                <ul data-testid="register-due">
                  {o.due.map((d) => (
                    <li key={d.reflector.id}>
                      {d.site.code} reflector {d.reflector.label}: last visit {day(d.lastVisitAtMs)}
                    </li>
                  ))}
                </ul>
              </section>
              <section className="gm-section">
                <h2>Sites ({o.sites.length})</h2>
                <table className="gm-table" data-testid="register-sites">
                  <thead>
                    <tr>
                      <th>Code</th>
                      <th>Name</th>
                      <th>Latest installation</th>
                    </tr>
                  </thead>
                  <tbody>
                    {o.sites.map(({ site, latestInstallation: i }) => (
                      <tr key={site.id}>
                        <td>{site.code}</td>
                        <td>{site.name}</td>
                        <td>{i ? `${day(i.installedAtMs)}: azimuth ${i.measuredAzimuthDeg.toFixed(1)}°, tilt ${i.measuredTiltDeg.toFixed(1)}°${i.notes ? `, ${i.notes}` : ''}` : 'none'}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </section>
            </>
          )}
        </main>
      </IonContent>
    </IonPage>
  );
}
