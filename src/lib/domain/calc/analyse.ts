/**
 * Network figures for the report: the plan's network solved at the system frequency with the
 * fault injected into each phase in turn, worst case kept per contact, jumper and rod.
 */
import type { PlanDocument } from '../../schemas/plan';
import { solveInjections, type Injection } from './batch';
import { tolerableBodyAmps } from './body';
import type { ContactFigures, NetworkFigures } from './contract';
import { computeFault } from './fault';
import { jumperFigures, rodFigures, type WorstCurrents } from './figures';
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
 * faultKa·1000 A symmetrical rms (Dalziel's limit is an rms limit) into each phase node in turn,
 * returning through remote earth; for each reach contact I_body = |V_open/(Z_th + R_body)|, A,
 * with Z_th from a unit current between the standing node and the surface. Parts with no path to
 * earth are reported as floating, never as numbers.
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
    const surface = network.indexOf.get(link.to);
    const floating = stand === undefined || surface === undefined;
    const figures: ContactFigures = { worker: link.from, surface: link.to, touchVolts: 0, bodyAmps: 0, limitAmps, worstPhase: null, status: floating ? 'floating' : 'solved' };
    contacts.push(figures);
    if (!floating) measured.push({ figures, stand, surface, loopOhms: bodyOhms });
  }
  const thevenin = measured.filter((m) => m.stand !== m.surface);
  if (factor) {
    solveInjections(factor, thevenin.map((m): Injection => ({ into: m.stand, outOf: m.surface })), 1, (k, column) => {
      const [zr, zi] = column.between(thevenin[k].stand, thevenin[k].surface);
      thevenin[k].loopOhms = Math.hypot(zr + bodyOhms, zi);
    });
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
  if (factor) {
    const injections = phases.map((phase): Injection => ({ into: phase.index, outOf: REFERENCE }));
    solveInjections(factor, injections, (plan.system.faultKa ?? NaN) * 1000, (k, column) => {
      for (let c = 0; c < contactStand.length; c++) {
        const touchVolts = column.magnitudeBetween(contactStand[c], contactSurface[c]);
        const bodyAmps = touchVolts / contactLoop[c];
        if (bodyAmps > contactBestA[c]) {
          contactBestA[c] = bodyAmps;
          contactBestV[c] = touchVolts;
          contactBestPhase[c] = k;
        }
      }
      for (let j = 0; j < jumperFrom.length; j++) {
        if (jumperAdmittance[j] === 0) continue;
        const amps = column.magnitudeBetween(jumperFrom[j], jumperTo[j]) * jumperAdmittance[j];
        if (amps > jumperA[j]) jumperA[j] = amps;
      }
      for (let r = 0; r < rodNode.length; r++) {
        const riseV = column.magnitudeBetween(rodNode[r], REFERENCE);
        if (riseV / rodOhms[r] > rodA[r]) {
          rodA[r] = riseV / rodOhms[r];
          rodV[r] = riseV;
        }
      }
    });
  }
  measured.forEach((m, c) => {
    if (contactBestPhase[c] < 0) return;
    Object.assign(m.figures, { touchVolts: contactBestV[c], bodyAmps: contactBestA[c], worstPhase: phases[contactBestPhase[c]].id });
  });

  const assumptions = [...network.assumptions];
  return {
    contacts,
    jumpers: jumperFigures(plan, network, fault, worst, assumptions),
    rods: rodFigures(plan, network, fault, bodyKg, worst),
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
  };
}
