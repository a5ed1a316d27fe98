/**
 * Logbook home: the sites stored on this phone (search by code or name, sort by last visit or distance from here),
 * a "New site" form checked in place, the open merge conflicts, and the way to Settings (backup, export, import).
 */
import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { getMeta, requestPersistentStorage, useGlintmarkDb, useOpenConflicts, useReflectors, useSites, type Here, type SiteListRow } from '../../../data/index.ts';
import { Segmented } from '../../components/fields.tsx';
import { useStore } from '../../state/store.ts';
import { workflow } from '../../state/workflow.ts';
import { BackupReminder } from '../settings/BackupReminder.tsx';
import { DemoBadge } from './bits.tsx';
import { TextInput } from './inputs.tsx';
import { NewSiteCard } from './NewSiteCard.tsx';
import { LogbookShell } from './LogbookShell.tsx';
import { useGpsFix } from './useGpsFix.ts';
import { fmtDistanceM, fmtLastVisit, SORT_OPTIONS, type ListSort } from './words.ts';
import { useNow } from '../../components/useNow.ts';

/** Rows shown before "Show more" (each row reads its reflector count). */
const PAGE_ROWS = 50;

function SiteRow(props: { row: SiteListRow; nowMs: number }) {
  const { site, lastVisitAtMs, installationCount, inspectionCount, distanceM } = props.row;
  const reflectors = useReflectors(site.id);
  return (
    <li>
      <Link className="gm-lb-row" to={`/logbook/site/${site.id}`} data-testid={`site-row-${site.code}`}>
        <span className="gm-lb-code">{site.code}</span>
        <span>{site.name}</span> <DemoBadge demo={site.demo} />
        <p className="gm-lb-meta">
          {reflectors === undefined ? '…' : `${reflectors.length} reflector${reflectors.length === 1 ? '' : 's'}`} · {installationCount} installation
          {installationCount === 1 ? '' : 's'} · {inspectionCount} inspection{inspectionCount === 1 ? '' : 's'}
        </p>
        <p className="gm-lb-meta">
          Last visit: {fmtLastVisit(lastVisitAtMs, props.nowMs)}
          {distanceM !== null ? ` · ${fmtDistanceM(distanceM)} away` : ''}
        </p>
      </Link>
    </li>
  );
}

function usePersistenceReminder(): boolean {
  const db = useGlintmarkDb();
  const [denied, setDenied] = useState(false);
  useEffect(() => {
    let live = true;
    (async () => {
      const known = await getMeta<{ result: string }>(db, 'persistence');
      const result = known?.result ?? (await requestPersistentStorage({ db }));
      if (live) setDenied(result === 'denied');
    })().catch(() => undefined);
    return () => {
      live = false;
    };
  }, [db]);
  return denied;
}

export function LogbookPage() {
  const wf = useStore(workflow);
  const [search, setSearch] = useState('');
  const [sort, setSort] = useState<ListSort>('lastVisit');
  const [here, setHere] = useState<(Here & { from: string }) | null>(null);
  const [rowsShown, setRowsShown] = useState(PAGE_ROWS);
  const [adding, setAdding] = useState(false);
  const gps = useGpsFix();
  const rows = useSites({ search, sort, here });
  const conflicts = useOpenConflicts();
  const persistenceDenied = usePersistenceReminder();
  const nowMs = useNow(60_000);

  const chooseSort = async (s: ListSort) => {
    setSort(s);
    if (s !== 'distance') return;
    const fix = await gps.get();
    if (fix) setHere({ latDeg: fix.latDeg, lonDeg: fix.lonDeg, from: `your GPS position (±${Math.round(fix.horizontalAccuracyM)} m)` });
    else if (wf.site) setHere({ latDeg: wf.site.latDeg, lonDeg: wf.site.lonDeg, from: `the planned site${wf.site.code ? ' ' + wf.site.code : ''}` });
  };

  return (
    <LogbookShell
      title="Logbook"
      end={
        <Link className="gm-btn gm-lb-linkbtn" to="/settings" data-testid="open-settings">
          Settings
        </Link>
      }
    >
      <h1 className="gm-label">Sites on this device</h1>
      <BackupReminder />
      {conflicts && conflicts.length > 0 ? (
        <p className="gm-warn" data-testid="conflicts-count">
          ⚠ {conflicts.length} merge conflict{conflicts.length === 1 ? '' : 's'} to review: <Link to="/settings">open Settings</Link>.
        </p>
      ) : null}
      {persistenceDenied ? (
        <p className="gm-warn" data-testid="persistence-denied">
          This browser may clear stored data when the phone runs short of space. Make backups often (Settings).
        </p>
      ) : null}
      <div className="gm-lb-actions">
        <button type="button" className="gm-btn gm-primary" onClick={() => setAdding((a) => !a)} aria-expanded={adding} data-testid="new-site">
          {adding ? 'Close the new-site form' : '+ New site'}
        </button>
      </div>
      {adding ? <NewSiteCard /> : null}

      <section className="gm-section" aria-labelledby="sites-h">
        <h2 id="sites-h">Sites</h2>
        <div className="gm-lb-search">
          <TextInput label="Search by code, name or notes" value={search} onChange={setSearch} testId="site-search" />
        </div>
        <div className="gm-lb-seg-wrap">
          <Segmented label="Sort by" value={sort} options={SORT_OPTIONS} onChange={(v) => void chooseSort(v)} testId="site-sort" />
        </div>
        {sort === 'distance' ? (
          <p className={here ? 'gm-note' : 'gm-warn'} data-testid="distance-from">
            {gps.busy
              ? 'Reading your position…'
              : here
                ? `Distances from ${here.from}.`
                : `${gps.error ?? 'No position yet.'} Without a position the list is sorted by code.`}
          </p>
        ) : null}
        {rows === undefined ? (
          <p>Loading…</p>
        ) : rows.length === 0 ? (
          <p className="gm-note" data-testid="no-sites">
            {search.trim() ? `No site matches “${search.trim()}”.` : 'No sites yet. Add one with “New site”, or restore a backup in Settings.'}
          </p>
        ) : (
          <>
            <p className="gm-note" data-testid="site-count">
              {rows.length} site{rows.length === 1 ? '' : 's'}
            </p>
            <ul className="gm-lb-list" data-testid="site-list">
              {rows.slice(0, rowsShown).map((r) => (
                <SiteRow key={r.site.id} row={r} nowMs={nowMs} />
              ))}
            </ul>
            {rows.length > rowsShown ? (
              <button type="button" className="gm-btn" onClick={() => setRowsShown((n) => n + PAGE_ROWS)} data-testid="more-sites">
                Show {Math.min(PAGE_ROWS, rows.length - rowsShown)} more
              </button>
            ) : null}
          </>
        )}
      </section>
    </LogbookShell>
  );
}
