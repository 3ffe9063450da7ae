/** Stored check reports are parsed, not cast: whatever the checker writes reads back whole. */
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import { libraryFacts } from '@/lib/domain/library-facts';
import { planSchema } from '@/lib/schemas/plan';
import { parseStoredReport, reportSchema } from '@/lib/schemas/report';

const dir = join(import.meta.dirname, '../../../fixtures/plans');
const fixtures = readdirSync(dir).filter((f) => f.endsWith('.json') && f !== 'expected.json');

describe('report schema', () => {
  it.each(fixtures)('reads back the report of %s as written', (file) => {
    const parsed = planSchema.safeParse(JSON.parse(readFileSync(join(dir, file), 'utf8')));
    if (!parsed.success) return; // fixtures of refused documents have no report
    const report = checkPlan(parsed.data, undefined, { today: '2026-01-15' });
    expect(parseStoredReport(JSON.stringify(report))).toEqual(report);
  });

  it('refuses a report missing a contract field or with a wrong severity, naming the path', () => {
    const report = checkPlan(planSchema.parse(JSON.parse(readFileSync(join(dir, 'bucket-tangent-clean.json'), 'utf8'))));
    const noSummary: Partial<typeof report> = { ...report };
    delete noSummary.summary;
    expect(() => parseStoredReport(JSON.stringify(noSummary))).toThrow(/summary/);
    const bad = reportSchema.safeParse({ ...report, findings: [{ rule: 'x', severity: 'fatal', elements: [], message: '', basis: '' }] });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].path).toEqual(['findings', 0, 'severity']);
    expect(parseStoredReport(null)).toBeNull();
  });
});

describe('library facts', () => {
  const plan = planSchema.parse(JSON.parse(readFileSync(join(dir, 'bucket-tangent-clean.json'), 'utf8')));
  const finding = (rule: string, severity: 'blocker' | 'warning' | 'note') => ({ rule, severity, elements: [], message: '', basis: '' });
  const reportWith = (...findings: ReturnType<typeof finding>[]) => ({ ...checkPlan(plan), findings });

  it('lists rules that fired before and not on the approved revision, above note level, sorted', () => {
    const earlier = [reportWith(finding('zone-ungrounded', 'blocker'), finding('lead-slack', 'note')), null, reportWith(finding('cable-underrated', 'warning'), finding('clamp-underrated', 'blocker'))];
    const approved = reportWith(finding('clamp-underrated', 'warning'));
    expect(libraryFacts(plan, approved, earlier).fixedRules).toEqual(['cable-underrated', 'zone-ungrounded']);
  });

  it('takes the tags and the structure\'s material from the document', () => {
    const facts = libraryFacts(plan, null, []);
    expect(facts.tags).toContain('bucket work');
    const structure = plan.nodes.find((n) => n.kind === 'structure');
    expect(facts.material).toBe(structure && structure.kind === 'structure' ? structure.material : null);
    expect(facts.fixedRules).toEqual([]);
  });
});
