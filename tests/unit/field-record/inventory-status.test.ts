import { describe, expect, it } from 'vitest';
import { inventorySetStatus, usableSets, type InventorySet } from '@/lib/domain/field-record';

const sets: InventorySet[] = [
  { tag: 'INV-1', status: 'in-service', testDueOn: '2026-05-04' },
  { tag: 'INV-2', status: 'in-service', testDueOn: '2026-05-03' },
  { tag: 'INV-3', status: 'out-of-service', testDueOn: '2027-01-01', statusReason: 'Carried fault current' },
  { tag: 'INV-4', status: 'retired', testDueOn: '2027-01-01' },
  { tag: 'INV-10', status: 'in-service', testDueOn: '2027-01-01' },
];
const lookup = inventorySetStatus(sets, '2026-05-04');

describe('set status from the inventory', () => {
  it('accepts an in-service set on its due date (overdue only once the date has passed), in any case', () => {
    expect(lookup.statusOf('INV-1')).toEqual({ usable: true });
    expect(lookup.statusOf(' inv-1 ')).toEqual({ usable: true });
  });

  it('refuses an overdue set, naming the date', () => {
    expect(lookup.statusOf('INV-2')).toEqual({ usable: false, reason: 'overdue', detail: 'INV-2 was due for its test on 2026-05-03' });
  });

  it('refuses out-of-service and retired sets, and an unknown tag', () => {
    expect(lookup.statusOf('INV-3')).toEqual({ usable: false, reason: 'out-of-service', detail: 'INV-3 is out of service: Carried fault current' });
    expect(lookup.statusOf('INV-4')).toMatchObject({ usable: false, reason: 'out-of-service', detail: 'INV-4 is retired' });
    expect(lookup.statusOf('VISITOR-9')).toMatchObject({ usable: false, reason: 'unknown' });
  });

  it('lists the usable sets in natural tag order', () => {
    expect(usableSets(sets, '2026-05-04').map((s) => s.tag)).toEqual(['INV-1', 'INV-10']);
  });
});
