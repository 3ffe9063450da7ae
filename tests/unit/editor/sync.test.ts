import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { findStarter } from '@/lib/domain/starters';
import { createApi, type EditorApi, type SaveResult } from '@/components/editor/api-client';
import { createEditorStore } from '@/components/editor/store';
import { draftKey, draftToRestore, readLocalDraft, startSync } from '@/components/editor/sync';

class MemoryStorage {
  map = new Map<string, string>();
  get length() { return this.map.size; }
  key(i: number) { return [...this.map.keys()][i] ?? null; }
  getItem(k: string) { return this.map.get(k) ?? null; }
  setItem(k: string, v: string) { this.map.set(k, v); }
  removeItem(k: string) { this.map.delete(k); }
}

const report = { format: 'bondmap-check', version: 1, ok: true, summary: { blockers: 0, warnings: 0, notes: 0 }, findings: [], fault: {}, tolerableBodyAmps: 0.2, zones: [], contacts: [], jumpers: [], rods: [], caution: '' } as never;

function setup(saveAnswers: SaveResult[]) {
  const store = createEditorStore({ doc: findStarter('tangent-bucket')!.build(), baseRevision: 2 });
  const api: EditorApi = {
    check: vi.fn(async () => ({ kind: 'ok' as const, report })),
    save: vi.fn(async (_id, body) => saveAnswers.shift() ?? { kind: 'saved' as const, plan: { currentRevision: body.expectedRevision + 1 } as never }),
  };
  const storage = new MemoryStorage();
  const events = new EventTarget();
  const sync = startSync(store, { planId: 7, api, storage, target: events as never });
  return { store, api, storage, events, sync };
}

beforeEach(() => vi.useFakeTimers());
afterEach(() => vi.useRealTimers());

describe('sync', () => {
  it('checks ~150 ms after changes pause and saves ~1.5 s after changes stop', async () => {
    const { store, api, sync } = setup([]);
    store.getState().addNode('mat', { x: 0, y: 0 });
    await vi.advanceTimersByTimeAsync(100);
    expect(api.check).not.toHaveBeenCalled();
    store.getState().addNode('truck', { x: 200, y: 0 });
    await vi.advanceTimersByTimeAsync(100);
    expect(api.check).not.toHaveBeenCalled();
    await vi.advanceTimersByTimeAsync(100);
    expect(api.check).toHaveBeenCalledTimes(1);
    expect(store.getState().report).toBe(report);
    expect(api.save).not.toHaveBeenCalled();
    await vi.advanceTimersByTimeAsync(1400);
    expect(api.save).toHaveBeenCalledTimes(1);
    expect(vi.mocked(api.save).mock.calls[0][1].expectedRevision).toBe(2);
    expect(store.getState()).toMatchObject({ saveState: 'saved', baseRevision: 3 });
    sync.stop();
  });

  it('keeps unsaved work on the device, goes offline, and sends it when the connection returns', async () => {
    const { store, api, storage, events, sync } = setup([{ kind: 'offline' }]);
    store.getState().addNode('mat', { x: 0, y: 0 });
    await vi.advanceTimersByTimeAsync(300);
    expect(readLocalDraft(storage, 7)?.baseRevision).toBe(2);
    expect(storage.getItem(draftKey(7, 2))).toContain('"M1"');
    await vi.advanceTimersByTimeAsync(1500);
    expect(store.getState().saveState).toBe('offline');
    events.dispatchEvent(new Event('online'));
    await vi.advanceTimersByTimeAsync(0);
    expect(api.save).toHaveBeenCalledTimes(2);
    expect(store.getState().saveState).toBe('saved');
    expect(readLocalDraft(storage, 7)).toBeNull();
    sync.stop();
  });

  it('stops on a stale revision with the conflict, and "keep mine" re-sends on the server revision', async () => {
    const { store, api, sync } = setup([{ kind: 'stale', currentRevision: 5, current: null }]);
    store.getState().addNode('mat', { x: 0, y: 0 });
    await vi.advanceTimersByTimeAsync(2000);
    expect(store.getState().saveState).toBe('conflict');
    expect(store.getState().conflict?.currentRevision).toBe(5);
    store.getState().addNode('truck', { x: 0, y: 0 });
    await vi.advanceTimersByTimeAsync(2000);
    expect(api.save).toHaveBeenCalledTimes(1); // nothing sent while the conflict is open
    store.getState().keepMine();
    await sync.saveNow();
    expect(vi.mocked(api.save).mock.calls[1][1].expectedRevision).toBe(5);
    expect(store.getState()).toMatchObject({ saveState: 'saved', baseRevision: 6 });
    sync.stop();
  });

  it('takes a stale answer whose server copy is exactly what was sent as saved (a save whose answer was lost)', async () => {
    const { store, api, storage, sync } = setup([]);
    vi.mocked(api.save).mockImplementationOnce(async (_id, body) => ({ kind: 'stale', currentRevision: 3, current: { currentRevision: 3, document: structuredClone(body.document) } as never }));
    store.getState().addNode('mat', { x: 0, y: 0 });
    await vi.advanceTimersByTimeAsync(2000);
    expect(store.getState()).toMatchObject({ saveState: 'saved', baseRevision: 3, conflict: null });
    expect(readLocalDraft(storage, 7)).toBeNull();
    // A server copy that differs is still a conflict.
    vi.mocked(api.save).mockImplementationOnce(async () => ({ kind: 'stale', currentRevision: 4, current: { currentRevision: 4, document: findStarter('tangent-bucket')!.build() } as never }));
    store.getState().addNode('truck', { x: 200, y: 0 });
    await vi.advanceTimersByTimeAsync(2000);
    expect(store.getState()).toMatchObject({ saveState: 'conflict', baseRevision: 3 });
    sync.stop();
  });

  it('shows a refused document as "invalid" with its issues', async () => {
    const { store, sync } = setup([{ kind: 'invalid', issues: [{ path: 'nodes[0].id', message: 'must not be empty' }] }]);
    store.getState().addNode('mat', { x: 0, y: 0 });
    await vi.advanceTimersByTimeAsync(2000);
    expect(store.getState().saveState).toBe('invalid');
    expect(store.getState().saveIssues[0].path).toBe('nodes[0].id');
    sync.stop();
  });

  it('an ended session says so, keeps the work, never retries by itself, and saves once signed in again', async () => {
    const { store, api, storage, events, sync } = setup([{ kind: 'signed-out' }]);
    store.getState().addNode('mat', { x: 0, y: 0 });
    await vi.advanceTimersByTimeAsync(2000);
    expect(store.getState().saveState).toBe('signed-out');
    expect(storage.getItem(draftKey(7, 2))).toContain('"M1"');
    await vi.advanceTimersByTimeAsync(60000);
    expect(api.save).toHaveBeenCalledTimes(1);
    // Back from the sign-in tab: the page gets the focus and saves.
    events.dispatchEvent(new Event('focus'));
    await vi.advanceTimersByTimeAsync(0);
    expect(api.save).toHaveBeenCalledTimes(2);
    expect(store.getState().saveState).toBe('saved');
    expect(store.getState().doc.nodes.some((n) => n.id === 'M1')).toBe(true);
    sync.stop();
  });

  it('403 and 413 are refusals with their own words, not "offline", and are not retried', async () => {
    const forbidden = setup([{ kind: 'forbidden', message: 'Your role may not change this plan.' }]);
    forbidden.store.getState().addNode('mat', { x: 0, y: 0 });
    await vi.advanceTimersByTimeAsync(2000);
    expect(forbidden.store.getState().saveState).toBe('forbidden');
    expect(forbidden.store.getState().message).toMatch(/may not change this plan.*stay on this device/);
    await vi.advanceTimersByTimeAsync(60000);
    expect(forbidden.api.save).toHaveBeenCalledTimes(1);
    forbidden.sync.stop();

    const large = setup([{ kind: 'too-large', message: 'This plan is too large for the server to take.' }]);
    large.store.getState().addNode('mat', { x: 0, y: 0 });
    await vi.advanceTimersByTimeAsync(2000);
    expect(large.store.getState().saveState).toBe('too-large');
    expect(large.store.getState().message).toMatch(/too large/);
    await vi.advanceTimersByTimeAsync(60000);
    expect(large.api.save).toHaveBeenCalledTimes(1);
    // A change (say, deleting elements) is tried again.
    large.store.getState().select(['M1']);
    large.store.getState().deleteSelection();
    await vi.advanceTimersByTimeAsync(2000);
    expect(large.api.save).toHaveBeenCalledTimes(2);
    expect(large.store.getState().saveState).toBe('saved');
    large.sync.stop();
  });

  it('the API client maps 401, 403 and 413 to refusals, not to "offline"', async () => {
    const answer = (status: number) => vi.fn(async () => new Response(JSON.stringify({ error: { code: 'X', message: 'No.' } }), { status }));
    const doc = findStarter('tangent-bucket')!.build();
    expect(await createApi(answer(401)).save(1, { expectedRevision: 1, document: doc })).toEqual({ kind: 'signed-out' });
    expect(await createApi(answer(403)).save(1, { expectedRevision: 1, document: doc })).toEqual({ kind: 'forbidden', message: 'No.' });
    expect((await createApi(answer(413)).save(1, { expectedRevision: 1, document: doc })).kind).toBe('too-large');
    expect(await createApi(answer(401)).check(doc)).toEqual({ kind: 'signed-out' });
    expect((await createApi(answer(413)).check(doc)).kind).toBe('too-large');
  });

  it('restores a kept copy only when the server does not already hold that very document', () => {
    const storage = new MemoryStorage();
    const doc = findStarter('tangent-bucket')!.build();
    storage.setItem(draftKey(7, 1), JSON.stringify({ doc, savedAt: '2026-05-01T00:00:00Z' }));
    const changed = { ...doc, title: 'Changed on the device' };
    expect(draftToRestore(storage, 7, changed)).toMatchObject({ baseRevision: 1 });
    expect(storage.length).toBe(1);
    // Same document, keys in another order: the save went through; nothing to restore, copy dropped.
    expect(draftToRestore(storage, 7, JSON.parse(JSON.stringify(Object.fromEntries(Object.entries(doc).reverse()))))).toBeNull();
    expect(storage.length).toBe(0);
  });
});
