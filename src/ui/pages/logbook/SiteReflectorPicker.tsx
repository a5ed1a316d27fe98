/**
 * Choose the site and reflector of a new record, or add them on the spot: the planned site (from Passes/Plan) when
 * it is not in the logbook yet, and a reflector with the shape and edge of the plan.
 */
import { useState } from 'react';
import { useReflectors, useSites, type ReflectorRecord, type SiteRecord } from '../../../data/index.ts';
import { SelectField } from '../../components/fields.tsx';
import { fmtDeg } from '../../format.ts';
import type { Workflow } from '../../state/workflow.ts';
import { workflow } from '../../state/workflow.ts';
import { ErrorNote, SavedNote } from './bits.tsx';
import { NewSiteCard } from './NewSiteCard.tsx';
import { ReflectorEditor } from './ReflectorEditor.tsx';
import { reflectorFormFromPlan } from './reflectorForm.ts';
import { findWorkflowSite, siteFormFromWorkflow, siteInputFromRecord } from './siteForm.ts';

export function SiteReflectorPicker(props: {
  wf: Workflow;
  siteId: string;
  reflectorId: string;
  set: (patch: { siteId?: string; reflectorId?: string }) => void;
  errors: { siteId?: string; reflectorId?: string };
}) {
  const sites = useSites();
  const reflectors = useReflectors(props.siteId);
  const [addingSite, setAddingSite] = useState(false);
  const [addingRefl, setAddingRefl] = useState(false);
  const [savedNote, setSavedNote] = useState<string | null>(null);
  const list: SiteRecord[] = sites?.map((r) => r.site) ?? [];
  const wfSite = props.wf.site;
  const wfSiteMissing = wfSite !== null && sites !== undefined && findWorkflowSite(list, wfSite) === null;

  const siteAdded = (s: SiteRecord) => {
    props.set({ siteId: s.id, reflectorId: '' });
    workflow.set({ site: siteInputFromRecord(s) });
    setAddingSite(false);
    setSavedNote(`Site ${s.code} saved on this device`);
  };
  const reflectorAdded = (r: ReflectorRecord) => {
    props.set({ reflectorId: r.id });
    setAddingRefl(false);
    setSavedNote(`Reflector ${r.label} saved on this device`);
  };

  return (
    <fieldset className="gm-lb-fieldset">
      <legend>Site and reflector</legend>
      <SelectField
        label="Site"
        value={props.siteId}
        options={[{ value: '', label: sites === undefined ? 'Loading…' : '— choose a site —' }, ...list.map((s) => ({ value: s.id, label: `${s.code}${s.name ? ' — ' + s.name : ''}${s.demo ? ' (DEMO)' : ''}` }))]}
        onChange={(v) => props.set({ siteId: v, reflectorId: '' })}
        testId="pick-site"
      />
      <ErrorNote message={props.errors.siteId} testId="pick-site-error" />
      {wfSiteMissing && !addingSite ? (
        <p className="gm-warn" data-testid="site-not-in-logbook">
          The planned site ({fmtDeg(wfSite.latDeg, 5)}, {fmtDeg(wfSite.lonDeg, 5)}) is not in the logbook yet.{' '}
          <button type="button" className="gm-btn" onClick={() => setAddingSite(true)} data-testid="create-site-from-plan">
            Add it as a site
          </button>
        </p>
      ) : null}
      {addingSite ? (
        <NewSiteCard title="Add the site" initial={wfSite && wfSiteMissing ? siteFormFromWorkflow(wfSite) : undefined} onSaved={siteAdded} />
      ) : (
        <button type="button" className="gm-btn" onClick={() => setAddingSite(true)} data-testid="add-site-inline">
          + New site
        </button>
      )}
      {props.siteId ? (
        <>
          <SelectField
            label="Reflector"
            value={props.reflectorId}
            options={[
              { value: '', label: reflectors === undefined ? 'Loading…' : reflectors.length ? '— choose a reflector —' : '— none yet: add one —' },
              ...(reflectors ?? []).map((r) => ({ value: r.id, label: `${r.label} (${r.shape}, ${r.edgeM} m)${r.demo ? ' (DEMO)' : ''}` })),
            ]}
            onChange={(v) => props.set({ reflectorId: v })}
            testId="pick-reflector"
          />
          <ErrorNote message={props.errors.reflectorId} testId="pick-reflector-error" />
          {addingRefl ? (
            <ReflectorEditor
              siteId={props.siteId}
              initial={reflectorFormFromPlan(props.wf, (reflectors ?? []).map((r) => r.label))}
              onSaved={reflectorAdded}
              onCancel={() => setAddingRefl(false)}
            />
          ) : (
            <button type="button" className="gm-btn" onClick={() => setAddingRefl(true)} data-testid="add-reflector-inline">
              + New reflector
            </button>
          )}
        </>
      ) : null}
      {savedNote ? <SavedNote testId="picker-saved">{savedNote}</SavedNote> : null}
    </fieldset>
  );
}
