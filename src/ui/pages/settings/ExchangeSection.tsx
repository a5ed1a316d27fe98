/**
 * Exchange with other tools: exports (GeoJSON for maps, CSV for spreadsheets) and the two-step site import
 * (preview listing every accepted and rejected row; nothing written until "Import N sites").
 */
import { useState } from 'react';
import {
  commitSiteImport,
  exportInspectionsCsv,
  exportInstallationsCsv,
  exportSitesCsv,
  exportSitesGeoJson,
  previewSiteImport,
  useGlintmarkDb,
  type GlintmarkDb,
  type SiteImportPreview,
} from '../../../data/index.ts';
import { saveTextFile } from '../../../sensors/backupFile.ts';
import { settings } from '../../state/settings.ts';
import { useStore } from '../../state/store.ts';
import { EXPORT_FILE_TYPES, EXPORT_KINDS, exportFileName, importKindOf, type ExportKind } from './fileNames.ts';
import { FilePicker } from './FilePicker.tsx';
import { ImportPreviewTable } from './ImportPreviewTable.tsx';
import { importButtonLabel } from './importPreview.ts';
import { messageOf } from './uiErrors.ts';

/** Site lists are small; a file far larger than this is not one. */
const MAX_IMPORT_BYTES = 10_000_000;

const EXPORTERS: Record<ExportKind, (db: GlintmarkDb, nowMs: number) => Promise<string>> = {
  'sites-geojson': async (db, nowMs) => JSON.stringify(await exportSitesGeoJson(db, nowMs), null, 2) + '\n',
  'sites-csv': (db) => exportSitesCsv(db),
  'installations-csv': (db) => exportInstallationsCsv(db),
  'inspections-csv': (db) => exportInspectionsCsv(db),
};

export function ExchangeSection(props: { onChanged: () => void }) {
  const db = useGlintmarkDb();
  const crew = useStore(settings).crewName.trim();
  const [busy, setBusy] = useState(false);
  const [exportMessage, setExportMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [preview, setPreview] = useState<{ fileName: string; preview: SiteImportPreview } | null>(null);
  const [importMessage, setImportMessage] = useState<{ ok: boolean; text: string } | null>(null);

  const exportOne = async (kind: ExportKind) => {
    setBusy(true);
    setExportMessage(null);
    try {
      // The React Compiler check takes this click handler for render code (it runs only from the export buttons).
      // eslint-disable-next-line react-hooks/purity
      const nowMs = Date.now();
      const name = exportFileName(kind, nowMs);
      const r = await saveTextFile(name, await EXPORTERS[kind](db, nowMs), EXPORT_FILE_TYPES[kind].mime);
      setExportMessage(r.ok ? { ok: true, text: `Saved to ${r.value.where}.` } : { ok: false, text: r.error.message });
    } catch (e) {
      setExportMessage({ ok: false, text: `The export failed: ${messageOf(e)}` });
    } finally {
      setBusy(false);
    }
  };

  const pick = async (file: File) => {
    setPreview(null);
    setImportMessage(null);
    if (file.size > MAX_IMPORT_BYTES) {
      setImportMessage({ ok: false, text: `"${file.name}" is ${(file.size / 1e6).toFixed(1)} MB: too large for a site list.` });
      return;
    }
    try {
      const text = await file.text();
      setPreview({ fileName: file.name, preview: await previewSiteImport(db, text, importKindOf(file.name, text)) });
    } catch (e) {
      setImportMessage({ ok: false, text: `"${file.name}" could not be read: ${messageOf(e)}` });
    }
  };

  const commit = async () => {
    if (!preview) return;
    setBusy(true);
    try {
      const sites = await commitSiteImport(db, preview.preview, { by: crew || 'Glintmark import' });
      setPreview(null);
      setImportMessage({ ok: true, text: `Imported ${sites.length} site${sites.length === 1 ? '' : 's'}: ${sites.map((s) => s.code).join(', ')}.` });
      props.onChanged();
    } catch (e) {
      setImportMessage({ ok: false, text: `Nothing was imported: ${messageOf(e)}` });
    } finally {
      setBusy(false);
    }
  };

  const n = preview?.preview.accepted.length ?? 0;
  return (
    <section className="gm-section" aria-labelledby="exchange-h">
      <h2 id="exchange-h">Exchange with other tools</h2>
      <div className="gm-settings-actions">
        {EXPORT_KINDS.map((k) => (
          <button key={k} type="button" className="gm-btn" disabled={busy} onClick={() => void exportOne(k)} data-testid={`export-${k}`}>
            {EXPORT_FILE_TYPES[k].label}
          </button>
        ))}
      </div>
      <p className="gm-note">
        CSV files keep every text exactly as typed: open them in a spreadsheet with formulas disabled (a note starting with “=” is not a formula).
        GeoJSON coordinates are [longitude, latitude, ellipsoidal height].
      </p>
      {exportMessage ? (
        <p className={exportMessage.ok ? 'gm-okt' : 'gm-error'} role={exportMessage.ok ? 'status' : 'alert'} data-testid="export-message">
          {exportMessage.ok ? '✓ ' : ''}
          {exportMessage.text}
        </p>
      ) : null}

      <h3>Import sites</h3>
      <p className="gm-note">
        CSV with a header row (code, name, latitude, longitude, height_m in ellipsoidal metres) or GeoJSON points. You see every row first;
        nothing is saved until you confirm.
      </p>
      <FilePicker label="Site list (.csv or .geojson)" accept=".csv,.geojson,.json,text/csv,application/geo+json,application/json" testId="import-file" disabled={busy} onFile={(f) => void pick(f)} />
      {preview ? (
        <div className="gm-settings-confirm" data-testid="import-preview">
          <ImportPreviewTable fileName={preview.fileName} preview={preview.preview} />
          <div className="gm-settings-actions">
            <button type="button" className="gm-btn gm-primary" disabled={busy || n === 0} onClick={() => void commit()} data-testid="import-commit">
              {importButtonLabel(n)}
            </button>
            <button type="button" className="gm-btn" onClick={() => setPreview(null)} data-testid="import-cancel">
              Cancel
            </button>
          </div>
        </div>
      ) : null}
      {importMessage ? (
        <p className={importMessage.ok ? 'gm-okt' : 'gm-error'} role={importMessage.ok ? 'status' : 'alert'} data-testid="import-message">
          {importMessage.ok ? '✓ ' : ''}
          {importMessage.text}
        </p>
      ) : null}
    </section>
  );
}
