/**
 * Loads the worked examples in fixtures/reference/ and runs each through the handler for its
 * quantity, so an entry nobody computes fails instead of being silently ignored.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect, it } from 'vitest';

export interface ReferenceEntry {
  quantity: string;
  inputs: Record<string, number | string>;
  value: number;
  unit: string;
  tolerance: number;
  source: string;
  label: 'pub' | 'mem' | 'calc' | 'practice';
  knownException?: { computes: number; note: string };
}

export function loadReference(file: string): ReferenceEntry[] {
  return JSON.parse(readFileSync(join(process.cwd(), 'fixtures/reference', file), 'utf8')) as ReferenceEntry[];
}

const describeInputs = (inputs: ReferenceEntry['inputs']): string =>
  Object.entries(inputs)
    .map(([key, value]) => `${key} ${value}`)
    .join(', ');

/**
 * One test per entry: |computed − value| ≤ tolerance, with the entry's source and label in the
 * test name and in the assertion message (the source sits beside each check).
 */
export function checkEntries(entries: ReferenceEntry[], handlers: Record<string, (inputs: ReferenceEntry['inputs']) => number>): void {
  it('has a handler for every quantity in the file', () => {
    const missing = entries.filter((entry) => !(entry.quantity in handlers)).map((entry) => entry.quantity);
    expect(missing).toEqual([]);
  });
  it.each(entries.map((entry) => [`${entry.quantity} (${describeInputs(entry.inputs)}) = ${entry.value} ${entry.unit} — ${entry.source} [${entry.label}]`, entry] as const))(
    '%s',
    (_name, entry) => {
      const handler = handlers[entry.quantity];
      expect(handler, `no handler for ${entry.quantity}`).toBeTypeOf('function');
      const computed = handler(entry.inputs);
      const source = `${entry.source} [${entry.label}]`;
      expect(Number.isFinite(computed), source).toBe(true);
      if (entry.knownException) {
        // The source's own figure is not reproduced: assert the documented exception exactly.
        expect(computed, `${source}: ${entry.knownException.note}`).toBe(entry.knownException.computes);
        expect(computed, source).not.toBe(entry.value);
        return;
      }
      expect(Math.abs(computed - entry.value), `${source}: computed ${computed}, expected ${entry.value} ± ${entry.tolerance}`).toBeLessThanOrEqual(entry.tolerance + 1e-12);
    },
  );
}
