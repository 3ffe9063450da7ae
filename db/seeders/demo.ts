/**
 * The invented demo: one co-operative with a person in each role and plans in every state, and
 * a second organisation that proves isolation. Idempotent: what exists already is left alone.
 */
import type { Db } from '@db/connection';
import { createPerson, findOrganizationBySlug } from '@db/repositories/people';
import { createPlan, describeStructure } from '@db/repositories/plans';
import { checkPlan } from '@/lib/domain/checker';
import { hash } from '@node-rs/argon2';
import { fingerprint } from '@/lib/server/fingerprint';
import { decidePlan, submitPlan } from '@db/repositories/review';
import { addComment } from '@db/repositories/revisions';
import type { Role } from '@/lib/domain/roles';
import { DEMO_PLANS, OTHER_ORG_PLAN, type DemoPlan } from './demo-plans';
import { seedPractice } from './demo-practice';
import { seedDemoEquipment } from './demo-equipment';
import { seedDemoRecords } from './demo-records';

export const DEMO_PASSWORD = 'bondmap-demo';

export const DEMO_SIGN_INS: { email: string; role: Role; name: string; org: 'demo' | 'other' }[] = [
  { email: 'admin@demo.test', role: 'admin', name: 'Odile Marchetti', org: 'demo' },
  { email: 'reviewer@demo.test', role: 'reviewer', name: 'Tobias Lindqvist-Oyelaran', org: 'demo' },
  { email: 'reviewer2@demo.test', role: 'reviewer', name: 'Priya Vantongeren', org: 'demo' },
  { email: 'lead@demo.test', role: 'crew_lead', name: 'Casimir Abernethy', org: 'demo' },
  { email: 'apprentice@demo.test', role: 'apprentice', name: 'Junie Halvorsen-Mbeki', org: 'demo' },
  { email: 'lead@other.test', role: 'crew_lead', name: 'Rosalind Fairweather-Osei', org: 'other' },
  { email: 'admin@other.test', role: 'admin', name: 'Emeric Stavros-Lund', org: 'other' },
];

const ORGS = {
  demo: { slug: 'larkspur-valley', name: 'Larkspur Valley Electric Co-operative' },
  other: { slug: 'quillback-ridge', name: 'Quillback Ridge Power Co-operative' },
};

async function ensureOrg(db: Db, key: 'demo' | 'other'): Promise<number> {
  const existing = await findOrganizationBySlug(db, ORGS[key].slug);
  if (existing) return existing.id;
  return (await db.models.Organization.create(ORGS[key])).id;
}

/** Creates each demo plan as a draft and walks it through the real workflow to its demo state. */
async function seedPlans(db: Db, organizationId: number, authorId: string, reviewerId: string | null, plans: DemoPlan[]): Promise<number> {
  if ((await db.models.Plan.count({ where: { organizationId } })) > 0) return 0;
  for (const plan of plans) {
    const report = checkPlan(plan.document);
    const created = await createPlan(db, { organizationId, authorId, title: plan.title, structure: describeStructure(plan.document), document: plan.document, report });
    if (plan.status === 'draft') continue;
    const submitted = await submitPlan(db, organizationId, created.id, authorId, report);
    if (submitted.kind !== 'ok') throw new Error(`demo plan "${plan.title}" cannot be submitted: ${submitted.kind}`);
    if (plan.status === 'submitted' || !reviewerId) continue;
    for (const pin of plan.pins ?? []) await addComment(db, organizationId, created.id, reviewerId, { elementId: pin.elementId, body: pin.body, revision: 1 });
    const approve = plan.status === 'approved';
    const decided = await decidePlan(db, organizationId, created.id, reviewerId, {
      decision: approve ? 'approve' : 'return',
      comment: approve ? null : plan.reviewNote ?? 'Please look again.',
      teachingNote: approve ? plan.reviewNote ?? null : null,
      documentHash: approve ? fingerprint(created.document) : null,
      reportHash: approve ? fingerprint(report) : null,
      revision: 1,
    });
    if (decided.kind !== 'ok') throw new Error(`demo plan "${plan.title}" cannot be decided: ${decided.kind}`);
  }
  return plans.length;
}

/** Seeds the demo; returns how many people and plans it added. */
export async function seedDemo(db: Db): Promise<{ people: number; plans: number }> {
  const orgIds = { demo: await ensureOrg(db, 'demo'), other: await ensureOrg(db, 'other') };
  const passwordHash = await hash(DEMO_PASSWORD, { memoryCost: 19456, timeCost: 2, parallelism: 1 });
  let people = 0;
  const ids: Record<string, string> = {};
  for (const s of DEMO_SIGN_INS) {
    const row = await db.models.User.findOne({ where: { email: s.email } });
    if (row) {
      ids[s.email] = row.id;
      continue;
    }
    const person = await createPerson(db, { organizationId: orgIds[s.org], email: s.email, name: s.name, role: s.role, passwordHash });
    ids[s.email] = person.id;
    people += 1;
  }
  const plans =
    (await seedPlans(db, orgIds.demo, ids['lead@demo.test'], ids['reviewer@demo.test'], DEMO_PLANS)) +
    (await seedPlans(db, orgIds.other, ids['lead@other.test'], null, [OTHER_ORG_PLAN])) +
    (await seedPractice(db, orgIds.demo, { lead: ids['lead@demo.test'], reviewer: ids['reviewer@demo.test'], apprentice: ids['apprentice@demo.test'] }));
  await seedDemoEquipment(db, orgIds.demo, ids['admin@demo.test'], ids['lead@demo.test']);
  const approved = await db.models.Plan.findOne({ where: { organizationId: orgIds.demo, status: 'approved' }, order: [['id', 'ASC']] });
  if (approved) await seedDemoRecords(db, orgIds.demo, approved.id, ids['lead@demo.test'], ids['apprentice@demo.test']);
  return { people, plans };
}
