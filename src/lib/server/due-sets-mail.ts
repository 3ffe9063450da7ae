/**
 * The daily due-sets message: once a day each organisation's admins get one message listing the
 * grounding sets that fell due within 30 days or became overdue since the last run. Every app
 * instance runs the job; a claim row per organisation per day (unique key) makes exactly one of
 * them send it, and the message is queued in the same transaction as the claim.
 */
import { Op, UniqueConstraintError } from 'sequelize';
import { getDb, type Db } from '@db/connection';
import { addDays, dueState, DUE_SOON_DAYS, type DueState } from '@/lib/domain/equipment';
import { rolesFor } from '@/lib/domain/permissions';
import { queueMail, type OutgoingMail } from './mail';
import { compose } from './mail-messages';
import { organisationToday } from './organisation';
import { publicUrl } from './settings';

export const DUE_SETS_KIND = 'equipment.due';

interface DueSet {
  tag: string;
  testDueOn: string;
  state: DueState;
}

export function dueSetsMessage(to: string, organizationId: number, sets: DueSet[], baseUrl: string): OutgoingMail {
  const overdue = sets.filter((s) => s.state === 'overdue');
  const soon = sets.filter((s) => s.state === 'soon');
  const line = (s: DueSet) => `${s.tag}: test due ${s.testDueOn}`;
  return compose({
    to,
    subject: `Grounding sets: ${overdue.length} overdue, ${soon.length} due within ${DUE_SOON_DAYS} days`,
    kind: DUE_SETS_KIND,
    organizationId,
    lines: [
      'These grounding sets changed their test state since the last message:',
      ...(overdue.length ? ['Overdue (do not use until tested):', ...overdue.map(line)] : []),
      ...(soon.length ? [`Due within ${DUE_SOON_DAYS} days:`, ...soon.map(line)] : []),
    ],
    link: { href: `${baseUrl}/equipment?due=${overdue.length ? 'overdue' : 'soon'}`, label: 'Open the grounding sets' },
  });
}

/** Claims today's run for one organisation and queues its message; false when another instance has it. */
async function runFor(db: Db, organizationId: number, day: string, baseUrl: string): Promise<boolean> {
  try {
    await db.sequelize.transaction(async (transaction) => {
      // The claim goes first: a second instance blocks on the unique key here, then fails.
      const claim = await db.models.EquipmentMailClaim.create({ organizationId, day, listed: '{}' }, { transaction });
      const previous = await db.models.EquipmentMailClaim.findOne({ where: { organizationId, day: { [Op.lt]: day } }, order: [['day', 'DESC']], transaction });
      const before = previous ? (JSON.parse(previous.listed) as Record<string, DueState>) : {};
      const rows = await db.models.GroundingSet.findAll({ where: { organizationId, status: { [Op.ne]: 'retired' }, testDueOn: { [Op.lte]: addDays(day, DUE_SOON_DAYS) } }, order: [['testDueOn', 'ASC'], ['tag', 'ASC']], transaction });
      const sets = rows.map((r) => ({ tag: r.tag, testDueOn: r.testDueOn, state: dueState(r.testDueOn, day) }));
      await claim.update({ listed: JSON.stringify(Object.fromEntries(sets.map((s) => [s.tag, s.state]))) }, { transaction });
      const fresh = sets.filter((s) => before[s.tag] !== s.state);
      if (fresh.length === 0) return;
      const admins = await db.models.User.findAll({ where: { organizationId, role: [...rolesFor('notify.sets-due')], disabled: false }, attributes: ['email'], transaction });
      await queueMail(admins.map((a) => dueSetsMessage(a.email, organizationId, fresh, baseUrl)), transaction, db);
    });
    return true;
  } catch (error) {
    if (error instanceof UniqueConstraintError) return false;
    throw error;
  }
}

/** Runs the day's job for every organisation (or the ones given); returns how many this run claimed. */
export async function runDueSetsMail(db: Db = getDb(), now = new Date(), organizationIds?: number[]): Promise<number> {
  const orgs = organizationIds ?? (await db.models.Organization.findAll({ attributes: ['id'] })).map((o) => o.id);
  let claimed = 0;
  // Each organisation's own day: its message goes out after its midnight, not Greenwich's.
  for (const id of orgs) if (await runFor(db, id, await organisationToday(id, now, db), publicUrl())) claimed += 1;
  return claimed;
}

let timer: ReturnType<typeof setInterval> | null = null;
const HOUR = 60 * 60 * 1000;

/** Starts this process's hourly run (idempotent); the first run after an organisation's midnight claims its day. */
export function startDueSetsMailJob(): void {
  if (timer) return;
  const run = () => void runDueSetsMail().catch(() => undefined);
  timer = setInterval(run, HOUR);
  timer.unref();
  setTimeout(run, 30_000).unref();
}
