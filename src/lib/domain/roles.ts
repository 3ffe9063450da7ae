/** The four roles of an organisation; what each may do is the table in permissions.ts. */
export const ROLES = ['admin', 'reviewer', 'crew_lead', 'apprentice'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  reviewer: 'Reviewer',
  crew_lead: 'Crew lead',
  apprentice: 'Apprentice',
};

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}
