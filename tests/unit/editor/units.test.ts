import { describe, expect, it } from 'vitest';
import { createEditorStore } from '@/components/editor/store';
import { findStarter } from '@/lib/domain/starters';
import { cableLabel, feetFromMetres, formatLength, lengthInputValue, metresFromFeet, parseLength } from '@/lib/domain/units';
import { CABLE_SIZES } from '@/lib/schemas/plan';

describe('lengths', () => {
  it('converts with the international foot (exactly 0.3048 m)', () => {
    expect(metresFromFeet(10)).toBeCloseTo(3.048, 12);
    expect(feetFromMetres(3.048)).toBeCloseTo(10, 12);
    expect(feetFromMetres(metresFromFeet(17.25))).toBeCloseTo(17.25, 12);
  });
  it.each([
    [3.048, 'imperial', '10 ft 0 in'],
    [3, 'imperial', '9 ft 10 in'],
    [0.1524, 'imperial', '0 ft 6 in'],
    [2.4384, 'imperial', '8 ft 0 in'],
    [3.0, 'metric', '3 m'],
    [0.905, 'metric', '0.91 m'],
  ] as const)('formats %f m as %s (%s)', (m, system, text) => {
    expect(formatLength(m, system)).toBe(text);
  });
  it.each([
    ['10', 3.048],
    ['10 ft', 3.048],
    ["10'", 3.048],
    ['10 ft 6 in', 3.2004],
    ['10\' 6"', 3.2004],
    ['10ft6in', 3.2004],
    ['6 in', 0.1524],
    ['6"', 0.1524],
    ['10.5', 3.2004],
  ])('reads "%s" as %f m', (text, metres) => {
    const r = parseLength(text, 'imperial');
    expect(r.ok && r.value).toBeCloseTo(metres, 6);
  });
  it.each([[''], ['ten feet'], ['5 ft 13 in'], ['1.2.3']])('refuses "%s" in feet', (text) => {
    expect(parseLength(text, 'imperial').ok).toBe(false);
  });
  it('reads what a keypad shows whichever units are chosen: "6.5", "6 ft 6 in", "6\'6\"", "2 m"', () => {
    const read = (text: string, system: 'metric' | 'imperial') => {
      const r = parseLength(text, system);
      return r.ok ? r.value : NaN;
    };
    expect(read('6.5', 'imperial')).toBeCloseTo(1.9812, 6);
    expect(read('6 ft 6 in', 'imperial')).toBeCloseTo(1.9812, 6);
    expect(read('6\'6"', 'imperial')).toBeCloseTo(1.9812, 6);
    expect(read('6\u20196\u201d', 'imperial')).toBeCloseTo(1.9812, 6);
    expect(read('2 m', 'imperial')).toBe(2);
    expect(read('150 cm', 'imperial')).toBe(1.5);
    expect(read('6 ft 6 in', 'metric')).toBeCloseTo(1.9812, 6);
    expect(read('2 m', 'metric')).toBe(2);
  });
  it('reads metres with or without the unit', () => {
    expect(parseLength('2.5', 'metric')).toEqual({ ok: true, value: 2.5 });
    expect(parseLength('2.5 m', 'metric')).toEqual({ ok: true, value: 2.5 });
    expect(parseLength('2,5', 'metric').ok).toBe(false);
  });
  it('puts a stored length in the input so it reads back to the same inch', () => {
    const shown = lengthInputValue(3.81, 'imperial');
    expect(shown).toBe('12 ft 6 in');
    const back = parseLength(shown, 'imperial');
    expect(back.ok && Math.abs(back.value - 3.81)).toBeLessThan(0.0127);
  });
});

describe('cable labels', () => {
  it.each([
    ['4', '4 AWG'],
    ['2', '2 AWG'],
    ['1/0', '1/0 AWG'],
    ['2/0', '2/0 AWG'],
    ['4/0', '4/0 AWG'],
    ['250', '250 kcmil'],
    ['350', '350 kcmil'],
  ] as const)('%s is %s', (size, label) => {
    expect(cableLabel(size, 'imperial')).toBe(label);
  });
  it('adds the copper area in metric, growing with the size', () => {
    expect(cableLabel('2/0', 'metric')).toBe('2/0 AWG (67.4 mm²)');
    const areas = CABLE_SIZES.map((c) => Number(/\(([\d.]+) mm²\)/.exec(cableLabel(c, 'metric'))![1]));
    expect([...areas].sort((a, b) => a - b)).toEqual(areas);
  });
});

describe('defaults in the units the crew works in', () => {
  it('an 8 ft rod of 5/8 in and 10 ft leads in feet; 2.4 m, 16 mm and 3 m in metres', () => {
    const imperial = createEditorStore({ doc: { ...findStarter('tangent-bucket')!.build(), links: [] }, units: 'imperial' });
    const rod = imperial.getState().addNode('ground-rod', { x: 0, y: 0 });
    const r = imperial.getState().doc.nodes.find((n) => n.id === rod) as { lengthM: number; diameterMm: number };
    expect(formatLength(r.lengthM, 'imperial')).toBe('8 ft 0 in');
    expect(r.diameterMm / 25.4).toBeCloseTo(0.625, 9);
    imperial.getState().connect('jumper', 'A', 'CB');
    expect(formatLength((imperial.getState().doc.links[0] as { lengthM: number }).lengthM, 'imperial')).toBe('10 ft 0 in');
    const metric = createEditorStore({ doc: { ...findStarter('tangent-bucket')!.build(), links: [] }, units: 'metric' });
    const rod2 = metric.getState().addNode('ground-rod', { x: 0, y: 0 });
    expect(metric.getState().doc.nodes.find((n) => n.id === rod2)).toMatchObject({ lengthM: 2.4, diameterMm: 16 });
  });
});
