/**
 * The data layer's public API for the UI (documented in README.md beside this file).
 * Screens import from here; they never import Dexie.
 */
export { openGlintmarkDb, CURRENT_SCHEMA_VERSION, type GlintmarkDb } from './db.ts';
export * from './types.ts';
export * from './errors.ts';

export type { WriteContext } from './repo/context.ts';
export type { EditContext, EntityRepo, ListOptions } from './repo/entity.ts';
export { siteRepo } from './repo/sites.ts';
export { geometryRepo, inspectionRepo, installationRepo, reflectorRepo } from './repo/entities.ts';
export { history, versionAt } from './repo/revisions.ts';
export {
  addPhoto,
  fillPhotoHashes,
  getPhoto,
  listPhotos,
  softDeletePhoto,
  undeletePhoto,
  DEFAULT_MAX_PHOTO_BYTES,
  SUGGESTED_PHOTO_ROLES,
  type AddPhotoOptions,
  type PhotoOwner,
} from './repo/photos.ts';
export { clearDraft, loadDraft, saveDraft, type Draft } from './repo/drafts.ts';
export { getMeta, setMeta, type MetaKey } from './repo/meta.ts';
export { listConflicts, resolveConflict } from './repo/conflicts.ts';
export {
  elementRepo,
  importElementSetsOnce,
  type ElementImportResult,
  type ElementSetInput,
  type PutElementSetsOptions,
} from './repo/elements.ts';

export {
  requestPersistentStorage,
  storageEstimate,
  withReopen,
  STORAGE_WARN_FRACTION,
  type PersistResult,
  type StorageEstimate,
  type StorageManagerLike,
} from './durability.ts';
export {
  backupToJson,
  exportBackup,
  exportBackupArchive,
  exportBackupRecords,
  writeBackupArchive,
  readBackup,
  ARCHIVE_FORMAT,
  ARCHIVE_FORMAT_VERSION,
  ARCHIVE_MIME,
  type ArchiveExportOptions,
  type ArchiveManifest,
  type ReadBackup,
  recordBackupSaved,
  restoreBackup,
  validateBackup,
  BACKUP_FORMAT,
  BACKUP_FORMAT_VERSION,
  BACKUP_TABLES,
  type BackupDocument,
  type BackupTable,
  type ExportOptions,
  type RestoreOptions,
  type TableCounts,
} from './backup.ts';
export { deepEqual } from './equal.ts';
export { decideRecordMerge, headOf, inHistory, withoutBlob, type MergeDecision, type MergeRow } from './mergeDecision.ts';
export { syncConflictIssues, syncElementIssues, syncRecordIssues, syncRevisionIssues } from './syncRows.ts';
export { mergeElementSets } from './mergeElements.ts';
export { rebuildSiteVisits } from './repo/siteVisits.ts';
export { markTransactionQuiet, type OutboxEntry, type SyncStateRecord } from './outbox.ts';
export { mergeBackup, type MergeConflict, type MergeOptions, type MergeReport, type TableMergeReport } from './merge.ts';
export { removeDemoData, type DemoRemovalReport } from './demo.ts';

export { AZIMUTH_METHOD_LABELS } from './words.ts';
export { listDeletedRecords, siteChildCounts, type DeletedEntry } from './deleted.ts';
export { EXPORT_DECIMALS } from './exchange/rounding.ts';
export { siteHeightForGeometryM, siteHeightKind } from './siteHeight.ts';
export { readSiteFile, siteFileKindOf, siteFileWhere, SITE_FILE_COLUMNS, SITE_FILE_MINIMAL_HEADER, type SiteFileKind, type SiteFileRead, type SiteFileRow } from './exchange/siteFile.ts';
export { exportSitesGeoJson, type PointFeature, type SitesFeatureCollection } from './exchange/geojson.ts';
export { exportInspectionsCsv, exportInstallationsCsv, exportSitesCsv, INSPECTION_COLUMNS, INSTALLATION_COLUMNS, SITE_COLUMNS } from './exchange/tablesCsv.ts';
export {
  commitSiteImport,
  previewSiteImport,
  type ImportRejection,
  type SiteDraft,
  type SiteImportKind,
  type SiteImportPreview,
} from './exchange/siteImport.ts';

export { querySiteDetail, querySiteListSources, type SiteDetail } from './queries.ts';
export { filterAndSortSites, foldForSearch, haversineDistanceM, type Here, type SiteListQuery, type SiteListRow, type SiteListSource, type SiteSort } from './siteList.ts';
export {
  getAppDb,
  GlintmarkDbContext,
  useDeletedRecords,
  useGeometries,
  useGlintmarkDb,
  useLiveRead,
  useHistory,
  useInspection,
  useInstallation,
  useOpenConflicts,
  usePhotos,
  useReflectors,
  useSite,
  useSiteDetail,
  useSites,
} from './hooks.ts';
