import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCheckCommand } from '@/cli/check-command';
import { checkPlan } from '@/lib/domain/checker';
import { parsePlan } from '@/lib/schemas/plan';
import { bucketLinks, bucketNodes, link, node, rawPlan } from '../../helpers/plan-factory';

const fixture = (name: string) => readFileSync(join(__dirname, '../../../fixtures/plans', name), 'utf8');

/** Runs the command against an in-memory file system; returns exit code and captured output. */
async function run(args: string[], files: Record<string, string>) {
  let stdout = '';
  let stderr = '';
  const code = await runCheckCommand({
    args,
    readFile: (path) => {
      if (!(path in files)) throw new Error(`ENOENT: no such file or directory, open '${path}'`);
      return files[path];
    },
    stdout: (t) => (stdout += t),
    stderr: (t) => (stderr += t),
  });
  return { code, stdout, stderr, lines: stderr.trimEnd().split('\n') };
}

describe('npm run check', () => {
  it('exits 0 and prints the report JSON for a clean plan', async () => {
    const source = fixture('bucket-tangent-clean.json');
    const { code, stdout, stderr } = await run(['plan.json'], { 'plan.json': source });
    expect(code).toBe(0);
    expect(stderr).toBe('');
    const parsed = parsePlan(JSON.parse(source));
    if (!parsed.ok) throw new Error('fixture invalid');
    expect(JSON.parse(stdout)).toEqual(checkPlan(parsed.plan));
  });

  it('exits 1 when the plan has a blocker, still printing the report', async () => {
    const { code, stdout } = await run(['--', 'p.json'], { 'p.json': fixture('climber-on-wood-pole.json') });
    expect(code).toBe(1);
    const findings = JSON.parse(stdout).findings as { rule: string; severity: string }[];
    expect(findings.filter((f) => f.severity === 'blocker').map((f) => f.rule)).toEqual(['stand-not-conductive']);
  });

  it('prints a readable table with --text', async () => {
    const { code, stdout } = await run(['--text', 'p.json'], { 'p.json': fixture('ground-worker-no-mat.json') });
    expect(code).toBe(1);
    for (const part of ['Result: NOT OK', '[BLOCKER] surface-outside-zone (W2, T1)', 'Contacts', 'Jumpers', 'Rods', 'Caution', 'approved detector']) {
      expect(stdout).toContain(part);
    }
    expect(stdout).toMatch(/W2\s+T1\s+\d/);
  });

  it('shows the injected current and a contact capped at the line-to-neutral voltage in --text', async () => {
    const { stdout } = await run(['--text', 'p.json'], { 'p.json': fixture('rod-only-voltage-cap.json') });
    expect(stdout).toContain('injected for contacts and rods (Df x If) 1.58 kA; contact voltages capped at 7200 V line-to-neutral');
    expect(stdout).toMatch(/W2\s+T1\s+7199\.6 \(capped\)/);
  });

  it('shows help and exits 0', async () => {
    const { code, stdout } = await run(['--help'], {});
    expect(code).toBe(0);
    expect(stdout).toContain('usage:');
  });

  it('reads options in any order, after a bare --, and -h as help', async () => {
    const source = fixture('bucket-tangent-clean.json');
    const { code, stdout } = await run(['--', 'plan.json', '--text', '--stage=draft'], { 'plan.json': source });
    expect(code).toBe(0);
    expect(stdout).not.toMatch(/^\{/);
    expect((await run(['-h'], {})).stdout).toContain('usage:');
  });

  it.each([
    [['-x', 'a.json'], 'unknown option -x'],
    [['--json', 'a.json'], 'unknown option --json'],
    [['a.json', '--stage'], '--stage needs a value'],
    [['a.json', '--stage', 'later'], '--stage must be one of'],
  ])('names the problem with %j', async (args, problem) => {
    const { code, stderr } = await run(args, { 'a.json': '{}' });
    expect(code).toBe(2);
    expect(stderr.split('\n')[0]).toContain(problem);
  });

  it.each([[[]], [['a.json', 'b.json']], [['--json', 'a.json']]])('refuses arguments %j with exit 2', async (args) => {
    const { code, stderr, stdout } = await run(args, { 'a.json': '{}', 'b.json': '{}' });
    expect(code).toBe(2);
    expect(stdout).toBe('');
    expect(stderr).toContain('usage:');
  });

  it('exits 2 for a file it cannot read', async () => {
    const { code, lines } = await run(['missing.json'], {});
    expect(code).toBe(2);
    expect(lines[0]).toMatch(/^cannot read missing\.json: ENOENT/);
  });

  it('exits 2 for a file that is not JSON', async () => {
    const { code, lines } = await run(['p.json'], { 'p.json': '{"format": "bondmap-plan",' });
    expect(code).toBe(2);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^\(document\): not valid JSON: /);
  });
});

const plan = (overrides: Parameters<typeof rawPlan>[0] = {}) => rawPlan({ nodes: bucketNodes(), links: bucketLinks(), ...overrides });
const withNode = (extra: Record<string, unknown>) => plan({ nodes: [...bucketNodes(), extra] });
const withLink = (extra: Record<string, unknown>) => plan({ links: [...bucketLinks(), extra] });
const NODE = bucketNodes().length;
const LINK = bucketLinks().length;

// Invalid documents: each must give exit 2 and name the problem by path on standard error.
describe.each([
  ['missing title', () => ({ ...plan(), title: undefined }), ['title: is required']],
  ['wrong format', () => ({ ...plan(), format: 'other-plan' }), ['format: must be "bondmap-plan"']],
  ['future version', () => ({ ...plan(), version: 2 }), ['version: must be 1']],
  ['missing system', () => ({ ...plan(), system: undefined }), ['system: is required']],
  ['negative fault current', () => plan({ system: { faultKa: -5 } }), ['system.faultKa: must be greater than 0']],
  ['fault current as text', () => plan({ system: { faultKa: '10' } }), ['system.faultKa: must be a number']],
  ['fault current too large', () => plan({ system: { faultKa: 500 } }), ['system.faultKa: must be at most 200 kA']],
  ['bad frequency', () => plan({ system: { frequencyHz: 55 } }), ['system.frequencyHz: must be 50 or 60']],
  ['zero clearing time', () => plan({ system: { clearingCycles: 0 } }), ['system.clearingCycles: must be greater than 0']],
  ['negative X/R', () => plan({ system: { xOverR: -1 } }), ['system.xOverR: must be 0 or more']],
  ['bad body weight', () => plan({ criteria: { bodyKg: 60 } }), ['criteria.bodyKg: must be 50 or 70']],
  ['nodes not a list', () => ({ ...plan(), nodes: {} }), ['nodes: must be a list']],
  ['unknown node kind', () => withNode({ id: 'Q', kind: 'gizmo' }), [`nodes[${NODE}].kind: must be one of phase, neutral, shield-wire, structure, crossarm, hardware, cluster-bar, ground-rod, earth, bucket, truck, mat, pole-ground, worker, supply-end`]],
  ['node that is not an object', () => withNode('A' as unknown as Record<string, unknown>), [`nodes[${NODE}]: must be an object`]],
  ['duplicate node id', () => withNode(node.phase('A')), [`nodes[${NODE}].id: duplicate id "A"`]],
  ['link id equal to a node id', () => withLink(link.bond('CB', 'A', 'B')), [`links[${LINK}].id: duplicate id "CB"`]],
  ['worker standing on an unknown node', () => withNode(node.worker('W9', 'B9')), [`nodes[${NODE}].standsOn: no node with id "B9"`]],
  ['structure without material', () => withNode({ id: 'P9', kind: 'structure' }), [`nodes[${NODE}].material: must be one of wood, steel, concrete, fiberglass`]],
  ['rod group without spacing', () => withNode(node.rod('R9', { count: 2 })), [`nodes[${NODE}].spacingM: is required when count is more than 1`]],
  ['rod with negative length', () => withNode(node.rod('R9', { lengthM: -1 })), [`nodes[${NODE}].lengthM: must be greater than 0`]],
  ['link to an unknown node', () => withLink(link.jumper('j9', 'A', 'Z9')), [`links[${LINK}].to: no node with id "Z9"`]],
  ['link from a node to itself', () => withLink(link.jumper('j9', 'A', 'A')), [`links[${LINK}].to: must differ from "from"`]],
  ['bad cable size', () => withLink(link.jumper('j9', 'A', 'CB', { cable: '6' })), [`links[${LINK}].cable: must be one of 4, 2, 1/0, 2/0, 3/0, 4/0, 250, 350`]],
  ['negative clamp rating', () => withLink(link.jumper('j9', 'A', 'CB', { clampKa: -10 })), [`links[${LINK}].clampKa: must be greater than 0`]],
  ['jumper without length', () => withLink({ id: 'j9', kind: 'jumper', from: 'A', to: 'CB', cable: '2' }), [`links[${LINK}].lengthM: is required`]],
  ['reach from a non-worker', () => withLink(link.reach('r9', 'CB', 'A')), [`links[${LINK}].from: a reach link starts at a worker`]],
  ['jumper on a worker', () => withLink(link.jumper('j9', 'W1', 'CB')), [`links[${LINK}].kind: a worker is joined to surfaces by reach links only; a worker is never a bonding path`]],
  ['a plain list instead of a document', () => [plan()] as unknown as Record<string, unknown>, ['(document): must be a plan document (a JSON object)']],
  [
    'several problems at once',
    () => ({ ...plan({ system: { faultKa: 0 }, nodes: [...bucketNodes(), node.worker('W9', 'B9')] }), version: 3 }),
    ['version: must be 1', 'system.faultKa: must be greater than 0', `nodes[${NODE}].standsOn: no node with id "B9"`],
  ],
])('invalid document: %s', (_name, build, expectedLines) => {
  it('exits 2 with every problem by path on standard error', async () => {
    const { code, stdout, lines } = await run(['bad.json'], { 'bad.json': JSON.stringify(build()) });
    expect(code).toBe(2);
    expect(stdout).toBe('');
    expect(lines).toEqual(expect.arrayContaining(expectedLines));
    expect(lines.length).toBe(expectedLines.length);
  });
});
