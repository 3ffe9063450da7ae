import { describe, expect, it } from 'vitest';
import { findStarter } from '@/lib/domain/starters';
import { parsePlan, type PlanDocument } from '@/lib/schemas/plan';
import { createEditorStore, HISTORY_LIMIT } from '@/components/editor/store';
import { STANDABLE } from '@/components/editor/panels/fields';
import { checkPlan } from '@/lib/domain/checker';

const starter = () => findStarter('tangent-bucket')!.build('Test plan');
const fresh = (doc: PlanDocument = starter()) => createEditorStore({ doc, baseRevision: 3 });
const ids = (doc: PlanDocument) => [...doc.nodes.map((n) => n.id), ...doc.links.map((l) => l.id)];

describe('editor store', () => {
  it('adds a node of every kind with a fresh id, selects it and keeps the document valid', () => {
    const store = fresh();
    const id = store.getState().addNode('cluster-bar', { x: 101, y: 99 });
    expect(id).toBe('CB2');
    const s = store.getState();
    expect(s.selection).toEqual(['CB2']);
    expect(s.doc.nodes.find((n) => n.id === 'CB2')?.position).toEqual({ x: 100, y: 100 }); // snapped to the 20 grid
    for (const kind of ['phase', 'neutral', 'shield-wire', 'structure', 'crossarm', 'hardware', 'ground-rod', 'earth', 'bucket', 'truck', 'mat', 'pole-ground', 'worker'] as const) {
      store.getState().addNode(kind, { x: 0, y: 0 });
    }
    expect(parsePlan(store.getState().doc).ok).toBe(true);
    expect(store.getState().saveState).toBe('unsaved');
  });

  it('a new worker stands on nothing until the user chooses, and the check blocks on it', () => {
    // Even with a bucket on the plan, nothing is guessed.
    const store = fresh();
    const id = store.getState().addNode('worker', { x: 0, y: 0 });
    const doc = store.getState().doc;
    const worker = doc.nodes.find((n) => n.id === id)!;
    expect(worker.kind).toBe('worker');
    expect('standsOn' in worker).toBe(false);
    expect(doc.nodes).toHaveLength(starter().nodes.length + 1);
    expect(parsePlan(doc).ok).toBe(true);
    const finding = checkPlan(doc).findings.find((f) => f.rule === 'worker-stands-nowhere');
    expect(finding).toMatchObject({ severity: 'blocker', elements: [id] });
  });

  it('offers as a standing surface only what a person can stand on or in', () => {
    for (const kind of ['bucket', 'truck', 'mat', 'earth', 'structure'] as const) expect(STANDABLE.has(kind)).toBe(true);
    for (const kind of ['phase', 'neutral', 'shield-wire', 'hardware', 'ground-rod', 'pole-ground', 'worker'] as const) expect(STANDABLE.has(kind)).toBe(false);
  });

  it('puts a dropped node where the drag left it (snapped) as one undo step', () => {
    const store = fresh();
    const before = store.getState().doc.nodes.find((n) => n.id === 'CB')!.position;
    const undoSteps = store.getState().past.length;
    store.getState().moveNodes(new Map([['CB', { x: 343, y: 258 }]]));
    expect(store.getState().doc.nodes.find((n) => n.id === 'CB')!.position).toEqual({ x: 340, y: 260 });
    expect(store.getState().past).toHaveLength(undoSteps + 1);
    expect(store.getState().saveState).toBe('unsaved');
    store.getState().undo();
    expect(store.getState().doc.nodes.find((n) => n.id === 'CB')!.position).toEqual(before);
    store.getState().redo();
    expect(store.getState().doc.nodes.find((n) => n.id === 'CB')!.position).toEqual({ x: 340, y: 260 });
  });

  it('a drop where the drag began changes nothing and adds no undo step', () => {
    const store = fresh();
    const doc = store.getState().doc;
    const at = doc.nodes.find((n) => n.id === 'CB')!.position!;
    store.getState().moveNodes(new Map([['CB', { ...at }]]));
    expect(store.getState().doc).toBe(doc);
    expect(store.getState().past).toHaveLength(0);
    expect(store.getState().version).toBe(0);
  });

  it('deletes a node with its links; a worker who stood on it stays, standing on nothing; undo restores all', () => {
    const store = fresh();
    const original = store.getState().doc;
    store.getState().select(['BK']);
    store.getState().deleteSelection();
    const doc = store.getState().doc;
    expect(ids(doc)).not.toContain('BK');
    expect(doc.nodes.find((n) => n.id === 'W1')).not.toHaveProperty('standsOn');
    expect(ids(doc)).not.toContain('jBK');
    expect(ids(doc)).toContain('rA');
    expect(parsePlan(doc).ok).toBe(true);
    store.getState().undo();
    expect(store.getState().doc).toBe(original);
    store.getState().redo();
    expect(ids(store.getState().doc)).not.toContain('BK');
    expect(store.getState().future).toHaveLength(0);
  });

  it('a new edit after undo drops the redo list', () => {
    const store = fresh();
    store.getState().addNode('mat', { x: 0, y: 0 });
    store.getState().undo();
    expect(store.getState().future).toHaveLength(1);
    store.getState().addNode('truck', { x: 0, y: 0 });
    expect(store.getState().future).toHaveLength(0);
    store.getState().redo();
    expect(ids(store.getState().doc)).not.toContain('M1');
  });

  it('keeps at most the history limit', () => {
    const store = fresh();
    for (let i = 0; i < HISTORY_LIMIT + 20; i++) store.getState().addNode('hardware', { x: i * 20, y: 0 });
    expect(store.getState().past.length).toBe(HISTORY_LIMIT);
  });

  it('copies and pastes with fresh ids, remapped links and a worker re-pointed to the copied stand', () => {
    const store = fresh();
    store.getState().select(['BK', 'W1', 'CB']);
    store.getState().copySelection();
    store.getState().paste();
    const s = store.getState();
    expect(s.selection.length).toBeGreaterThanOrEqual(3);
    const newWorker = s.doc.nodes.find((n) => n.kind === 'worker' && n.id !== 'W1')!;
    expect(newWorker.kind === 'worker' && newWorker.standsOn).toBe('BK2');
    const jumper = s.doc.links.find((l) => l.from === 'BK2');
    expect(jumper).toMatchObject({ kind: 'jumper', to: 'CB2' });
    expect(s.doc.nodes.find((n) => n.id === 'BK2')!.position).toEqual({ x: 480, y: 360 });
    expect(parsePlan(s.doc).ok).toBe(true);
    store.getState().paste();
    expect(store.getState().doc.nodes.find((n) => n.id === 'BK3')!.position).toEqual({ x: 520, y: 400 });
  });

  it('duplicates the selection in one undoable step', () => {
    const store = fresh();
    const count = store.getState().doc.nodes.length;
    store.getState().select(['A']);
    store.getState().duplicateSelection();
    expect(store.getState().doc.nodes.length).toBe(count + 1);
    expect(store.getState().selection).toHaveLength(1);
    store.getState().undo();
    expect(store.getState().doc.nodes.length).toBe(count);
  });

  it('draws links by tapping two elements with a link tool, refusing a jumper to a worker', () => {
    const store = fresh();
    store.getState().armLinkTool('jumper');
    store.getState().tapElement('W1');
    store.getState().tapElement('CB');
    expect(store.getState().message).toMatch(/never a bonding path/);
    store.getState().armLinkTool('bond');
    store.getState().tapElement('P1');
    store.getState().tapElement('CB');
    expect(store.getState().doc.links.at(-1)).toMatchObject({ kind: 'bond', from: 'P1', to: 'CB', id: 'b1' });
    const id = store.getState().connect('reach', 'W1', 'P1');
    expect(id).toBe('r1');
    expect(parsePlan(store.getState().doc).ok).toBe(true);
  });

  it('refuses a second identical link unless a parallel lead is asked for', () => {
    const store = fresh();
    const before = store.getState().doc.links.length;
    // jA already joins A and CB; the same pair either way round is refused with a reason.
    expect(store.getState().connect('jumper', 'CB', 'A')).toBeNull();
    expect(store.getState().message).toMatch(/already joined by jumper jA/);
    store.getState().armLinkTool('jumper');
    store.getState().tapElement('A');
    store.getState().tapElement('CB');
    expect(store.getState().doc.links).toHaveLength(before);
    // A bond between the same two nodes is a different link and is allowed, once its caution is accepted.
    expect(store.getState().connect('bond', 'A', 'CB')).toBeNull();
    expect(store.getState().settleBond('bond')).not.toBeNull();
    const id = store.getState().addParallel('jA');
    expect(id).not.toBeNull();
    const copy = store.getState().doc.links.find((l) => l.id === id)!;
    const original = store.getState().doc.links.find((l) => l.id === 'jA')!;
    expect(copy).toMatchObject({ kind: 'jumper', from: 'A', to: 'CB', cable: (original as { cable: string }).cable });
    store.getState().undo();
    expect(store.getState().doc.links.some((l) => l.id === id)).toBe(false);
  });

  it('warns before a bond on a phase or between the cluster bar and ground, and offers a jumper', () => {
    const store = fresh({ ...starter(), links: [] });
    const count = () => store.getState().doc.links.length;
    store.getState().armLinkTool('bond');
    store.getState().tapElement('A');
    store.getState().tapElement('CB');
    expect(count()).toBe(0);
    expect(store.getState().pendingBond?.caution).toMatch(/existing permanent connection.*joins a phase/);
    expect(store.getState().settleBond('jumper')).toBe('j1');
    expect(store.getState().doc.links[0]).toMatchObject({ kind: 'jumper', from: 'A', to: 'CB' });
    store.getState().tapElement('CB');
    store.getState().tapElement('N');
    expect(store.getState().pendingBond?.caution).toMatch(/cluster bar to the neutral or to ground/);
    store.getState().settleBond('cancel');
    expect(count()).toBe(1);
    // A bond between the bucket and the bar is what bonds are for: no caution.
    store.getState().tapElement('BK');
    store.getState().tapElement('CB');
    expect(store.getState().pendingBond).toBeNull();
    expect(store.getState().doc.links.at(-1)).toMatchObject({ kind: 'bond', from: 'BK', to: 'CB' });
  });

  it('read-only stores refuse every edit', () => {
    const store = createEditorStore({ doc: starter(), readOnly: true });
    const doc = store.getState().doc;
    store.getState().addNode('mat', { x: 0, y: 0 });
    store.getState().select(['A']);
    store.getState().deleteSelection();
    expect(store.getState().doc).toBe(doc);
    expect(store.getState().saveState).toBe('locked');
  });

  it('tracks save versions: saved only when the saved version is the current one', () => {
    const store = fresh();
    store.getState().addNode('mat', { x: 0, y: 0 });
    const v = store.getState().version;
    store.getState().addNode('truck', { x: 0, y: 0 });
    store.getState().markSaved(v, 4);
    expect(store.getState().saveState).toBe('unsaved');
    expect(store.getState().baseRevision).toBe(4);
    store.getState().markSaved(store.getState().version, 5);
    expect(store.getState().saveState).toBe('saved');
  });

  it('keeps mine after a conflict by moving the base to the server revision', () => {
    const store = fresh();
    store.getState().addNode('mat', { x: 0, y: 0 });
    store.getState().setSaveState('conflict', { conflict: { currentRevision: 7, document: starter() } });
    store.getState().keepMine();
    expect(store.getState()).toMatchObject({ baseRevision: 7, conflict: null, saveState: 'unsaved' });
    expect(ids(store.getState().doc)).toContain('M1');
  });

  it('reloads theirs, dropping history and local changes', () => {
    const store = fresh();
    store.getState().addNode('mat', { x: 0, y: 0 });
    const theirs = { ...starter(), title: 'Theirs' };
    store.getState().reloadFromServer(theirs, 9);
    expect(store.getState()).toMatchObject({ baseRevision: 9, saveState: 'saved', past: [] });
    expect(store.getState().doc.title).toBe('Theirs');
  });
});
