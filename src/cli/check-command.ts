/**
 * `npm run check -- [--text] FILE`: checks one plan file. The logic lives here, apart from the
 * process, so tests drive it with fake files and writers. Exit status (docs/plan-format.md): 0 when
 * the plan is ok, 1 with any blocker, 2 for a document that cannot be read or is invalid, with
 * every problem by path on standard error, one a line.
 */
import { checkPlan } from '../lib/domain/checker';
import type { SetRecord } from '../lib/domain/equipment';
import { isCalendarDate } from '../lib/domain/equipment';
import { CHECK_STAGES, type CheckStage } from '../lib/domain/sets-in-plan';
import { inventoryFromCsv } from '../lib/schemas/equipment-csv';
import { parsePlan } from '../lib/schemas/plan';
import { formatTextReport } from './text-report';

export const EXIT_OK = 0;
export const EXIT_BLOCKED = 1;
export const EXIT_INVALID = 2;

export const USAGE =
  'usage: npm run check -- [--text] [--equipment SETS.csv [--stage draft|submit|field] [--today YYYY-MM-DD]] FILE\n' +
  '  prints the check report as JSON (or a table with --text); exit 0 ok, 1 blockers, 2 invalid\n' +
  '  --equipment checks the jumpers\' sets (equipmentId = tag) against an inventory in the export CSV format';

export interface CheckCommandIo {
  args: string[];
  readFile(path: string): Promise<string> | string;
  stdout(text: string): void;
  stderr(text: string): void;
  /** Today's date (YYYY-MM-DD) for overdue tests; the process passes the clock's. */
  today?: string;
}

type Parsed = { ok: true; text: boolean; file: string; equipment?: string; stage: CheckStage; today?: string } | { ok: false; problem: string } | { ok: 'help' };

function parseArgs(args: string[]): Parsed {
  let text = false;
  let equipment: string | undefined;
  let stage: CheckStage = 'draft';
  let today: string | undefined;
  const files: string[] = [];
  for (let i = 0; i < args.length; i += 1) {
    const arg = args[i];
    if (arg === '--') continue;
    if (arg === '--equipment' || arg === '--stage' || arg === '--today') {
      const value = args[i + 1];
      if (value === undefined || value.startsWith('--')) return { ok: false, problem: `${arg} needs a value` };
      i += 1;
      if (arg === '--equipment') equipment = value;
      else if (arg === '--today') {
        if (!isCalendarDate(value)) return { ok: false, problem: '--today must be a date written YYYY-MM-DD' };
        today = value;
      }
      else if ((CHECK_STAGES as readonly string[]).includes(value)) stage = value as CheckStage;
      else return { ok: false, problem: `--stage must be one of ${CHECK_STAGES.join(', ')}` };
      continue;
    }
    if (arg === '--help' || arg === '-h') return { ok: 'help' };
    if (arg === '--text') text = true;
    else if (arg.startsWith('-') && arg !== '-') return { ok: false, problem: `unknown option ${arg}` };
    else files.push(arg);
  }
  if (files.length !== 1) return { ok: false, problem: files.length === 0 ? 'no plan file given' : 'give exactly one plan file' };
  return { ok: true, text, file: files[0], equipment, stage, today };
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
  let inventory: SetRecord[] | undefined;
  if (args.equipment) {
    let csv: string;
    try {
      csv = await io.readFile(args.equipment);
    } catch (error) {
      io.stderr(`cannot read ${args.equipment}: ${error instanceof Error ? error.message : String(error)}\n`);
      return EXIT_INVALID;
    }
    const read = inventoryFromCsv(csv);
    if (!read.ok) {
      io.stderr(read.issues.map((issue) => `${args.equipment} ${issue.path}: ${issue.message}\n`).join(''));
      return EXIT_INVALID;
    }
    inventory = read.sets;
  }
  const report = checkPlan(parsed.plan, undefined, inventory ? { inventory, today: args.today ?? io.today, stage: args.stage } : {});
  io.stdout(args.text ? formatTextReport(report, parsed.plan.title) : `${JSON.stringify(report, null, 2)}\n`);
  return report.ok ? EXIT_OK : EXIT_BLOCKED;
}
