/**
 * Guards read top to bottom in an endpoint: each returns what it checked or throws an AppError
 * that the endpoint wrapper turns into JSON (401 signed out, 403 naming the role needed).
 */
import type { APIContext } from 'astro';
import type { Person } from '@/lib/domain/people';
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

export function requireRole(ctx: Pick<APIContext, 'locals'>, ...roles: Role[]): Person {
  return assertRole(requireUser(ctx), ...roles);
}

/** The same check on a person already signed in: the first line of a service (src/lib/server/services). */
export function assertRole(person: Person, ...roles: Role[]): Person {
  if (!roles.includes(person.role)) {
    throw new AppError('ROLE_REQUIRED', { message: roleMessage(roles), extra: { requiredRoles: roles } });
  }
  return person;
}

export function hasRole(person: Person | null, ...roles: Role[]): boolean {
  return !!person && roles.includes(person.role);
}
