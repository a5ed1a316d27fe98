/**
 * Keep the crew's current task (site, geometries, aim, capture) in the logbook database's drafts, so a phone that
 * kills the app in the background reopens where the crew left off.
 */
import { loadDraft, saveDraft, type GlintmarkDb } from '../../data/index.ts';
import { DEFAULT_WORKFLOW, isLegacyExample, workflow, type Workflow } from './workflow.ts';

const KEY = 'workflow';

/** Shape check for a draft that may come from an older app version. */
function isWorkflow(v: unknown): v is Workflow {
  const w = v as Partial<Workflow> | null;
  return !!w && Array.isArray(w.geometries) && typeof w.shape === 'string' && typeof w.edgeM === 'string' && typeof w.band === 'string';
}

/**
 * Put back the saved task, unless the crew has already changed something since the app started (the screen is
 * shown before the database has opened, so a fast tap must not be overwritten by an older draft).
 */
export async function restoreWorkflow(db: GlintmarkDb): Promise<void> {
  const before = workflow.get();
  const d = await loadDraft<unknown>(db, KEY);
  if (d && isWorkflow(d.value) && workflow.get() === before) {
    const w = d.value;
    const geometries = w.geometries.every(isLegacyExample) && !w.target ? DEFAULT_WORKFLOW.geometries : w.geometries;
    workflow.set({ ...DEFAULT_WORKFLOW, ...w, geometries });
  }
}

/**
 * Save on every change, at most every 300 ms, and at once when the page is hidden (app backgrounded or closed).
 * Returns an unsubscribe function.
 */
export function persistWorkflow(db: GlintmarkDb): () => void {
  let timer: ReturnType<typeof setTimeout> | undefined;
  let pending = false;
  const save = () => {
    clearTimeout(timer);
    if (!pending) return;
    pending = false;
    saveDraft(db, KEY, workflow.get()).catch(() => {
      /* the draft is a convenience: a failed write leaves the previous draft in place */
    });
  };
  const unsub = workflow.subscribe(() => {
    pending = true;
    clearTimeout(timer);
    timer = setTimeout(save, 300);
  });
  const onHide = () => {
    if (document.visibilityState === 'hidden') save();
  };
  document.addEventListener('visibilitychange', onHide);
  window.addEventListener('pagehide', save);
  return () => {
    save();
    unsub();
    document.removeEventListener('visibilitychange', onHide);
    window.removeEventListener('pagehide', save);
  };
}
