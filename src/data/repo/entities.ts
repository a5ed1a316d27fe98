/** Reflectors, planned geometries, installations and inspections: the generic repository with a list order each. */
import { makeEntityRepo } from './entity.ts';

export const reflectorRepo = makeEntityRepo('reflectors', {
  compare: (a, b) => a.label.localeCompare(b.label, undefined, { numeric: true }) || a.createdAtMs - b.createdAtMs,
});

export const geometryRepo = makeEntityRepo('geometries', {
  compare: (a, b) => a.createdAtMs - b.createdAtMs || a.id.localeCompare(b.id),
});

/** Newest installation first. */
export const installationRepo = makeEntityRepo('installations', {
  compare: (a, b) => b.installedAtMs - a.installedAtMs || a.id.localeCompare(b.id),
});

/** Newest inspection first. */
export const inspectionRepo = makeEntityRepo('inspections', {
  compare: (a, b) => b.inspectedAtMs - a.inspectedAtMs || a.id.localeCompare(b.id),
});
