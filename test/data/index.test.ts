import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import * as api from '../../src/data/index.ts';

describe('public API', () => {
  it('exposes the documented entry points (README.md) from one module', () => {
    const fns = [
      'openGlintmarkDb', 'history', 'versionAt', 'addPhoto', 'getPhoto', 'listPhotos', 'softDeletePhoto', 'undeletePhoto',
      'saveDraft', 'loadDraft', 'clearDraft', 'getMeta', 'setMeta', 'listConflicts', 'resolveConflict',
      'requestPersistentStorage', 'storageEstimate', 'withReopen', 'exportBackup', 'backupToJson', 'recordBackupSaved',
      'restoreBackup', 'validateBackup', 'mergeBackup', 'removeDemoData', 'exportSitesGeoJson', 'exportInstallationsCsv',
      'exportInspectionsCsv', 'exportSitesCsv', 'previewSiteImport', 'commitSiteImport', 'querySiteListSources',
      'querySiteDetail', 'filterAndSortSites', 'foldForSearch', 'haversineDistanceM', 'getAppDb', 'useGlintmarkDb', 'useSites',
      'useSite', 'useSiteDetail', 'useReflectors', 'useGeometries', 'useInstallation', 'useInspection', 'useHistory',
      'usePhotos', 'useOpenConflicts', 'importElementSetsOnce',
    ] as const;
    for (const f of fns) expect(typeof api[f], f).toBe('function');
    for (const r of [api.siteRepo, api.reflectorRepo, api.geometryRepo, api.installationRepo, api.inspectionRepo]) {
      expect(Object.keys(r).sort()).toEqual(['create', 'get', 'list', 'softDelete', 'table', 'undelete', 'update']);
    }
    expect(Object.keys(api.elementRepo).sort()).toEqual(['get', 'list', 'put', 'remove']);
    expect(api.BACKUP_TABLES).toContain('elements');
    expect(api.SUGGESTED_PHOTO_ROLES).toHaveLength(7);
    expect(api.CURRENT_SCHEMA_VERSION).toBe(5);
  });
});
