/**
 * Property-based checks of the checker over random valid plans (fast-check): it never throws,
 * never reports NaN or Infinity, and behaves sensibly under edits that cannot make a plan worse.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import type { CheckReport } from '@/lib/domain/report';
import { compareFindings } from '@/lib/domain/rules/index';
import type { PlanDocument } from '@/lib/schemas/plan';
import { planArb } from '../../helpers/random-plan';

/** The report's elements renamed back with `back`; messages get the same textual renaming. */
function renameReport(report: CheckReport, back: (id: string) => string, text: (s: string) => string): CheckReport {
  return {
    ...report,
    findings: report.findings.map((f) => ({ ...f, elements: f.elements.map(back), message: text(f.message) })),
    zones: report.zones.map((z) => ({ ...z, nodes: z.nodes.map(back), ...(z.poleGroundDependent ? { poleGroundDependent: z.poleGroundDependent.map(back) } : {}) })),
    contacts: report.contacts.map((c) => ({ ...c, worker: back(c.worker), surface: back(c.surface), worstPhase: c.worstPhase ? back(c.worstPhase) : c.worstPhase })),
    jumpers: report.jumpers.map((j) => ({ ...j, link: back(j.link) })),
    rods: report.rods.map((r) => ({ ...r, node: back(r.node) })),
    bonds: report.bonds?.map((b) => ({ ...b, link: back(b.link) })),
    assumptions: report.assumptions?.map((a) => ({ ...a, element: back(a.element) })),
  };
}

const TOPOLOGY_RULES = new Set(['stand-not-conductive', 'surface-outside-zone', 'phase-ungrounded', 'zone-ungrounded', 'pole-ground-relied', 'contact-unsolved', 'link-on-insulator', 'reach-insulating', 'plan-incomplete']);
const keyOf = (f: { rule: string; elements: string[] }) => `${f.rule}|${f.elements.join(',')}`;

describe('checkPlan on random valid plans', () => {
  it('never throws, never reports NaN or Infinity, and keeps its own invariants', () => {
    fc.assert(
      fc.property(planArb, (plan) => {
        const report = checkPlan(plan);
        // JSON turns NaN and ±Infinity into null, so a lossless round trip proves there are none.
        expect(JSON.parse(JSON.stringify(report))).toEqual(report);
        expect(report.findings.filter((f) => f.rule === 'calc-failed')).toEqual([]);
        expect([...report.findings].sort(compareFindings)).toEqual(report.findings);
        expect(report.summary.blockers).toBe(report.findings.filter((f) => f.severity === 'blocker').length);
        expect(report.ok).toBe(report.summary.blockers === 0);
        const zoned = report.zones.flatMap((z) => z.nodes);
        expect(new Set(zoned).size).toBe(zoned.length);
        expect(checkPlan(plan)).toEqual(report);
      }),
      { numRuns: 150 },
    );
  });

  // A new jumper inside one zone cannot split a zone or cut a path to ground, so no topology rule
  // can start firing. (Network figures can move either way when a parallel path is added, and the
  // new jumper can itself be underrated, so those rules are not part of this property.)
  it('adding a jumper between two nodes of one zone adds no topology finding and keeps the zones', () => {
    fc.assert(
      fc.property(planArb, fc.nat(), fc.nat(), (plan, i, j) => {
        const before = checkPlan(plan);
        const zone = before.zones.filter((z) => z.nodes.length >= 2)[i % Math.max(1, before.zones.length)];
        fc.pre(zone !== undefined);
        const a = zone.nodes[j % zone.nodes.length];
        const b = zone.nodes[(j + 1) % zone.nodes.length];
        const extra = { id: 'extra', kind: 'jumper' as const, from: a, to: b, cable: '350' as const, lengthM: 1 };
        const after = checkPlan({ ...plan, links: [...plan.links, extra] });
        const had = new Set(before.findings.map(keyOf));
        expect(after.findings.filter((f) => TOPOLOGY_RULES.has(f.rule) && !had.has(keyOf(f)))).toEqual([]);
        expect(after.zones.map((z) => z.nodes)).toEqual(before.zones.map((z) => z.nodes));
        expect(after.zones.filter((z) => !z.grounded).length).toBeLessThanOrEqual(before.zones.filter((z) => !z.grounded).length);
      }),
      { numRuns: 150 },
    );
  });

  it('renaming every id consistently changes nothing but the ids', () => {
    fc.assert(
      fc.property(planArb, (plan) => {
        const to = (id: string) => id.replace(/^n(\d+)$/, 'q$1').replace(/^l(\d+)$/, 'm$1');
        const back = (id: string) => id.replace(/^q(\d+)$/, 'n$1').replace(/^m(\d+)$/, 'l$1');
        const renamed: PlanDocument = {
          ...plan,
          nodes: plan.nodes.map((n) => (n.kind === 'worker' ? { ...n, id: to(n.id), standsOn: to(n.standsOn!) } : { ...n, id: to(n.id) })),
          links: plan.links.map((l) => ({ ...l, id: to(l.id), from: to(l.from), to: to(l.to) })),
        };
        const text = (s: string) => s.replace(/\bq(\d+)\b/g, 'n$1').replace(/\bm(\d+)\b/g, 'l$1');
        expect(renameReport(checkPlan(renamed), back, text)).toEqual(checkPlan(plan));
      }),
      { numRuns: 100 },
    );
  });

  // Bonds are permanent metalwork; a de-energized phase conductor has none, so the generator's
  // bonds on phases are dropped here and only jumpers could have grounded a phase.
  it('removing every jumper leaves every reached phase flagged by a blocker', () => {
    fc.assert(
      fc.property(planArb, (plan) => {
        const phases = new Set(plan.nodes.filter((n) => n.kind === 'phase').map((n) => n.id));
        const links = plan.links.filter((l) => l.kind === 'reach' || (l.kind === 'bond' && !phases.has(l.from) && !phases.has(l.to)));
        const report = checkPlan({ ...plan, links });
        const reached = new Set(links.filter((l) => l.kind === 'reach' && phases.has(l.to)).map((l) => l.to));
        for (const phase of reached) {
          expect(report.findings.some((f) => f.severity === 'blocker' && f.elements.includes(phase)), phase).toBe(true);
        }
        if (reached.size > 0) expect(report.ok).toBe(false);
      }),
      { numRuns: 150 },
    );
  });
});
