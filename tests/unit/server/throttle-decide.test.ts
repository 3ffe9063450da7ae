import { describe, expect, it } from 'vitest';
import { decide, type BucketPolicy } from '@db/repositories/throttle';

const t0 = new Date('2026-01-01T00:00:00Z');
const at = (ms: number) => new Date(t0.getTime() + ms);
const block: BucketPolicy = { windowMs: 60_000, free: 3, after: 'block' };
const backoff: BucketPolicy = { windowMs: 60_000, free: 2, after: 'backoff', backoffBaseMs: 1000, backoffMaxMs: 8000 };

function run(policy: BucketPolicy, times: number[]) {
  let row = { hits: 0, window_started: t0, last_hit_at: null as Date | null };
  return times.map((ms) => {
    const { take, next } = decide(row, policy, at(ms));
    row = next;
    return take.ok ? 'ok' : Math.ceil(take.retryAfterMs / 1000);
  });
}

describe('throttle bucket decisions', () => {
  it('block: the free hits, then refused until the window ends, then free again', () => {
    expect(run(block, [0, 1, 2, 3, 30_000, 60_000, 60_001])).toEqual(['ok', 'ok', 'ok', 60, 30, 'ok', 'ok']);
  });

  it('backoff: waits double after each hit past the free ones, capped, and a refused hit does not count', () => {
    // free: 0, 10 ms. Then 1 s after the last hit, then 2 s, then 4 s, 8 s, 8 s (cap).
    expect(run(backoff, [0, 10, 20, 1010, 1020, 3010, 7010, 15_010])).toEqual(['ok', 'ok', 1, 'ok', 2, 'ok', 'ok', 'ok']);
  });

  it('backoff never asks for more than its cap', () => {
    const times = Array.from({ length: 40 }, (_, i) => i * 10);
    const waits = run({ ...backoff, windowMs: 3_600_000 }, times).filter((x) => x !== 'ok') as number[];
    expect(Math.max(...waits)).toBeLessThanOrEqual(8);
  });
});
