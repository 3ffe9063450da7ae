import { fontRuns, GREEK, LATIN } from '@/components/editor/pdf-font';
import { describe, expect, it } from 'vitest';
import { STARTERS, emptyPlan } from '@/lib/domain/starters';
import { parsePlan } from '@/lib/schemas/plan';
import { createEditorStore } from '@/components/editor/store';
import { nearestInDirection, placeUnpositioned, readingOrder, removeElements } from '@/components/editor/plan-ops';
import { buildFromForm, LINK_FIELDS, LINK_SCHEMA, NODE_FIELDS, NODE_SCHEMA, toFormValues } from '@/components/editor/panels/fields';
import { commandFor } from '@/components/editor/keyboard';
import { pdfText } from '@/components/editor/export';

describe('starters', () => {
  it('has the five starting layouts', () => {
    expect(STARTERS.map((s) => s.id)).toEqual(['tangent-bucket', 'climber-wood', 'steel-structure', 'double-circuit', 'underbuilt-truck']);
  });
  describe.each(STARTERS.map((s) => [s.id, s] as const))('%s', (_id, starter) => {
    const doc = starter.build('Named by the test');
    it('parses as a plan document', () => {
      const parsed = parsePlan(doc);
      expect(parsed.ok ? [] : parsed.issues).toEqual([]);
    });
    it('places every node and has a worker who reaches something', () => {
      expect(doc.title).toBe('Named by the test');
      expect(doc.nodes.every((n) => n.position && Number.isFinite(n.position.x))).toBe(true);
      expect(doc.nodes.some((n) => n.kind === 'worker')).toBe(true);
      expect(doc.links.some((l) => l.kind === 'reach')).toBe(true);
      expect(doc.links.some((l) => l.kind === 'jumper')).toBe(true);
    });
    it('builds a new copy each time', () => {
      expect(starter.build()).not.toBe(starter.build());
      expect(starter.build().nodes).not.toBe(starter.build().nodes);
    });
  });
  it('the double circuit has six phases and the underbuilt layout a worker on a mat', () => {
    const dc = STARTERS.find((s) => s.id === 'double-circuit')!.build();
    expect(dc.nodes.filter((n) => n.kind === 'phase')).toHaveLength(6);
    const ub = STARTERS.find((s) => s.id === 'underbuilt-truck')!.build();
    expect(ub.nodes.find((n) => n.id === 'W2')).toMatchObject({ kind: 'worker', standsOn: 'M1' });
    expect(STARTERS.find((s) => s.id === 'steel-structure')!.build().nodes.find((n) => n.kind === 'structure')).toMatchObject({ material: 'steel' });
  });
  it('the empty plan parses', () => {
    expect(parsePlan(emptyPlan()).ok).toBe(true);
  });
});

describe('the document built from store state', () => {
  it('round-trips through JSON and parsePlan unchanged after edits', () => {
    const store = createEditorStore({ doc: STARTERS[0].build() });
    const s = store.getState();
    s.addNode('ground-rod', { x: 700, y: 400 });
    s.connect('jumper', 'R', 'CB');
    s.addNode('truck', { x: 0, y: 500 });
    s.select(['A']);
    s.duplicateSelection();
    const doc = store.getState().doc;
    const parsed = parsePlan(JSON.parse(JSON.stringify(doc)));
    expect(parsed.ok).toBe(true);
    if (parsed.ok) expect(parsed.plan).toEqual(doc);
  });
  it('places nodes that came without positions', () => {
    const doc = STARTERS[0].build();
    const bare = { ...doc, nodes: doc.nodes.map((n) => ({ ...n, position: undefined })) } as typeof doc;
    const placed = placeUnpositioned(bare);
    expect(placed.nodes.every((n) => n.position)).toBe(true);
    expect(new Set(placed.nodes.map((n) => `${n.position!.x},${n.position!.y}`)).size).toBe(placed.nodes.length);
  });
  it('removing nothing keeps the same document object', () => {
    const doc = STARTERS[0].build();
    expect(removeElements(doc, [])).toBe(doc);
  });
  it('orders nodes for Tab by row and finds neighbours for the arrow keys', () => {
    const doc = STARTERS[0].build();
    expect(readingOrder(doc).slice(0, 3)).toEqual(['A', 'B', 'C']);
    expect(nearestInDirection(doc, 'A', 'right')).toBe('B');
    expect(nearestInDirection(doc, 'A', 'up')).toBeNull();
    expect(nearestInDirection(doc, 'B', 'down')).toBe('CB');
  });
});

describe('inspector forms', () => {
  it('reads a jumper back in metres from feet and inches', () => {
    const doc = STARTERS[0].build();
    const jumper = doc.links.find((l) => l.id === 'jA')! as Record<string, unknown>;
    const values = { ...toFormValues(LINK_FIELDS.jumper, jumper, 'imperial'), lengthM: '12 ft 6 in' };
    const r = buildFromForm(LINK_FIELDS.jumper, values, jumper, 'imperial', LINK_SCHEMA);
    expect(r.ok && r.value.lengthM).toBeCloseTo(3.81, 6);
  });
  it('names the field in every error and returns nothing to store', () => {
    const rod = { id: 'R', kind: 'ground-rod', lengthM: 2.4, diameterMm: 16, soilOhmM: 100 };
    const values = { ...toFormValues(NODE_FIELDS['ground-rod'], rod, 'metric'), lengthM: '-1', diameterMm: 'wide' };
    const r = buildFromForm(NODE_FIELDS['ground-rod'], values, rod, 'metric', NODE_SCHEMA);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors.diameterMm).toBe('Rod diameter must be a number');
      expect(r.errors.lengthM).toBeUndefined(); // schema errors wait until every number reads
    }
    const r2 = buildFromForm(NODE_FIELDS['ground-rod'], { ...values, diameterMm: '16' }, rod, 'metric', NODE_SCHEMA);
    expect(!r2.ok && r2.errors.lengthM).toBe('Driven length must be greater than 0');
  });
  it('drops a blank optional field instead of storing an empty string', () => {
    const n = { id: 'N', kind: 'neutral', label: 'Neutral', groundOhms: 5 };
    const r = buildFromForm(NODE_FIELDS.neutral, { label: 'Neutral', groundOhms: '' }, n, 'metric', NODE_SCHEMA);
    expect(r.ok && 'groundOhms' in r.value).toBe(false);
  });
});

describe('keyboard commands', () => {
  it.each([
    [{ key: 'z', ctrlKey: true }, 'undo'],
    [{ key: 'z', metaKey: true }, 'undo'],
    [{ key: 'Z', ctrlKey: true, shiftKey: true }, 'redo'],
    [{ key: 'y', ctrlKey: true }, 'redo'],
    [{ key: 'c', ctrlKey: true }, 'copy'],
    [{ key: 'v', metaKey: true }, 'paste'],
    [{ key: 'd', ctrlKey: true }, 'duplicate'],
    [{ key: 'Delete' }, 'delete'],
    [{ key: 'Backspace' }, 'delete'],
    [{ key: 'Tab' }, 'next'],
    [{ key: 'Tab', shiftKey: true }, 'previous'],
    [{ key: 'ArrowLeft' }, 'left'],
    [{ key: 'ArrowDown', shiftKey: true }, 'nudge-down'],
    [{ key: 'q' }, null],
  ])('%o → %s', (event, command) => {
    expect(commandFor(event)).toBe(command);
  });
});

describe('PDF text', () => {
  it('keeps what the embedded Source Sans 3 prints (Ω ρ π − µ ²) and spells out the rest', () => {
    expect(pdfText('0.5 Ω — 2 ≤ 3 × ρ π − µ ²')).toBe('0.5 Ω — 2 <= 3 × ρ π − µ ²');
    expect(pdfText('a ⚡ b')).toBe('a ? b');
  });
  it('splits text into Latin and Greek runs for the two font subsets', () => {
    expect(fontRuns('100 Ω·m, ρ = 2')).toEqual([['100 ', LATIN], ['Ω', GREEK], ['·m, ', LATIN], ['ρ', GREEK], [' = 2', LATIN]]);
  });
});
