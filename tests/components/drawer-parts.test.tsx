import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { ConflictDialog } from '@/components/editor/panels/ConflictDialog';
import { FindingsList } from '@/components/editor/panels/FindingsList';
import { SaveIndicator } from '@/components/editor/panels/SaveIndicator';
import type { Finding } from '@/lib/domain/report';

const findings: Finding[] = [
  { rule: 'surface-outside-zone', severity: 'blocker', elements: ['W1', 'X1'], message: 'W1 can touch X1, which is outside the zone.', basis: 'Equipotential practice' },
  { rule: 'lead-slack', severity: 'warning', elements: ['j2'], message: 'Jumper j2 is much longer than its span.', basis: 'Common practice' },
  { rule: 'rod-barricade', severity: 'note', elements: ['R1'], message: 'Barricade rod R1 out to 6 m.', basis: 'IEEE Std 80' },
  { rule: 'phase-ungrounded', severity: 'blocker', elements: ['C'], message: 'Phase C is not grounded.', basis: 'Treat as energized' },
];

describe('the findings list', () => {
  it('groups by severity with words and glyphs, blockers first', () => {
    render(<FindingsList findings={findings} />);
    const groups = screen.getAllByRole('region');
    expect(groups.map((g) => g.getAttribute('aria-label'))).toEqual(['Blockers', 'Warnings', 'Notes']);
    expect(within(groups[0]).getByText('Blockers (2)')).toBeInTheDocument();
    expect(within(groups[0]).getAllByText('Blocker')).toHaveLength(2);
    expect(within(groups[1]).getByText('Warning')).toBeInTheDocument();
    expect(within(groups[2]).getByText('Note')).toBeInTheDocument();
    for (const g of groups) expect(g.querySelectorAll('svg').length).toBeGreaterThan(0);
    expect(screen.getByText('W1 can touch X1, which is outside the zone.')).toBeInTheDocument();
    expect(screen.getByText(/Basis: IEEE Std 80/)).toBeInTheDocument();
  });
  it('"Show" hands back the finding so its elements can be selected', async () => {
    const onShow = vi.fn();
    render(<FindingsList findings={findings} onShow={onShow} />);
    await userEvent.click(screen.getByRole('button', { name: 'Show W1, X1' }));
    expect(onShow).toHaveBeenCalledWith(findings[0]);
  });
  it('says "Clear" when there is nothing to fix', () => {
    render(<FindingsList findings={[]} />);
    expect(screen.getByTestId('findings-clear')).toHaveTextContent('Clear');
    expect(screen.queryByRole('region')).toBeNull();
  });
});

describe('the save-state indicator', () => {
  it.each([
    ['saved', 'Saved'],
    ['saving', 'Saving…'],
    ['offline', 'Offline — kept on this device'],
    ['conflict', 'Conflict'],
    ['unsaved', 'Unsaved changes'],
  ] as const)('%s reads "%s"', (state, text) => {
    render(<SaveIndicator state={state} />);
    expect(screen.getByRole('status')).toHaveTextContent(text);
    expect(screen.getByRole('status').querySelector('svg')).not.toBeNull();
  });
  it('offers to try again when offline', async () => {
    const onRetry = vi.fn();
    render(<SaveIndicator state="offline" onRetry={onRetry} />);
    await userEvent.click(screen.getByRole('button', { name: 'Try now' }));
    expect(onRetry).toHaveBeenCalledOnce();
  });
});

describe('the conflict dialog', () => {
  it('names both revisions and offers the two choices', async () => {
    const onReloadTheirs = vi.fn();
    const onKeepMine = vi.fn();
    render(<ConflictDialog yourRevision={3} currentRevision={5} onReloadTheirs={onReloadTheirs} onKeepMine={onKeepMine} />);
    const dialog = screen.getByRole('alertdialog', { name: 'This plan changed while you were editing' });
    expect(dialog).toHaveTextContent('revision 5');
    expect(dialog).toHaveTextContent('revision 3');
    expect(screen.getByRole('button', { name: 'Reload theirs' })).toHaveFocus();
    await userEvent.click(screen.getByRole('button', { name: 'Keep mine as a new revision' }));
    expect(onKeepMine).toHaveBeenCalledOnce();
    expect(onReloadTheirs).not.toHaveBeenCalled();
    await userEvent.click(screen.getByRole('button', { name: 'Reload theirs' }));
    expect(onReloadTheirs).toHaveBeenCalledOnce();
  });
});

describe('identical findings', () => {
  const clamp = (id: string): Finding => ({ rule: 'clamp-underrated', severity: 'blocker', elements: [id], message: `Jumper ${id} has clamps rated 10 kA, below the 12 kA it would carry.`, basis: 'Clamp ratings' });
  it('read as one finding listing every lead, and Show shows them all', async () => {
    const onShow = vi.fn();
    render(<FindingsList findings={[...['jA', 'jB', 'jC', 'jD', 'jE', 'jF'].map(clamp), findings[3]]} onShow={onShow} />);
    const items = screen.getAllByRole('listitem');
    expect(items).toHaveLength(2);
    expect(within(items[0]).getByTestId('finding-group')).toHaveTextContent('The same for 6 places: jA, jB, jC, jD, jE, jF');
    await userEvent.click(within(items[0]).getByRole('button', { name: 'Show jA, jB, jC, jD, jE, jF' }));
    expect(onShow.mock.calls[0][0].elements).toEqual(['jA', 'jB', 'jC', 'jD', 'jE', 'jF']);
  });
  it('different sentences stay apart', () => {
    const other = { ...clamp('jB'), message: 'Jumper jB has clamps rated 8 kA, below the 12 kA it would carry.' };
    render(<FindingsList findings={[clamp('jA'), other]} />);
    expect(screen.getAllByRole('listitem')).toHaveLength(2);
  });
});
