/** The messages Bondmap sends, in our own words, each with a plain-text and an HTML body. */
import { escapeHtml } from './html';
import type { OutgoingMail } from './mail';


export function compose(input: { to: string; subject: string; kind: string; organizationId: number | null; lines: string[]; link: { href: string; label: string } }): OutgoingMail {
  const footer = 'Bondmap is a planning aid; it does not replace your employer\'s procedures, local codes or a qualified person.';
  const text = [...input.lines, '', `${input.link.label}: ${input.link.href}`, '', footer].join('\n');
  const html = `<!doctype html><html><body style="font-family:'Source Sans 3',system-ui,sans-serif;color:#1b2330;background:#f7f7f4;padding:16px">
${input.lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('\n')}
<p><a href="${escapeHtml(input.link.href)}" style="color:#0f766e">${escapeHtml(input.link.label)}</a></p>
<p style="color:#475467;font-size:14px">${escapeHtml(footer)}</p></body></html>`;
  return { to: input.to, subject: input.subject, kind: input.kind, organizationId: input.organizationId, text, html };
}

/** At most this many comments, each cut to this many characters, go into one mail; the plan page has them all. */
export const MAIL_COMMENTS = 20;
export const MAIL_COMMENT_CHARS = 1000;

/** Cuts text to `max` code points (never inside a surrogate pair), marking the cut. */
export function clip(text: string, max: number): string {
  const points = [...text];
  return points.length <= max ? text : `${points.slice(0, max).join('')}…`;
}

function commentLines(comments: string[]): string[] {
  const shown = comments.slice(0, MAIL_COMMENTS).map((c) => `• ${clip(c, MAIL_COMMENT_CHARS)}`);
  const more = comments.length - MAIL_COMMENTS;
  return more > 0 ? [...shown, `…and ${more} more on the plan page.`] : shown;
}

export interface PlanRef {
  id: number;
  title: string;
  revision: number;
  organizationId: number;
}

export function submittedMessage(to: string, plan: PlanRef, byName: string, baseUrl: string): OutgoingMail {
  return compose({
    to,
    subject: `Plan to review: ${plan.title}`,
    kind: 'plan.submitted',
    organizationId: plan.organizationId,
    lines: [`${byName} has submitted "${plan.title}" (revision ${plan.revision}) for review.`, 'It passed the check with no blockers; please look it over before the crew climbs.'],
    link: { href: `${baseUrl}/plans/${plan.id}/review`, label: 'Open the review' },
  });
}

export function decidedMessage(to: string, plan: PlanRef, decision: 'approve' | 'return', byName: string, comments: string[], baseUrl: string): OutgoingMail {
  const approved = decision === 'approve';
  return compose({
    to,
    subject: approved ? `Approved: ${plan.title}` : `Returned with comments: ${plan.title}`,
    kind: approved ? 'plan.approved' : 'plan.returned',
    organizationId: plan.organizationId,
    lines: approved
      ? [`${byName} approved "${plan.title}" (revision ${plan.revision}).`, 'Keep the field record as the grounds go on and come off.']
      : [`${byName} returned "${plan.title}" (revision ${plan.revision}) with these comments:`, ...commentLines(comments), 'Fix what they point at, then submit again.'],
    link: { href: `${baseUrl}/plans/${plan.id}`, label: 'Open the plan' },
  });
}

export function invitationMessage(to: string, name: string, organizationName: string, invitedBy: string, link: string, days: number): OutgoingMail {
  return compose({
    to,
    subject: `You are invited to Bondmap for ${organizationName}`,
    kind: 'user.invited',
    organizationId: null,
    lines: [`Hello ${name},`, `${invitedBy} has added you to Bondmap for ${organizationName}.`, `Choose your password with the link below; it works once and for ${days} days.`],
    link: { href: link, label: 'Set your password' },
  });
}

export function resetMessage(to: string, name: string, link: string, hours: number): OutgoingMail {
  return compose({
    to,
    subject: 'Reset your Bondmap password',
    kind: 'user.reset',
    organizationId: null,
    lines: [`Hello ${name},`, 'Someone (we hope you) asked to reset your Bondmap password.', `The link below works once and for ${hours} hour${hours === 1 ? '' : 's'}. If you did not ask, ignore this message; your password stays as it is.`],
    link: { href: link, label: 'Choose a new password' },
  });
}

/** To an address that already has an account in another organisation: nothing was created. */
export function addressInUseMessage(to: string, organizationName: string, signInLink: string): OutgoingMail {
  return compose({
    to,
    subject: `An invitation to Bondmap for ${organizationName}`,
    kind: 'user.invite-refused',
    organizationId: null,
    lines: [
      `An admin of ${organizationName} tried to add this address to Bondmap.`,
      'This address already has a Bondmap account in another organisation, and one address can belong to one organisation only, so nothing was created.',
      'If you should join them, ask them to invite another address of yours. If you did not expect this, you need do nothing.',
    ],
    link: { href: signInLink, label: 'Sign in to your account' },
  });
}

/** To the writer of a comment when someone else (usually the plan's author) answers it. */
export function replyMessage(to: string, plan: PlanRef, byName: string, answered: string, reply: string, baseUrl: string): OutgoingMail {
  return compose({
    to,
    subject: `Reply to your comment: ${plan.title}`,
    kind: 'comment.replied',
    organizationId: plan.organizationId,
    lines: [`${byName} replied to your comment on "${plan.title}" (revision ${plan.revision}).`, `Your comment: ${clip(answered, MAIL_COMMENT_CHARS)}`, `The reply: ${clip(reply, MAIL_COMMENT_CHARS)}`],
    link: { href: `${baseUrl}/plans/${plan.id}`, label: 'Open the plan' },
  });
}
