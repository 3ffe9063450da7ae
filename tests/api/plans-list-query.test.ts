/**
 * The plan list's single query (db/repositories/plans.ts) gives exactly what the earlier
 * Sequelize `findAndCountAll` gave: the same items in the same order, the same totals, the same
 * JSON bytes on the wire, for every sort, direction, filter, search and a page past the end; and
 * one plan read in one query gives what the earlier two queries gave.
 */
import { Op, type Order, type WhereOptions } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getPlan, listPlans, readStoredDocument } from '@db/repositories/plans';
import type { Plan } from '@db/models';
import { PLAN_SORTS, defaultSortDir, listPlansQuery, type ListPlansQuery } from '@/lib/schemas/api';
import type { PlanStatus } from '@/lib/domain/plan-status';
import { planJson, summaryJson } from '@/lib/server/plan-json';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makePerson, makeTeam, planDocument, testDb, PASSWORD } from '../helpers/factories';

const COLUMNS: Record<ListPlansQuery['sort'], string> = { updated: 'updatedAt', created: 'createdAt', title: 'title', status: 'status', blockers: 'blockers', warnings: 'warnings', structure: 'structure', submitted: 'submittedAt' };

/** The list as it was computed before: Sequelize instances, findAndCountAll's two queries. */
async function referenceList(organizationId: number, query: ListPlansQuery & { authorId?: string; statuses?: PlanStatus[] }) {
  const where: WhereOptions = { organizationId };
  if (query.status) Object.assign(where, { status: query.status });
  else if (query.statuses) Object.assign(where, { status: { [Op.in]: query.statuses } });
  if (query.authorId) Object.assign(where, { authorId: query.authorId });
  if (query.q) Object.assign(where, { title: { [Op.like]: `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%` } });
  const dir = (query.dir ?? defaultSortDir(query.sort)).toUpperCase() as 'ASC' | 'DESC';
  const order: Order = [[COLUMNS[query.sort], dir], ['id', dir]];
  const db = testDb();
  const { rows, count } = await db.models.Plan.findAndCountAll({ where, order, include: [{ model: db.models.User, as: 'author', attributes: ['name'] }], limit: query.pageSize, offset: (query.page - 1) * query.pageSize });
  const items = (rows as (Plan & { author?: { name: string } })[]).map((r) => ({
    id: r.id, title: r.title, structure: r.structure, status: r.status, blockers: r.blockers, warnings: r.warnings, authorId: r.authorId,
    authorName: r.author?.name ?? '', currentRevision: r.currentRevision, submittedAt: r.submittedAt ?? null, createdAt: r.createdAt, updatedAt: r.updatedAt,
  }));
  return { items, total: count, page: query.page, pageSize: query.pageSize, pages: Math.max(1, Math.ceil(count / query.pageSize)) };
}

const wire = (page: Awaited<ReturnType<typeof listPlans>>) => JSON.stringify({ ...page, items: page.items.map(summaryJson) });

let organizationId: number;
let lead: Client;
let otherAuthor: string;
beforeAll(async () => {
  const team = await makeTeam();
  organizationId = team.organizationId;
  lead = await signedIn(team.lead.email, PASSWORD);
  const titles = ['Bravo pole', 'alpha pole', 'Charlie 50% pole', 'Delta_tower', 'Echo pole', 'Foxtrot \\ pole', 'Golf pole'];
  for (const title of titles) expect((await lead.post('/api/plans', { title, document: planDocument() })).status).toBe(201);
  const other = await makePerson(organizationId, 'crew_lead', { name: 'Another invented lead' });
  otherAuthor = other.id;
  const plans = await testDb().models.Plan.findAll({ where: { organizationId }, order: [['id', 'ASC']] });
  // Mixed statuses, null counts, submitted times and a second author, so each sort has ties and nulls.
  await plans[1].update({ status: 'submitted', submittedAt: new Date('2026-03-01T10:00:00.123Z'), blockers: null, warnings: null });
  await plans[2].update({ status: 'approved', submittedAt: new Date('2026-02-01T10:00:00Z'), authorId: otherAuthor });
  await plans[3].update({ status: 'returned', blockers: 3, warnings: 1 });
  await plans[4].update({ structure: 'An invented tangent' });
});
afterAll(closeTestDb);

describe('the plan list query', () => {
  const queries: Record<string, unknown>[] = [{}, { pageSize: 3 }, { pageSize: 3, page: 3 }, { page: 9 }, { q: '50%' }, { q: '_' }, { q: '\\' }, { q: 'POLE' }, { status: 'submitted' }];
  for (const sort of PLAN_SORTS) for (const dir of [undefined, 'asc', 'desc']) queries.push({ sort, ...(dir ? { dir } : {}), pageSize: 4 });

  it('matches the earlier findAndCountAll byte for byte on every sort, direction, filter and page', async () => {
    for (const raw of queries) {
      const query = listPlansQuery.parse(raw);
      expect(wire(await listPlans(testDb(), organizationId, query)), JSON.stringify(raw)).toBe(wire(await referenceList(organizationId, query)));
    }
  });

  it('matches with several statuses, an author filter, none of the statuses and a page past the end', async () => {
    const base = listPlansQuery.parse({ pageSize: 2 });
    for (const extra of [{ statuses: ['draft', 'returned'] as PlanStatus[] }, { statuses: [] as PlanStatus[] }, { authorId: otherAuthor }, { statuses: ['draft'] as PlanStatus[], page: 7 }]) {
      const query = { ...base, ...extra };
      expect(wire(await listPlans(testDb(), organizationId, query)), JSON.stringify(extra)).toBe(wire(await referenceList(organizationId, query)));
    }
  });

  it('answers the API with the same page as the repository', async () => {
    const response = await lead.get('/api/plans?sort=blockers&pageSize=5&page=2');
    expect(response.status).toBe(200);
    expect(response.text).toBe(wire(await referenceList(organizationId, listPlansQuery.parse({ sort: 'blockers', pageSize: 5, page: 2 }))));
  });
});

/** One plan as it was read before: the plan with its author, then its current revision. */
async function referencePlan(id: number) {
  const db = testDb();
  const r = (await db.models.Plan.findOne({ where: { id, organizationId }, include: [{ model: db.models.User, as: 'author', attributes: ['name'] }] })) as (Plan & { author?: { name: string } }) | null;
  if (!r) return null;
  const revision = await db.models.PlanRevision.findOne({ where: { planId: id, number: r.currentRevision } });
  if (!revision) return null;
  return {
    id: r.id, title: r.title, structure: r.structure, status: r.status, blockers: r.blockers, warnings: r.warnings, authorId: r.authorId,
    authorName: r.author?.name ?? '', currentRevision: r.currentRevision, submittedAt: r.submittedAt ?? null, createdAt: r.createdAt, updatedAt: r.updatedAt,
    document: readStoredDocument(revision.document), report: revision.report ? JSON.parse(revision.report) : null,
    revisionCreatedAt: revision.createdAt, revisionCreatedBy: revision.createdBy,
  };
}

describe('one plan', () => {
  it('reads each plan, a later revision and a revision without a report exactly as the two queries did', async () => {
    const plans = await testDb().models.Plan.findAll({ where: { organizationId }, order: [['id', 'ASC']] });
    const saved = await lead.put(`/api/plans/${plans[0].id}`, { expectedRevision: 1, title: 'Bravo pole, second go', document: planDocument() });
    expect(saved.status).toBe(200);
    await testDb().models.PlanRevision.update({ report: null }, { where: { planId: plans[5].id } });
    for (const plan of plans) {
      const mine = await getPlan(testDb(), organizationId, plan.id);
      const theirs = await referencePlan(plan.id);
      expect(mine && JSON.stringify(planJson(mine)), String(plan.id)).toBe(theirs && JSON.stringify(planJson(theirs)));
      expect(JSON.stringify(mine), String(plan.id)).toBe(JSON.stringify(theirs));
    }
    expect((await getPlan(testDb(), organizationId, plans[0].id))?.currentRevision).toBe(2);
    expect(await getPlan(testDb(), organizationId + 1000000, plans[0].id)).toBeNull();
  });
});
