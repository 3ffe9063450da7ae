/**
 * The device's own store, in IndexedDB (through `idb`): the outbox of entries and photos that wait
 * to be sent, and the last copy of each record a person opened with the time it was in step with
 * the server. Everything is keyed by person: one person's queue waits for that person's next sign-in.
 */
import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { RecordView } from '@/components/records/types';
import type { OutboxStore, Pending } from './outbox';

export interface CachedRecord {
  personId: string;
  recordId: number;
  record: RecordView;
  /** ISO time of the last answer from the server with nothing waiting to be sent. */
  inStepAt: string | null;
}

interface OfflineSchema extends DBSchema {
  outbox: { key: string; value: Pending; indexes: { byRecord: [string, number, number] } };
  records: { key: [string, number]; value: CachedRecord };
}

let opening: Promise<IDBPDatabase<OfflineSchema>> | null = null;
export function offlineDb(): Promise<IDBPDatabase<OfflineSchema>> {
  opening ??= openDB<OfflineSchema>('bondmap-field', 1, {
    upgrade(db) {
      db.createObjectStore('outbox', { keyPath: 'key' }).createIndex('byRecord', ['personId', 'recordId', 'seq']);
      db.createObjectStore('records', { keyPath: ['personId', 'recordId'] });
    },
  });
  return opening;
}

export const idbOutboxStore: OutboxStore = {
  async list(personId, recordId) {
    const range = IDBKeyRange.bound([personId, recordId, -Infinity], [personId, recordId, Infinity]);
    return (await offlineDb()).getAllFromIndex('outbox', 'byRecord', range);
  },
  async put(item) {
    await (await offlineDb()).put('outbox', item);
  },
  async remove(key) {
    await (await offlineDb()).delete('outbox', key);
  },
};

export async function cachedRecord(personId: string, recordId: number): Promise<CachedRecord | undefined> {
  return (await offlineDb()).get('records', [personId, recordId]);
}

export async function keepRecord(entry: CachedRecord): Promise<void> {
  await (await offlineDb()).put('records', entry);
}
