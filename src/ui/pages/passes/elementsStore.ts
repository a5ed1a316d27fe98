/**
 * Orbital element sets kept on this phone for offline pass prediction.
 *
 * The sets live in the logbook database (table `elements`, schema version 4, through `elementRepo`), so they are
 * in the full backup and travel by merge. The interface is narrow (list / add / remove) and async; callers never
 * see the storage. One set per catalogue number: adding a set for a number already stored replaces it (last added
 * wins). Each set is checked (its lines must parse as that set) before it is written.
 *
 * Earlier versions kept the sets in localStorage under ELEMENTS_STORAGE_KEY. On first use the database store
 * imports those once (`importElementSetsOnce`; damaged entries are dropped, as they always were) and then clears
 * the old key. `createElementsStore` is that older key-value store, kept to read the old entries.
 */
import { parseTle, type TleSet } from '../../../core/orbit/tle.ts';
import { elementRepo, getAppDb, importElementSetsOnce, type ElementSetRecord, type GlintmarkDb } from '../../../data/index.ts';

export interface StoredElementSet extends TleSet {
  /** True for the invented demonstration satellite: never for real planning. */
  demo: boolean;
  /** When the set was added on this phone, ms since 1970 UTC. */
  addedAtMs: number;
}

/** The part of the Web Storage API this module uses (localStorage, or a fake in tests). */
export interface KeyValueStorage {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem?(key: string): void;
}

export interface ElementsStore {
  listElementSets(): Promise<StoredElementSet[]>;
  /** Adds or replaces (by catalogue number); resolves to the full list after the change. */
  addElementSets(sets: readonly TleSet[], opts?: { demo?: boolean; nowMs?: number }): Promise<StoredElementSet[]>;
  /** Removes the set with this catalogue number (no error when absent); resolves to the list after the change. */
  removeElementSet(catalogNumber: string): Promise<StoredElementSet[]>;
}

export const ELEMENTS_STORAGE_KEY = 'glintmark.elementSets.v1';

/** Entries that still parse as the element set they claim to be; anything else is dropped. */
function revive(raw: unknown): StoredElementSet[] {
  if (!Array.isArray(raw)) return [];
  const out: StoredElementSet[] = [];
  for (const r of raw as Partial<StoredElementSet>[]) {
    if (!r || typeof r.line1 !== 'string' || typeof r.line2 !== 'string') continue;
    const parsed = parseTle(`${r.line1}\n${r.line2}`);
    const set = parsed.sets[0];
    if (!set || parsed.errors.length > 0) continue;
    out.push({
      ...set,
      name: typeof r.name === 'string' ? r.name : '',
      demo: r.demo === true,
      addedAtMs: typeof r.addedAtMs === 'number' && Number.isFinite(r.addedAtMs) ? r.addedAtMs : 0,
    });
  }
  return out;
}

/**
 * The earlier store over a key-value storage (localStorage), kept to read what older versions saved.
 * Writes throw the storage's own error (e.g. QuotaExceededError).
 */
export function createElementsStore(storage: KeyValueStorage, key = ELEMENTS_STORAGE_KEY): ElementsStore {
  const read = (): StoredElementSet[] => {
    const text = storage.getItem(key);
    if (!text) return [];
    try {
      return revive(JSON.parse(text));
    } catch {
      return [];
    }
  };
  const write = (sets: StoredElementSet[]) => storage.setItem(key, JSON.stringify(sets));
  return {
    async listElementSets() {
      return read();
    },
    async addElementSets(sets, opts = {}) {
      const nowMs = opts.nowMs ?? Date.now();
      const byNumber = new Map(read().map((s) => [s.catalogNumber, s]));
      for (const s of sets) {
        byNumber.set(s.catalogNumber, { name: s.name, catalogNumber: s.catalogNumber, line1: s.line1, line2: s.line2, epochMs: s.epochMs, demo: opts.demo === true, addedAtMs: nowMs });
      }
      const next = [...byNumber.values()];
      write(next);
      return next;
    },
    async removeElementSet(catalogNumber) {
      const next = read().filter((s) => s.catalogNumber !== catalogNumber);
      write(next);
      return next;
    },
  };
}

/** In-memory storage, used when localStorage is missing or blocked (sets then last until the app closes). */
export function memoryStorage(): KeyValueStorage {
  const m = new Map<string, string>();
  return { getItem: (k) => m.get(k) ?? null, setItem: (k, v) => void m.set(k, v) };
}

function defaultStorage(): KeyValueStorage | undefined {
  try {
    return globalThis.localStorage ?? undefined;
  } catch {
    return undefined; /* access to localStorage can throw when storage is disabled */
  }
}

const toStored = (r: ElementSetRecord): StoredElementSet => ({
  name: r.name,
  catalogNumber: r.catalogNumber,
  line1: r.line1,
  line2: r.line2,
  epochMs: r.epochMs,
  demo: r.demo,
  addedAtMs: r.addedAtMs,
});

/**
 * The store over the logbook database. `legacy` is where older versions kept the sets (localStorage): they are
 * imported on first use, once per database, and the old key is cleared afterwards. Rejections are the database's
 * (e.g. QuotaExceededError) or a ValidationError for a set whose lines do not parse; nothing is written then.
 */
export function createDbElementsStore(db: () => GlintmarkDb, legacy?: KeyValueStorage, key = ELEMENTS_STORAGE_KEY): ElementsStore {
  let imported: Promise<void> | null = null;
  const importLegacy = async () => {
    if (!legacy) return;
    const old = await createElementsStore(legacy, key).listElementSets();
    await importElementSetsOnce(db(), old);
    try {
      legacy.removeItem?.(key);
    } catch {
      /* the old entries stay behind; the import is recorded and will not run again */
    }
  };
  const ready = () =>
    (imported ??= importLegacy().catch((e: unknown) => {
      imported = null; // try again on the next call
      throw e;
    }));
  const list = async () => (await elementRepo.list(db())).map(toStored);
  return {
    async listElementSets() {
      await ready();
      return list();
    },
    async addElementSets(sets, opts = {}) {
      await ready();
      await elementRepo.put(db(), sets, { demo: opts.demo, nowMs: opts.nowMs });
      return list();
    },
    async removeElementSet(catalogNumber) {
      await ready();
      await elementRepo.remove(db(), catalogNumber);
      return list();
    },
  };
}

const store = createDbElementsStore(getAppDb, defaultStorage());
export const listElementSets = store.listElementSets;
export const addElementSets = store.addElementSets;
export const removeElementSet = store.removeElementSet;
