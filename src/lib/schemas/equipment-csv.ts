/**
 * The inventory as CSV: what `GET /api/equipment/export.csv` writes, `POST /api/equipment/import`
 * reads and `npm run check -- --equipment` reads. Parsed with csv-parse; every problem is reported
 * as `line N.column` (line 1 is the header), and a file with any problem yields no rows at all.
 */
import { CsvError, parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import { DEFAULT_TEST_INTERVAL_MONTHS, isCalendarDate, testDueOn, type SetRecord } from '@/lib/domain/equipment';
import { createSetBody, type CreateSetBody } from './equipment';
import { formatIssuePath } from './plan';

export const CSV_COLUMNS = ['tag', 'description', 'cable', 'lengthM', 'clampKind', 'clampKa', 'clampCycles', 'connection', 'inServiceOn', 'status', 'statusReason', 'lastTestedOn', 'testDueOn', 'notes'] as const;
const REQUIRED = ['tag', 'cable', 'lengthM', 'clampKind', 'clampKa', 'clampCycles', 'connection', 'inServiceOn'] as const;
const NUMERIC = new Set(['lengthM', 'clampKa', 'clampCycles']);
/** Written by the export for reading; recomputed from the organisation's interval on import. */
const IGNORED_ON_IMPORT = new Set(['testDueOn']);
export const MAX_CSV_ROWS = 5000;

export interface CsvIssue {
  path: string;
  message: string;
}
export interface CsvRow {
  line: number;
  body: CreateSetBody;
  /** The export's due date, kept for the command-line check only. */
  testDueOn?: string;
}
export type CsvResult = { ok: true; rows: CsvRow[] } | { ok: false; issues: CsvIssue[] };

type Record_ = { record: Record<string, string>; info: { lines: number } };

function readRecords(text: string): { records: Record_[] } | { issues: CsvIssue[] } {
  try {
    const records = parse(text, { columns: true, info: true, bom: true, skip_empty_lines: true, trim: true, relax_column_count: false }) as Record_[];
    return { records };
  } catch (error) {
    if (error instanceof CsvError) {
      const line = (error as CsvError & { lines?: number }).lines ?? 1;
      return { issues: [{ path: `line ${line}.(row)`, message: error.message.replace(/^Invalid Record Length: /, '') }] };
    }
    throw error;
  }
}

function headerIssues(text: string): CsvIssue[] {
  let first: string[];
  try {
    first = (parse(text, { bom: true, to_line: 1, trim: true, relax_column_count: true }) as string[][])[0] ?? [];
  } catch (error) {
    // A header the CSV reader cannot read at all (a stray quote, an unclosed one) is a problem of line 1.
    if (error instanceof CsvError) return [{ path: 'line 1.(header)', message: error.message }];
    throw error;
  }
  const issues: CsvIssue[] = [];
  for (const name of first) if (!(CSV_COLUMNS as readonly string[]).includes(name)) issues.push({ path: `line 1.${name || '(empty)'}`, message: `unknown column; the columns are ${CSV_COLUMNS.join(', ')}` });
  for (const name of REQUIRED) if (!first.includes(name)) issues.push({ path: `line 1.${name}`, message: 'column is missing' });
  const seen = new Set<string>();
  for (const name of first) {
    if (seen.has(name)) issues.push({ path: `line 1.${name}`, message: 'column appears twice' });
    seen.add(name);
  }
  return issues;
}

/** Turns the cells of one row into the shape createSetBody parses (numbers as numbers, blanks absent). */
function cellsToInput(record: Record<string, string>): Record<string, unknown> {
  const input: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(record)) {
    if (value === '' || IGNORED_ON_IMPORT.has(key)) continue;
    input[key] = NUMERIC.has(key) ? (Number.isFinite(Number(value)) && /\S/.test(value) ? Number(value) : value) : value;
  }
  return input;
}

/** Parses an inventory CSV; all rows or every problem. */
export function parseInventoryCsv(text: string): CsvResult {
  if (!text.trim()) return { ok: false, issues: [{ path: 'line 1.(file)', message: 'the file is empty; the first line must name the columns' }] };
  const header = headerIssues(text);
  if (header.length) return { ok: false, issues: header };
  const read = readRecords(text);
  if ('issues' in read) return { ok: false, issues: read.issues };
  if (read.records.length === 0) return { ok: false, issues: [{ path: 'line 2.(row)', message: 'the file has no sets under its header' }] };
  if (read.records.length > MAX_CSV_ROWS) return { ok: false, issues: [{ path: `line ${MAX_CSV_ROWS + 2}.(row)`, message: `at most ${MAX_CSV_ROWS} sets in one file` }] };
  const issues: CsvIssue[] = [];
  const rows: CsvRow[] = [];
  const firstLineOfTag = new Map<string, number>();
  for (const { record, info } of read.records) {
    const line = info.lines;
    const input = cellsToInput(record);
    for (const key of NUMERIC) if (typeof input[key] === 'string') issues.push({ path: `line ${line}.${key}`, message: `must be a number, not "${String(input[key])}"` });
    const parsed = createSetBody.safeParse(input);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const path = formatIssuePath(issue.path);
        if (NUMERIC.has(path) && typeof input[path] === 'string') continue;
        issues.push({ path: `line ${line}.${path}`, message: issue.message });
      }
      continue;
    }
    const earlier = firstLineOfTag.get(parsed.data.tag.toLowerCase());
    if (earlier !== undefined) issues.push({ path: `line ${line}.tag`, message: `tag "${parsed.data.tag}" is already on line ${earlier}` });
    firstLineOfTag.set(parsed.data.tag.toLowerCase(), line);
    const due = record.testDueOn;
    rows.push({ line, body: parsed.data, ...(due && isCalendarDate(due) ? { testDueOn: due } : {}) });
  }
  return issues.length ? { ok: false, issues } : { ok: true, rows };
}

/** The inventory a CSV describes, for the command-line check: the file's due dates, else computed. */
export function inventoryFromCsv(text: string, intervalMonths = DEFAULT_TEST_INTERVAL_MONTHS): { ok: true; sets: SetRecord[] } | { ok: false; issues: CsvIssue[] } {
  const result = parseInventoryCsv(text);
  if (!result.ok) return result;
  return {
    ok: true,
    sets: result.rows.map(({ body: b, testDueOn: due }) => ({
      tag: b.tag,
      cable: b.cable,
      lengthM: b.lengthM,
      clampKind: b.clampKind,
      clampKa: b.clampKa,
      clampCycles: b.clampCycles,
      connection: b.connection,
      status: b.status,
      lastTestedOn: b.lastTestedOn ?? null,
      testDueOn: due ?? testDueOn(b.lastTestedOn ?? null, b.inServiceOn, intervalMonths),
    })),
  };
}

const FREE_TEXT = new Set(['description', 'statusReason', 'notes']);

/** Writes sets as CSV with the columns above (a leading apostrophe defuses spreadsheet formulas in free text). */
export function inventoryToCsv(sets: readonly Partial<Record<(typeof CSV_COLUMNS)[number], string | number | null>>[]): string {
  const safe = (c: string, v: unknown) => (FREE_TEXT.has(c) && typeof v === 'string' && /^[=+\-@\t\r]/.test(v) ? `'${v}` : v);
  return stringify(
    sets.map((s) => CSV_COLUMNS.map((c) => safe(c, s[c] ?? ''))),
    { header: true, columns: [...CSV_COLUMNS] },
  );
}
