/** The field screen's outbox: order, retry with a growing wait on a fake clock, refusals kept, sign-out waits. */
import { describe, expect, it } from 'vitest';
import { FIRST_RETRY_MS, memoryStore, Outbox, type Clock, type StampedEntry, type Transport } from '@/components/records/offline/outbox';
import type { ApiResult } from '@/components/records/record-client';

/** A clock the test moves by hand; timers fire when it passes their time. */
function fakeClock(start = 1_000_000) {
  let now = start;
  const timers: { at: number; run: () => void; live: boolean }[] = [];
  const clock: Clock = {
    now: () => now,
    later: (run, ms) => {
      const timer = { at: now + ms, run, live: true };
      timers.push(timer);
      return () => void (timer.live = false);
    },
  };
  const advance = async (ms: number) => {
    now += ms;
    for (const t of timers.filter((x) => x.live && x.at <= now)) {
      t.live = false;
      t.run();
    }
    await new Promise((r) => setTimeout(r, 0));
  };
  return { clock, advance, pending: () => timers.filter((t) => t.live).map((t) => t.at - now) };
}

const note = (n: number): StampedEntry => ({ type: 'note', text: `note ${n}`, clientId: `c${n}`, at: `2026-05-04T07:0${n}:00.000Z` });
const ok: ApiResult<unknown> = { ok: true, status: 201, body: {} };
const offline: ApiResult<unknown> = { ok: false, status: 0, code: 'OFFLINE', message: 'No connection' };

function server(answers: Record<string, ApiResult<unknown>[]> = {}) {
  const received: string[] = [];
  const photoIds: string[] = [];
  const transport: Transport = {
    entry: async (_id, entry) => {
      received.push(entry.clientId);
      return answers[entry.clientId]?.shift() ?? ok;
    },
    photo: async (_id, _file, caption, clientId) => {
      received.push(`photo:${caption}`);
      photoIds.push(clientId);
      return answers[`photo:${caption}`]?.shift() ?? ok;
    },
  };
  return { transport, received, photoIds };
}

describe('the outbox', () => {
  it('sends in the order things were made, even when the device clock steps back', async () => {
    const { clock, advance } = fakeClock();
    const { transport, received } = server();
    const box = new Outbox(memoryStore(), transport, 'p1', 7, clock);
    await box.addEntry(note(1));
    await advance(-5_000);
    await box.addPhoto(new Blob(['x']), 'cluster bar', '2026-05-04T07:02:00.000Z', 'ph1');
    await box.addEntry(note(3));
    expect(await box.flush()).toBe('done');
    expect(received).toEqual(['c1', 'photo:cluster bar', 'c3']);
    expect(await box.items()).toEqual([]);
  });

  it('sends a photo with its own id as the clientId, the same id again after a lost answer', async () => {
    const { clock, advance } = fakeClock();
    const { transport, photoIds } = server({ 'photo:cluster bar': [offline] });
    const box = new Outbox(memoryStore(), transport, 'p1', 7, clock);
    await box.addPhoto(new Blob(['x']), 'cluster bar', '2026-05-04T07:02:00.000Z', '3f1c2b8e-5d4a-4c1e-9b7a-2e6f0d9c8a11');
    expect(await box.flush()).toBe('waiting');
    await advance(FIRST_RETRY_MS);
    expect(photoIds).toEqual(['3f1c2b8e-5d4a-4c1e-9b7a-2e6f0d9c8a11', '3f1c2b8e-5d4a-4c1e-9b7a-2e6f0d9c8a11']);
    expect(await box.items()).toEqual([]);
  });

  it('stops at a lost connection, keeps the rest in order, and retries after a growing wait', async () => {
    const { clock, advance, pending } = fakeClock();
    const { transport, received } = server({ c2: [offline, offline] });
    const box = new Outbox(memoryStore(), transport, 'p1', 7, clock);
    for (const n of [1, 2, 3]) await box.addEntry(note(n));
    expect(await box.flush()).toBe('waiting');
    expect(received).toEqual(['c1', 'c2']);
    expect((await box.items()).map((i) => i.key)).toEqual(['c2', 'c3']);
    expect(pending()).toEqual([FIRST_RETRY_MS]);
    await advance(FIRST_RETRY_MS - 1);
    expect(received).toEqual(['c1', 'c2']);
    await advance(1);
    expect(received).toEqual(['c1', 'c2', 'c2']);
    expect(pending()).toEqual([FIRST_RETRY_MS * 2]);
    await advance(FIRST_RETRY_MS * 2);
    expect(received).toEqual(['c1', 'c2', 'c2', 'c2', 'c3']);
    expect(await box.items()).toEqual([]);
    expect(pending()).toEqual([]);
  });

  it('keeps a refused entry with its refusal, and goes on with the next', async () => {
    const refusal: ApiResult<unknown> = { ok: false, status: 409, code: 'SET_ALREADY_ON', message: 'A set is already on that jumper.', items: ['jA'] };
    const { transport, received } = server({ c1: [refusal] });
    const box = new Outbox(memoryStore(), transport, 'p1', 7, fakeClock().clock);
    await box.addEntry(note(1));
    await box.addEntry(note(2));
    expect(await box.flush()).toBe('done');
    expect(received).toEqual(['c1', 'c2']);
    expect(await box.items()).toEqual([expect.objectContaining({ key: 'c1', refused: { code: 'SET_ALREADY_ON', message: 'A set is already on that jumper.', items: ['jA'] } })]);
    expect(await box.flush()).toBe('done');
    expect(received).toEqual(['c1', 'c2']);
  });

  it('waits for the same person to sign in again when the session has ended', async () => {
    const store = memoryStore();
    const { transport, received } = server({ c1: [{ ok: false, status: 401, code: 'UNAUTHENTICATED', message: 'Sign in' }] });
    const { clock, pending } = fakeClock();
    const box = new Outbox(store, transport, 'p1', 7, clock);
    await box.addEntry(note(1));
    expect(await box.flush()).toBe('signed-out');
    expect(pending()).toEqual([]);
    expect(await new Outbox(store, transport, 'p2', 7, clock).flush()).toBe('done');
    expect(received).toEqual(['c1']);
    expect(await new Outbox(store, transport, 'p1', 7, clock).flush()).toBe('done');
    expect(received).toEqual(['c1', 'c1']);
  });

  it('runs one flush at a time: a second call joins the first and nothing is sent twice', async () => {
    const { transport, received } = server();
    const box = new Outbox(memoryStore(), transport, 'p1', 7, fakeClock().clock);
    await box.addEntry(note(1));
    await Promise.all([box.flush(), box.flush()]);
    expect(received).toEqual(['c1']);
  });

  it('a flush asked for while one is sending also sends what was added since (close-out right after the last entry)', async () => {
    let answerFirst: (r: ApiResult<unknown>) => void = () => undefined;
    const received: string[] = [];
    const transport: Transport = {
      entry: (_id, entry) => {
        received.push(entry.clientId);
        return entry.clientId === 'c1' ? new Promise((r) => (answerFirst = r)) : Promise.resolve(ok);
      },
      photo: async () => ok,
    };
    const box = new Outbox(memoryStore(), transport, 'p1', 7, fakeClock().clock);
    await box.addEntry(note(1));
    const first = box.flush();
    await new Promise((r) => setTimeout(r, 0));
    await box.addEntry(note(2));
    const second = box.flush();
    answerFirst(ok);
    expect(await second).toBe('done');
    expect(await first).toBe('done');
    expect(received).toEqual(['c1', 'c2']);
    expect(await box.items()).toEqual([]);
  });
});

