import { useEffect, useState } from 'react';
import type { Pass } from '../../../core/orbit/passes.ts';
import { siteHeightForGeometryM, type SiteRecord } from '../../../data/index.ts';
import { NEXT_PASS_DAYS } from './nextPass.ts';

/** "Next pass: GLINT-A descending, incidence 29.3°, 2026-12-03 05:43 UTC", computed on the phone. */
export function NextPass(props: { site: SiteRecord }) {
  const { latDeg, lonDeg } = props.site;
  const heightEllM = siteHeightForGeometryM(props.site);
  const [state, setState] = useState<{ pass: Pass | null; sets: number } | undefined>(undefined);
  useEffect(() => {
    let live = true;
    // Loaded on demand: the orbit code stays out of the Logbook's own bundle.
    void Promise.all([import('../passes/elementsStore.ts'), import('./nextPass.ts')])
      .then(async ([store, np]) => {
        const sets = await store.listElementSets();
        const pass = np.nextPassOver(sets, { latDeg, lonDeg, heightEllM }, Date.now());
        if (live) setState({ pass, sets: sets.length });
      })
      .catch(() => live && setState({ pass: null, sets: 0 }));
    return () => {
      live = false;
    };
  }, [latDeg, lonDeg, heightEllM]);

  let textOut: string;
  if (state === undefined) textOut = 'Next pass: computing…';
  else if (state.sets === 0) textOut = 'Next pass: no orbital elements on this phone yet — load them on the Passes screen.';
  else if (!state.pass) textOut = `Next pass: none in the next ${NEXT_PASS_DAYS} days within 20°–46° incidence.`;
  else {
    const p = state.pass;
    textOut = `Next pass: ${p.satellite} ${p.direction}, incidence ${p.incidenceDeg.toFixed(1)}°, reflector azimuth ${p.reflectorAzimuthDeg.toFixed(1)}°, ${p.timeUtc.slice(0, 16).replace('T', ' ')} UTC.`;
  }
  return (
    <p className="gm-note" data-testid="next-pass">
      {textOut}
    </p>
  );
}
