/** The site-import preview: every accepted site and every rejected row with its reason. Text is shown as text. */
import type { SiteImportPreview } from '../../../data/index.ts';
import { previewRows, previewSummary } from './importPreview.ts';

export function ImportPreviewTable(props: { fileName: string; preview: SiteImportPreview }) {
  const rows = previewRows(props.preview);
  return (
    <>
      <p data-testid="import-summary">
        <strong>{props.fileName}</strong>: {previewSummary(props.preview)}
      </p>
      <div className="gm-settings-scroll" tabIndex={0} role="region" aria-label="Import preview (scrolls sideways)">
        <table className="gm-table">
          <thead>
            <tr>
              <th scope="col">Row</th>
              <th scope="col">Result</th>
              <th scope="col">Site or reason</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={r.key} data-testid={`import-row-${i}`} data-status={r.status}>
                <td>{r.where}</td>
                <td className={`gm-settings-status-${r.status}`}>{r.status === 'accepted' ? '✓ New site' : '✗ Rejected'}</td>
                {r.status === 'accepted' ? (
                  <td>
                    <strong>{r.code}</strong> {r.name}
                    <br />
                    <span className="gm-note">{r.position}</span>
                  </td>
                ) : (
                  <td>{r.reason}</td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
