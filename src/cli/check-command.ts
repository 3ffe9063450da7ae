/**
 * `npm run check -- [--text] FILE`: checks one plan file. The logic lives here, apart from the
 * process, so tests drive it with fake files and writers. Exit status (docs/plan-format.md): 0 when
 * the plan is ok, 1 with any blocker, 2 for a document that cannot be read or is invalid, with
 * every problem by path on standard error, one a line.
 */
import { parseArgs } from 'node:util';
import { checkPlan } from '@/lib/domain/checker';
import type { SetRecord } from '@/lib/domain/equipment';
import { isCalendarDate } from '@/lib/domain/equipment';
import { CHECK_STAGES, type CheckStage } from '@/lib/domain/sets-in-plan';
import { inventoryFromCsv } from '@/lib/schemas/equipment-csv';
import { parsePlan } from '@/lib/schemas/plan';
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

const OPTIONS = {
  text: { type: 'boolean' },
  help: { type: 'boolean', short: 'h' },
  equipment: { type: 'string' },
  stage: { type: 'string' },
  today: { type: 'string' },
} as const;

/** Node's own parser; its errors become one short line naming the option. */
function readArgs(args: string[]): Parsed {
  let parsed;
  try {
    // A bare `--` (npm passes it through) is skipped, not an end of options.
    parsed = parseArgs({ args: args.filter((a) => a !== '--'), options: OPTIONS, allowPositionals: true, strict: true });
  } catch (error) {
    const code = (error as { code?: string }).code;
    const option = /'(-[^' ]+)/.exec(error instanceof Error ? error.message : '')?.[1] ?? 'an option';
    if (code === 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE') return { ok: false, problem: `${option} needs a value` };
    if (code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION') return { ok: false, problem: `unknown option ${option}` };
    return { ok: false, problem: error instanceof Error ? error.message : String(error) };
  }
  const { values, positionals } = parsed;
  if (values.help) return { ok: 'help' };
  if (values.today !== undefined && !isCalendarDate(values.today)) return { ok: false, problem: '--today must be a date written YYYY-MM-DD' };
  const stage = values.stage ?? 'draft';
  if (!(CHECK_STAGES as readonly string[]).includes(stage)) return { ok: false, problem: `--stage must be one of ${CHECK_STAGES.join(', ')}` };
  if (positionals.length !== 1) return { ok: false, problem: positionals.length === 0 ? 'no plan file given' : 'give exactly one plan file' };
  return { ok: true, text: values.text ?? false, file: positionals[0], equipment: values.equipment, stage: stage as CheckStage, today: values.today };
}

/** The file's text, or null after saying on standard error why it could not be read. */
async function readOrSay(io: CheckCommandIo, path: string): Promise<string | null> {
  try {
    return await io.readFile(path);
  } catch (error) {
    io.stderr(`cannot read ${path}: ${error instanceof Error ? error.message : String(error)}\n`);
    return null;
  }
}

/** Runs the command and returns its exit status; never throws for a bad file or document. */
export async function runCheckCommand(io: CheckCommandIo): Promise<number> {
  const args = readArgs(io.args);
  if (args.ok === 'help') {
    io.stdout(`${USAGE}\n`);
    return EXIT_OK;
  }
  if (!args.ok) {
    io.stderr(`${args.problem}\n${USAGE}\n`);
    return EXIT_INVALID;
  }
  const source = await readOrSay(io, args.file);
  if (source === null) return EXIT_INVALID;
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
    const csv = await readOrSay(io, args.equipment);
    if (csv === null) return EXIT_INVALID;
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
