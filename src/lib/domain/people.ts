/** A person of an organisation, as the app sees them (never the password hash). */
import type { Role } from './roles';

export interface Person {
  id: string;
  organizationId: number;
  organizationName: string;
  email: string;
  name: string;
  role: Role;
  disabled: boolean;
  /** False while an invited person has not yet set a password. */
  hasPassword: boolean;
}

/** Normalises an e-mail address for storage and look-up (case and surrounding space do not matter). */
export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

/**
 * The mailbox an address delivers to, for telling whether two accounts share one: case-blind,
 * and without a `+tag` on the local part (most mail servers deliver `name+x@host` to `name@host`).
 */
export function mailboxKey(email: string): string {
  const address = normaliseEmail(email);
  const at = address.lastIndexOf('@');
  if (at < 0) return address;
  const local = address.slice(0, at).split('+')[0];
  return `${local}@${address.slice(at + 1)}`;
}
