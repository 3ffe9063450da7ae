/**
 * Every finding in a list carries its rule id as a small muted code label beside it (drawer,
 * practice results), while the sentence itself names no rule id.
 */
import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { FindingsList } from '@/components/editor/panels/FindingsList';
import { AttemptResultView } from '@/components/practice/AttemptResultView';
import type { AttemptResult } from '@/components/practice/types';
import type { Finding } from '@/lib/domain/report';
import type { PlanDocument } from '@/lib/schemas/plan';

const findings: Finding[] = [
  { rule: 'surface-outside-zone', severity: 'blocker', elements: ['W1', 'X1'], message: 'W1 can touch X1, which is outside the zone.', basis: 'Equipotential practice' },
  { rule: 'lead-slack', severity: 'warning', elements: ['j2'], message: 'Jumper j2 is much longer than its span.', basis: 'Common practice' },
];

function expectLabels(container: HTMLElement, rules: string[]) {
  const labels = [...container.querySelectorAll('code[data-rule-id]')];
  expect(labels.map((l) => l.textContent)).toEqual(rules);
  for (const l of labels) expect(l.className).toMatch(/\btext-note\b/);
}

describe('rule id labels', () => {
  it('sit beside each finding of the drawer as muted code, outside the sentence', () => {
    const { container } = render(<FindingsList findings={findings} />);
    expectLabels(container, ['surface-outside-zone', 'lead-slack']);
    for (const f of findings) expect(screen.getByText(f.message).querySelector('code')).toBeNull();
  });

  it('sit beside the practice result\'s findings and the planted gaps', () => {
    const doc = { nodes: [], links: [] } as unknown as PlanDocument;
    const result: AttemptResult = {
      score: 50,
      passed: false,
      found: [findings[0]],
      missed: [findings[1]],
      wrong: ['X9'],
      explanation: { gaps: [{ rule: 'phase-ungrounded', elements: ['C'], message: 'Phase C is not grounded.', basis: 'Treat as energized' }], teachingNote: null, original: { planId: 1, revision: 1, title: 'Invented pole', href: '/library/1' } },
      mine: { attempts: 1, best: 50, latest: 50 },
    };
    const { container } = render(<AttemptResultView result={result} doc={doc} onRetry={() => {}} />);
    expectLabels(container, ['surface-outside-zone', 'lead-slack', 'phase-ungrounded']);
    expect(screen.getByText('Phase C is not grounded.').textContent).not.toContain('phase-ungrounded');
  });
});
