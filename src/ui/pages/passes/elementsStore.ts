/**
 * Orbital element sets kept on this phone for offline pass prediction.
 *
 * For now the sets live in localStorage under one key. The logbook's Dexie schema will take them over later:
 * the interface is deliberately narrow (list / add / remove) and async, so that swap changes this file only and
 * no caller. Each stored set is re-checked with parseTle when read, so a damaged entry is dropped, not propagated.
 * One set per catalogue number: adding a set for a number already stored replaces it (last added wins).
 */
import { parseTle, type TleSet } from '../../../core/orbit/tle.ts';

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

/** A store over any key-value storage. Writes throw the storage's own error (e.g. QuotaExceededError). */
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

function defaultStorage(): KeyValueStorage {
  try {
    const ls = globalThis.localStorage;
    if (ls) return ls;
  } catch {
    /* access to localStorage can throw when storage is disabled */
  }
  return memoryStorage();
}

const store = createElementsStore(defaultStorage());
export const listElementSets = store.listElementSets;
export const addElementSets = store.addElementSets;
export const removeElementSet = store.removeElementSet;
