/**
 * The organisation's grounding sets. Every function takes the organisation id: another
 * organisation's set is simply not found. Each change of status, each fault and each test leaves
 * a set event.
 */
import { Op, UniqueConstraintError, type Order, type Transaction, type WhereOptions } from 'sequelize';
import { addDays, dueState, limitFor, SET_FIELD_WORDS, testDueOn, type SetRecord } from '@/lib/domain/equipment';
import type { CreateSetBody, ListSetsQuery, PatchSetBody, SetSort, SetTestBody } from '@/lib/schemas/equipment';
import type { Db } from '@db/connection';
import type { GroundingSet, SetEvent, SetTest } from '@db/models';
import { getSettings } from './equipment-settings';
import { lockOrganization } from './people';

/** A set on the wire (the issue's field names). */
export interface SetJson extends SetRecord {
  id: number;
  description: string;
  inServiceOn: string;
  statusReason: string | null;
  notes: string | null;
}

export interface TestJson {
  id: number;
  testedOn: string;
  resistanceMilliohms: number;
  limitMilliohms: number | null;
  passed: boolean;
  notes: string | null;
  testedBy: string | null;
}

export interface EventJson {
  kind: string;
  fromStatus: string | null;
  toStatus: string | null;
  reason: string | null;
  occurredOn: string | null;
  actorId: string | null;
  at: Date;
}

export function setJson(row: GroundingSet): SetJson {
  return {
    id: row.id,
    tag: row.tag,
    description: row.description,
    cable: row.cable,
    lengthM: row.lengthM,
    clampKind: row.clampKind,
    clampKa: row.clampKa,
    clampCycles: row.clampCycles,
    connection: row.connection,
    inServiceOn: row.inServiceOn,
    status: row.status,
    statusReason: row.statusReason,
    lastTestedOn: row.lastTestedOn,
    testDueOn: row.testDueOn,
    notes: row.notes,
  };
}

const testJson = (t: SetTest): TestJson => ({
  id: t.id,
  testedOn: t.testedOn,
  resistanceMilliohms: t.resistanceMilliohms,
  limitMilliohms: t.limitMilliohms,
  passed: t.passed,
  notes: t.notes,
  testedBy: t.testedBy,
});
const eventJson = (e: SetEvent): EventJson => ({ kind: e.kind, fromStatus: e.fromStatus, toStatus: e.toStatus, reason: e.reason, occurredOn: e.occurredOn, actorId: e.actorId, at: e.createdAt });

const SORT: Record<SetSort, string> = { tag: 'tag', cable: 'cable', length: 'lengthM', clamp: 'clampKa', status: 'status', lastTested: 'lastTestedOn', due: 'testDueOn' };

/** One page of sets; `due` and `dueWithinDays` count from `today` (YYYY-MM-DD) and skip retired sets. */
export async function listSets(db: Db, organizationId: number, query: ListSetsQuery, today: string) {
  const where: WhereOptions = { organizationId };
  if (query.status) Object.assign(where, { status: query.status });
  if (query.q) Object.assign(where, { tag: { [Op.like]: `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%` } });
  const due: Record<string | symbol, string>[] = [];
  if (query.due === 'overdue') due.push({ [Op.lt]: today });
  if (query.due === 'soon') due.push({ [Op.gte]: today, [Op.lte]: addDays(today, 30) });
  if (query.dueWithinDays !== undefined) due.push({ [Op.lte]: addDays(today, query.dueWithinDays) });
  if (due.length) Object.assign(where, { testDueOn: { [Op.and]: due } });
  // A retired set is never due; the due filters leave it out unless its status is asked for.
  if (due.length && !query.status) Object.assign(where, { status: { [Op.ne]: 'retired' } });
  const dir = query.dir.toUpperCase() as 'ASC' | 'DESC';
  const order: Order = [[SORT[query.sort], dir], ['tag', 'ASC'], ['id', 'ASC']];
  const { rows, count } = await db.models.GroundingSet.findAndCountAll({ where, order, limit: query.pageSize, offset: (query.page - 1) * query.pageSize });
  return { items: rows.map(setJson), total: count, page: query.page, pageSize: query.pageSize };
}

export async function allSets(db: Db, organizationId: number): Promise<SetJson[]> {
  return (await db.models.GroundingSet.findAll({ where: { organizationId }, order: [['tag', 'ASC']] })).map(setJson);
}

/** The sets a plan names, for the checker (only the tags asked for; none when it names none). */
export async function inventoryFor(db: Db, organizationId: number, tags: string[]): Promise<SetRecord[]> {
  if (tags.length === 0) return [];
  return (await db.models.GroundingSet.findAll({ where: { organizationId, tag: { [Op.in]: tags } } })).map(setJson);
}

/** Sets overdue and due within 30 days, among those not retired. */
export async function dueCounts(db: Db, organizationId: number, today: string): Promise<{ overdue: number; soon: number }> {
  const rows = await db.models.GroundingSet.findAll({ where: { organizationId, status: { [Op.ne]: 'retired' }, testDueOn: { [Op.lte]: addDays(today, 30) } }, attributes: ['testDueOn'] });
  const states = rows.map((r) => dueState(r.testDueOn, today));
  return { overdue: states.filter((s) => s === 'overdue').length, soon: states.filter((s) => s === 'soon').length };
}

export async function getSet(db: Db, organizationId: number, id: number) {
  const row = await db.models.GroundingSet.findOne({ where: { id, organizationId } });
  if (!row) return null;
  const [tests, events] = await Promise.all([
    db.models.SetTest.findAll({ where: { setId: id, organizationId }, order: [['testedOn', 'DESC'], ['id', 'DESC']] }),
    db.models.SetEvent.findAll({ where: { setId: id, organizationId }, order: [['id', 'DESC']] }),
  ]);
  return { set: setJson(row), tests: tests.map(testJson), events: events.map(eventJson) };
}

export type WriteOutcome<T> =
  | { kind: 'ok'; value: T }
  | { kind: 'not-found' }
  | { kind: 'duplicate-tag'; tag: string }
  /** A set that must pass a test was to be put in service (by an import: the tags, as the file wrote them). */
  | { kind: 'needs-test'; tags?: string[] }
  | { kind: 'invalid'; path: string; message: string };

function event(organizationId: number, setId: number, actorId: string | null, fields: Partial<Pick<SetEvent, 'fromStatus' | 'toStatus' | 'reason' | 'occurredOn'>> & { kind: string }) {
  return { organizationId, setId, actorId, fromStatus: null, toStatus: null, reason: null, occurredOn: null, ...fields };
}

/** Inserts or (by tag) updates sets in one transaction; used by POST and the CSV import. */
export async function saveSets(db: Db, organizationId: number, actorId: string, bodies: CreateSetBody[], mode: 'create' | 'upsert', transaction?: Transaction): Promise<WriteOutcome<{ created: SetJson[]; updated: SetJson[] }>> {
  try {
    return await db.sequelize.transaction({ transaction }, async (t) => {
      // One save of sets at a time per organisation: two imports locking the gaps of the same new
      // tags, then both inserting into them, deadlocked (a 500 for one of them).
      await lockOrganization(db, organizationId, t);
      const { testIntervalMonths } = await getSettings(db, organizationId, t);
      if (mode === 'upsert') {
        // Only a passing test returns a set that carried fault current or failed a test to service;
        // an import naming it in service (or leaving the status out) must not. Checked before any write.
        const held = await db.models.GroundingSet.findAll({ where: { organizationId, tag: { [Op.in]: bodies.map((b) => b.tag) }, needsPassingTest: true }, attributes: ['tag'], transaction: t, lock: t.LOCK.UPDATE });
        const waiting = new Set(held.map((r) => r.tag.toLowerCase()));
        const tags = bodies.filter((b) => b.status === 'in-service' && waiting.has(b.tag.toLowerCase())).map((b) => b.tag);
        if (tags.length) return { kind: 'needs-test' as const, tags };
      }
      const created: SetJson[] = [];
      const updated: SetJson[] = [];
      for (const body of bodies) {
        const fields = {
          ...body,
          notes: body.notes ?? null,
          statusReason: body.status === 'in-service' ? null : (body.statusReason ?? null),
          lastTestedOn: body.lastTestedOn ?? null,
          testDueOn: testDueOn(body.lastTestedOn ?? null, body.inServiceOn, testIntervalMonths),
        };
        const existing = mode === 'upsert' ? await db.models.GroundingSet.findOne({ where: { organizationId, tag: body.tag }, transaction: t, lock: t.LOCK.UPDATE }) : null;
        if (existing) {
          const from = existing.status;
          await existing.update(fields, { transaction: t });
          await db.models.SetEvent.create(event(organizationId, existing.id, actorId, { kind: 'imported', fromStatus: from, toStatus: existing.status, reason: fields.statusReason }), { transaction: t });
          updated.push(setJson(existing));
        } else {
          const row = await db.models.GroundingSet.create({ organizationId, ...fields }, { transaction: t });
          await db.models.SetEvent.create(event(organizationId, row.id, actorId, { kind: mode === 'create' ? 'created' : 'imported', toStatus: row.status, reason: fields.statusReason }), { transaction: t });
          created.push(setJson(row));
        }
      }
      return { kind: 'ok' as const, value: { created, updated } };
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) return { kind: 'duplicate-tag', tag: String((error.fields as Record<string, unknown>)?.tag ?? bodies[0]?.tag ?? '') };
    throw error;
  }
}

/** Edits a set, takes it out of service, or records that it carried fault current. */
export async function updateSet(db: Db, organizationId: number, id: number, actorId: string, patch: PatchSetBody): Promise<WriteOutcome<SetJson>> {
  try {
    return await db.sequelize.transaction(async (t) => {
      const row = await db.models.GroundingSet.findOne({ where: { id, organizationId }, transaction: t, lock: t.LOCK.UPDATE });
      if (!row) return { kind: 'not-found' as const };
      const { faultOn, status, statusReason, ...record } = patch;
      const from = row.status;
      if (faultOn) {
        const reason = statusReason ?? `Carried fault current on ${faultOn}; out of service until it passes a test.`;
        await row.update({ status: 'out-of-service', statusReason: reason, needsPassingTest: true }, { transaction: t });
        await db.models.SetEvent.create(event(organizationId, id, actorId, { kind: 'fault', fromStatus: from, toStatus: 'out-of-service', reason, occurredOn: faultOn }), { transaction: t });
      } else if (status && status !== from) {
        if (status === 'in-service' && row.needsPassingTest) return { kind: 'needs-test' as const };
        await row.update({ status, statusReason: status === 'in-service' ? null : (statusReason ?? null) }, { transaction: t });
        await db.models.SetEvent.create(event(organizationId, id, actorId, { kind: 'status', fromStatus: from, toStatus: status, reason: statusReason ?? null }), { transaction: t });
      } else if (statusReason !== undefined && row.status !== 'in-service') {
        await row.update({ statusReason }, { transaction: t });
      }
      if (Object.keys(record).length > 0) {
        const { testIntervalMonths } = await getSettings(db, organizationId, t);
        const inServiceOn = record.inServiceOn ?? row.inServiceOn;
        await row.update({ ...record, testDueOn: testDueOn(row.lastTestedOn, inServiceOn, testIntervalMonths) }, { transaction: t });
        await db.models.SetEvent.create(event(organizationId, id, actorId, { kind: 'edited', reason: `Changed ${Object.keys(record).map((k) => SET_FIELD_WORDS[k] ?? k).join(', ')}` }), { transaction: t });
      }
      return { kind: 'ok' as const, value: setJson(row) };
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) return { kind: 'duplicate-tag', tag: patch.tag ?? '' };
    throw error;
  }
}

/** The latest day a fault was recorded on or a test failed: a pass must be on or after it to count. */
async function needsTestSince(db: Db, organizationId: number, setId: number, transaction: Transaction): Promise<string | null> {
  const fault = await db.models.SetEvent.findOne({ where: { organizationId, setId, kind: 'fault' }, attributes: ['occurredOn'], order: [['occurredOn', 'DESC']], transaction });
  const failed = await db.models.SetTest.findOne({ where: { organizationId, setId, passed: false }, attributes: ['testedOn'], order: [['testedOn', 'DESC']], transaction });
  const days = [fault?.occurredOn, failed?.testedOn].filter((d): d is string => typeof d === 'string');
  return days.length ? days.sort().at(-1)! : null;
}

/**
 * Records an in-service test. The limit is the one given, else the organisation's for the set's
 * cable and length (a given limit above the organisation's is refused); with a limit, `passed`
 * follows from it. A passing test moves the due date and puts a set that was out only for want of
 * a passing test back in service, when it is dated on or after the fault or failed test that took
 * the set out (an older pass is kept in the history only); a failing one takes it out.
 */
export async function recordTest(db: Db, organizationId: number, id: number, actorId: string, body: SetTestBody): Promise<WriteOutcome<{ set: SetJson; test: TestJson }>> {
  return db.sequelize.transaction(async (t) => {
    const row = await db.models.GroundingSet.findOne({ where: { id, organizationId }, transaction: t, lock: t.LOCK.UPDATE });
    if (!row) return { kind: 'not-found' as const };
    const settings = await getSettings(db, organizationId, t);
    const ownLimit = limitFor(settings.resistanceLimits, row.cable, row.lengthM);
    // The organisation's limit is an admin's setting: a tester may test to a stricter one, never a looser one.
    if (ownLimit !== null && body.limitMilliohms != null && body.limitMilliohms > ownLimit) {
      return { kind: 'invalid' as const, path: 'limitMilliohms', message: `must not be above your organisation's limit of ${ownLimit} mΩ for this set's cable and length (leave it empty to use that limit)` };
    }
    const limit = body.limitMilliohms ?? ownLimit;
    const computed = limit === null ? undefined : body.resistanceMilliohms <= limit;
    if (computed === undefined && body.passed === undefined) return { kind: 'invalid' as const, path: 'passed', message: 'is required when no resistance limit applies (give limitMilliohms, or enter limits in the equipment settings)' };
    if (computed !== undefined && body.passed !== undefined && computed !== body.passed) return { kind: 'invalid' as const, path: 'passed', message: `does not agree with ${body.resistanceMilliohms} mΩ against the limit of ${limit} mΩ` };
    const passed = computed ?? (body.passed as boolean);
    // Only a pass on or after the day of what took the set out (a fault, a failed test) puts it back.
    const since = passed && row.needsPassingTest ? await needsTestSince(db, organizationId, id, t) : null;
    const test = await db.models.SetTest.create({ organizationId, setId: id, testedOn: body.testedOn, testedBy: actorId, resistanceMilliohms: body.resistanceMilliohms, limitMilliohms: limit, passed, notes: body.notes ?? null }, { transaction: t });
    const from = row.status;
    await db.models.SetEvent.create(event(organizationId, id, actorId, { kind: 'test', reason: `${passed ? 'Passed' : 'Failed'}: ${body.resistanceMilliohms} mΩ${limit !== null ? ` (limit ${limit} mΩ)` : ''}`, occurredOn: body.testedOn }), { transaction: t });
    if (passed) {
      const last = row.lastTestedOn && row.lastTestedOn > body.testedOn ? row.lastTestedOn : body.testedOn;
      const back = row.needsPassingTest && row.status === 'out-of-service' && (since === null || body.testedOn >= since);
      await row.update({ lastTestedOn: last, testDueOn: testDueOn(last, row.inServiceOn, settings.testIntervalMonths), ...(back ? { status: 'in-service', statusReason: null, needsPassingTest: false } : {}) }, { transaction: t });
      if (back) await db.models.SetEvent.create(event(organizationId, id, actorId, { kind: 'status', fromStatus: from, toStatus: 'in-service', reason: `Passed its test on ${body.testedOn}`, occurredOn: body.testedOn }), { transaction: t });
    } else if (row.status === 'in-service') {
      const reason = `Failed its test on ${body.testedOn}; out of service until it passes a test.`;
      await row.update({ status: 'out-of-service', statusReason: reason, needsPassingTest: true }, { transaction: t });
      await db.models.SetEvent.create(event(organizationId, id, actorId, { kind: 'status', fromStatus: from, toStatus: 'out-of-service', reason, occurredOn: body.testedOn }), { transaction: t });
    }
    return { kind: 'ok' as const, value: { set: setJson(row), test: testJson(test) } };
  });
}
