/**
 * Network figures for the report: the plan's network solved at the system frequency with the
 * fault injected into each phase in turn, worst case kept per contact, jumper and rod.
 */
import type { PlanDocument } from '@/lib/schemas/plan';
import { drivingPointImpedances, positionOf, solveInjectionBlocks, type Injection } from './batch';
import { tolerableBodyAmps } from './body';
import type { ContactFigures, NetworkFigures } from './contract';
import { computeFault } from './fault';
import { bondFigures, jumperFigures, rodFigures, type WorstCurrents } from './figures';
import { isSpan } from '@/lib/domain/plan-model';
import { assembleAdmittance, buildNetwork, REFERENCE, type Network } from './network';
import { factorSymmetric, type LdlFactor } from './sparse';

/** Body resistance when the plan gives none, Ω — IEEE Std 80. */
export const DEFAULT_BODY_OHMS = 1000;

/** Factorises the network's admittance matrix once; null for a network with no unknowns. */
export function factorNetwork(network: Network): LdlFactor | null {
  return network.size > 0 ? factorSymmetric(assembleAdmittance(network)) : null;
}

/**
 * Solves a plan's network — IEEE Std 80's body-current model on a nodal solve: fault current
 * Df·If (the effective asymmetrical rms over the shock duration, IEEE Std 80) into each phase node
 * in turn, returning through remote earth; for each reach contact I_body = |V_open/(Z_th + R_body)|,
 * A, with Z_th from a unit current between the standing node and the surface (for a reach to
 * another worker, that worker's standing node, one body resistance: the conservative case). Where
 * nominalKv is given, |V_open| is capped at the line-to-neutral voltage, which the source cannot
 * exceed. Parts with no path to earth are reported as floating, never as numbers.
 */
export function analyseNetwork(plan: PlanDocument): NetworkFigures {
  const network = buildNetwork(plan);
  const factor = factorNetwork(network);
  const fault = computeFault(plan.system);
  const bodyKg = plan.criteria?.bodyKg ?? 50;
  const bodyOhms = plan.criteria?.bodyOhms ?? DEFAULT_BODY_OHMS;
  const limitAmps = tolerableBodyAmps(fault.durationS, bodyKg);
  const nodeById = new Map(plan.nodes.map((node) => [node.id, node]));

  // Contacts: a worker on `earth` stands at the reference; wood, fiberglass and floating parts
  // have no network index and give a floating contact.
  const contacts: ContactFigures[] = [];
  const measured: { figures: ContactFigures; stand: number; surface: number; loopOhms: number }[] = [];
  for (const link of plan.links) {
    if (link.kind !== 'reach') continue;
    const worker = nodeById.get(link.from);
    const stand = worker?.kind === 'worker' && worker.standsOn !== undefined ? network.indexOf.get(worker.standsOn) : undefined;
    const target = nodeById.get(link.to);
    const surfaceId = target?.kind === 'worker' ? target.standsOn : link.to;
    const surface = surfaceId === undefined ? undefined : network.indexOf.get(surfaceId);
    const floating = stand === undefined || surface === undefined;
    const figures: ContactFigures = { worker: link.from, surface: link.to, touchVolts: 0, bodyAmps: 0, limitAmps, worstPhase: null, status: floating ? 'floating' : 'solved', systemVoltageLimited: false };
    contacts.push(figures);
    if (!floating) measured.push({ figures, stand, surface, loopOhms: bodyOhms });
  }
  const thevenin = measured.filter((m) => m.stand !== m.surface);
  if (factor) {
    const z = drivingPointImpedances(factor, thevenin.map((m): Injection => ({ into: m.stand, outOf: m.surface })));
    thevenin.forEach((m, k) => (m.loopOhms = Math.hypot(z.re[k] + bodyOhms, z.im[k])));
  }

  const phases: { id: string; index: number }[] = [];
  const unsolvedPhases: string[] = [];
  for (const node of plan.nodes) {
    if (node.kind !== 'phase') continue;
    const index = network.indexOf.get(node.id);
    if (index === undefined || !factor) unsolvedPhases.push(node.id);
    else phases.push({ id: node.id, index });
  }

  const worst = emptyWorst(plan, network);
  const contactStand = Int32Array.from(measured, (m) => m.stand);
  const contactSurface = Int32Array.from(measured, (m) => m.surface);
  const contactLoop = Float64Array.from(measured, (m) => m.loopOhms);
  const contactBestA = new Float64Array(measured.length).fill(-1);
  const contactBestV = new Float64Array(measured.length);
  const contactBestPhase = new Int32Array(measured.length).fill(-1);
  const { jumperFrom, jumperTo, jumperAdmittance, jumperA, rodNode, rodOhms, rodA, rodV } = worst;
  const capVolts = fault.lineToNeutralVolts ?? Infinity;
  const contactCapped = new Uint8Array(measured.length);
  if (factor) {
    // Elimination positions of every end read after each phase's solve (remote earth reads 0 V).
    const at = (indices: Int32Array) => Int32Array.from(indices, (i) => positionOf(factor, i));
    const [cStand, cSurface, jFrom, jTo, bFrom, bTo, rNode] = [contactStand, contactSurface, jumperFrom, jumperTo, worst.bondFrom, worst.bondTo, rodNode].map(at);
    const earth = positionOf(factor, REFERENCE);
    const injections = phases.map((phase): Injection => ({ into: phase.index, outOf: REFERENCE }));
    solveInjectionBlocks(factor, injections, fault.injectedKa * 1000, ({ first, count, stride, values }) => {
      /** |V_a − V_b| of right-hand side r, V, from elimination positions. */
      const magnitude = (a: number, b: number, r: number) => {
        const ia = a * stride + 2 * r;
        const ib = b * stride + 2 * r;
        const vr = values[ia] - values[ib];
        const vi = values[ia + 1] - values[ib + 1];
        return Math.sqrt(vr * vr + vi * vi);
      };
      // Phases in list order for each element, so ties keep the first phase, as one solve at a time did.
      for (let c = 0; c < cStand.length; c++) {
        for (let r = 0; r < count; r++) {
          const openVolts = magnitude(cStand[c], cSurface[c], r);
          const touchVolts = Math.min(openVolts, capVolts);
          const bodyAmps = touchVolts / contactLoop[c];
          if (bodyAmps > contactBestA[c]) {
            contactBestA[c] = bodyAmps;
            contactBestV[c] = touchVolts;
            contactBestPhase[c] = first + r;
            contactCapped[c] = openVolts > capVolts ? 1 : 0;
          }
        }
      }
      for (let j = 0; j < jFrom.length; j++) {
        if (jumperAdmittance[j] === 0) continue;
        for (let r = 0; r < count; r++) {
          const amps = magnitude(jFrom[j], jTo[j], r) * jumperAdmittance[j];
          if (amps > jumperA[j]) jumperA[j] = amps;
        }
      }
      for (let j = 0; j < bFrom.length; j++) {
        for (let r = 0; r < count; r++) {
          const amps = magnitude(bFrom[j], bTo[j], r) * worst.bondAdmittance[j];
          if (amps > worst.bondA[j]) worst.bondA[j] = amps;
        }
      }
      for (let k = 0; k < rNode.length; k++) {
        for (let r = 0; r < count; r++) {
          const riseV = magnitude(rNode[k], earth, r);
          if (riseV / rodOhms[k] > rodA[k]) {
            rodA[k] = riseV / rodOhms[k];
            rodV[k] = riseV;
          }
        }
      }
    });
  }
  measured.forEach((m, c) => {
    if (contactBestPhase[c] < 0) return;
    Object.assign(m.figures, { touchVolts: contactBestV[c], bodyAmps: contactBestA[c], worstPhase: phases[contactBestPhase[c]].id, systemVoltageLimited: contactCapped[c] === 1 });
  });

  const assumptions = [...network.assumptions];
  return {
    contacts,
    jumpers: jumperFigures(plan, network, fault, worst, assumptions),
    rods: rodFigures(plan, network, fault, bodyKg, worst),
    bonds: bondFigures(worst),
    assumptions,
    unsolvedPhases,
  };
}

/** Typed arrays of the jumpers and rods to follow through the phase solves; currents start at −1 (none solved). */
function emptyWorst(plan: PlanDocument, network: Network): WorstCurrents {
  const branchOfLink = new Map<string, number>();
  network.branchElement.forEach((element, b) => network.branchKind[b] !== 'ground' && branchOfLink.set(element, b));
  const jumperLinks = plan.links.filter((link) => link.kind === 'jumper');
  const jumperFrom = new Int32Array(jumperLinks.length);
  const jumperTo = new Int32Array(jumperLinks.length);
  const jumperAdmittance = new Float64Array(jumperLinks.length); // 1/|Z|, S; 0 when not in the network
  const jumperBranch = new Int32Array(jumperLinks.length).fill(-1);
  jumperLinks.forEach((link, j) => {
    const b = branchOfLink.get(link.id);
    if (b === undefined) return;
    jumperBranch[j] = b;
    jumperFrom[j] = network.branchFrom[b];
    jumperTo[j] = network.branchTo[b];
    jumperAdmittance[j] = 1 / Math.hypot(network.branchRe[b], network.branchIm[b]);
  });
  // Bonds that are not spans (spans are line conductor, rated by the line): followed for bond rules.
  const nodeById = new Map(plan.nodes.map((node) => [node.id, node]));
  const bondLinks = plan.links.flatMap((link) =>
    link.kind === 'bond' && branchOfLink.has(link.id) && !isSpan(link, nodeById.get(link.from), nodeById.get(link.to)) ? [link] : [],
  );
  const bondBranch = bondLinks.map((link) => branchOfLink.get(link.id) as number);
  const rodIds = [...network.rods.keys()];
  const rodBranch = rodIds.map((id) => network.rods.get(id)?.branch as number);
  return {
    jumperBranch,
    jumperFrom,
    jumperTo,
    jumperAdmittance,
    jumperA: new Float64Array(jumperLinks.length).fill(-1),
    rodIds,
    rodNode: Int32Array.from(rodBranch, (b) => network.branchFrom[b]),
    rodOhms: Float64Array.from(rodBranch, (b) => network.branchRe[b]),
    rodA: new Float64Array(rodIds.length).fill(-1),
    rodV: new Float64Array(rodIds.length),
    bonds: bondLinks.map((link) => ({ link: link.id, ohmsGiven: link.ohms !== undefined })),
    bondFrom: Int32Array.from(bondBranch, (b) => network.branchFrom[b]),
    bondTo: Int32Array.from(bondBranch, (b) => network.branchTo[b]),
    bondAdmittance: Float64Array.from(bondBranch, (b) => 1 / Math.hypot(network.branchRe[b], network.branchIm[b])),
    bondA: new Float64Array(bondLinks.length).fill(-1),
  };
}
