/**
 * Who may do what: the one table of the roles each named action allows. Guards, endpoints, pages,
 * the navigation and the role-matrix test all ask `can(role, action)`; docs/permissions.md is
 * written from this table (`permissionsMarkdown`) and a unit test keeps the two equal.
 *
 * The order of the roles in each row is the order a refusal names them in ("needs the Crew lead or
 * Admin role", `requiredRoles`), so it is part of the answer and kept as the routes gave it.
 */
import { ROLE_LABELS, ROLES, type Role } from './roles';

export interface Permission {
  /** Who may, in the order a refusal names them. */
  readonly roles: readonly Role[];
  /** What it allows, in the words of the role table. */
  readonly allows: string;
}

const EVERYONE: readonly Role[] = ['admin', 'reviewer', 'crew_lead', 'apprentice'];

export const PERMISSIONS = {
  'plan.view': { roles: EVERYONE, allows: 'See plans, their revisions, differences, comments and history' },
  'plan.check': { roles: EVERYONE, allows: 'Run the checker on a plan or a document without saving it' },
  'plan.create': { roles: ['crew_lead', 'admin'], allows: 'Start a new plan' },
  'plan.edit': { roles: ['crew_lead', 'admin'], allows: 'Save a draft or returned plan (and keep the report of a check run on it)' },
  'plan.submit': { roles: ['crew_lead', 'admin'], allows: 'Submit a plan for review' },
  'plan.withdraw': { roles: ['crew_lead', 'admin'], allows: 'Withdraw a submitted plan they wrote' },
  'plan.withdraw-any': { roles: ['admin'], allows: 'Withdraw a submitted plan someone else wrote' },
  'plan.reopen': { roles: ['crew_lead', 'admin'], allows: 'Start a new draft revision from an approved plan' },
  'plan.review': { roles: ['reviewer', 'admin'], allows: 'Approve or return a submitted plan (never one they wrote or edited)' },
  'plan.comment': { roles: ['reviewer', 'admin', 'crew_lead'], allows: 'Comment on a plan' },
  'comment.resolve': { roles: ['crew_lead', 'admin', 'reviewer'], allows: 'Mark a comment resolved or open it again' },
  'library.view': { roles: EVERYONE, allows: 'Study approved plans in the library' },
  'records.view': { roles: EVERYONE, allows: 'See closed field records, their photos and PDF' },
  'records.view-open': { roles: ['crew_lead', 'admin', 'reviewer'], allows: 'See field records that are still open' },
  'records.write': { roles: ['crew_lead', 'admin'], allows: 'Start a field record, add entries and photos, close it out' },
  'sets.view': { roles: EVERYONE, allows: 'See the grounding sets, their tests and the test settings; export the list' },
  'sets.test': { roles: ['admin', 'crew_lead'], allows: 'Record a test of a grounding set' },
  'sets.manage': { roles: ['admin'], allows: 'Add, change and import grounding sets' },
  'practice.view': { roles: EVERYONE, allows: 'Open published practice exercises' },
  'practice.take': { roles: ['apprentice'], allows: 'Hand in an answer to a practice exercise' },
  'practice.manage': { roles: ['reviewer', 'admin'], allows: 'Make, change and publish exercises; see unpublished ones and everyone\'s progress' },
  'people.manage': { roles: ['admin'], allows: 'Invite people, change their role, disable them' },
  'settings.edit': { roles: ['admin'], allows: 'Change the organisation\'s settings and the grounding-set test settings' },
  'mail.read': { roles: ['admin'], allows: 'Read the mail the local catcher holds (development only)' },
  'home.own-work': { roles: ['crew_lead'], allows: 'Home lists their own plans and open records rather than everyone\'s' },
  'notify.plan-submitted': { roles: ['reviewer'], allows: 'Receive the e-mail that a plan was submitted' },
  'notify.sets-due': { roles: ['admin'], allows: 'Receive the daily e-mail of grounding sets due for test' },
} as const satisfies Record<string, Permission>;

export type Action = keyof typeof PERMISSIONS;
export const ACTIONS = Object.keys(PERMISSIONS) as Action[];

export function isAction(value: unknown): value is Action {
  return typeof value === 'string' && Object.hasOwn(PERMISSIONS, value);
}

/** The roles an action allows, in the order a refusal names them. */
export function rolesFor(action: Action): readonly Role[] {
  return PERMISSIONS[action].roles;
}

export function can(role: Role, action: Action): boolean {
  return rolesFor(action).includes(role);
}

/** True when the role may do at least one of the actions (a menu entry that serves several). */
export function canAny(role: Role, actions: readonly Action[]): boolean {
  return actions.some((action) => can(role, action));
}

/** docs/permissions.md, written from the table (`npm run docs:permissions`). */
export function permissionsMarkdown(): string {
  const head = `| action | allows | ${ROLES.map((r) => ROLE_LABELS[r]).join(' | ')} |`;
  const rule = `|---|---|${ROLES.map(() => ':-:|').join('')}`;
  const rows = ACTIONS.map((a) => `| \`${a}\` | ${PERMISSIONS[a].allows} | ${ROLES.map((r) => (can(r, a) ? 'yes' : '—')).join(' | ')} |`);
  return [
    '# Who may do what',
    '',
    'Written from `src/lib/domain/permissions.ts` by `npm run docs:permissions`; do not edit by hand.',
    'A unit test keeps this page equal to the table, and the role-matrix test',
    '(`tests/api/role-matrix.test.ts`) asks every route, as every role, for the answer the table gives.',
    'Signed out, every route but signing in and out, password reset and the health check answers 401 (a',
    'form page sends the browser to sign in). Once the role allows an action, another organisation\'s',
    'plans, comments, people, records, sets and exercises are 404, never 403. A menu entry shows when',
    'the role may do what its page is for (Practice: `practice.take` or `practice.manage`).',
    '',
    head,
    rule,
    ...rows,
    '',
  ].join('\n');
}
