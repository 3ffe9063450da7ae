/**
 * The field record as the endpoints use it: access by role, the rules judged inside the record's
 * lock (src/lib/domain/field-record), and the mail that goes with a deviation or a close-out.
 */
import { getDb } from '@db/connection';
import { addEntry, approvingReviewer, closeRecord, getRecord, type Judge, type RecordDetail, type StoredEntry } from '@db/repositories/field-records';
import { allSets } from '@db/repositories/equipment';
import { getOrganisationSettings } from '@db/repositories/organisation-settings';
import { inventorySetStatus, judgeAppend, judgeCloseOut, nextStep, recordPlanFrom, replay, type FieldEntry, type InventorySet, type Refusal, type SetStatusLookup } from '@/lib/domain/field-record';
import type { Person } from '@/lib/domain/people';
import { can } from '@/lib/domain/permissions';
import type { EntryInput } from '@/lib/schemas/field-record';
import { AppError } from './errors';
import { roleRefusal } from './guards';
import { queueMail } from './mail';
import { closedMessages, deviationMessage } from './record-mail';
import { publicUrl } from './settings';
import { formatDate } from '@/lib/time-format';

/** The organisation's sets as the record needs them, with the day they are judged on (the organisation's own) and its zone. */
export interface InventoryCopy {
  today: string;
  timeZone: string;
  sets: (InventorySet & { description: string })[];
}

/**
 * Every set of the organisation (retired ones too, so the device can name why a tag is refused).
 * The record's GET carries this copy so the device judges an install offline as the server does.
 */
export async function inventoryCopy(organizationId: number, now = new Date()): Promise<InventoryCopy> {
  const sets = (await allSets(getDb(), organizationId)).map((s) => ({ tag: s.tag, description: s.description, status: s.status, testDueOn: s.testDueOn, statusReason: s.statusReason }));
  const { timeZone } = await getOrganisationSettings(getDb(), organizationId);
  return { today: formatDate(now, timeZone), timeZone, sets };
}

/** Is a set fit to go on: a tag of the organisation's inventory, in service, not past its test date. */
export async function setStatusLookupFor(organizationId: number, now = new Date()): Promise<SetStatusLookup> {
  const copy = await inventoryCopy(organizationId, now);
  return inventorySetStatus(copy.sets, copy.today);
}

function refusalError(refusal: Refusal): AppError {
  return new AppError(refusal.code, { message: refusal.message, extra: refusal.items ? { items: refusal.items } : undefined });
}

/** Reads a record the person may see: other organisations 404; open records only for `records.view-open`. */
export async function readableRecord(person: Person, id: number): Promise<RecordDetail> {
  const record = await getRecord(getDb(), person.organizationId, id);
  if (!record) throw new AppError('NOT_FOUND');
  if (record.status !== 'closed' && !can(person.role, 'records.view-open')) throw roleRefusal('records.view-open', 'An open field record is for the crew. ');
  return record;
}

/** People named on a sign-on must be of the organisation (checked before the rules). */
async function checkPeople(person: Person, input: EntryInput): Promise<void> {
  if (input.type !== 'sign-on' || !input.people.length) return;
  const rows = await getDb().models.User.findAll({ where: { id: input.people, organizationId: person.organizationId, disabled: false }, attributes: ['id'] });
  const known = new Set(rows.map((r) => r.id));
  const issues = input.people.flatMap((id, i) => (known.has(id) ? [] : [{ path: `people[${i}]`, message: 'is not an active person of your organisation' }]));
  if (issues.length) throw new AppError('VALIDATION', { issues });
}

/** Records an entry; a repeat of a clientId answers with the stored entry (created: false). */
export async function recordEntry(person: Person, recordId: number, input: EntryInput, requestUrl?: URL): Promise<{ created: boolean; entry: StoredEntry }> {
  const db = getDb();
  await checkPeople(person, input);
  const sets = await setStatusLookupFor(person.organizationId);
  const entry = { ...input, actorId: person.id } as FieldEntry;
  const judge: Judge = (document, entries, closed) => judgeAppend(document, entries, closed, sets);
  const outcome = await addEntry(db, person.organizationId, recordId, entry, judge);
  switch (outcome.kind) {
    case 'not-found':
      throw new AppError('NOT_FOUND');
    case 'client-id-reused':
      throw new AppError('CLIENT_ID_REUSED');
    case 'refused':
      throw refusalError(outcome.refusal);
    case 'repeat':
      return { created: false, entry: outcome.entry };
    case 'created':
      break;
  }
  if (input.type === 'deviation') {
    const record = (await getRecord(db, person.organizationId, recordId))!;
    const reviewer = await approvingReviewer(db, record.planId, record.revision);
    if (reviewer && !reviewer.disabled) await queueMail([deviationMessage(reviewer.email, record, person.organizationId, person.name, input.text, publicUrl(requestUrl))]);
  }
  return { created: true, entry: outcome.entry };
}

/** Closes out: refused (listing the sets still on) until every set that went on has come off. */
export async function closeOut(person: Person, recordId: number, requestUrl?: URL): Promise<RecordDetail> {
  const db = getDb();
  const outcome = await closeRecord(db, person.organizationId, recordId, person.id, judgeCloseOut);
  if (outcome.kind === 'not-found') throw new AppError('NOT_FOUND');
  if (outcome.kind === 'refused') throw refusalError(outcome.refusal);
  const record = (await getRecord(db, person.organizationId, recordId))!;
  const reviewer = await approvingReviewer(db, record.planId, record.revision);
  const lead = await db.models.User.findByPk(record.leadId, { attributes: ['email', 'disabled'] });
  const to = [...new Set([...(reviewer && !reviewer.disabled ? [reviewer.email] : []), ...(lead && !lead.disabled ? [lead.email] : [])])];
  const { timeZone } = await getOrganisationSettings(db, person.organizationId);
  await queueMail(closedMessages(to, record, person.organizationId, person.name, publicUrl(requestUrl), timeZone));
  return record;
}

/** The record as the API answers it: entries in order, counts, the sets on now and the next step. */
export function recordJson(record: RecordDetail, inventory?: InventoryCopy) {
  const plan = recordPlanFrom(record.document);
  const state = replay(plan, record.entries.map((e) => e.entry), record.status === 'closed');
  return {
    id: record.id,
    planId: record.planId,
    planTitle: record.planTitle,
    revision: record.revision,
    status: record.status,
    workDate: record.workDate,
    structure: record.structure,
    location: record.location,
    clearanceRef: record.clearanceRef,
    detector: record.detector,
    lead: { id: record.leadId, name: record.leadName },
    closedAt: record.closedAt,
    closedBy: record.closedBy ? { id: record.closedBy, name: record.closedByName } : null,
    counts: { on: state.on.length, installed: state.installed, removed: state.removed },
    setsOn: state.on,
    voltageFound: state.voltageFound,
    testPassed: state.testPassed,
    briefing: state.briefing,
    next: nextStep(plan, state),
    plan,
    document: record.document,
    entries: record.entries.map(entryJson),
    photos: record.photos.map((p) => ({ id: p.id, caption: p.caption, mime: p.mime, bytes: p.bytes, width: p.width, height: p.height, createdAt: p.createdAt, url: `/api/records/${record.id}/photos/${p.id}` })),
    ...(inventory ? { inventory } : {}),
  };
}

export function entryJson(e: StoredEntry) {
  return { id: e.id, ...e.entry, actorName: e.actorName, flags: e.flags, recordedAt: e.recordedAt };
}
