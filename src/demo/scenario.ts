/**
 * The invented demo scenario: a small subsidence-monitoring network of four sites on "Marrowby Fen" (an invented
 * place), watched by the invented satellite GLINT-A, with one installation already logged. Every record carries
 * demo: true, so the whole scenario can be removed in one step without touching real records.
 */
import { aimForPass } from '../core/geometry/pointing.ts';
import { declination } from '../core/magnetic/declination.ts';
import { findPasses } from '../core/orbit/passes.ts';
import { parseTle } from '../core/orbit/tle.ts';
import { groupTracks, type Track } from '../core/orbit/tracks.ts';
import { bandWavelengthM } from '../core/radar/bands.ts';
import { misalignment } from '../core/reflector/misalignment.ts';
import { geometryRepo, installationRepo, reflectorRepo, siteRepo, type GlintmarkDb } from '../data/index.ts';
import { DEMO_TLE } from './elements.ts';

export const DEMO_CREW = 'Demo crew';

/** Invented sites: codes, names and positions are made up for the demo. */
export const DEMO_SITES = [
  { code: 'MF-01', name: 'Marrowby Fen north dyke', latDeg: 52.5712, lonDeg: 0.3321, heightEllM: 46.2 },
  { code: 'MF-02', name: 'Cotter\'s Drain pumping station', latDeg: 52.5538, lonDeg: 0.3714, heightEllM: 45.1 },
  { code: 'MF-03', name: 'Hollins Levels farm track', latDeg: 52.5391, lonDeg: 0.3107, heightEllM: 44.8 },
  { code: 'MF-04', name: 'Saltney Carr reference (stable ground)', latDeg: 52.5925, lonDeg: 0.2876, heightEllM: 52.9 },
] as const;

const DAY_MS = 86_400_000;

/** The GLINT-A tracks over MF-01 in the 12 days from `nowMs` (one repeat cycle), descending first. */
export function demoTracks(nowMs: number): Track[] {
  const set = parseTle(DEMO_TLE).sets[0];
  const s = DEMO_SITES[0];
  const { passes } = findPasses(set, { latDeg: s.latDeg, lonDeg: s.lonDeg, heightM: s.heightEllM }, { startMs: nowMs, days: 12 });
  return groupTracks(passes).sort((a, b) => (a.direction === b.direction ? a.incidenceDeg - b.incidenceDeg : a.direction === 'descending' ? -1 : 1));
}

export interface DemoSummary {
  siteIds: string[];
  installationId: string;
}

/** Write the demo scenario. Throws (writing nothing more) if a demo site code is already taken by a live site. */
export async function loadDemoScenario(db: GlintmarkDb, nowMs = Date.now()): Promise<DemoSummary> {
  const ctx = { by: DEMO_CREW, nowMs: nowMs - 2 * DAY_MS };
  const wavelengthM = bandWavelengthM('C');
  const elementsEpochMs = parseTle(DEMO_TLE).sets[0].epochMs;
  const tracks = demoTracks(nowMs);
  const desc = tracks.find((t) => t.direction === 'descending');
  const asc = tracks.find((t) => t.direction === 'ascending');

  const siteIds: string[] = [];
  let installationId = '';
  for (const [i, s] of DEMO_SITES.entries()) {
    const site = await siteRepo.create(
      db,
      { ...s, positionSource: 'gnss-survey', positionAccuracyM: 0.02, referenceFrame: 'ITRF2020', frameEpoch: 2026.9, notes: 'Demo site (invented).', demo: true },
      ctx,
    );
    siteIds.push(site.id);
    for (const track of [desc, asc]) {
      if (!track) continue;
      const reflector = await reflectorRepo.create(
        db,
        {
          siteId: site.id,
          label: `${s.code}-${track.direction === 'descending' ? 'D' : 'A'}`,
          shape: 'triangular',
          edgeM: 1.2,
          construction: { panels: 'solid', drainage: 'three 20 mm holes at the apex', foundation: 'concrete pillar 0.8 m deep' },
          apex: null,
          apexHeightAboveMarkM: 0.35,
          gnssArpOffsetM: null,
          notes: `Demo reflector for the ${track.direction} track.`,
          demo: true,
        },
        ctx,
      );
      const geometry = await geometryRepo.create(
        db,
        {
          siteId: site.id,
          reflectorId: reflector.id,
          incidenceDeg: track.incidenceDeg,
          headingDeg: track.headingDeg,
          look: track.look,
          direction: track.direction,
          band: 'C',
          wavelengthM,
          source: 'orbital-elements',
          satellite: track.satellite,
          elementsEpochMs,
          demo: true,
        },
        ctx,
      );
      if (i === 0 && track === desc) {
        const aim = aimForPass({ incidenceDeg: track.incidenceDeg, headingDeg: track.headingDeg, look: track.look, losAzimuthDeg: track.reflectorAzimuthDeg });
        const measured = { azimuthDeg: aim.reflectorAzimuthDeg + 0.6, tiltDeg: aim.baseTiltDeg - 0.3, rollDeg: 0.2 };
        const installedAtMs = nowMs - DAY_MS;
        const decl = declination({ latDeg: s.latDeg, lonDeg: s.lonDeg, heightM: s.heightEllM, timeMs: installedAtMs });
        const loss = misalignment({ shape: 'triangular', edgeM: 1.2, wavelengthM }, measured, {
          incidenceDeg: track.incidenceDeg, headingDeg: track.headingDeg, look: track.look, losAzimuthDeg: track.reflectorAzimuthDeg,
        }).lossDb;
        const inst = await installationRepo.create(
          db,
          {
            reflectorId: reflector.id,
            siteId: site.id,
            geometryIds: [geometry.id],
            plannedAzimuthDeg: aim.reflectorAzimuthDeg,
            plannedTiltDeg: aim.baseTiltDeg,
            measuredAzimuthDeg: measured.azimuthDeg,
            measuredTiltDeg: measured.tiltDeg,
            measuredRollDeg: measured.rollDeg,
            azimuthMethod: 'sun-shadow',
            declinationDeg: decl.ok ? decl.value.declinationDeg : null,
            declinationModel: decl.ok ? decl.value.model : null,
            fix: { latDeg: s.latDeg, lonDeg: s.lonDeg, accuracyM: 3.5, atMs: installedAtMs },
            predictedLossDb: loss,
            crew: [DEMO_CREW],
            installedAtMs,
            notes: 'Demo installation: azimuth laid out from the sun\'s shadow, checked against the compass away from the vehicle.',
            photoIds: [],
            demo: true,
          },
          { by: DEMO_CREW, nowMs: installedAtMs },
        );
        installationId = inst.id;
      }
    }
  }
  return { siteIds, installationId };
}
