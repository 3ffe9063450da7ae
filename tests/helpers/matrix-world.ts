/**
 * Fixtures for the generated role matrix. Two organisations with one person of each role; every
 * fixture a cell changes is made fresh by the cell that asks for it, and the few read-only ones
 * (a plan with two revisions, a closed record with a photo) are made once by whichever cell asks
 * first. So no cell's answer depends on which cells ran before it, or whether they ran at all.
 */
import sharp from 'sharp';
import { expect } from 'vitest';
import type { Role } from '@/lib/domain/roles';
import { Client, signedIn, type ApiResponse } from './api';
import { setBody } from './equipment';
import { makePerson, makeTeam, PASSWORD, planDocument } from './factories';
import { upload } from './photos';
import { bucketDocument } from './practice';

type Team = Awaited<ReturnType<typeof makeTeam>>;
export type Org = 'ours' | 'theirs';

/** One promise per key, made on first use. */
function memo<T>(make: () => Promise<T>): () => Promise<T> {
  let value: Promise<T> | null = null;
  return () => (value ??= make());
}

const emailOf = (team: Team, role: Role) => ({ admin: team.admin, reviewer: team.reviewer, crew_lead: team.lead, apprentice: team.apprentice })[role].email;

export class World {
  private clients = new Map<string, Promise<Client>>();
  private constructor(private readonly teams: Record<Org, Team>) {}

  static readonly get = memo(async () => {
    const [ours, theirs] = await Promise.all([makeTeam(), makeTeam()]);
    return new World({ ours, theirs });
  });

  get organizationId(): number {
    return this.teams.ours.organizationId;
  }

  /** The signed-in client of a role in an organisation (one session each, kept). */
  client(role: Role, org: Org = 'ours'): Promise<Client> {
    const key = `${org}/${role}`;
    if (!this.clients.has(key)) this.clients.set(key, signedIn(emailOf(this.teams[org], role), PASSWORD));
    return this.clients.get(key)!;
  }

  /** A session of its own, for a cell that ends it (sign-out). */
  freshClient(role: Role, org: Org = 'ours'): Promise<Client> {
    return signedIn(emailOf(this.teams[org], role), PASSWORD);
  }

  private async lead() {
    return this.client('crew_lead');
  }

  async draft(): Promise<number> {
    const created = await (await this.lead()).post('/api/plans', { title: 'Invented matrix pole', document: planDocument() });
    expect(created.status, created.text).toBe(201);
    return created.body.plan.id;
  }

  async submitted(): Promise<number> {
    const id = await this.draft();
    expect((await (await this.lead()).post(`/api/plans/${id}/submit`)).status).toBe(200);
    return id;
  }

  async approved(document = planDocument()): Promise<{ id: number; revision: number }> {
    const lead = await this.lead();
    const created = await lead.post('/api/plans', { title: 'Invented approved pole', document });
    expect(created.status, created.text).toBe(201);
    const id = created.body.plan.id as number;
    expect((await lead.post(`/api/plans/${id}/submit`)).status).toBe(200);
    expect((await (await this.client('reviewer')).post(`/api/plans/${id}/review`, { decision: 'approve', teachingNote: 'Invented note.' })).status).toBe(200);
    return { id, revision: created.body.plan.currentRevision };
  }

  /** A plan with two revisions and one comment, only ever read. */
  readonly readable = memo(async () => {
    const id = await this.draft();
    expect((await (await this.lead()).put(`/api/plans/${id}`, { expectedRevision: 1, document: planDocument() })).status).toBe(200);
    return id;
  });

  async comment(): Promise<{ planId: number; commentId: number }> {
    const planId = await this.draft();
    const made = await (await this.client('reviewer')).post(`/api/plans/${planId}/comments`, { body: 'Invented matrix comment.' });
    expect(made.status).toBe(201);
    return { planId, commentId: made.body.comment.id };
  }

  /** An approved plan field records are started on; records only add to it. */
  readonly recordPlan = memo(async () => (await this.approved()).id);

  async openRecord(): Promise<number> {
    const made = await (await this.lead()).post(`/api/plans/${await this.recordPlan()}/records`);
    expect(made.status).toBe(201);
    return made.body.id;
  }

  /** A closed record with one photo, only ever read. */
  readonly closedRecord = memo(async () => {
    const id = await this.openRecord();
    const photo = await upload(await this.lead(), id, await pngBytes(), 'p.png', 'image/png');
    expect(photo.status).toBe(201);
    expect((await (await this.lead()).post(`/api/records/${id}/close`)).status).toBe(200);
    return { id, photoUrl: photo.body.url as string };
  });

  async set(): Promise<number> {
    const made = await (await this.client('admin')).post('/api/equipment', setBody());
    expect(made.status).toBe(201);
    return made.body.set.id;
  }

  /** An approved plan practice exercises are made from; exercises only add to it. */
  readonly practicePlan = memo(() => this.approved(bucketDocument()));

  async exercise(): Promise<number> {
    const plan = await this.practicePlan();
    const made = await (await this.client('reviewer')).post('/api/exercises', { planId: plan.id, revision: plan.revision, kind: 'find', prompt: 'Find the gap', removeLinks: ['jBK'] });
    expect(made.status).toBe(201);
    return made.body.exercise.id;
  }

  async spareApprentice(): Promise<string> {
    return (await makePerson(this.organizationId, 'apprentice')).id;
  }
}

export const pngBytes = memo(() => sharp({ create: { width: 40, height: 30, channels: 3, background: '#446' } }).png().toBuffer());

/** What a cell compares: the status for JSON routes; for form pages, where the answer went. */
export type Outcome = number | string;

export function formOutcome(response: Pick<ApiResponse, 'status' | 'headers'>): string {
  if (response.status !== 303) return String(response.status);
  const location = new URL(response.headers.get('location') ?? '', 'http://app.test');
  if (location.pathname === '/login') return '303 sign-in';
  return `303 ${location.search.slice(1) || location.pathname.replace(/\/\d+/g, '/:id')}`;
}
