/**
 * The "New site" form, checked in place. "Saved on this device" appears only after siteRepo.create resolved;
 * a refused save (duplicate code, storage full …) keeps the form and says why beside it. Saved from the Logbook, the
 * phone goes straight to the new site, whose page shows the confirmation at the top and offers to add its reflector;
 * with `onSaved` (inside another form) the confirmation appears beside the Save button instead.
 */
import { useState } from 'react';
import { Link, useHistory } from 'react-router-dom';
import { siteRepo, useGlintmarkDb, withReopen, type SiteRecord } from '../../../data/index.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { workflow } from '../../state/workflow.ts';
import { ErrorNote, SaveButton, SavedNote } from './bits.tsx';
import { shownErrors } from './inputs.tsx';
import { EMPTY_SITE_FORM, parseSiteForm, siteFormFromWorkflow, type SiteForm } from './siteForm.ts';
import { SiteFormFields } from './SiteFormFields.tsx';
import { useSaveState } from './useSaveState.ts';
import { writtenBy } from './words.ts';
import { SafetyNotice } from '../../components/SafetyNotice.tsx';

export function NewSiteCard(props: { initial?: SiteForm; onSaved?: (s: SiteRecord) => void; title?: string }) {
  const db = useGlintmarkDb();
  const st = useStore(settings);
  const nav = useHistory();
  const [form, setForm] = useState<SiteForm>(() => {
    if (props.initial) return props.initial;
    const s = workflow.get().site;
    return s && s.source !== 'logbook' ? siteFormFromWorkflow(s) : EMPTY_SITE_FORM;
  });
  const [tried, setTried] = useState(false);
  const { busy, error, setError, run } = useSaveState();
  const [codeTaken, setCodeTaken] = useState<string | null>(null);
  const [saved, setSaved] = useState<SiteRecord | null>(null);
  const parsed = parseSiteForm(form);
  const errors = { ...shownErrors(parsed.errors, form, tried), ...(codeTaken && codeTaken === form.code.trim() ? { code: `Code ${codeTaken} is already used by another site on this device` } : {}) };

  const edit = (f: SiteForm) => {
    setForm(f);
    setSaved(null);
    setError(null);
  };
  const save = async () => {
    setTried(true);
    setSaved(null);
    if (!parsed.fields) {
      setError('Check the marked fields.');
      return;
    }
    setError(null);
    const fields = parsed.fields;
    await run(
      async () => {
        const rec = await withReopen(db, () => siteRepo.create(db, fields, { by: writtenBy(st.crewName) }));
        if (!props.onSaved) {
          nav.push(`/logbook/site/${rec.id}?saved=new`);
          return;
        }
        setSaved(rec);
        setForm(EMPTY_SITE_FORM);
        setTried(false);
        props.onSaved(rec);
      },
      (e) => {
        if (e instanceof Error && e.name === 'DuplicateCodeError') setCodeTaken(fields.code);
      },
    );
  };

  return (
    <section className="gm-card" aria-labelledby="new-site-h" data-testid="new-site-form">
      <h2 id="new-site-h">{props.title ?? 'New site'}</h2>
      <SiteFormFields form={form} setForm={edit} errors={errors} />
      <SafetyNotice hazards={['access', 'digging', 'traffic']} title="Setting up a new site" />
      <div className="gm-lb-actions">
        <SaveButton busy={busy} onSave={() => void save()} testId="save-site">
          Save site
        </SaveButton>
      </div>
      <ErrorNote message={error} />
      {saved ? (
        <div>
          <SavedNote />
          <p>
            <Link to={`/logbook/site/${saved.id}`} data-testid="open-new-site">
              Open site {saved.code}
            </Link>
          </p>
        </div>
      ) : null}
    </section>
  );
}
