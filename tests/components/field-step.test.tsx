import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { StepPanel } from '@/components/records/StepPanel';
import { stampEntry } from '@/components/records/record-client';
import type { RecordView } from '@/components/records/types';
import type { NextStep } from '@/lib/domain/field-record';

const me = { id: 'u1', name: 'Invented Lead' };
function record(next: NextStep, over: Partial<RecordView> = {}): RecordView {
  return {
    id: 1, planId: 1, planTitle: 'Invented pole', revision: 1, status: 'open', workDate: '2026-05-04', structure: '', location: '', clearanceRef: '', detector: 'Detector 7',
    lead: me, closedAt: null, closedBy: null, counts: { on: 0, installed: 0, removed: 0 }, setsOn: [], voltageFound: false, testPassed: false, briefing: {}, next,
    plan: { phases: ['A', 'B'], jumpers: [{ id: 'jA', label: 'Phase A – Cluster bar' }] }, document: {} as RecordView['document'], entries: [], photos: [], ...over,
  };
}

const future = '2999-01-01';
const inventory = {
  today: '2026-05-04',
  sets: [
    { tag: 'LV-07', description: 'Invented phase set', status: 'in-service' as const, testDueOn: future },
    { tag: 'LV-08', description: 'Invented phase set', status: 'in-service' as const, testDueOn: future },
    { tag: 'LV-09', description: 'Invented overdue set', status: 'in-service' as const, testDueOn: '2026-01-01' },
    { tag: 'LV-10', description: 'Invented faulted set', status: 'out-of-service' as const, testDueOn: future, statusReason: 'Carried fault current' },
    { tag: 'LV-11', description: 'Invented retired set', status: 'retired' as const, testDueOn: future },
  ],
};
const withPlanned = (tag: string) => ({ links: [{ id: 'jA', kind: 'jumper', from: 'a', to: 'b', equipmentId: tag }] }) as unknown as RecordView['document'];

describe('the set picker', () => {
  it('offers only the sets fit to go on and not already on, searchable by tag', async () => {
    render(<StepPanel record={record({ kind: 'install', link: 'jA' }, { inventory, setsOn: [{ link: 'jB', setTag: 'lv-08', at: '', by: 'u1' }] })} people={[me]} me={me} busy={false} submit={vi.fn()} onClose={() => undefined} />);
    expect(screen.getAllByRole('radio').map((r) => r.closest('label')!.textContent)).toEqual(['LV-07Invented phase set']);
    await userEvent.type(screen.getByLabelText('Find a set by tag'), 'zz');
    expect(screen.queryAllByRole('radio')).toHaveLength(0);
  });

  it("chooses the plan's own set first", () => {
    render(<StepPanel record={record({ kind: 'install', link: 'jA' }, { inventory, document: withPlanned('lv-07') })} people={[me]} me={me} busy={false} submit={vi.fn()} onClose={() => undefined} />);
    expect(screen.getByRole('radio', { name: /LV-07/ })).toBeChecked();
    expect(screen.getByText(/named in the plan/)).toBeTruthy();
  });

  it('says why the set the plan names cannot go on, and chooses none', () => {
    render(<StepPanel record={record({ kind: 'install', link: 'jA' }, { inventory, document: withPlanned('LV-10') })} people={[me]} me={me} busy={false} submit={vi.fn()} onClose={() => undefined} />);
    expect(screen.getByTestId('planned-set-unfit').textContent).toContain('LV-10 is out of service: Carried fault current');
    expect(screen.getAllByRole('radio').every((r) => !(r as HTMLInputElement).checked)).toBe(true);
  });
});

describe('the next-step panel', () => {
  it('records a clear test only when every phase reads absent and the detector was proved before and after', async () => {
    const submit = vi.fn();
    render(<StepPanel record={record({ kind: 'voltage-test' })} people={[me]} me={me} busy={false} submit={submit} onClose={() => undefined} />);
    const button = screen.getByRole('button', { name: 'Record test' });
    await userEvent.click(screen.getByLabelText('Detector proved before'));
    await userEvent.click(screen.getAllByRole('button', { name: 'Absent' })[0]);
    expect(button).toBeDisabled();
    await userEvent.click(screen.getAllByRole('button', { name: 'Absent' })[1]);
    expect(button).toBeDisabled();
    await userEvent.click(screen.getByLabelText('Detector proved after'));
    expect(button).toBeEnabled();
    await userEvent.click(button);
    expect(submit).toHaveBeenCalledWith({ type: 'voltage-test', detector: 'Detector 7', detectorCheckedBefore: true, detectorCheckedAfter: true, phases: { A: 'absent', B: 'absent' } });
  });

  it('records voltage found at once: one phase reading present is enough, nothing else has to be ticked', async () => {
    const submit = vi.fn();
    render(<StepPanel record={record({ kind: 'voltage-test' })} people={[me]} me={me} busy={false} submit={submit} onClose={() => undefined} />);
    const button = screen.getByRole('button', { name: 'Record test' });
    await userEvent.click(screen.getAllByRole('button', { name: 'Present' })[0]);
    expect(button).toBeEnabled();
    await userEvent.click(button);
    expect(submit).toHaveBeenCalledWith({ type: 'voltage-test', detector: 'Detector 7', detectorCheckedBefore: false, detectorCheckedAfter: false, phases: { A: 'present' } });
  });

  it('puts a set on only with a set picked and the ground-end-first confirmation', async () => {
    const submit = vi.fn();
    render(<StepPanel record={record({ kind: 'install', link: 'jA' }, { inventory })} people={[me]} me={me} busy={false} submit={submit} onClose={() => undefined} />);
    const button = screen.getByRole('button', { name: 'Set on' });
    await userEvent.click(screen.getByLabelText(/Ground end on first/));
    expect(button).toBeDisabled();
    await userEvent.click(screen.getByRole('radio', { name: /LV-07/ }));
    expect(button).toBeEnabled();
    await userEvent.click(screen.getByLabelText(/Ground end on first/));
    expect(button).toBeDisabled();
    await userEvent.click(screen.getByLabelText(/Ground end on first/));
    await userEvent.click(button);
    expect(submit).toHaveBeenCalledWith({ type: 'install', link: 'jA', setTag: 'LV-07', groundEndFirst: true });
  });

  it('says who closed the record out and when, in the organisation\'s time zone', () => {
    render(<StepPanel record={record({ kind: 'closed' }, { status: 'closed', closedAt: '2026-05-04T19:05:00.000Z', closedBy: me })} people={[me]} me={me} busy={false} submit={vi.fn()} onClose={() => undefined} timeZone="America/Chicago" />);
    expect(screen.getByTestId('next-step').textContent).toBe('Closed out by Invented Lead at 2026-05-04 14:05 CDT. Nothing more can be recorded.');
  });

  it('after voltage was found offers no way to put a set on, only the stop', () => {
    render(<StepPanel record={record({ kind: 'stop' }, { voltageFound: true })} people={[me]} me={me} busy={false} submit={vi.fn()} onClose={() => undefined} />);
    expect(screen.getByRole('alert').textContent).toMatch(/Call the system operator/);
    expect(screen.queryByRole('button', { name: 'Set on' })).toBeNull();
  });
});

describe('stamping an entry on the device', () => {
  it('gives each entry its own UUID and the device time', () => {
    const a = stampEntry({ type: 'note', text: 'x' }, new Date('2026-05-04T07:00:00Z'));
    const b = stampEntry({ type: 'note', text: 'x' }, new Date('2026-05-04T07:00:00Z'));
    expect(a.clientId).toMatch(/^[0-9a-f-]{36}$/);
    expect(a.clientId).not.toBe(b.clientId);
    expect(a.at).toBe('2026-05-04T07:00:00.000Z');
  });
});
