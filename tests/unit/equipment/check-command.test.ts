/** `npm run check -- plan.json --equipment sets.csv`: the same set rules from the command line. */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { runCheckCommand } from '@/cli/check-command';

const dir = join(__dirname, '../../../fixtures/equipment');
const files: Record<string, string> = {
  'sets.csv': readFileSync(join(dir, 'inventory.csv'), 'utf8'),
  'overdue.json': readFileSync(join(dir, 'set-test-overdue.json'), 'utf8'),
  'clean.json': readFileSync(join(dir, 'sets-clean.json'), 'utf8'),
  'bad.csv': 'tag,cable\nX,2/0\n',
};

async function run(args: string[]) {
  let stdout = '';
  let stderr = '';
  const code = await runCheckCommand({
    args,
    readFile: (path) => {
      if (!(path in files)) throw new Error(`ENOENT: ${path}`);
      return files[path];
    },
    stdout: (t) => (stdout += t),
    stderr: (t) => (stderr += t),
    today: '2026-06-15',
  });
  return { code, stdout, stderr };
}

it('checks the sets against the inventory file and lists them in the report', async () => {
  const { code, stdout } = await run(['overdue.json', '--equipment', 'sets.csv']);
  expect(code).toBe(0);
  const report = JSON.parse(stdout);
  expect(report.findings.find((f: { rule: string }) => f.rule === 'set-test-overdue')).toMatchObject({ severity: 'warning', elements: ['jA'] });
  expect(report.sets.map((s: { tag: string }) => s.tag)).toEqual(['LV-205', 'LV-202', 'LV-203', 'LV-204']);
});

it('makes the overdue test a blocker with --stage submit (exit 1)', async () => {
  const { code, stdout } = await run(['--equipment', 'sets.csv', '--stage', 'submit', 'overdue.json']);
  expect(code).toBe(1);
  expect(JSON.parse(stdout).findings.find((f: { rule: string }) => f.rule === 'set-test-overdue').severity).toBe('blocker');
});

it('ignores sets without --equipment', async () => {
  const { code, stdout } = await run(['overdue.json']);
  expect(code).toBe(0);
  expect(JSON.parse(stdout).sets).toBeUndefined();
});

it('exits 2 naming the line and column of a bad inventory, and for a missing value', async () => {
  const bad = await run(['clean.json', '--equipment', 'bad.csv']);
  expect(bad.code).toBe(2);
  expect(bad.stderr).toMatch(/bad\.csv line 1\.lengthM: column is missing/);
  expect((await run(['clean.json', '--equipment'])).stderr).toMatch(/--equipment needs a value/);
  expect((await run(['clean.json', '--equipment', 'sets.csv', '--stage', 'later'])).code).toBe(2);
  expect((await run(['clean.json', '--equipment', 'none.csv'])).stderr).toMatch(/cannot read none\.csv/);
});

it('lists the sets with status and due date in the text report', async () => {
  const { stdout } = await run(['--text', '--equipment', 'sets.csv', 'overdue.json']);
  const lines = stdout.split('\n');
  const start = lines.indexOf('Grounding sets');
  expect(start).toBeGreaterThan(0);
  expect(lines[start + 3]).toMatch(/^ {2}LV-205\s+jA\s+in-service\s+2025-05-01\s+2026-05-01\s+overdue$/);
  expect((await run(['--text', 'overdue.json'])).stdout).not.toContain('Grounding sets');
});

it('checks on the day given by --today', async () => {
  const early = await run(['--equipment', 'sets.csv', '--stage', 'submit', '--today', '2026-04-30', 'overdue.json']);
  expect(early.code).toBe(0);
  expect((await run(['--equipment', 'sets.csv', '--today', '2026-02-30', 'overdue.json'])).stderr).toMatch(/--today must be a date/);
});
