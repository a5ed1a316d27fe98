/** A stored inspection: edit (a revision per save), photos, history, soft delete with Undo. */
import { inspectionRepo, useGlintmarkDb, useInspection, type InspectionFields, type InspectionRecord } from '../../../data/index.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { workflow } from '../../state/workflow.ts';
import { WhenStored } from './banners.tsx';
import { shownErrors } from './inputs.tsx';
import { InspectionFieldset } from './InspectionFieldset.tsx';
import { inspectionFormFromRecord, isInspectionForm, parseInspectionForm, type InspectionForm } from './inspectionForm.ts';
import { RecordEditScreen } from './RecordEditScreen.tsx';
import { withoutMeta } from './siteForm.ts';
import { useEditSession } from './useEditSession.ts';
import { fmtUtc, writtenBy } from './words.ts';

function EditForm(props: { rec: InspectionRecord }) {
  const { rec } = props;
  const db = useGlintmarkDb();
  const st = useStore(settings);
  const wf = useStore(workflow);
  const edit = useEditSession({
    draftKey: `inspection-edit:${rec.id}`,
    rec,
    toForm: inspectionFormFromRecord,
    isForm: isInspectionForm,
    parse: (f: InspectionForm) => parseInspectionForm(f).fields,
    current: (r): Omit<InspectionFields, 'photoIds'> => withoutMeta(r),
    write: (patch, expectedRev) => inspectionRepo.update(db, rec.id, patch, { by, expectedRev }),
  });
  const { form, update } = edit;
  const parsed = parseInspectionForm(form);
  const by = writtenBy(st.crewName, parsed.fields?.crew ?? rec.crew);

  return (
    <RecordEditScreen
      noun="inspection"
      rec={rec}
      when={`inspected ${fmtUtc(rec.inspectedAtMs)}`}
      edit={edit}
      by={by}
      repo={inspectionRepo}
      fields={<InspectionFieldset form={form} set={update} errors={shownErrors(parsed.errors, form, true)} capture={wf.capture} />}
    />
  );
}

export function EditInspection(props: { id: string }) {
  const rec = useInspection(props.id);
  return (
    <WhenStored rec={rec} back="Logbook" testId="inspection-missing" missing="This inspection is not stored on this device.">
      {(r) => <EditForm rec={r} />}
    </WhenStored>
  );
}
