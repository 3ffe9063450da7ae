/**
 * The field screen's outbox: entries and photos made on the device wait here (in IndexedDB, see
 * store.ts) and go to the server one at a time, in the order they were made, when there is a
 * connection. A resend is harmless for entries (the server answers a repeated clientId with the
 * stored entry). A refusal is kept beside its item, never dropped; a lost connection, a server
 * fault or a throttle waits and tries again later; a signed-out session waits for the next sign-in.
 */
import type { EntryBody } from '@/lib/domain/field-record';
import type { ApiResult } from '@/components/records/record-client';

export type StampedEntry = EntryBody & { clientId: string; at: string };
export interface Refused {
  code: string;
  message: string;
  items?: string[];
}

interface Common {
  /** The entry's clientId, or a photo's own id: unique on the device. */
  key: string;
  personId: string;
  recordId: number;
  /** Order of making on this device: items go out in this order. */
  seq: number;
  refused?: Refused;
}
export type PendingEntry = Common & { kind: 'entry'; entry: StampedEntry };
export type PendingPhoto = Common & { kind: 'photo'; file: Blob; caption: string; at: string };
export type Pending = PendingEntry | PendingPhoto;

export interface OutboxStore {
  /** One person's items for one record, in `seq` order. */
  list(personId: string, recordId: number): Promise<Pending[]>;
  put(item: Pending): Promise<void>;
  remove(key: string): Promise<void>;
}

export interface Transport {
  entry(recordId: number, entry: StampedEntry): Promise<ApiResult<unknown>>;
  /** Sends a photo with its outbox key as the clientId, so a repeat stores nothing new. */
  photo(recordId: number, file: Blob, caption: string, clientId: string): Promise<ApiResult<unknown>>;
}

export interface Clock {
  now(): number;
  later(run: () => void, ms: number): () => void;
}
export const realClock: Clock = {
  now: () => Date.now(),
  later: (run, ms) => {
    const handle = setTimeout(run, ms);
    return () => clearTimeout(handle);
  },
};

/** Why sending stopped: nothing left, no connection (retry scheduled), or the session is gone. */
export type FlushOutcome = 'done' | 'waiting' | 'signed-out';

/** Answers that mean "not now" rather than "no": keep the item and try again later. */
const retryable = (status: number) => status === 0 || status === 408 || status === 429 || status >= 500;
export const FIRST_RETRY_MS = 2_000;
export const LAST_RETRY_MS = 60_000;

export class Outbox {
  private running: Promise<FlushOutcome> | null = null;
  /** The pass queued behind the running one (at most one: later calls join it). */
  private queued: Promise<FlushOutcome> | null = null;
  private cancelRetry: (() => void) | null = null;
  private failures = 0;
  private lastSeq = 0;

  constructor(
    private readonly store: OutboxStore,
    private readonly transport: Transport,
    readonly personId: string,
    readonly recordId: number,
    private readonly clock: Clock = realClock,
    private readonly changed: () => void = () => undefined,
  ) {}

  items(): Promise<Pending[]> {
    return this.store.list(this.personId, this.recordId);
  }

  /** A seq after every earlier one on this device, even when the clock steps back. */
  private nextSeq(): number {
    this.lastSeq = Math.max(this.lastSeq + 1, this.clock.now());
    return this.lastSeq;
  }

  async addEntry(entry: StampedEntry): Promise<void> {
    await this.store.put({ kind: 'entry', key: entry.clientId, personId: this.personId, recordId: this.recordId, seq: this.nextSeq(), entry });
    this.changed();
  }

  async addPhoto(file: Blob, caption: string, at: string, key: string): Promise<void> {
    await this.store.put({ kind: 'photo', key, personId: this.personId, recordId: this.recordId, seq: this.nextSeq(), file, caption, at });
    this.changed();
  }

  /** Puts a refused item out of the way once the crew has read the refusal. */
  async dismiss(key: string): Promise<void> {
    await this.store.remove(key);
    this.changed();
  }

  /**
   * Sends what waits, in order; one send at a time. A call made while one is sending queues one
   * more pass after it (never two at once), so what was added after that send listed its items
   * goes too before the call answers: close-out right after the last entry waits for that entry.
   */
  flush(): Promise<FlushOutcome> {
    if (this.queued) return this.queued;
    const before = this.running;
    const run: Promise<FlushOutcome> = before
      ? (this.queued = before.catch(() => 'done' as const).then(() => {
          this.queued = null;
          return this.send();
        }))
      : this.send();
    this.running = run;
    void run.catch(() => undefined).finally(() => {
      if (this.running === run) this.running = null;
    });
    return run;
  }

  stop(): void {
    this.cancelRetry?.();
    this.cancelRetry = null;
  }

  private async send(): Promise<FlushOutcome> {
    this.stop();
    for (const item of await this.items()) {
      if (item.refused) continue;
      const result = item.kind === 'entry' ? await this.transport.entry(this.recordId, item.entry) : await this.transport.photo(this.recordId, item.file, item.caption, item.key);
      if (result.ok) {
        await this.store.remove(item.key);
        this.failures = 0;
        this.changed();
        continue;
      }
      if (result.status === 401) return 'signed-out';
      if (retryable(result.status)) {
        this.failures += 1;
        const wait = Math.min(FIRST_RETRY_MS * 2 ** (this.failures - 1), LAST_RETRY_MS);
        this.cancelRetry = this.clock.later(() => void this.flush(), wait);
        return 'waiting';
      }
      // A refusal (409), a bad field (400), a record gone (404), a role lost (403): kept and shown.
      await this.store.put({ ...item, refused: { code: result.code, message: result.message, ...(result.items ? { items: result.items } : {}) } });
      this.changed();
    }
    return 'done';
  }
}

/** An in-memory store (tests, and a device without IndexedDB for the length of one page). */
export function memoryStore(): OutboxStore {
  const items = new Map<string, Pending>();
  return {
    list: async (personId, recordId) => [...items.values()].filter((i) => i.personId === personId && i.recordId === recordId).sort((a, b) => a.seq - b.seq),
    put: async (item) => void items.set(item.key, item),
    remove: async (key) => void items.delete(key),
  };
}
