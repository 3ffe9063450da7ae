/**
 * The grounding-set inventory's operations, for the equipment endpoints and the equipment pages
 * alike: add a set, import a CSV, record a test, edit a set or record a fault, save the test
 * settings. Each checks who may do it and returns what was stored, or throws an AppError naming
 * the field.
 */
import { getDb } from '@db/connection';
import { recordTest, saveSets, updateSet, type SetJson } from '@db/repositories/equipment';
import { saveSettings } from '@db/repositories/equipment-settings';
import type { Person } from '@/lib/domain/people';
import type { CreateSetBody, PatchSetBody, SetTestBody, SettingsBody } from '@/lib/schemas/equipment';
import { parseInventoryCsv } from '@/lib/schemas/equipment-csv';
import { unwrap } from '@/lib/server/equipment-http';
import { AppError } from '@/lib/server/errors';
import { assertCan } from '@/lib/server/guards';
import { organisationToday } from '@/lib/server/organisation';

/** The dates given (by path) that lie after `today`, each named. */
function futureIssues(dates: Record<string, string | null | undefined>, today: string) {
  return Object.entries(dates).filter(([, day]) => day && day > today).map(([path]) => ({ path, message: 'must not be in the future' }));
}

/**
 * Dates a person says something happened on cannot be after today where the organisation works:
 * every such field is named, and the organisation's day is read once, only when a date was given.
 */
async function notInFuture(person: Person, dates: Record<string, string | null | undefined>): Promise<void> {
  if (!Object.values(dates).some(Boolean)) return;
  const issues = futureIssues(dates, await organisationToday(person.organizationId));
  if (issues.length) throw new AppError('VALIDATION', { issues });
}

/** Adds a set; a tag the organisation already uses is SET_TAG_TAKEN naming it. */
export async function addSet(person: Person, input: CreateSetBody): Promise<SetJson> {
  assertCan(person, 'sets.manage');
  await notInFuture(person, { inServiceOn: input.inServiceOn, lastTestedOn: input.lastTestedOn });
  const { created } = unwrap(await saveSets(getDb(), person.organizationId, person.id, [input], 'create'));
  return created[0];
}

/**
 * Imports a CSV inventory, all or nothing: rows whose tag exists update that set, the others are
 * added. Any bad row is VALIDATION with every problem as `line N.column`, and nothing is saved.
 */
export async function importSets(person: Person, csv: string): Promise<{ created: SetJson[]; updated: SetJson[] }> {
  assertCan(person, 'sets.manage');
  const invalid = (issues: { path: string; message: string }[]) =>
    new AppError('VALIDATION', { message: 'Some rows are not valid; nothing was imported. Fix the cells listed and import the whole file again.', issues });
  const parsed = parseInventoryCsv(csv);
  if (!parsed.ok) throw invalid(parsed.issues);
  // A set never tested is due one interval after it went into service: a day to come would keep it "in date" for that long.
  const dates = Object.fromEntries(parsed.rows.flatMap((r) => (['inServiceOn', 'lastTestedOn'] as const).map((key) => [`line ${r.line}.${key}`, r.body[key]])));
  const future = futureIssues(dates, await organisationToday(person.organizationId));
  if (future.length) throw invalid(future);
  const outcome = await saveSets(getDb(), person.organizationId, person.id, parsed.rows.map((r) => r.body), 'upsert');
  if (outcome.kind === 'needs-test') {
    const held = new Set(outcome.tags?.map((tag) => tag.toLowerCase()));
    throw invalid(parsed.rows.filter((r) => held.has(r.body.tag.toLowerCase())).map((r) => ({ path: `line ${r.line}.status`, message: 'cannot be in-service until the set passes a test (it carried fault current or failed its last test); record a passing test, or import it as out-of-service' })));
  }
  if (outcome.kind !== 'ok') throw invalid([{ path: 'tag', message: 'another import changed the same tags at the same moment; import again' }]);
  return outcome.value;
}

/** Records an in-service test; a pass can put the set back in service. */
export async function recordSetTest(person: Person, setId: number, input: SetTestBody) {
  assertCan(person, 'sets.test');
  await notInFuture(person, { testedOn: input.testedOn });
  return unwrap(await recordTest(getDb(), person.organizationId, setId, person.id, input));
}

/** Edits a set, changes its status (a reason is required out of service) or records a fault. */
export async function changeSet(person: Person, setId: number, input: PatchSetBody): Promise<SetJson> {
  assertCan(person, 'sets.manage');
  await notInFuture(person, { inServiceOn: input.inServiceOn, faultOn: input.faultOn });
  return unwrap(await updateSet(getDb(), person.organizationId, setId, person.id, input));
}

/** The organisation's test interval and resistance limits (its own choices; none ship as facts). */
export async function saveTestSettings(person: Person, input: SettingsBody) {
  assertCan(person, 'settings.edit');
  return saveSettings(getDb(), person.organizationId, person.id, input);
}
