/**
 * Mail through an outbox: requests only insert rows; a worker in every app process claims due
 * rows (a claim token, so two instances never send one message twice), sends them with nodemailer
 * and retries with back-off. A failing mail server therefore never fails a request.
 */
import { randomBytes } from 'node:crypto';
import nodemailer, { type Transporter } from 'nodemailer';
import { Op, type Transaction } from 'sequelize';
import { getDb, type Db } from '@db/connection';
import { settings } from './settings';
import { log } from './log';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  kind: string;
  organizationId: number | null;
}

const MAX_ATTEMPTS = 20;
const CLAIM_MS = 60_000;

let transport: Transporter | null = null;
function getTransport(): Transporter | null {
  const url = settings().BONDMAP_SMTP_URL;
  if (!url) return null;
  transport ??= nodemailer.createTransport(url, { from: settings().BONDMAP_MAIL_FROM });
  return transport;
}

/** Puts messages in the outbox (inside the caller's transaction when given) and nudges the worker. */
export async function queueMail(messages: OutgoingMail[], transaction?: Transaction, db: Db = getDb()): Promise<void> {
  if (!messages.length) return;
  await db.models.MailOutbox.bulkCreate(
    messages.map((m) => ({ organizationId: m.organizationId, toAddress: m.to, subject: m.subject, textBody: m.text, htmlBody: m.html, kind: m.kind, claimToken: null, claimedUntil: null, lastError: null, sentAt: null })),
    { transaction },
  );
  const nudge = () => {
    setTimeout(() => void deliverDue().catch(logDeliveryError), 10);
  };
  if (transaction) transaction.afterCommit(nudge);
  else nudge();
}

/** Sends every due message once; returns how many were sent. Safe to run on many instances at once. */
export async function deliverDue(db: Db = getDb(), now = new Date()): Promise<number> {
  const smtp = getTransport();
  if (!smtp) return 0;
  const token = randomBytes(12).toString('hex');
  const [claimed] = await db.models.MailOutbox.update(
    { claimToken: token, claimedUntil: new Date(now.getTime() + CLAIM_MS) },
    { where: { status: 'pending', nextAttemptAt: { [Op.lte]: now }, [Op.or]: [{ claimedUntil: null }, { claimedUntil: { [Op.lt]: now } }] }, limit: 25 },
  );
  if (!claimed) return 0;
  const rows = await db.models.MailOutbox.findAll({ where: { claimToken: token } });
  let sent = 0;
  for (const row of rows) {
    try {
      await smtp.sendMail({ to: row.toAddress, subject: row.subject, text: row.textBody, html: row.htmlBody });
      await row.update({ status: 'sent', sentAt: new Date(), attempts: row.attempts + 1, claimToken: null, claimedUntil: null, lastError: null });
      sent += 1;
    } catch (error) {
      const attempts = row.attempts + 1;
      log.warn({ err: error, mailId: row.id, attempts }, 'mail not delivered; will retry');
      const backoffMs = Math.min(2 ** attempts * 1000, 10 * 60_000);
      await row.update({
        attempts,
        status: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending',
        nextAttemptAt: new Date(Date.now() + backoffMs),
        claimToken: null,
        claimedUntil: null,
        lastError: (error as Error).message.slice(0, 2000),
      });
    }
  }
  return sent;
}

let worker: ReturnType<typeof setInterval> | null = null;

/** A failed delivery round (database down, say) is retried on the next tick; it is logged, never swallowed. */
function logDeliveryError(error: unknown): void {
  log.warn({ err: error }, 'mail delivery round failed; retrying on the next tick');
}

/** Starts this process's delivery loop once (idempotent); it never keeps the process alive. */
export function startMailWorker(): void {
  if (worker || !settings().BONDMAP_SMTP_URL) return;
  worker = setInterval(() => void deliverDue().catch(logDeliveryError), settings().BONDMAP_MAIL_POLL_MS);
  worker.unref();
}

export interface CaughtMessage {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
}

/** What the local catcher received for people of one organisation (newest first), optionally for one address. */
export async function caughtMailFor(organizationId: number, to: string | null, db: Db = getDb()): Promise<CaughtMessage[]> {
  const people = await db.models.User.findAll({ where: { organizationId }, attributes: ['email'] });
  const ours = new Set(people.map((p) => p.email));
  const rows = await db.models.CaughtMail.findAll({ order: [['id', 'DESC']], limit: 500 });
  return rows
    .map((r) => ({ id: Number(r.id), from: r.mailFrom, to: r.recipients.split(', '), subject: r.subject, text: r.textBody, html: r.htmlBody, receivedAt: r.receivedAt.toISOString() }))
    .filter((m) => m.to.some((address) => ours.has(address)) && (!to || m.to.includes(to.toLowerCase())));
}
