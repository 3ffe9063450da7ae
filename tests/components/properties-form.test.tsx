import { fireEvent, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { createElement } from 'react';
import { PropertiesForm } from '@/components/editor/panels/PropertiesForm';
import { Inspector } from '@/components/editor/panels/Inspector';
import { LINK_FIELDS, LINK_SCHEMA, NODE_FIELDS, NODE_SCHEMA, SYSTEM_FIELDS, SYSTEM_SCHEMA } from '@/components/editor/panels/fields';
import { EditorStoreContext } from '@/components/editor/selectors';
import { createEditorStore } from '@/components/editor/store';
import { findStarter } from '@/lib/domain/starters';
import { NODE_KINDS, type NodeKind } from '@/lib/schemas/plan';

const SAMPLE: Record<NodeKind, Record<string, unknown>> = {
  phase: { id: 'A', kind: 'phase', phase: 'A', label: 'Phase A' },
  neutral: { id: 'N', kind: 'neutral', groundOhms: 5 },
  'shield-wire': { id: 'SW', kind: 'shield-wire' },
  structure: { id: 'S', kind: 'structure', material: 'steel', groundOhms: 8 },
  crossarm: { id: 'X', kind: 'crossarm', material: 'wood' },
  hardware: { id: 'H', kind: 'hardware' },
  'cluster-bar': { id: 'CB', kind: 'cluster-bar' },
  'ground-rod': { id: 'R1', kind: 'ground-rod', lengthM: 2.4384, diameterMm: 16, soilOhmM: 100 },
  earth: { id: 'E1', kind: 'earth' },
  bucket: { id: 'BK', kind: 'bucket', insulatedBoom: true },
  truck: { id: 'T1', kind: 'truck' },
  mat: { id: 'M1', kind: 'mat' },
  'pole-ground': { id: 'PG', kind: 'pole-ground' },
  worker: { id: 'W1', kind: 'worker', standsOn: 'BK' },
  'supply-end': { id: 'SE', kind: 'supply-end', phases: ['A'] },
};
const NODES = [SAMPLE.bucket, SAMPLE['cluster-bar'], SAMPLE.worker] as never[];

function renderNodeForm(kind: NodeKind, onApply = vi.fn(), units: 'metric' | 'imperial' = 'metric') {
  render(<PropertiesForm title={`Edit ${kind}`} fields={NODE_FIELDS[kind]} source={SAMPLE[kind]} schema={NODE_SCHEMA} units={units} nodes={NODES} onApply={onApply} />);
  return onApply;
}

describe.each(NODE_KINDS.map((k) => [k]))('the %s form', (kind) => {
  it('stores the element unchanged when nothing is edited', async () => {
    const onApply = renderNodeForm(kind);
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(onApply).toHaveBeenCalledTimes(1);
    expect(NODE_SCHEMA.safeParse(onApply.mock.calls[0][0]).success).toBe(true);
  });
  it('refuses a label longer than 200 characters, naming the field', async () => {
    const onApply = renderNodeForm(kind);
    fireEvent.change(screen.getByLabelText(/^Label/), { target: { value: 'x'.repeat(201) } });
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(onApply).not.toHaveBeenCalled();
    expect(screen.getByText('Label must be at most 200 characters')).toBeInTheDocument();
    expect(screen.getByLabelText(/^Label/)).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByRole('alert')).toHaveTextContent('nothing was changed');
  });
});

describe('kind-specific fields', () => {
  it('ground rod: reads feet and inches into metres', async () => {
    const onApply = renderNodeForm('ground-rod', vi.fn(), 'imperial');
    const length = screen.getByLabelText(/^Driven length/);
    expect(length).toHaveValue('8 ft 0 in');
    await userEvent.clear(length);
    await userEvent.type(length, '10 ft 6 in');
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(onApply.mock.calls[0][0].lengthM).toBeCloseTo(3.2004, 6);
  });
  it.each([
    ['Driven length', '0', 'Driven length must be greater than 0'],
    ['Rod diameter', 'thick', 'Rod diameter must be a number'],
    ['Soil resistivity', '-5', 'Soil resistivity must be greater than 0'],
    ['Number of rods', '1.5', 'Number of rods must be a whole number'],
  ])('ground rod: %s "%s" is refused with "%s"', async (label, value, message) => {
    const onApply = renderNodeForm('ground-rod');
    fireEvent.change(screen.getByLabelText(new RegExp(`^${label}`)), { target: { value } });
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(onApply).not.toHaveBeenCalled();
    expect(screen.getByText(message)).toBeInTheDocument();
  });
  it('neutral: a negative resistance is refused', async () => {
    const onApply = renderNodeForm('neutral');
    fireEvent.change(screen.getByLabelText(/^Resistance to earth/), { target: { value: '-1' } });
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(onApply).not.toHaveBeenCalled();
    expect(screen.getByText('Resistance to earth must be greater than 0')).toBeInTheDocument();
  });
  it('worker: picks what to stand on from the nodes, never another worker', async () => {
    const onApply = renderNodeForm('worker');
    const select = screen.getByLabelText(/^Stands on/);
    expect([...(select as HTMLSelectElement).options].map((o) => o.value)).toEqual(['BK', 'CB']);
    await userEvent.selectOptions(select, 'CB');
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(onApply.mock.calls[0][0]).toMatchObject({ standsOn: 'CB' });
  });
  it('bucket: the insulated boom is a yes/no choice', async () => {
    const onApply = renderNodeForm('bucket');
    await userEvent.selectOptions(screen.getByLabelText(/^Insulated boom/), 'false');
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(onApply.mock.calls[0][0]).toMatchObject({ insulatedBoom: false });
  });
});

describe('link and system forms', () => {
  const jumper = { id: 'j1', kind: 'jumper', from: 'A', to: 'CB', cable: '2/0', lengthM: 3 };
  it('jumper: cable sizes shown as AWG/kcmil, length in feet, stored in metres', async () => {
    const onApply = vi.fn();
    render(<PropertiesForm title="Jumper j1" fields={LINK_FIELDS.jumper} source={jumper} schema={LINK_SCHEMA} units="imperial" onApply={onApply} />);
    const cable = screen.getByLabelText(/^Cable size/) as HTMLSelectElement;
    expect([...cable.options].map((o) => o.text)).toContain('250 kcmil');
    expect([...cable.options].map((o) => o.text)).toContain('2/0 AWG');
    await userEvent.selectOptions(cable, '4/0');
    fireEvent.change(screen.getByLabelText(/^Lead length/), { target: { value: '15' } });
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(onApply.mock.calls[0][0]).toMatchObject({ cable: '4/0' });
    expect(onApply.mock.calls[0][0].lengthM).toBeCloseTo(4.572, 6);
  });
  it('jumper: a zero clamp rating is refused with its name', async () => {
    const onApply = vi.fn();
    render(<PropertiesForm title="Jumper j1" fields={LINK_FIELDS.jumper} source={jumper} schema={LINK_SCHEMA} units="metric" onApply={onApply} />);
    fireEvent.change(screen.getByLabelText(/^Clamp rating \(/), { target: { value: '0' } });
    fireEvent.change(screen.getByLabelText(/^Lead length/), { target: { value: 'long' } });
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(onApply).not.toHaveBeenCalled();
    expect(screen.getByText('Lead length must be a length in metres, e.g. 3.5')).toBeInTheDocument();
  });
  it('system data: a fault current above 200 kA is refused', async () => {
    const onApply = vi.fn();
    const system = { frequencyHz: 60, faultKa: 10, clearingCycles: 15, xOverR: 10 };
    render(<PropertiesForm title="System data" fields={SYSTEM_FIELDS} source={system} schema={SYSTEM_SCHEMA} units="metric" onApply={onApply} />);
    fireEvent.change(screen.getByLabelText(/^Fault current/), { target: { value: '250' } });
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(onApply).not.toHaveBeenCalled();
    expect(screen.getByText('Fault current must be at most 200 kA')).toBeInTheDocument();
    fireEvent.change(screen.getByLabelText(/^Fault current/), { target: { value: '12.5' } });
    await userEvent.selectOptions(screen.getByLabelText(/^Frequency/), '50');
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(onApply.mock.calls[0][0]).toMatchObject({ faultKa: 12.5, frequencyHz: 50 });
  });
});

describe('the inspector on a store', () => {
  const setup = () => {
    const store = createEditorStore({ doc: findStarter('tangent-bucket')!.build() });
    render(createElement(EditorStoreContext.Provider, { value: store }, createElement(Inspector)));
    return store;
  };
  it('shows system data with nothing selected, and the selected element otherwise', async () => {
    const store = setup();
    expect(screen.getByRole('form', { name: 'System data' })).toBeInTheDocument();
    store.getState().select(['jA']);
    expect(await screen.findByRole('form', { name: 'Jumper jA' })).toBeInTheDocument();
  });
  it('stores a valid edit and nothing on an invalid one', async () => {
    const store = setup();
    store.getState().select(['BK']);
    await screen.findByRole('form', { name: 'Bucket BK' });
    const before = store.getState().doc;
    fireEvent.change(screen.getByLabelText(/^Label/), { target: { value: 'y'.repeat(300) } });
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(store.getState().doc).toBe(before);
    fireEvent.change(screen.getByLabelText(/^Label/), { target: { value: 'Bucket, truck 7' } });
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(store.getState().doc.nodes.find((n) => n.id === 'BK')?.label).toBe('Bucket, truck 7');
    store.getState().undo();
    expect(store.getState().doc).toBe(before);
  });
  it('switches the units of the shown lengths', async () => {
    const store = setup();
    store.getState().select(['jA']);
    const length = await screen.findByLabelText(/^Lead length/);
    expect(length).toHaveValue('9 ft 10 in');
    await userEvent.click(screen.getByRole('radio', { name: 'Metres' }));
    expect(screen.getByLabelText(/^Lead length/)).toHaveValue('3');
  });
});
