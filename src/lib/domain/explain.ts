/**
 * "Explain" for the library: in plain words, what one element does in the work zone, with the
 * figures of the check. Pure: reads the plan and its stored report only.
 */
import type { PlanDocument } from '@/lib/schemas/plan';
import type { CheckReport } from './report';
import { findZones } from './zones';
import { formatMetres, formatMilliamps, type UnitSystem } from './units';

export interface Explanation {
  id: string;
  title: string;
  lines: string[];
}

const fmt = (v: number | null | undefined, digits: number) => (v === null || v === undefined ? '—' : v.toFixed(digits));

const barricade = (rod: { barricadeRadiusM?: number | null }, units: UnitSystem) =>
  rod.barricadeRadiusM === null || rod.barricadeRadiusM === undefined ? '—' : formatMetres(rod.barricadeRadiusM, units);

/** One explanation per node and link of the plan, in document order. */
export function explainPlan(plan: PlanDocument, report: CheckReport | null, units: UnitSystem = 'metric'): Explanation[] {
  const zones = findZones(plan);
  const zoneOf = new Map<string, number>();
  zones.forEach((z, i) => z.nodes.forEach((id) => zoneOf.set(id, i)));
  const label = (id: string) => plan.nodes.find((n) => n.id === id)?.label ?? id;
  const out: Explanation[] = [];

  for (const node of plan.nodes) {
    const lines: string[] = [];
    const z = zoneOf.get(node.id);
    if (node.kind === 'worker') {
      if (node.standsOn === undefined) lines.push('Stands on nothing yet: choose what this worker stands on or in.');
      else lines.push(`Stands on ${label(node.standsOn)} (${node.standsOn}); everything this worker reaches must be in the same zone as that.`);
      for (const c of report?.contacts.filter((c) => c.worker === node.id) ?? []) {
        lines.push(`Touching ${label(c.surface)}: ${fmt(c.touchVolts, 1)} V across the body, ${formatMilliamps(c.bodyAmps)} through it, against a limit of ${formatMilliamps(c.limitAmps)}.`);
      }
    } else if (node.kind === 'supply-end') {
      lines.push(`Marks a source that can feed the work through ${node.phases.map(label).join(', ')}; grounds belong between it and the workers, or at the work location.`);
    } else if (z === undefined) {
      lines.push('Not a bonding path: wood, fiberglass and concrete join nothing a clamp is put on.');
    } else {
      const zone = zones[z];
      lines.push(`In zone ${z + 1} with ${zone.nodes.length - 1} other element${zone.nodes.length === 2 ? '' : 's'}; that zone is ${zone.grounded ? 'grounded' : 'NOT grounded'}.`);
      const bonds = plan.links.filter((l) => (l.kind === 'jumper' || l.kind === 'bond') && (l.from === node.id || l.to === node.id));
      if (bonds.length) lines.push(`Held there by ${bonds.map((l) => `${l.kind} ${l.id} to ${label(l.from === node.id ? l.to : l.from)}`).join('; ')}.`);
      if (node.kind === 'phase') lines.push('A phase is treated as energized until it is grounded; its jumper carries the fault current if the line is re-energized.');
      if (node.kind === 'cluster-bar') lines.push('The common point: phases, neutral and the worker\'s position are bonded here so they rise together.');
      if (node.kind === 'pole-ground') lines.push('An existing pole ground conducts, but is never relied on to ground the zone.');
    }
    const rod = report?.rods.find((r) => r.node === node.id);
    if (rod) lines.push(`Resistance to remote earth ${fmt(rod.ohms, 1)} Ω; barricade ${barricade(rod as { barricadeRadiusM?: number | null }, units)} around it.`);
    for (const f of report?.findings.filter((f) => f.elements.includes(node.id)) ?? []) lines.push(`${f.severity[0].toUpperCase()}${f.severity.slice(1)}: ${f.message}`);
    out.push({ id: node.id, title: `${node.label ?? node.kind} (${node.id})`, lines });
  }

  for (const link of plan.links) {
    const lines: string[] = [];
    if (link.kind === 'reach') lines.push(`${label(link.from)} can touch ${label(link.to)} from the work position.`);
    else {
      lines.push(`${link.kind === 'jumper' ? 'Temporary protective ground' : 'Permanent bond'} between ${label(link.from)} and ${label(link.to)}.`);
      const j = report?.jumpers.find((j) => j.link === link.id);
      if (j) lines.push(`Impedance ${fmt(j.ohms === null ? null : j.ohms * 1000, 2)} mΩ; fault duty ${fmt(j.dutyKa, 2)} kA against a cable rating of ${fmt(j.cableRatingKa, 1)} kA${j.clampRatingKa !== null ? ` and a clamp rating of ${fmt(j.clampRatingKa, 1)} kA` : ''}.`);
    }
    for (const f of report?.findings.filter((f) => f.elements.includes(link.id)) ?? []) lines.push(`${f.severity[0].toUpperCase()}${f.severity.slice(1)}: ${f.message}`);
    out.push({ id: link.id, title: `${link.kind} ${link.id}`, lines });
  }
  return out;
}
