/**
 * A stored installation: edit it (each save writes a revision, refused if the record changed meanwhile), add or
 * remove photos, see its history, delete it softly with Undo. Unsaved edits are kept as a draft.
 */
import { installationRepo, useGlintmarkDb, useInstallation, type InstallationRecord } from '../../../data/index.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { WhenStored } from './banners.tsx';
import { shownErrors } from './inputs.tsx';
import { InstallationFieldset } from './InstallationFieldset.tsx';
import { installationFormFromRecord, isInstallationForm, parseInstallationForm, type InstallationCoreFields, type InstallationForm } from './installationForm.ts';
import { RecordEditScreen } from './RecordEditScreen.tsx';
import { withoutMeta } from './siteForm.ts';
import { useEditSession } from './useEditSession.ts';
import { fmtUtc, writtenBy } from './words.ts';

function EditForm(props: { rec: InstallationRecord }) {
  const { rec } = props;
  const db = useGlintmarkDb();
  const st = useStore(settings);
  const edit = useEditSession({
    draftKey: `installation-edit:${rec.id}`,
    rec,
    toForm: installationFormFromRecord,
    isForm: isInstallationForm,
    parse: (f: InstallationForm) => parseInstallationForm(f).fields,
    current: (r): InstallationCoreFields => withoutMeta(r),
    write: (patch, expectedRev) => installationRepo.update(db, rec.id, patch, { by, expectedRev }),
  });
  const { form, update } = edit;
  const parsed = parseInstallationForm(form);
  const by = writtenBy(st.crewName, parsed.fields?.crew ?? rec.crew);
  const n = rec.geometryIds.length;

  return (
    <RecordEditScreen
      noun="installation"
      rec={rec}
      when={`installed ${fmtUtc(rec.installedAtMs)}`}
      edit={edit}
      by={by}
      repo={installationRepo}
      fields={<InstallationFieldset form={form} set={update} errors={shownErrors(parsed.errors, form, true)} />}
    >
      <p className="gm-note">
        Serves {n} planned geometr{n === 1 ? 'y' : 'ies'} of the site (listed on the site screen).
      </p>
    </RecordEditScreen>
  );
}

export function EditInstallation(props: { id: string }) {
  const rec = useInstallation(props.id);
  return (
    <WhenStored rec={rec} back="Logbook" testId="installation-missing" missing="This installation is not stored on this device.">
      {(r) => <EditForm rec={r} />}
    </WhenStored>
  );
}
