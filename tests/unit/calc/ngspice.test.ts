/**
 * Cross-check of our network solve against ngspice, a general-purpose circuit simulator: the same
 * networks written as SPICE netlists (resistors, inductors L = X/(2πf), one AC current source into
 * a phase node, node 0 = remote earth), solved by AC analysis at the system frequency, and every
 * node voltage compared within 0.1 %. All circuits of one frequency share one ngspice run: they
 * meet only at node 0, so each is solved independently of the others.
 */
import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, describe, expect, it } from 'vitest';
import { parsePlan, type PlanDocument } from '@/lib/schemas/plan';
import { buildNetwork, factorNetwork, REFERENCE, type Network } from '@/lib/domain/calc';
import { generatePlan, seededRandom } from '../../../bench/generate-plan';
import { solveOne } from '../../helpers/solve';

const NGSPICE = '/usr/bin/ngspice';
const GENERATED = 60;
/** Branch voltages below this fraction of the circuit's largest node voltage are compared against it instead. */
const BRANCH_FLOOR = 1e-9;
const run = promisify(execFile);
const workDir = mkdtempSync(join(tmpdir(), 'bondmap-ngspice-'));
afterAll(() => process.env.KEEP_NGSPICE ? undefined : rmSync(workDir, { recursive: true, force: true }));

interface Circuit {
  name: string;
  frequencyHz: number;
  network: Network;
  /** Unknown index the test current enters at. */
  inject: number;
  amps: number;
}

function fixturePlans(): { name: string; plan: PlanDocument }[] {
  const dir = join(process.cwd(), 'fixtures/plans');
  return readdirSync(dir)
    .filter((file) => file.endsWith('.json'))
    .flatMap((file) => {
      const parsed = parsePlan(JSON.parse(readFileSync(join(dir, file), 'utf8')));
      return parsed.ok ? [{ name: file, plan: parsed.plan }] : []; // expected.json is not a plan
    });
}

/** Fixture plans with no path to earth at all, so no network to solve. */
const NOTHING_EARTHED = ['earth-jumper-no-ground.json', 'empty-plan.json', 'pole-ground-only.json', 'rod-too-short.json'];

/** One circuit per plan: the current goes into the first phase with a path to earth, else any node. */
function toCircuit(name: string, plan: PlanDocument, rand: () => number): Circuit | null {
  const network = buildNetwork(plan);
  if (network.size === 0) return null;
  const phases = plan.nodes.filter((n) => n.kind === 'phase' && network.indexOf.has(n.id)).map((n) => network.indexOf.get(n.id) as number);
  const inject = phases.length > 0 ? phases[Math.floor(rand() * phases.length)] : 0;
  return { name, frequencyHz: plan.system.frequencyHz, network, inject, amps: plan.system.faultKa! * 1000 };
}

function netlist(circuits: Circuit[], frequencyHz: number, rawPath: string): string {
  const lines = [`bondmap cross-check at ${frequencyHz} Hz`];
  circuits.forEach((circuit, c) => {
    const node = (i: number) => (i === REFERENCE ? '0' : `c${c}n${i}`);
    const { network } = circuit;
    lines.push(`I${c} 0 ${node(circuit.inject)} AC ${circuit.amps}`);
    for (let b = 0; b < network.branchRe.length; b++) {
      const from = node(network.branchFrom[b]);
      const to = node(network.branchTo[b]);
      if (from === to) continue;
      if (network.branchIm[b] > 0) {
        lines.push(`R${c}b${b} ${from} c${c}m${b} ${network.branchRe[b]}`);
        lines.push(`L${c}b${b} c${c}m${b} ${to} ${network.branchIm[b] / (2 * Math.PI * frequencyHz)}`);
      } else {
        lines.push(`R${c}b${b} ${from} ${to} ${network.branchRe[b]}`);
      }
    }
  });
  lines.push('.control', `ac lin 1 ${frequencyHz} ${frequencyHz}`, 'set filetype=ascii', `write ${rawPath} all`, 'quit', '.endc', '.end', '');
  return lines.join('\n');
}

/** Parses the single-point ASCII raw file ngspice writes: variable name → [re, im]. */
function parseRaw(text: string): Map<string, [number, number]> {
  const names = [...text.split('\nVariables:')[1].split('\nValues:')[0].matchAll(/^\s*(\d+)\s+(\S+)\s+\S+\s*$/gm)].map((m) => m[2]);
  const values = [...text.split('\nValues:')[1].matchAll(/(-?[\d.]+e[-+]\d+),(-?[\d.]+e[-+]\d+)/g)].map((m) => [Number(m[1]), Number(m[2])] as [number, number]);
  return new Map(names.map((name, i) => [name.toLowerCase(), values[i]]));
}

async function solveWithNgspice(circuits: Circuit[], frequencyHz: number): Promise<Map<string, [number, number]>> {
  const cir = join(workDir, `f${frequencyHz}.cir`);
  const raw = join(workDir, `f${frequencyHz}.raw`);
  writeFileSync(cir, netlist(circuits, frequencyHz, raw));
  await run(NGSPICE, ['-b', cir], { timeout: 60_000, maxBuffer: 64 * 1024 * 1024 });
  return parseRaw(readFileSync(raw, 'utf8'));
}

describe('network solve against ngspice AC analysis', () => {
  it('finds ngspice (Debian package ngspice; the test set-up installs it)', () => {
    expect(existsSync(NGSPICE), `ngspice is missing at ${NGSPICE}: install it with "apt-get install ngspice"; this cross-check must not be skipped`).toBe(true);
  });

  it(`agrees within 0.1 % on ${GENERATED} generated networks and every fixture plan`, async () => {
    expect(existsSync(NGSPICE), `ngspice is missing at ${NGSPICE}: install it with "apt-get install ngspice"`).toBe(true);
    const rand = seededRandom(20240611);
    const fixtures = fixturePlans();
    const sources = [
      ...Array.from({ length: GENERATED }, (_, k) => ({
        name: `generated ${k}`,
        plan: generatePlan({ elements: 20 + Math.floor(rand() * 300), seed: 1000 + k, frequencyHz: rand() < 0.3 ? 50 : 60 }),
      })),
      ...fixtures,
    ];
    const circuits = sources.map(({ name, plan }) => toCircuit(name, plan, rand)).filter((c): c is Circuit => c !== null);
    // Fixtures with nothing earthed have no circuit: exactly these.
    const solved = new Set(circuits.map((c) => c.name));
    expect(fixtures.filter((f) => !solved.has(f.name)).map((f) => f.name).sort()).toEqual(NOTHING_EARTHED);
    expect(circuits.length).toBe(GENERATED + fixtures.length - NOTHING_EARTHED.length);
    const byFrequency = [50, 60].map((f) => circuits.filter((c) => c.frequencyHz === f));
    const results = await Promise.all(byFrequency.map((group, k) => (group.length ? solveWithNgspice(group, [50, 60][k]) : Promise.resolve(new Map()))));

    let compared = 0;
    let comparedBranches = 0;
    byFrequency.forEach((group, k) => {
      group.forEach((circuit, c) => {
        const { network } = circuit;
        const factor = factorNetwork(network);
        if (!factor) throw new Error('circuit without unknowns');
        const bRe = new Float64Array(network.size);
        bRe[circuit.inject] = circuit.amps;
        const ours = solveOne(factor, bRe, new Float64Array(network.size));
        const spice = Array.from({ length: network.size }, (_, i) => results[k].get(`v(c${c}n${i})`) as [number, number] | undefined);
        const vMax = Math.max(...spice.map((v) => (v ? Math.hypot(v[0], v[1]) : 0)));
        for (let i = 0; i < network.size; i++) {
          const v = spice[i];
          expect(v, `${circuit.name}: ngspice gave no voltage for unknown ${i}`).toBeDefined();
          if (!v) continue;
          const error = Math.hypot(ours.re[i] - v[0], ours.im[i] - v[1]);
          const allowed = 1e-3 * Math.max(Math.hypot(v[0], v[1]), 1e-6 * vMax);
          expect(error, `${circuit.name}, unknown ${i}: ours ${ours.re[i]}+j${ours.im[i]}, ngspice ${v[0]}+j${v[1]}`).toBeLessThanOrEqual(allowed);
          compared++;
        }
        // Branch voltages: node voltages are dominated by the ground resistances, so the jumper and
        // bond impedances (milliohms, with their reactance) show only in differences across branches.
        const at = (i: number): [number, number] => (i === REFERENCE ? [0, 0] : (spice[i] as [number, number]));
        const ourAt = (i: number): [number, number] => (i === REFERENCE ? [0, 0] : [ours.re[i], ours.im[i]]);
        for (let b = 0; b < network.branchRe.length; b++) {
          const [f, t] = [network.branchFrom[b], network.branchTo[b]];
          if (f === t) continue;
          const s = [at(f)[0] - at(t)[0], at(f)[1] - at(t)[1]];
          const o = [ourAt(f)[0] - ourAt(t)[0], ourAt(f)[1] - ourAt(t)[1]];
          const error = Math.hypot(o[0] - s[0], o[1] - s[1]);
          const allowed = 1e-3 * Math.max(Math.hypot(s[0], s[1]), BRANCH_FLOOR * vMax);
          expect(error, `${circuit.name}, branch ${network.branchElement[b]}: ours ${o[0]}+j${o[1]}, ngspice ${s[0]}+j${s[1]}`).toBeLessThanOrEqual(allowed);
          comparedBranches++;
        }
      });
    });
    expect(compared).toBeGreaterThan(1000);
    expect(comparedBranches).toBeGreaterThan(1000);
  }, 30_000);
});
