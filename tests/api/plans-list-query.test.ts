/**
 * The plan list's single query (db/repositories/plans.ts) gives exactly what the earlier
 * Sequelize `findAndCountAll` gave: the same items in the same order, the same totals, the same
 * JSON bytes on the wire, for every sort, direction, filter, search and a page past the end.
 */
import { Op, type Order, type WhereOptions } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listPlans } from '../../db/repositories/plans';
import type { Plan } from '../../db/models';
import { PLAN_SORTS, defaultSortDir, listPlansQuery, type ListPlansQuery } from '../../src/lib/schemas/api';
import type { PlanStatus } from '../../src/lib/domain/plan-status';
import { summaryJson } from '../../src/lib/server/plan-json';
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
