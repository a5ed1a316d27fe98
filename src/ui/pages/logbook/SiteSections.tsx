/** The parts of the site screen: details, reflectors, planned geometries, installations and inspections. */
import { useState } from 'react';
import { Link, useHistory } from 'react-router-dom';
import type { GeometryRecord, InspectionRecord, InstallationRecord, ReflectorRecord, SiteRecord } from '../../../data/index.ts';
import { fmtNum } from '../../format.ts';
import { fmtUtcAndSite } from '../../siteTime.ts';
import { useStore } from '../../state/store.ts';
import { workflow } from '../../state/workflow.ts';
import { DemoBadge } from './bits.tsx';
import { describeGeometry } from './geometryPlan.ts';
import { checklistSummary } from './inspectionForm.ts';
import { ReflectorEditor } from './ReflectorEditor.tsx';
import { reflectorFormFromPlan } from './reflectorForm.ts';
import { siteInputFromRecord } from './siteForm.ts';
import { CHECKLIST_LABELS, fmtUtc, METHOD_WORDS, POSITION_SOURCE_WORDS, siteHeightWords } from './words.ts';

export function SiteDetails(props: { site: SiteRecord }) {
  const s = props.site;
  return (
    <dl className="gm-lb-dl" data-testid="site-details">
      <dt>Latitude (°)</dt>
      <dd data-testid="site-lat-value">{fmtNum(s.latDeg, 7)}</dd>
      <dt>Longitude (°)</dt>
      <dd data-testid="site-lon-value">{fmtNum(s.lonDeg, 7)}</dd>
      <dt>Height</dt>
      <dd data-testid="site-height-value">{siteHeightWords(s)}</dd>
      <dt>Position source</dt>
      <dd>{POSITION_SOURCE_WORDS[s.positionSource]}</dd>
      <dt>Horizontal accuracy (m)</dt>
      <dd>{s.positionAccuracyM === null ? 'unknown' : fmtNum(s.positionAccuracyM, 1)}</dd>
      <dt>Reference frame</dt>
      <dd>
        {s.referenceFrame}
        {s.frameEpoch !== null ? `, epoch ${s.frameEpoch}` : ''}
      </dd>
      <dt>Notes</dt>
      <dd className="gm-lb-text" data-testid="site-notes-value">
        {s.notes || '—'}
      </dd>
      <dt>Stored</dt>
      <dd>
        revision {s.rev}, last changed {fmtUtc(s.updatedAtMs)}
      </dd>
    </dl>
  );
}

function ReflectorCard(props: { r: ReflectorRecord; site: SiteRecord; onEdit: () => void }) {
  const { r, site } = props;
  const nav = useHistory();
  const install = () => {
    workflow.set({ site: siteInputFromRecord(site) });
    nav.push(`/logbook/new-installation?reflector=${r.id}`);
  };
  const c = r.construction;
  return (
    <li className="gm-card" style={{ marginBottom: 8 }} data-testid={`reflector-${r.label}`}>
      <h3 style={{ margin: '0 0 4px' }}>
        Reflector {r.label} <DemoBadge demo={r.demo} />
      </h3>
      <p className="gm-lb-meta">
        {r.shape === 'square' ? 'Square' : 'Triangular'} trihedral, inner edge {fmtNum(r.edgeM, 2)} m, {c.panels === 'mesh' ? `mesh panels (${fmtNum(c.meshOpeningMm ?? NaN, 0)} mm opening)` : 'solid panels'}
        ; apex {fmtNum(r.apexHeightAboveMarkM, 2)} m above the mark.
      </p>
      {r.apex ? (
        <p className="gm-lb-meta">
          Apex {fmtNum(r.apex.latDeg, 7)}°, {fmtNum(r.apex.lonDeg, 7)}°, {fmtNum(r.apex.heightEllM, 3)} m ellipsoidal.
        </p>
      ) : null}
      {r.gnssArpOffsetM ? (
        <p className="gm-lb-meta">
          GNSS antenna offset: east {fmtNum(r.gnssArpOffsetM.eastM, 3)} m, north {fmtNum(r.gnssArpOffsetM.northM, 3)} m, up {fmtNum(r.gnssArpOffsetM.upM, 3)} m.
        </p>
      ) : null}
      {c.drainage ? <p className="gm-lb-meta gm-lb-text">Drainage: {c.drainage}</p> : null}
      {c.foundation ? <p className="gm-lb-meta gm-lb-text">Foundation: {c.foundation}</p> : null}
      {r.notes ? <p className="gm-lb-meta gm-lb-text">{r.notes}</p> : null}
      <div className="gm-lb-actions">
        <Link className="gm-btn gm-lb-linkbtn" to={`/logbook/inspection/new/${r.id}`} data-testid={`inspect-${r.label}`}>
          Inspect
        </Link>
        <button type="button" className="gm-btn" onClick={install} data-testid={`install-${r.label}`}>
          Record installation
        </button>
        <button type="button" className="gm-btn" onClick={props.onEdit} data-testid={`edit-reflector-${r.label}`}>
          Edit
        </button>
      </div>
    </li>
  );
}

export function ReflectorSection(props: { site: SiteRecord; reflectors: ReflectorRecord[]; startAdding?: boolean }) {
  const wf = useStore(workflow);
  const [editing, setEditing] = useState<string | 'new' | null>(props.startAdding ? 'new' : null);
  const live = props.site.deletedAtMs === null;
  return (
    <section className="gm-section" aria-labelledby="refl-h">
      <h2 id="refl-h">Reflectors ({props.reflectors.length})</h2>
      {props.reflectors.length === 0 ? <p className="gm-note">No reflector recorded on this site yet.</p> : null}
      <ul className="gm-lb-list">
        {props.reflectors.map((r) =>
          editing === r.id ? (
            <li key={r.id}>
              <ReflectorEditor siteId={props.site.id} existing={r} initial={reflectorFormFromPlan(wf, [])} onSaved={() => setEditing(null)} onCancel={() => setEditing(null)} />
            </li>
          ) : (
            <ReflectorCard key={r.id} r={r} site={props.site} onEdit={() => setEditing(r.id)} />
          ),
        )}
      </ul>
      {editing === 'new' ? (
        <ReflectorEditor
          siteId={props.site.id}
          initial={reflectorFormFromPlan(wf, props.reflectors.map((r) => r.label))}
          onSaved={() => setEditing(null)}
          onCancel={() => setEditing(null)}
        />
      ) : live ? (
        <button type="button" className="gm-btn" onClick={() => setEditing('new')} data-testid="add-reflector">
          + Add reflector
        </button>
      ) : null}
    </section>
  );
}

export function GeometryTable(props: { geometries: GeometryRecord[]; reflectors: ReflectorRecord[] }) {
  if (props.geometries.length === 0) return <p className="gm-note">No planned geometries recorded (they are added with an installation made from a plan).</p>;
  const label = (id: string | null) => (id === null ? 'any' : (props.reflectors.find((r) => r.id === id)?.label ?? '—'));
  return (
    <ul className="gm-lb-list" data-testid="geometry-list">
      {props.geometries.map((g) => (
        <li key={g.id} className="gm-lb-meta">
          Reflector {label(g.reflectorId)}: {describeGeometry(g)} <DemoBadge demo={g.demo} />
        </li>
      ))}
    </ul>
  );
}

export function InstallationList(props: { installations: InstallationRecord[]; reflectors: ReflectorRecord[]; zone?: string | null }) {
  if (props.installations.length === 0) return <p className="gm-note">No installation recorded.</p>;
  const label = (id: string) => props.reflectors.find((r) => r.id === id)?.label ?? '—';
  return (
    <ul className="gm-lb-list">
      {props.installations.map((i) => (
        <li key={i.id}>
          <Link className="gm-lb-row" to={`/logbook/installation/${i.id}`} data-testid="installation-row">
            <b>{props.zone ? fmtUtcAndSite(i.installedAtMs, props.zone) : fmtUtc(i.installedAtMs)}</b> · reflector {label(i.reflectorId)} <DemoBadge demo={i.demo} />
            <p className="gm-lb-meta">
              Azimuth {fmtNum(i.measuredAzimuthDeg, 2)}° true (planned {fmtNum(i.plannedAzimuthDeg, 2)}°), tilt {fmtNum(i.measuredTiltDeg, 2)}°, roll{' '}
              {fmtNum(i.measuredRollDeg, 2)}° · {METHOD_WORDS[i.azimuthMethod]} · {i.photoIds.length} photo{i.photoIds.length === 1 ? '' : 's'}
            </p>
          </Link>
        </li>
      ))}
    </ul>
  );
}

export function InspectionList(props: { inspections: InspectionRecord[]; reflectors: ReflectorRecord[]; zone?: string | null }) {
  if (props.inspections.length === 0) return <p className="gm-note">No inspection recorded.</p>;
  const label = (id: string) => props.reflectors.find((r) => r.id === id)?.label ?? '—';
  return (
    <ul className="gm-lb-list">
      {props.inspections.map((i) => (
        <li key={i.id}>
          <Link className="gm-lb-row" to={`/logbook/inspection/${i.id}`} data-testid="inspection-row">
            <b>{props.zone ? fmtUtcAndSite(i.inspectedAtMs, props.zone) : fmtUtc(i.inspectedAtMs)}</b> · reflector {label(i.reflectorId)} <DemoBadge demo={i.demo} />
            <p className="gm-lb-meta">{checklistSummary(i.checklist, CHECKLIST_LABELS)}</p>
          </Link>
        </li>
      ))}
    </ul>
  );
}
