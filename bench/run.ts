/**
 * `npm run bench`: times the whole check on generated plans of 100, 1,000 and 10,000 elements,
 * reports heap growth, and compares the sparse solver with dense Gaussian elimination on the same
 * networks. Prints a table; asserts nothing (timings belong to the machine, not to the tests).
 */
import { writeFileSync } from 'node:fs';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import type { PlanDocument } from '@/lib/schemas/plan';
import { analyseNetwork, assembleAdmittance, buildNetwork, REFERENCE } from '@/lib/domain/calc';
import { solveInjections, type Injection } from '@/lib/domain/calc/batch';
import { factorSymmetric } from '@/lib/domain/calc/sparse';
import { factorDense, solveDense } from './dense-solver';
import { generatePlan } from './generate-plan';

setFlagsFromString('--expose-gc');
const gc = runInNewContext('gc') as () => void;

type Check = (plan: PlanDocument) => unknown;
async function loadCheck(): Promise<{ name: string; check: Check }> {
  try {
    const checker = (await import('@/lib/domain/checker')) as { checkPlan?: Check };
    if (checker.checkPlan) return { name: 'checkPlan', check: checker.checkPlan };
  } catch {
    // No checker yet: time the network analysis alone.
  }
  return { name: 'analyseNetwork', check: analyseNetwork };
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const time = (f: () => void) => {
  const start = performance.now();
  f();
  return performance.now() - start;
};
/** CPU time of the process, ms: on a shared machine it moves far less than the wall clock. */
const cpuTime = (f: () => void) => {
  const start = process.cpuUsage();
  f();
  const used = process.cpuUsage(start);
  return (used.user + used.system) / 1000;
};

/** Heap held after one check, MB, from a collected heap (a collection during the check can hide short-lived garbage). */
function heapDeltaMb(check: Check, plan: PlanDocument): number {
  gc();
  const before = process.memoryUsage().heapUsed;
  const keep = check(plan); // held until measured, so its result counts
  const after = process.memoryUsage().heapUsed;
  void keep;
  return Math.max(0, after - before) / 2 ** 20;
}

/** The right-hand sides the analysis solves: every earthed phase, plus one per solved contact. */
function injectionsOf(plan: PlanDocument, network: ReturnType<typeof buildNetwork>): Injection[] {
  const phases = plan.nodes.filter((n) => n.kind === 'phase' && network.indexOf.has(n.id)).map((n) => ({ into: network.indexOf.get(n.id) as number, outOf: REFERENCE }));
  const nodeById = new Map(plan.nodes.map((n) => [n.id, n]));
  const contacts = plan.links.flatMap((l) => {
    const w = nodeById.get(l.from);
    const p = w?.kind === 'worker' ? network.indexOf.get(w.standsOn ?? '') : undefined;
    const s = network.indexOf.get(l.to);
    return l.kind === 'reach' && p !== undefined && s !== undefined && p !== s ? [{ into: p, outOf: s }] : [];
  });
  return [...phases, ...contacts];
}

const DENSE_SOLVES_TIMED = 10;
const DENSE_MAX_UNKNOWNS = 4000; // 4000² complex doubles = 256 MB; above this the dense run is not attempted

function compareSolvers(plan: PlanDocument) {
  const network = buildNetwork(plan);
  const matrix = assembleAdmittance(network);
  const injections = injectionsOf(plan, network);
  const sparseMs = median(
    [0, 1, 2, 3, 4, 5, 6].map(() =>
      time(() => {
        const factor = factorSymmetric(matrix);
        solveInjections(factor, injections, 1, () => undefined);
      }),
    ),
  );
  let denseMs: number | null = null;
  let denseNote = 'measured';
  if (network.size <= DENSE_MAX_UNKNOWNS) {
    let lu: ReturnType<typeof factorDense> | undefined;
    const factorMs = time(() => (lu = factorDense(matrix)));
    const b = new Float64Array(network.size);
    const timed = Math.min(DENSE_SOLVES_TIMED, injections.length);
    const solveMs = time(() => {
      for (let k = 0; k < timed; k++) {
        b.fill(0);
        b[injections[k].into] = 1;
        solveDense(lu as NonNullable<typeof lu>, b, new Float64Array(network.size));
      }
    });
    denseMs = factorMs + (timed ? (solveMs / timed) * injections.length : 0);
    if (timed < injections.length) denseNote = `factor measured, ${timed} of ${injections.length} solves timed and scaled`;
  } else {
    denseNote = `skipped: ${network.size} unknowns need ${((network.size ** 2 * 16) / 2 ** 30).toFixed(1)} GB`;
  }
  return { unknowns: network.size, rhs: injections.length, sparseMs, denseMs, denseNote };
}

async function main() {
  const { name, check } = await loadCheck();
  const rows: string[][] = [];
  const solverRows: string[][] = [];
  const timesBySize = new Map<number, number>();
  const cpuBySize = new Map<number, number>();
  const rhsBySize = new Map<number, number>();
  compareSolvers(generatePlan({ elements: 300, seed: 1 })); // warm both solvers' code before timing either
  for (const elements of [100, 1000, 10000]) {
    const plan = generatePlan({ elements, seed: 42 });
    const actual = plan.nodes.length + plan.links.length;
    const runs = elements <= 100 ? 60 : elements <= 1000 ? 25 : 9;
    for (let k = 0; k < 3; k++) check(plan); // warm the JIT
    const times = Array.from({ length: runs }, () => time(() => check(plan)));
    const cpuTimes = Array.from({ length: runs }, () => cpuTime(() => check(plan)));
    const heapMb = heapDeltaMb(check, plan);
    timesBySize.set(elements, median(times));
    cpuBySize.set(elements, median(cpuTimes));
    const s = compareSolvers(plan);
    rhsBySize.set(elements, s.rhs);
    rows.push([String(actual), String(plan.nodes.length), String(plan.links.length), String(s.rhs), median(times).toFixed(2), Math.min(...times).toFixed(2), median(cpuTimes).toFixed(2), heapMb.toFixed(1)]);
    solverRows.push([
      String(actual),
      String(s.unknowns),
      String(s.rhs),
      s.sparseMs.toFixed(2),
      s.denseMs === null ? '—' : s.denseMs.toFixed(1),
      s.denseMs === null ? '—' : `${(s.denseMs / s.sparseMs).toFixed(0)}×`,
      s.denseNote,
    ]);
  }
  const table = (head: string[], body: string[][]) => {
    const widths = head.map((h, i) => Math.max(h.length, ...body.map((r) => r[i].length)));
    const line = (r: string[]) => r.map((c, i) => (i === r.length - 1 && i > 0 && isNaN(Number(c[0])) ? c : c.padStart(widths[i]))).join('  ');
    console.log([line(head), widths.map((w) => '-'.repeat(w)).join('  '), ...body.map(line)].join('\n'));
  };
  console.log(`Whole check (${name}), median over several runs, this machine:`);
  table(['elements', 'nodes', 'links', 'rhs', 'median ms', 'best ms', 'median CPU ms', 'heap +MB'], rows);
  const grow = (m: Map<number, number>) => (m.get(10000) as number) / (m.get(1000) as number);
  const growth = grow(timesBySize);
  const rhsGrowth = grow(rhsBySize);
  console.log(`growth 1,000 → 10,000 elements: ${growth.toFixed(1)}× (CPU time ${grow(cpuBySize).toFixed(1)}×; linear 10×, quadratic 100×, cubic 1000×; goal ≤ 15×)`);
  console.log(
    `right-hand sides (phases + contacts) grow ${rhsGrowth.toFixed(1)}×; per right-hand side the check grows ${(growth / rhsGrowth).toFixed(1)}× (CPU time ${(grow(cpuBySize) / rhsGrowth).toFixed(1)}×)`,
  );
  console.log(`1,000-element check: ${(timesBySize.get(1000) as number).toFixed(2)} ms median (goal < 20 ms)`);
  if (process.env.BONDMAP_BENCH_OUT) {
    const round = (x: number) => Math.round(x * 100) / 100;
    writeFileSync(process.env.BONDMAP_BENCH_OUT, JSON.stringify({ check1kMs: round(timesBySize.get(1000) as number), check10kMs: round(timesBySize.get(10000) as number), checkGrowth: round(growth) }));
  }
  console.log(`peak resident set: ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB\n`);
  console.log('Solver alone: factor + every right-hand side the analysis solves (phases and contacts):');
  table(['elements', 'unknowns', 'rhs', 'sparse ms', 'dense ms', 'ratio', 'dense'], solverRows);
}

await main();
