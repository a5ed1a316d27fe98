import { useEffect, useState } from 'react';
import { siteHeightForGeometryM, type GeometryRecord, type ReflectorRecord, type SiteRecord } from '../../../data/index.ts';
import { fmtUtcAndSite, siteTimeZone } from '../../siteTime.ts';
import { NEXT_PASS_DAYS, type SiteNextPasses } from './nextPass.ts';

type State = { ok: true; r: SiteNextPasses; sets: number } | { ok: false; message: string };

const passWords = (p: { satellite: string; direction: string; incidenceDeg: number; reflectorAzimuthDeg: number; timeMs: number }, zone: string | null) =>
  `${p.satellite} ${p.direction}, incidence ${p.incidenceDeg.toFixed(1)}°, reflector azimuth ${p.reflectorAzimuthDeg.toFixed(1)}°, ${fmtUtcAndSite(p.timeMs, zone)}`;

/** The next pass of each track the site's reflectors serve (marked with the reflector), computed on the phone. */
export function NextPass(props: { site: SiteRecord; geometries: GeometryRecord[]; reflectors: ReflectorRecord[] }) {
  const { latDeg, lonDeg, demo } = props.site;
  const heightEllM = siteHeightForGeometryM(props.site);
  // Plain keys of what the search needs: it reruns only when these change, not on every record edit of the site.
  const gKey = JSON.stringify(props.geometries.map((g) => ({ reflectorId: g.reflectorId, incidenceDeg: g.incidenceDeg, direction: g.direction, satellite: g.satellite, look: g.look, deletedAtMs: g.deletedAtMs })));
  const rKey = JSON.stringify(props.reflectors.map((r) => ({ id: r.id, label: r.label, deletedAtMs: r.deletedAtMs })));
  const [state, setState] = useState<State | undefined>(undefined);
  useEffect(() => {
    let live = true;
    // Loaded on demand: the orbit code stays out of the Logbook's own bundle.
    void Promise.all([import('../passes/elementsStore.ts'), import('./nextPass.ts')])
      .then(async ([store, np]) => {
        const sets = await store.listElementSets();
        if (!live) return;
        const r = np.siteNextPasses(sets, { latDeg, lonDeg, heightEllM, demo }, JSON.parse(gKey) as GeometryRecord[], JSON.parse(rKey) as ReflectorRecord[], Date.now());
        if (live) setState({ ok: true, r, sets: sets.length });
      })
      .catch((e: unknown) => live && setState({ ok: false, message: `Next pass: the stored element sets could not be read (${e instanceof Error ? e.message : String(e)}).` }));
    return () => {
      live = false;
    };
  }, [latDeg, lonDeg, heightEllM, demo, gKey, rKey]);

  const zone = siteTimeZone(latDeg, lonDeg);
  let lines: string[];
  if (state === undefined) lines = ['Next pass: computing…'];
  else if (!state.ok) lines = [state.message];
  else {
    const r = state.r;
    if (state.sets === 0) lines = ['Next pass: no element sets are stored on this phone — load them on the Passes screen.'];
    else if (r.usable === 0) lines = [`Next pass: only the invented demo satellite's elements are stored, and they never serve a real site — load real element sets on the Passes screen.`];
    else if (r.served.length) {
      lines = r.served.map((s) =>
        s.pass
          ? `Next pass for reflector ${s.reflectorLabel}: ${passWords(s.pass, zone)}.`
          : `Reflector ${s.reflectorLabel}: no pass of its track (${s.geometry.satellite ?? 'any satellite'} ${s.geometry.direction ?? ''} ${s.geometry.incidenceDeg.toFixed(1)}°) in the next ${NEXT_PASS_DAYS} days from the stored element sets.`,
      );
    } else if (r.any) lines = [`Next pass (no reflector of this site serves a planned track yet): ${passWords(r.any, zone)}.`];
    else lines = [`Next pass: none in the next ${NEXT_PASS_DAYS} days within ${r.incidenceMinDeg}°–${r.incidenceMaxDeg}° incidence.`];
    if (r.demoSkipped && r.usable) lines.push(`The invented demo satellite (${r.demoSkipped} element set${r.demoSkipped === 1 ? '' : 's'}) is left out: demo elements never serve a real site.`);
    lines.push(...r.failures.map((f) => `Element set problem — ${f}`));
  }
  return (
    <div className="gm-note" data-testid="next-pass">
      {lines.map((l, i) => (
        <p key={i} className={l.startsWith('Element set problem') ? 'gm-warn' : undefined} style={{ margin: '4px 0' }}>
          {demo && i === 0 ? <span className="gm-demo-badge">DEMO</span> : null} {l}
        </p>
      ))}
    </div>
  );
}
