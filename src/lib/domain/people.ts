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
