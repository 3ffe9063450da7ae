/**
 * Field records, their entries and photos. Every function takes the organisation id: another
 * organisation's record is simply not found. Entries are only inserted; each write locks the
 * record row, so the rules are judged against exactly the entries before it, and the unique
 * (record, clientId) key makes a repeated entry answer with the stored one.
 */
import { Op, QueryTypes, Transaction, UniqueConstraintError, type WhereOptions } from 'sequelize';
import type { EntryBody, FieldEntry, Flag, Refusal, StoreVerdict } from '@/lib/domain/field-record';
import type { RecordStatus } from '@/lib/schemas/field-record';
import type { PlanDocument } from '@/lib/schemas/plan';
import type { Db } from '@db/connection';
import type { FieldRecord, FieldRecordEntry } from '@db/models';
import { recordEvent } from './audit';
import { readStoredDocument } from './plans';
import { nameMap } from './review';

export interface RecordSummary {
  id: number;
  planId: number;
  planTitle: string;
  revision: number;
  status: RecordStatus;
  workDate: string;
  structure: string;
  location: string;
  clearanceRef: string;
  detector: string;
  leadId: string;
  leadName: string;
  setsOn: number;
  closedAt: Date | null;
  closedBy: string | null;
  closedByName: string | null;
  createdAt: Date;
}

export interface StoredEntry {
  id: number;
  entry: FieldEntry;
  flags: Flag[];
  actorName: string;
  recordedAt: Date;
}

export interface PhotoRow {
  id: number;
  /** The id the device gave the photo (null for photos stored before devices sent one). */
  clientId: string | null;
  objectKey: string;
  mime: string;
  bytes: number;
  width: number;
  height: number;
  caption: string;
  createdBy: string;
  createdAt: Date;
}

export interface RecordDetail extends RecordSummary {
  document: PlanDocument;
  entries: StoredEntry[];
  photos: PhotoRow[];
}

const locked = () => ({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED });

async function summaries(db: Db, rows: FieldRecord[]): Promise<RecordSummary[]> {
  const names = await nameMap(db, rows.flatMap((r) => [r.leadId, ...(r.closedBy ? [r.closedBy] : [])]));
  const plans = rows.length ? await db.models.Plan.findAll({ where: { id: [...new Set(rows.map((r) => r.planId))] }, attributes: ['id', 'title'] }) : [];
  const titles = new Map(plans.map((p) => [p.id, p.title]));
  return rows.map((r) => ({
    id: r.id,
    planId: r.planId,
    planTitle: titles.get(r.planId) ?? '',
    revision: r.revision,
    status: r.status,
    workDate: r.workDate,
    structure: r.structure,
    location: r.location,
    clearanceRef: r.clearanceRef,
    detector: r.detector,
    leadId: r.leadId,
    leadName: names.get(r.leadId) ?? '',
    setsOn: r.setsOn,
    closedAt: r.closedAt ?? null,
    closedBy: r.closedBy ?? null,
    closedByName: r.closedBy ? names.get(r.closedBy) ?? '' : null,
    createdAt: r.createdAt,
  }));
}

export function toFieldEntry(row: FieldRecordEntry): FieldEntry {
  return { ...(JSON.parse(row.body) as EntryBody), clientId: row.clientId, at: row.at.toISOString(), actorId: row.actorId };
}

export interface NewRecord {
  planId: number;
  leadId: string;
  workDate: string;
  location: string;
  clearanceRef: string;
  detector: string;
}

/** Opens a record on the plan's approved revision; refused unless the plan is approved now. */
export async function createRecord(db: Db, organizationId: number, input: NewRecord): Promise<{ kind: 'ok'; record: RecordSummary } | { kind: 'not-found' } | { kind: 'not-approved'; status: string }> {
  const outcome = await db.sequelize.transaction(locked(), async (transaction) => {
    const plan = await db.models.Plan.findOne({ where: { id: input.planId, organizationId }, lock: transaction.LOCK.SHARE, transaction });
    if (!plan) return { kind: 'not-found' as const };
    if (plan.status !== 'approved' || !plan.approvedRevision) return { kind: 'not-approved' as const, status: plan.status };
    const row = await db.models.FieldRecord.create({ organizationId, ...input, revision: plan.approvedRevision, structure: plan.structure }, { transaction });
    await recordEvent(db, { organizationId, actorId: input.leadId, action: 'record.opened', subjectType: 'plan', subjectId: plan.id, details: { recordId: row.id, revision: plan.approvedRevision } }, transaction);
    return { kind: 'ok' as const, row };
  });
  if (outcome.kind !== 'ok') return outcome;
  return { kind: 'ok', record: (await summaries(db, [outcome.row]))[0] };
}

export async function listRecords(db: Db, organizationId: number, query: { status?: RecordStatus; page: number; pageSize: number; planId?: number; leadId?: string }) {
  const where: WhereOptions = { organizationId };
  if (query.status) Object.assign(where, { status: query.status });
  if (query.planId) Object.assign(where, { planId: query.planId });
  if (query.leadId) Object.assign(where, { leadId: query.leadId });
  const { rows, count } = await db.models.FieldRecord.findAndCountAll({
    where,
    // Open records with sets on first, then other open records, then closed; newest first within each.
    order: [[db.sequelize.literal("(status = 'open' AND sets_on > 0)"), 'DESC'], [db.sequelize.literal("(status = 'open')"), 'DESC'], ['workDate', 'DESC'], ['id', 'DESC']],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: await summaries(db, rows), total: count, page: query.page, pageSize: query.pageSize, pages: Math.max(1, Math.ceil(count / query.pageSize)) };
}

async function storedEntries(db: Db, recordId: number, transaction?: Transaction): Promise<FieldRecordEntry[]> {
  return db.models.FieldRecordEntry.findAll({ where: { recordId }, order: [['id', 'ASC']], transaction });
}

export async function getRecord(db: Db, organizationId: number, id: number): Promise<RecordDetail | null> {
  const row = await db.models.FieldRecord.findOne({ where: { id, organizationId } });
  if (!row) return null;
  const [summary] = await summaries(db, [row]);
  const revision = await db.models.PlanRevision.findOne({ where: { planId: row.planId, number: row.revision } });
  const entries = await storedEntries(db, id);
  const names = await nameMap(db, entries.map((e) => e.actorId));
  const photos = await db.models.FieldRecordPhoto.findAll({ where: { recordId: id }, order: [['id', 'ASC']] });
  return {
    ...summary,
    document: readStoredDocument(revision!.document),
    entries: entries.map((e) => ({ id: e.id, entry: toFieldEntry(e), flags: JSON.parse(e.flags) as Flag[], actorName: names.get(e.actorId) ?? '', recordedAt: e.recordedAt })),
    photos: photos.map((p) => p.get({ plain: true }) as PhotoRow),
  };
}

/** What the rules say about a write, given the entries so far; called inside the record lock. */
export type Judge = (document: PlanDocument, entries: FieldEntry[], closed: boolean) => StoreVerdict;

export type AddEntryOutcome =
  | { kind: 'created' | 'repeat'; entry: StoredEntry }
  | { kind: 'not-found' }
  | { kind: 'client-id-reused' }
  | { kind: 'refused'; refusal: Refusal };

const bodyOf = (entry: FieldEntry): string => {
  const { clientId: _c, at: _a, actorId: _b, ...body } = entry;
  void _c; void _a; void _b;
  return JSON.stringify(body);
};

/** Records one entry (or finds the one already recorded under its clientId). */
export async function addEntry(db: Db, organizationId: number, recordId: number, entry: FieldEntry, judge: Judge): Promise<AddEntryOutcome> {
  const attempt = () =>
    db.sequelize.transaction(locked(), async (transaction): Promise<AddEntryOutcome> => {
      const record = await db.models.FieldRecord.findOne({ where: { id: recordId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
      if (!record) return { kind: 'not-found' };
      const existing = await db.models.FieldRecordEntry.findOne({ where: { recordId, clientId: entry.clientId }, transaction });
      if (existing) return existing.body === bodyOf(entry) ? { kind: 'repeat', entry: await stored(db, existing) } : { kind: 'client-id-reused' };
      const revision = await db.models.PlanRevision.findOne({ where: { planId: record.planId, number: record.revision }, transaction });
      const before = (await storedEntries(db, recordId, transaction)).map(toFieldEntry);
      const verdict = judge(readStoredDocument(revision!.document), [...before, entry], record.status === 'closed');
      if (!verdict.ok) return { kind: 'refused', refusal: verdict.refusal };
      const row = await db.models.FieldRecordEntry.create(
        { recordId, clientId: entry.clientId, type: entry.type, body: bodyOf(entry), flags: JSON.stringify(verdict.flags), at: new Date(entry.at), actorId: entry.actorId },
        { transaction },
      );
      if (record.setsOn !== verdict.setsOn) await record.update({ setsOn: verdict.setsOn }, { transaction });
      return { kind: 'created', entry: await stored(db, row, transaction) };
    });
  try {
    return await attempt();
  } catch (error) {
    // Two first sends of one clientId racing past the check: the key lets one in; the other reads it.
    if (error instanceof UniqueConstraintError) return attempt();
    throw error;
  }
}

async function stored(db: Db, row: FieldRecordEntry, transaction?: Transaction): Promise<StoredEntry> {
  const actor = await db.models.User.findByPk(row.actorId, { attributes: ['name'], transaction });
  return { id: row.id, entry: toFieldEntry(row), flags: JSON.parse(row.flags) as Flag[], actorName: actor?.name ?? '', recordedAt: row.recordedAt };
}

/** Closes the record when the rules allow it; records who and when. */
export async function closeRecord(db: Db, organizationId: number, recordId: number, actorId: string, judge: Judge): Promise<{ kind: 'ok' } | { kind: 'not-found' } | { kind: 'refused'; refusal: Refusal }> {
  return db.sequelize.transaction(locked(), async (transaction) => {
    const record = await db.models.FieldRecord.findOne({ where: { id: recordId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!record) return { kind: 'not-found' as const };
    const revision = await db.models.PlanRevision.findOne({ where: { planId: record.planId, number: record.revision }, transaction });
    const entries = (await storedEntries(db, recordId, transaction)).map(toFieldEntry);
    const verdict = judge(readStoredDocument(revision!.document), entries, record.status === 'closed');
    if (!verdict.ok) return { kind: 'refused' as const, refusal: verdict.refusal };
    await record.update({ status: 'closed', closedAt: new Date(), closedBy: actorId, setsOn: 0 }, { transaction });
    await recordEvent(db, { organizationId, actorId, action: 'record.closed', subjectType: 'plan', subjectId: record.planId, details: { recordId } }, transaction);
    return { kind: 'ok' as const };
  });
}

/** Whether the organisation lets a photo's original keep its location metadata. */
export async function keepsPhotoLocation(db: Db, organizationId: number): Promise<boolean> {
  const rows = await db.sequelize.query<{ keep: number }>('SELECT keep_photo_location AS keep FROM organizations WHERE id = ?', { replacements: [organizationId], type: QueryTypes.SELECT });
  return Boolean(rows[0]?.keep);
}

/** The photo a device already stored under this clientId, if any. */
export async function photoByClientId(db: Db, organizationId: number, recordId: number, clientId: string): Promise<PhotoRow | null> {
  const record = await db.models.FieldRecord.findOne({ where: { id: recordId, organizationId }, attributes: ['id'] });
  if (!record) return null;
  const row = await db.models.FieldRecordPhoto.findOne({ where: { recordId, clientId } });
  return row ? (row.get({ plain: true }) as PhotoRow) : null;
}

export type AddPhotoOutcome = { kind: 'ok' | 'repeat'; photo: PhotoRow } | { kind: 'not-found' } | { kind: 'closed' };

/**
 * Adds a photo row, only while the record is open (checked under the record's lock). A clientId
 * already stored answers with that photo (kind 'repeat'), also when two first sends race.
 */
export async function addPhoto(db: Db, organizationId: number, recordId: number, photo: Omit<PhotoRow, 'id' | 'createdAt' | 'clientId'> & { clientId?: string | null }): Promise<AddPhotoOutcome> {
  const attempt = () =>
    db.sequelize.transaction(locked(), async (transaction): Promise<AddPhotoOutcome> => {
      const record = await db.models.FieldRecord.findOne({ where: { id: recordId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
      if (!record) return { kind: 'not-found' };
      const existing = photo.clientId ? await db.models.FieldRecordPhoto.findOne({ where: { recordId, clientId: photo.clientId }, transaction }) : null;
      if (existing) return { kind: 'repeat', photo: existing.get({ plain: true }) as PhotoRow };
      if (record.status === 'closed') return { kind: 'closed' };
      const row = await db.models.FieldRecordPhoto.create({ recordId, ...photo }, { transaction });
      return { kind: 'ok', photo: row.get({ plain: true }) as PhotoRow };
    });
  try {
    return await attempt();
  } catch (error) {
    // Two first sends of one clientId racing past the check: the key lets one in; the other reads it.
    if (error instanceof UniqueConstraintError) return attempt();
    throw error;
  }
}

export async function getPhoto(db: Db, organizationId: number, recordId: number, photoId: number): Promise<PhotoRow | null> {
  const record = await db.models.FieldRecord.findOne({ where: { id: recordId, organizationId }, attributes: ['id'] });
  if (!record) return null;
  const row = await db.models.FieldRecordPhoto.findOne({ where: { id: photoId, recordId } });
  return row ? (row.get({ plain: true }) as PhotoRow) : null;
}

/** The record's status without its entries (for quick guards). */
export async function recordStatus(db: Db, organizationId: number, recordId: number): Promise<RecordStatus | null> {
  const row = await db.models.FieldRecord.findOne({ where: { id: recordId, organizationId, status: { [Op.in]: ['open', 'closed'] } }, attributes: ['status'] });
  return row?.status ?? null;
}

/** The reviewer who approved the revision a record is fixed to (for its mail). */
export async function approvingReviewer(db: Db, planId: number, revision: number): Promise<{ id: string; email: string; name: string; disabled: boolean } | null> {
  const decision = await db.models.PlanDecision.findOne({ where: { planId, revision, decision: 'approve' } });
  if (!decision) return null;
  const user = await db.models.User.findByPk(decision.reviewerId, { attributes: ['id', 'email', 'name', 'disabled'] });
  return user ? { id: user.id, email: user.email, name: user.name, disabled: user.disabled } : null;
}
