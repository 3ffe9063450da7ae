/**
 * Jumper and rod figures for the report, from the worst currents the phase solves found.
 */
import type { PlanDocument } from '@/lib/schemas/plan';
import type { Assumption, BondFigures, FaultFigures, JumperFigures, RodFigures } from './contract';
import type { Network } from './network';
import { cableRating, clampRatingAt, RATING_TABLE_HZ, TABLE_SHORT_S } from './ratings';
import { BARRICADE_METHOD, barricadeRadius } from './rods';

/** Running worst cases over the phase injections; a current of −1 means no phase was solved. */
export interface WorstCurrents {
  /** Per jumper link (in plan order): its branch index or −1, its ends, and 1/|Z| in S. */
  jumperBranch: Int32Array;
  jumperFrom: Int32Array;
  jumperTo: Int32Array;
  jumperAdmittance: Float64Array;
  jumperA: Float64Array;
  rodIds: string[];
  rodNode: Int32Array;
  rodOhms: Float64Array;
  rodA: Float64Array;
  rodV: Float64Array;
  /** Per bond in the network (plan order): what it is, its ends, 1/|Z| in S and its worst current, A. */
  bonds: Omit<BondFigures, 'currentKa'>[];
  bondFrom: Int32Array;
  bondTo: Int32Array;
  bondAdmittance: Float64Array;
  bondA: Float64Array;
}

/** Bonds the solve put current through (more than 1 A), with the worst current, kA. */
export function bondFigures(worst: WorstCurrents): BondFigures[] {
  return worst.bonds.flatMap((bond, j) => (worst.bondA[j] > 1 ? [{ ...bond, currentKa: worst.bondA[j] / 1000 }] : []));
}

/**
 * Jumper figures: impedance at the system frequency, duty (the full asymmetrical fault current —
 * parallel jumpers are not credited with sharing it, since one clamp letting go puts it all on the
 * rest), cable and clamp ratings for the clearing time, and the worst solved current, kA.
 */
export function jumperFigures(plan: PlanDocument, network: Network, fault: FaultFigures, worst: WorstCurrents, assumptions: Assumption[]): JumperFigures[] {
  const frequencyHz = plan.system.frequencyHz;
  const jumperLinks = plan.links.filter((link) => link.kind === 'jumper');
  return jumperLinks.map((link, j): JumperFigures => {
    const b = worst.jumperBranch[j];
    const rating = cableRating(link.cable, fault.durationS, frequencyHz);
    const resistanceOhms = link.ohms ?? (b < 0 ? 0 : network.branchRe[b]);
    const reactanceOhms = link.ohms !== undefined || b < 0 ? 0 : network.branchIm[b];
    let clampRatingKa: number | null = null;
    if (link.clampKa !== undefined) {
      // A clamp rating without its duration is taken as for 15 cycles at 60 Hz (0.25 s), the
      // shortest F855 withstand duration: I²t conversion then credits the least. clampCycles are
      // always cycles of 60 Hz, the rating table's own basis, whatever the system frequency.
      const clampCycles = link.clampCycles ?? TABLE_SHORT_S * RATING_TABLE_HZ;
      if (link.clampCycles === undefined) {
        assumptions.push({ element: link.id, field: 'clampCycles', value: clampCycles, unit: 'cycles', basis: 'clamp rating taken as for 0.25 s, the shortest ASTM F855 withstand duration, which credits the least' });
      }
      clampRatingKa = clampRatingAt(link.clampKa, clampCycles, fault.durationS, frequencyHz);
    }
    return {
      link: link.id,
      ohms: Math.hypot(resistanceOhms, reactanceOhms),
      resistanceOhms,
      reactanceOhms,
      dutyKa: fault.asymmetricalKa,
      cableRatingKa: rating.ratingKa,
      fusingKa: rating.fusingKa,
      clampRatingKa,
      currentKa: worst.jumperA[j] < 0 ? null : worst.jumperA[j] / 1000,
    };
  });
}

/**
 * Rod figures: resistance and method (rods.ts), the worst solved current and potential rise, and
 * the barricade radius. Without any solved fault the whole injected fault current (Df·If) is
 * taken through the rod, the most it could carry.
 */
export function rodFigures(plan: PlanDocument, network: Network, fault: FaultFigures, bodyKg: 50 | 70, worst: WorstCurrents): RodFigures[] {
  const nodeById = new Map(plan.nodes.map((node) => [node.id, node]));
  return worst.rodIds.map((id, r): RodFigures => {
    const node = nodeById.get(id);
    const rod = network.rods.get(id);
    const solved = worst.rodA[r] >= 0;
    const currentA = solved ? worst.rodA[r] : fault.injectedKa * 1000;
    const barricade = barricadeRadius({
      soilOhmM: node?.kind === 'ground-rod' ? node.soilOhmM : 0,
      currentA,
      durationS: fault.durationS,
      bodyKg,
      lengthM: node?.kind === 'ground-rod' ? node.lengthM : 0,
    });
    return {
      node: id,
      ohms: rod?.ohms ?? 0,
      method: rod?.method ?? '',
      currentKa: solved ? currentA / 1000 : null,
      potentialRiseVolts: solved ? worst.rodV[r] : null,
      barricadeRadiusM: barricade.radiusM,
      tolerableStepVolts: barricade.tolerableStepVolts,
      barricadeMethod: solved ? BARRICADE_METHOD : `${BARRICADE_METHOD}; no fault was solved, so the whole fault current is taken through the rod`,
    };
  });
}
