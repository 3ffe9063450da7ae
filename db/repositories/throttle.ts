/**
 * Atomic throttle counters in the database, so they hold across instances and restarts. Each
 * take locks its bucket's row (SELECT … FOR UPDATE) for the decision, so parallel attempts are
 * counted one by one: twenty at once count as twenty.
 */
import { QueryTypes, Transaction } from 'sequelize';
import type { Db } from '@db/connection';
import { sha256Hex } from '@/lib/server/fingerprint';

export interface BucketPolicy {
  /** Length of the counting window. */
  windowMs: number;
  /** Hits allowed in a window with no delay. */
  free: number;
  /**
   * After `free` hits: 'block' refuses until the window ends; 'backoff' lets one more hit through
   * after a delay that doubles from `backoffBaseMs` up to `backoffMaxMs` since the last hit.
   */
  after: 'block' | 'backoff';
  backoffBaseMs?: number;
  backoffMaxMs?: number;
}

export type TakeResult = { ok: true } | { ok: false; retryAfterMs: number };

export function bucketKey(action: string, kind: string, value: string): string {
  return `${action}:${kind}:${sha256Hex(value)}`;
}

interface Row {
  hits: number;
  window_started: Date;
  last_hit_at: Date | null;
}

/** Decides one hit against a bucket's state (pure; exported for the unit tests). */
export function decide(row: Row, policy: BucketPolicy, now: Date): { take: TakeResult; next: Row } {
  const fresh = now.getTime() - new Date(row.window_started).getTime() >= policy.windowMs;
  const state: Row = fresh ? { hits: 0, window_started: now, last_hit_at: null } : row;
  if (state.hits < policy.free) return { take: { ok: true }, next: { ...state, hits: state.hits + 1, last_hit_at: now } };
  if (policy.after === 'block') {
    const retryAfterMs = new Date(state.window_started).getTime() + policy.windowMs - now.getTime();
    return { take: { ok: false, retryAfterMs }, next: state };
  }
  const over = state.hits - policy.free;
  const delay = Math.min((policy.backoffBaseMs ?? 1000) * 2 ** Math.min(over, 30), policy.backoffMaxMs ?? 60_000);
  const allowedAt = new Date(state.last_hit_at ?? state.window_started).getTime() + delay;
  if (now.getTime() < allowedAt) return { take: { ok: false, retryAfterMs: allowedAt - now.getTime() }, next: state };
  return { take: { ok: true }, next: { ...state, hits: state.hits + 1, last_hit_at: now } };
}

/** Takes one hit from each bucket, all or none: refused when any bucket refuses (the longest wait wins). */
export async function takeHits(db: Db, buckets: Array<{ key: string; policy: BucketPolicy }>, now = new Date()): Promise<TakeResult> {
  const sorted = [...buckets].sort((a, b) => a.key.localeCompare(b.key)); // one lock order: no deadlocks
  return db.sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED }, async (transaction) => {
    const decisions = [];
    for (const { key, policy } of sorted) {
      // Takes the row's exclusive lock at once (INSERT IGNORE would take a shared one first, and two
      // shared holders upgrading to FOR UPDATE deadlock).
      await db.sequelize.query('INSERT INTO throttle_buckets (bucket, hits, window_started, last_hit_at) VALUES (?, 0, ?, NULL) ON DUPLICATE KEY UPDATE bucket = bucket', { replacements: [key, now], transaction });
      const [row] = await db.sequelize.query<Row>('SELECT hits, window_started, last_hit_at FROM throttle_buckets WHERE bucket = ? FOR UPDATE', { replacements: [key], type: QueryTypes.SELECT, transaction });
      decisions.push({ key, ...decide(row, policy, now) });
    }
    const refused = decisions.filter((d) => !d.take.ok).map((d) => (d.take as { retryAfterMs: number }).retryAfterMs);
    if (refused.length) return { ok: false, retryAfterMs: Math.max(...refused) };
    for (const d of decisions) {
      await db.sequelize.query('UPDATE throttle_buckets SET hits = ?, window_started = ?, last_hit_at = ? WHERE bucket = ?', { replacements: [d.next.hits, d.next.window_started, d.next.last_hit_at, d.key], transaction });
    }
    return { ok: true } as TakeResult;
  });
}

/** Forgets a bucket (a right password clears its e-mail's failures). */
export async function clearBucket(db: Db, key: string): Promise<void> {
  await db.sequelize.query('DELETE FROM throttle_buckets WHERE bucket = ?', { replacements: [key] });
}

/** Gives one hit back (a successful sign-in does not count against its client address). */
export async function refundHit(db: Db, key: string): Promise<void> {
  await db.sequelize.query('UPDATE throttle_buckets SET hits = GREATEST(hits, 1) - 1 WHERE bucket = ?', { replacements: [key] });
}

/** Buckets whose window ended more than a day ago count for nothing; keeps the table small. */
export async function tidyBuckets(db: Db, now = new Date()): Promise<void> {
  await db.sequelize.query('DELETE FROM throttle_buckets WHERE window_started < ?', { replacements: [new Date(now.getTime() - 86400_000)] });
}
