/**
 * The permissions table: well formed, written out to docs/permissions.md unchanged, and holding
 * the role split of the product brief (who draws, who reviews, who studies, who administers).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ACTIONS, can, canAny, isAction, PERMISSIONS, permissionsMarkdown, rolesFor } from '@/lib/domain/permissions';
import { isRole, ROLES } from '@/lib/domain/roles';

describe('the permissions table', () => {
  it('names only known roles, each once, in every row', () => {
    for (const action of ACTIONS) {
      const roles = rolesFor(action);
      expect(roles.length, action).toBeGreaterThan(0);
      expect(new Set(roles).size, action).toBe(roles.length);
      for (const role of roles) expect(isRole(role), `${action}: ${role}`).toBe(true);
      expect(PERMISSIONS[action].allows.length, action).toBeGreaterThan(5);
    }
  });

  it('answers can() from the row, and nothing for an unknown action', () => {
    for (const action of ACTIONS) for (const role of ROLES) expect(can(role, action)).toBe(rolesFor(action).includes(role));
    expect(isAction('plan.create')).toBe(true);
    expect(isAction('constructor')).toBe(false);
    expect(isAction('plan.delete')).toBe(false);
    expect(canAny('crew_lead', ['practice.take', 'practice.manage'])).toBe(false);
    expect(canAny('apprentice', ['practice.take', 'practice.manage'])).toBe(true);
  });

  // product.md, "Who uses it": the crew lead draws and submits and keeps the field record; the
  // reviewer approves or returns; the apprentice reads the library and practises; the admin
  // manages people, sets and defaults.
  it('keeps the roles of the product brief', () => {
    expect(rolesFor('plan.create')).toEqual(['crew_lead', 'admin']);
    expect(rolesFor('plan.review')).toEqual(['reviewer', 'admin']);
    expect(rolesFor('records.write')).toEqual(['crew_lead', 'admin']);
    expect(rolesFor('practice.take')).toEqual(['apprentice']);
    for (const action of ['people.manage', 'settings.edit', 'sets.manage'] as const) expect(rolesFor(action)).toEqual(['admin']);
    // Nobody both writes plans and is only a learner: an apprentice changes nothing of a plan.
    for (const action of ['plan.create', 'plan.edit', 'plan.submit', 'plan.review', 'plan.comment', 'records.write', 'records.view-open'] as const) {
      expect(can('apprentice', action), action).toBe(false);
    }
    // A reviewer never edits what they review.
    for (const action of ['plan.create', 'plan.edit', 'plan.submit', 'plan.reopen'] as const) expect(can('reviewer', action), action).toBe(false);
  });
});

describe('docs/permissions.md', () => {
  it('is the table as written by npm run docs:permissions', () => {
    const text = readFileSync(join(__dirname, '../../../docs/permissions.md'), 'utf8');
    expect(text).toBe(permissionsMarkdown());
  });

  it('has one row per action and one column per role', () => {
    const rows = permissionsMarkdown().split('\n').filter((l) => l.startsWith('| `'));
    expect(rows.map((r) => r.split('`')[1])).toEqual(ACTIONS);
    for (const row of rows) expect(row.split('|').length - 2).toBe(2 + ROLES.length);
  });
});
