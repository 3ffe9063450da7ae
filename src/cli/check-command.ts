/**
 * `npm run check -- [--text] FILE`: checks one plan file. The logic lives here, apart from the
 * process, so tests drive it with fake files and writers. Exit status (docs/plan-format.md): 0 when
 * the plan is ok, 1 with any blocker, 2 for a document that cannot be read or is invalid, with
 * every problem by path on standard error, one a line.
 */
import { checkPlan } from '../lib/domain/checker';
import { parsePlan } from '../lib/schemas/plan';
import { formatTextReport } from './text-report';

export const EXIT_OK = 0;
export const EXIT_BLOCKED = 1;
export const EXIT_INVALID = 2;

export const USAGE = 'usage: npm run check -- [--text] FILE\n  prints the check report as JSON (or a table with --text); exit 0 ok, 1 blockers, 2 invalid';

export interface CheckCommandIo {
  args: string[];
  readFile(path: string): Promise<string> | string;
  stdout(text: string): void;
  stderr(text: string): void;
}

type Parsed = { ok: true; text: boolean; file: string } | { ok: false; problem: string } | { ok: 'help' };

function parseArgs(args: string[]): Parsed {
  let text = false;
  const files: string[] = [];
  for (const arg of args) {
    if (arg === '--') continue;
    if (arg === '--help' || arg === '-h') return { ok: 'help' };
    if (arg === '--text') text = true;
    else if (arg.startsWith('-') && arg !== '-') return { ok: false, problem: `unknown option ${arg}` };
    else files.push(arg);
  }
  if (files.length !== 1) return { ok: false, problem: files.length === 0 ? 'no plan file given' : 'give exactly one plan file' };
  return { ok: true, text, file: files[0] };
}

/** Runs the command and returns its exit status; never throws for a bad file or document. */
export async function runCheckCommand(io: CheckCommandIo): Promise<number> {
  const args = parseArgs(io.args);
  if (args.ok === 'help') {
    io.stdout(`${USAGE}\n`);
    return EXIT_OK;
  }
  if (!args.ok) {
    io.stderr(`${args.problem}\n${USAGE}\n`);
    return EXIT_INVALID;
  }
  let source: string;
  try {
    source = await io.readFile(args.file);
  } catch (error) {
    io.stderr(`cannot read ${args.file}: ${error instanceof Error ? error.message : String(error)}\n`);
    return EXIT_INVALID;
  }
  let input: unknown;
  try {
    input = JSON.parse(source.replace(/^\uFEFF/, ''));
  } catch (error) {
    io.stderr(`(document): not valid JSON: ${error instanceof Error ? error.message : String(error)}\n`);
    return EXIT_INVALID;
  }
  const parsed = parsePlan(input);
  if (!parsed.ok) {
    io.stderr(parsed.issues.map((issue) => `${issue.path}: ${issue.message}\n`).join(''));
    return EXIT_INVALID;
  }
  const report = checkPlan(parsed.plan);
  io.stdout(args.text ? formatTextReport(report, parsed.plan.title) : `${JSON.stringify(report, null, 2)}\n`);
  return report.ok ? EXIT_OK : EXIT_BLOCKED;
}
