/**
 * Guards read top to bottom in an endpoint: each returns what it checked or throws an AppError
 * that the endpoint wrapper turns into JSON (401 signed out, 403 naming the roles the action needs).
 * Who may do what is the table in `@/lib/domain/permissions`; nothing here lists roles.
 */
import type { APIContext } from 'astro';
import type { Person } from '@/lib/domain/people';
import { can, rolesFor, type Action } from '@/lib/domain/permissions';
import { ROLE_LABELS, type Role } from '@/lib/domain/roles';
import { AppError } from './errors';

export function requireUser(ctx: Pick<APIContext, 'locals'>): Person {
  const person = ctx.locals.person;
  if (!person) throw new AppError('AUTH_REQUIRED');
  return person;
}

export function roleMessage(roles: readonly Role[]): string {
  return `This needs the ${roles.map((r) => ROLE_LABELS[r]).join(' or ')} role; yours does not allow it. Ask your admin if you need it.`;
}

/** The 403 for a person whose role does not allow `action`, naming the roles that do. */
export function roleRefusal(action: Action, prefix = ''): AppError {
  const roles = rolesFor(action);
  return new AppError('ROLE_REQUIRED', { message: `${prefix}${roleMessage(roles)}`, extra: { requiredRoles: [...roles] } });
}

/** The signed-in person, if their role allows `action`; else 401 or 403. */
export function requireCan(ctx: Pick<APIContext, 'locals'>, action: Action): Person {
  return assertCan(requireUser(ctx), action);
}

/** The same check on a person already signed in: the first line of a service (src/lib/server/services). */
export function assertCan(person: Person, action: Action): Person {
  if (!can(person.role, action)) throw roleRefusal(action);
  return person;
}

/** Whether a (possibly signed-out) person's role allows `action`. */
export function allows(person: Person | null | undefined, action: Action): boolean {
  return !!person && can(person.role, action);
}

