/**
 * The sync outbox (schema version 6): every revision written on this phone leaves an entry in `outbox`, in the
 * SAME IndexedDB transaction as the revision (a Dexie DBCore middleware widens each read-write transaction that
 * touches `revisions` to include `outbox`), so no repository has to remember it and a crash can never keep one
 * without the other. The sync layer (src/sync/) reads the entries, pushes the records they name and deletes the
 * entries only after the register acknowledged them. Nothing here talks to a network.
 *
 * `syncState` holds the device-local sync facts (server address, sign-in token, push number, pull cursor):
 * like `meta` it is never part of a backup.
 */
import type { DBCore, DBCoreMutateRequest, DBCoreTable, DBCoreTransaction, Middleware } from 'dexie';
import type { RevisionRecord, VersionedTable } from './types.ts';

export interface OutboxEntry {
  /** Auto-incremented; the order entries were written. */
  seq?: number;
  table: VersionedTable;
  recordId: string;
  /** The revision that made the entry; null for an entry added to send a whole record (first sign-in). */
  revisionId: string | null;
  atMs: number;
  /** Set when the register refused this record's last push: its words, shown in Settings. Cleared by a new edit. */
  refused?: string;
}

export interface SyncStateRecord {
  key: string;
  value: unknown;
}

/** Tables the outbox middleware adds to every read-write transaction that writes revisions. */
const OUTBOX = 'outbox';

/**
 * Read-write transactions whose revision writes must NOT be queued: the sync pull writes revisions that came
 * from the register. Keyed by the IndexedDB transaction object the core layer hands out.
 */
const quiet = new WeakSet<object>();

/** Mark a Dexie transaction (its `idbtrans`) so the revisions it writes are not queued for pushing. */
export function markTransactionQuiet(idbtrans: object): void {
  quiet.add(idbtrans);
}

function entriesFor(values: readonly unknown[]): OutboxEntry[] {
  return (values as RevisionRecord[]).map((r) => ({ table: r.table, recordId: r.recordId, revisionId: r.id, atMs: r.atMs }));
}

/** The DBCore middleware; installed by openGlintmarkDb. */
export const outboxMiddleware: Middleware<DBCore> = {
  stack: 'dbcore',
  name: 'glintmark-outbox',
  create(down: DBCore): DBCore {
    const hasOutbox = () => down.schema.tables.some((t) => t.name === OUTBOX);
    return {
      ...down,
      transaction(stores, mode, options) {
        const widen = mode === 'readwrite' && stores.includes('revisions') && !stores.includes(OUTBOX) && hasOutbox();
        return down.transaction(widen ? [...stores, OUTBOX] : stores, mode, options);
      },
      table(name: string): DBCoreTable {
        const table = down.table(name);
        if (name !== 'revisions') return table;
        return {
          ...table,
          async mutate(req: DBCoreMutateRequest) {
            if ((req.type === 'add' || req.type === 'put') && hasOutbox() && !quiet.has(req.trans as DBCoreTransaction & object) && req.values.length > 0) {
              await down.table(OUTBOX).mutate({ type: 'add', trans: req.trans, values: entriesFor(req.values) });
            }
            return table.mutate(req);
          },
        };
      },
    };
  },
};
