/**
 * Unsaved editor work on this device, in IndexedDB (through `idb`) instead of localStorage: plans
 * with many elements outgrow localStorage's few megabytes. The editor's sync (sync.ts) reads and
 * writes through a small synchronous Storage shape; this keeps such a shape in memory, loaded from
 * IndexedDB before the editor starts, and writes every change through to IndexedDB in order.
 */
import { openDB, type DBSchema, type IDBPDatabase } from 'idb';

export type DraftStorage = Pick<Storage, 'getItem' | 'setItem' | 'removeItem' | 'key' | 'length'>;

interface DraftSchema extends DBSchema {
  drafts: { key: string; value: string };
}

/** Drafts the editor kept in localStorage before: moved over once, then removed there. */
const LEGACY_PREFIX = 'bondmap:draft:';

/** A synchronous mirror: reads from memory; writes to memory and, in the background, to `persist`. */
export function mirrorStorage(initial: Iterable<[string, string]>, persist: { put(key: string, value: string): void; remove(key: string): void }): DraftStorage {
  const map = new Map(initial);
  return {
    get length() {
      return map.size;
    },
    key: (i) => [...map.keys()][i] ?? null,
    getItem: (key) => map.get(key) ?? null,
    setItem: (key, value) => {
      map.set(key, value);
      persist.put(key, value);
    },
    removeItem: (key) => {
      map.delete(key);
      persist.remove(key);
    },
  };
}

function openDrafts(): Promise<IDBPDatabase<DraftSchema>> {
  return openDB<DraftSchema>('bondmap-drafts', 1, { upgrade: (db) => void db.createObjectStore('drafts') });
}

/** Loads the drafts kept on this device (moving any left in localStorage) and returns the mirror. */
export async function loadDraftStorage(legacy: Storage | null = typeof localStorage === 'undefined' ? null : localStorage): Promise<DraftStorage> {
  const db = await openDrafts();
  if (legacy) {
    const old = Array.from({ length: legacy.length }, (_, i) => legacy.key(i)).filter((k): k is string => Boolean(k?.startsWith(LEGACY_PREFIX)));
    for (const key of old) {
      const value = legacy.getItem(key);
      if (value !== null) await db.put('drafts', value, key);
      legacy.removeItem(key);
    }
  }
  const tx = db.transaction('drafts');
  const [keys, values] = await Promise.all([tx.store.getAllKeys(), tx.store.getAll()]);
  // Each write is its own transaction, started in call order; IndexedDB runs them in that order.
  return mirrorStorage(
    keys.map((k, i) => [k, values[i]]),
    {
      put: (key, value) => void db.put('drafts', value, key).catch(() => undefined),
      remove: (key) => void db.delete('drafts', key).catch(() => undefined),
    },
  );
}
