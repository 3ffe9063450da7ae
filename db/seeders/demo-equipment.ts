/**
 * The invented co-operative's grounding sets: about twenty, each with a test history that keeps
 * its state relative to the day it is seeded (most in date, three due soon, one overdue, one out of
 * service after carrying fault current, one retired), and the editable demo plans hanging some of
 * them. Resistances are invented demo figures, recorded as the tester's pass/fail (no limits ship).
 */
import { addDays, addMonths, type Connection, type ClampKind } from '@/lib/domain/equipment';
import { metresFromFeet } from '@/lib/domain/units';
import { checkPlan } from '@/lib/domain/checker';
import type { CableSize, PlanDocument } from '@/lib/schemas/plan';
import type { Db } from '@db/connection';
import { inventoryFor, recordTest, saveSets, updateSet } from '@db/repositories/equipment';
import { getPlan, saveDraft } from '@db/repositories/plans';

type Story = 'in-date' | { soonDays: number } | 'overdue' | 'fault' | 'retired';
interface DemoSet { tag: string; description: string; cable: CableSize; /** Round feet, as the demo co-operative buys its sets. */ lengthFt: number; lastTestMonthsAgo?: number; story: Story; clampKind?: ClampKind; connection?: Connection }

const CLAMP: Partial<Record<CableSize, number>> = { '1/0': 21, '2/0': 27, '4/0': 43 };

const SETS: DemoSet[] = [
  { tag: 'LV-101', description: 'Phase set, truck 4', cable: '2/0', lengthFt: 8, lastTestMonthsAgo: 2, story: 'in-date' },
  { tag: 'LV-102', description: 'Phase set, truck 4', cable: '2/0', lengthFt: 8, lastTestMonthsAgo: 2, story: 'in-date' },
  { tag: 'LV-103', description: 'Phase set, truck 4', cable: '2/0', lengthFt: 6, lastTestMonthsAgo: 2, story: 'in-date' },
  { tag: 'LV-104', description: 'Neutral set, truck 4', cable: '2/0', lengthFt: 6, lastTestMonthsAgo: 5, story: 'in-date' },
  { tag: 'LV-105', description: 'Phase set, truck 7', cable: '2/0', lengthFt: 5, lastTestMonthsAgo: 5, story: 'in-date' },
  { tag: 'LV-106', description: 'Neutral set, truck 7', cable: '2/0', lengthFt: 4, lastTestMonthsAgo: 7, story: 'in-date' },
  { tag: 'LV-107', description: 'Bucket bond, truck 7', cable: '2/0', lengthFt: 10, lastTestMonthsAgo: 7, story: 'in-date' },
  { tag: 'LV-108', description: 'Bucket bond, truck 4', cable: '2/0', lengthFt: 10, lastTestMonthsAgo: 9, story: 'in-date' },
  { tag: 'LV-109', description: 'Phase set, truck 7', cable: '2/0', lengthFt: 8, lastTestMonthsAgo: 9, story: 'in-date' },
  { tag: 'LV-110', description: 'Phase set, truck 7', cable: '2/0', lengthFt: 6, lastTestMonthsAgo: 10, story: 'in-date' },
  { tag: 'LV-111', description: 'Substation set', cable: '4/0', lengthFt: 15, lastTestMonthsAgo: 4, story: 'in-date' },
  { tag: 'LV-112', description: 'Substation set', cable: '4/0', lengthFt: 15, lastTestMonthsAgo: 4, story: 'in-date' },
  { tag: 'LV-113', description: 'Long set, transmission kit', cable: '4/0', lengthFt: 20, lastTestMonthsAgo: 8, story: 'in-date' },
  { tag: 'LV-114', description: 'Spare phase set', cable: '2/0', lengthFt: 8, story: { soonDays: 6 } },
  { tag: 'LV-115', description: 'Spare bucket bond', cable: '2/0', lengthFt: 10, story: { soonDays: 14 } },
  { tag: 'LV-116', description: 'Long set, transmission kit', cable: '4/0', lengthFt: 20, story: { soonDays: 25 } },
  { tag: 'LV-117', description: 'Spare phase set', cable: '2/0', lengthFt: 8, story: 'overdue' },
  { tag: 'LV-118', description: 'Phase set, truck 9', cable: '2/0', lengthFt: 6, lastTestMonthsAgo: 6, story: 'fault' },
  { tag: 'LV-119', description: 'Old phase set', cable: '1/0', lengthFt: 10, lastTestMonthsAgo: 3, story: 'retired' },
  { tag: 'LV-120', description: 'Live-line clamp set', cable: '2/0', lengthFt: 4, lastTestMonthsAgo: 3, story: 'in-date', clampKind: 'live-line' },
];

/** Test dates, oldest first: yearly back from the last one, never before the set entered service. */
function testDates(last: string, inServiceOn: string): string[] {
  const dates = [last];
  for (let back = addMonths(last, -12); back > inServiceOn; back = addMonths(back, -12)) dates.unshift(back);
  return dates;
}

/** An invented reading for a cable length, varied a little per test. */
const reading = (set: DemoSet, i: number) => Math.round((0.3 * metresFromFeet(set.lengthFt) + 0.25 + ((i * 7 + set.tag.charCodeAt(5)) % 5) * 0.03) * 100) / 100;

async function seedSet(db: Db, organizationId: number, adminId: string, leadId: string, set: DemoSet, today: string): Promise<void> {
  const inServiceOn = addMonths(today, -(30 + (set.tag.charCodeAt(5) % 3) * 6));
  const saved = await saveSets(db, organizationId, adminId, [{ tag: set.tag, description: set.description, cable: set.cable, lengthM: metresFromFeet(set.lengthFt), clampKind: set.clampKind ?? 'grounding', clampKa: CLAMP[set.cable] ?? 27, clampCycles: 15, connection: set.connection ?? 'ferrule', inServiceOn, status: 'in-service' }], 'create');
  if (saved.kind !== 'ok') throw new Error(`demo set ${set.tag}: ${saved.kind}`);
  const id = saved.value.created[0].id;
  const story = set.story;
  const last = typeof story === 'object' ? addDays(addMonths(today, -12), story.soonDays) : story === 'overdue' ? addDays(addMonths(today, -12), -20) : addMonths(today, -(set.lastTestMonthsAgo ?? 6));
  const dates = testDates(last, inServiceOn);
  for (const [i, testedOn] of dates.entries()) {
    const failing = story === 'retired' && i === dates.length - 1;
    const outcome = await recordTest(db, organizationId, id, i % 2 ? leadId : adminId, { testedOn, resistanceMilliohms: failing ? 4.8 : reading(set, i), passed: !failing, notes: failing ? 'Broken strands at one ferrule.' : null });
    if (outcome.kind !== 'ok') throw new Error(`demo test of ${set.tag}: ${outcome.kind}`);
  }
  if (story === 'fault') await updateSet(db, organizationId, id, adminId, { faultOn: addDays(today, -9) });
  if (story === 'retired') await updateSet(db, organizationId, id, adminId, { status: 'retired', statusReason: 'Broken strands at a ferrule; cable to be scrapped.' });
}

/** The editable demo plans take in-date sets whose cable and length match their jumpers. */
async function hangSets(db: Db, organizationId: number, leadId: string, today: string): Promise<void> {
  const inventory = await inventoryFor(db, organizationId, SETS.map((s) => s.tag));
  const free = inventory.filter((s) => s.status === 'in-service' && s.testDueOn > addDays(today, 30));
  const plans = await db.models.Plan.findAll({ where: { organizationId, status: ['draft', 'returned'] } });
  for (const row of plans) {
    const plan = await getPlan(db, organizationId, row.id);
    if (!plan) continue;
    const links = plan.document.links.map((link) => {
      if (link.kind !== 'jumper' || link.equipmentId) return link;
      const index = free.findIndex((s) => s.cable === link.cable && Math.abs(s.lengthM - link.lengthM) < 0.01);
      if (index < 0) return link;
      const [set] = free.splice(index, 1);
      return { ...link, equipmentId: set.tag, clampKa: set.clampKa, clampCycles: set.clampCycles, clampKind: set.clampKind, connection: set.connection };
    });
    const document: PlanDocument = { ...plan.document, links };
    const report = checkPlan(document, undefined, { inventory, today });
    await saveDraft(db, organizationId, row.id, leadId, { expectedRevision: plan.currentRevision, document, report });
  }
}

/** Seeds the sets once (nothing when the organisation has any); returns how many it added. */
export async function seedDemoEquipment(db: Db, organizationId: number, adminId: string, leadId: string, now = new Date()): Promise<number> {
  if ((await db.models.GroundingSet.count({ where: { organizationId } })) > 0) return 0;
  const today = now.toISOString().slice(0, 10);
  for (const set of SETS) await seedSet(db, organizationId, adminId, leadId, set, today);
  await hangSets(db, organizationId, leadId, today);
  return SETS.length;
}
