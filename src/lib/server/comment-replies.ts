/**
 * Answering a review comment, for the JSON API and the plan and review pages alike: the reply goes
 * under the comment on the plan's current revision, and the comment's writer is told by mail when
 * someone else answered (in the same transaction, so a reply never goes without its mail).
 */
import { getDb } from '@db/connection';
import { addReply } from '@db/repositories/comment-replies';
import type { Person } from '@/lib/domain/people';
import { AppError } from './errors';
import { queueMail } from './mail';
import { replyMessage } from './mail-messages';
import { publicUrl } from './settings';

export async function replyToComment(person: Person, planId: number, input: { replyTo: number; body: string }, requestUrl?: URL): Promise<number> {
  const db = getDb();
  const outcome = await addReply(db, person.organizationId, planId, person.id, input, async (transaction, answered, revision) => {
    if (answered.authorId === person.id) return;
    const writer = await db.models.User.findOne({ where: { id: answered.authorId, organizationId: person.organizationId }, attributes: ['email', 'disabled'], transaction });
    const plan = await db.models.Plan.findByPk(planId, { attributes: ['title'], transaction });
    if (!writer || writer.disabled || !plan) return;
    const ref = { id: planId, title: plan.title, revision, organizationId: person.organizationId };
    await queueMail([replyMessage(writer.email, ref, person.name, answered.body, input.body, publicUrl(requestUrl))], transaction);
  });
  switch (outcome.kind) {
    case 'ok':
      return outcome.id;
    case 'plan-not-found':
      throw new AppError('NOT_FOUND');
    case 'no-comment':
      throw new AppError('VALIDATION', { issues: [{ path: 'replyTo', message: `no comment ${input.replyTo} on this plan` }] });
    case 'nested':
      throw new AppError('VALIDATION', { issues: [{ path: 'replyTo', message: `comment ${input.replyTo} is itself a reply; answer comment ${outcome.replyTo}, which starts its thread` }] });
  }
}
