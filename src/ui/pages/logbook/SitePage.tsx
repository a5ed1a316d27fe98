/**
 * One site: details (units in labels), reflectors, planned geometries, installations, inspections and the history
 * timeline; "Use this site" hands it to Plan or Passes; delete is soft, with Undo.
 */
import { useEffect, useState } from 'react';
import { useHistory, useLocation, useParams } from 'react-router-dom';
import { siteChildCounts, siteRepo, useGlintmarkDb, useSiteDetail, withReopen, type SiteDetail, type SiteRecord } from '../../../data/index.ts';
import { siteTimeZone } from '../../siteTime.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { workflow } from '../../state/workflow.ts';
import { ApplyToCurrentButton, DeletedBanner, WhenStored } from './banners.tsx';
import { BackLink, DemoBadge, ErrorNote, SaveButton, SavedNote } from './bits.tsx';
import { shownErrors } from './inputs.tsx';
import { LogbookShell } from './LogbookShell.tsx';
import { NextPass } from './NextPass.tsx';
import { parseSiteForm, sitePatch, siteFormFromRecord, siteInputFromRecord, withoutMeta, type SiteForm } from './siteForm.ts';
import { SiteFormFields } from './SiteFormFields.tsx';
import { GeometryTable, InspectionList, InstallationList, ReflectorSection, SiteDetails } from './SiteSections.tsx';
import { Timeline } from './Timeline.tsx';
import { DeletedRecords } from './DeletedRecords.tsx';
import { loadSiteTimeline, type TimelineEntry } from './timeline.ts';
import { useSaveState } from './useSaveState.ts';
import { useToggleDeleted } from './useToggleDeleted.ts';
import { siteChildWords, writtenBy } from './words.ts';

function SiteEditor(props: { site: SiteRecord; onDone: (saved: boolean) => void }) {
  const db = useGlintmarkDb();
  const st = useStore(settings);
  // The version the edit started from: only the fields changed since then are written, and only onto that rev
  // unless the crew chooses to apply them to the current version after a refusal.
  const [base] = useState(() => ({ rev: props.site.rev, fields: withoutMeta(props.site) }));
  const [form, setForm] = useState<SiteForm>(() => siteFormFromRecord(props.site));
  const { busy, error, setError, stale, run } = useSaveState();
  const parsed = parseSiteForm(form, props.site.demo);
  const save = async (onto?: 'current') => {
    if (!parsed.fields) {
      setError('Check the marked fields.');
      return;
    }
    const patch = sitePatch(base.fields, parsed.fields);
    const expectedRev = onto === 'current' ? props.site.rev : base.rev;
    await run(async () => {
      await withReopen(db, () => siteRepo.update(db, props.site.id, patch, { by: writtenBy(st.crewName), expectedRev }));
      props.onDone(true);
    });
  };
  return (
    <section className="gm-card" aria-label="Edit site" data-testid="site-edit-form">
      <SiteFormFields form={form} setForm={setForm} errors={shownErrors(parsed.errors, form, true)} />
      <div className="gm-lb-actions">
        <SaveButton busy={busy} onSave={() => void save()} testId="save-site">
          Save changes
        </SaveButton>
        <button type="button" className="gm-btn" onClick={() => props.onDone(false)}>
          Cancel
        </button>
      </div>
      <ErrorNote message={error} />
      {stale ? <ApplyToCurrentButton onClick={() => void save('current')} /> : null}
    </section>
  );
}

function SiteBody(props: { detail: SiteDetail }) {
  const { site, reflectors, geometries, installations, inspections, conflicts } = props.detail;
  const db = useGlintmarkDb();
  const st = useStore(settings);
  const nav = useHistory();
  const justCreated = new URLSearchParams(useLocation().search).get('saved') === 'new';
  const [addingReflector, setAddingReflector] = useState(0);
  const [editing, setEditing] = useState(false);
  const [saved, setSaved] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [timeline, setTimeline] = useState<TimelineEntry[] | null>(null);
  const deleted = site.deletedAtMs !== null;
  const zone = siteTimeZone(site.latDeg, site.lonDeg);

  useEffect(() => {
    let live = true;
    loadSiteTimeline(db, site.id)
      .then((t) => live && setTimeline(t))
      .catch((e: unknown) => live && setError(`The history could not be read: ${e instanceof Error ? e.message : String(e)}`));
    return () => {
      live = false;
    };
  }, [db, props.detail, site.id]);

  const use = (path: string) => {
    workflow.set({ site: siteInputFromRecord(site) });
    nav.push(path);
  };
  const toggleDeleted = useToggleDeleted(siteRepo, site, writtenBy(st.crewName), `Site ${site.code}`, { setSaved, setError });
  const [confirming, setConfirming] = useState<string | null>(null);
  /** Ask first when the site has children, naming how many of each go with it; a bare site is deleted at once (Undo). */
  const askDelete = async () => {
    const n = await siteChildCounts(db, site.id);
    const parts = siteChildWords(n);
    if (parts.length === 0) await toggleDeleted();
    else setConfirming(`Delete site ${site.code} with ${parts.join(', ')}? They stay restorable from “Deleted records” until removed for good.`);
  };

  return (
    <>
      <BackLink to="/logbook">All sites</BackLink>
      <h1 data-testid="site-title">
        {site.code} <DemoBadge demo={site.demo} />
      </h1>
      {site.name ? <p className="gm-lb-text">{site.name}</p> : null}
      {justCreated && !deleted ? (
        <div className="gm-card" data-testid="site-created">
          <SavedNote testId="saved">{`Site ${site.code} saved on this device`}</SavedNote>
          {reflectors.length === 0 ? (
            <div className="gm-lb-actions">
              <button
                type="button"
                className="gm-btn gm-primary"
                data-testid="add-its-reflector"
                onClick={() => {
                  setAddingReflector((n) => n + 1);
                  requestAnimationFrame(() => document.getElementById('refl-h')?.scrollIntoView({ block: 'start' }));
                }}
              >
                Add its reflector
              </button>
            </div>
          ) : null}
        </div>
      ) : null}
      {deleted ? (
        <DeletedBanner testId="site-deleted" onUndo={() => void toggleDeleted()}>
          <b>✕ This site is deleted</b> (with the reflectors, installations and inspections deleted with it). Nothing is lost until you remove it
          for good: Undo restores them all.
        </DeletedBanner>
      ) : null}
      {saved ? <SavedNote>{saved}</SavedNote> : null}
      <ErrorNote message={error} />
      {conflicts.length ? (
        <p className="gm-warn" data-testid="site-conflicts">
          ⚠ {conflicts.length} merge conflict{conflicts.length === 1 ? '' : 's'} about this site; review in Settings.
        </p>
      ) : null}
      {!deleted ? (
        <div className="gm-lb-actions">
          <button type="button" className="gm-btn gm-primary" onClick={() => use('/plan')} data-testid="use-site-plan">
            Use this site → Plan
          </button>
          <button type="button" className="gm-btn" onClick={() => use('/passes')} data-testid="use-site-passes">
            Use this site → Passes
          </button>
        </div>
      ) : null}
      <NextPass site={site} geometries={geometries} reflectors={reflectors} />

      <section className="gm-section" aria-labelledby="details-h">
        <h2 id="details-h">Site details</h2>
        {editing ? <SiteEditor
            site={site}
            onDone={(ok) => {
              setEditing(false);
              setSaved(ok ? 'Saved on this device' : null);
            }}
          /> : <SiteDetails site={site} />}
        {!editing && !deleted ? (
          <div className="gm-lb-actions">
            <button type="button" className="gm-btn" onClick={() => setEditing(true)} data-testid="edit-site">
              Edit site
            </button>
            <button type="button" className="gm-btn" onClick={() => void askDelete()} data-testid="delete-site">
              Delete site
            </button>
          </div>
        ) : null}
        {confirming && !deleted ? (
          <div className="gm-card" role="alertdialog" aria-label="Confirm deleting the site" data-testid="confirm-delete-site">
            <p>{confirming}</p>
            <div className="gm-lb-actions">
              <button
                type="button"
                className="gm-btn gm-primary"
                data-testid="confirm-delete-site-yes"
                onClick={() => {
                  setConfirming(null);
                  void toggleDeleted();
                }}
              >
                Delete all
              </button>
              <button type="button" className="gm-btn" onClick={() => setConfirming(null)} data-testid="confirm-delete-site-no">
                Keep the site
              </button>
            </div>
          </div>
        ) : null}
      </section>

      <ReflectorSection key={addingReflector} site={site} reflectors={reflectors} startAdding={addingReflector > 0} />
      <section className="gm-section" aria-labelledby="geo-h">
        <h2 id="geo-h">Planned geometries ({geometries.length})</h2>
        <GeometryTable geometries={geometries} reflectors={reflectors} />
      </section>
      <section className="gm-section" aria-labelledby="inst-h">
        <h2 id="inst-h">Installations ({installations.length})</h2>
        <InstallationList installations={installations} reflectors={reflectors} zone={zone} />
      </section>
      <section className="gm-section" aria-labelledby="insp-h">
        <h2 id="insp-h">Inspections ({inspections.length})</h2>
        <InspectionList inspections={inspections} reflectors={reflectors} zone={zone} />
      </section>
      {!deleted ? <DeletedRecords siteId={site.id} title="Deleted on this site" /> : null}
      <section className="gm-section" aria-labelledby="hist-h">
        <h2 id="hist-h">History</h2>
        {timeline === null ? <p>Loading history…</p> : <Timeline entries={timeline} />}
      </section>
    </>
  );
}

function SiteScreen(props: { siteId: string }) {
  const detail = useSiteDetail(props.siteId);
  return (
    <WhenStored rec={detail} back="All sites" testId="site-missing" missing="This site is not stored on this device.">
      {(d) => <SiteBody detail={d} />}
    </WhenStored>
  );
}

export function SitePage() {
  const { siteId } = useParams<{ siteId: string }>();
  return (
    <LogbookShell title="Site">
      <SiteScreen key={siteId} siteId={siteId} />
    </LogbookShell>
  );
}
