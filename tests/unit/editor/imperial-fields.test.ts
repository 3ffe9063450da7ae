import { describe, expect, it } from 'vitest';
import { buildFromForm, NODE_FIELDS, NODE_SCHEMA, toFormValues } from '@/components/editor/panels/fields';

// 5/8 in = 15.875 mm and 3/4 in = 19.05 mm exactly (1 in = 25.4 mm, NIST SP 811).
const rod = { id: 'R1', kind: 'ground-rod', lengthM: 2.4384, diameterMm: 15.875, soilOhmM: 100 };
const fields = NODE_FIELDS['ground-rod'];

describe('the rod diameter field', () => {
  it('shows inches in feet mode and millimetres in metres', () => {
    expect(toFormValues(fields, rod, 'imperial').diameterMm).toBe('0.625');
    expect(toFormValues(fields, rod, 'metric').diameterMm).toBe('15.875');
  });

  it('stores what is typed in inches as millimetres', () => {
    const values = { ...toFormValues(fields, rod, 'imperial'), diameterMm: '0.75' };
    const built = buildFromForm(fields, values, rod, 'imperial', NODE_SCHEMA);
    expect(built.ok && built.value.diameterMm).toBeCloseTo(19.05, 9);
    const metric = buildFromForm(fields, { ...toFormValues(fields, rod, 'metric'), diameterMm: '19' }, rod, 'metric', NODE_SCHEMA);
    expect(metric.ok && metric.value.diameterMm).toBe(19);
  });
});

describe('the body weight basis', () => {
  it('names pounds beside kilograms (50 kg = 110.2 lb, 70 kg = 154.3 lb; 1 lb = 0.45359237 kg)', async () => {
    const { CRITERIA_FIELDS } = await import('@/components/editor/panels/fields');
    const options = CRITERIA_FIELDS.find((f) => f.key === 'bodyKg')!.options!.map((o) => o.label);
    expect(options).toEqual(['50 kg (110 lb)', '70 kg (154 lb)']);
  });
});
