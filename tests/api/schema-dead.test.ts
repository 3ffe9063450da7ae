/** Migration 0013: the sign-in table the throttle replaced and the plans column nothing read are gone. */
import { afterAll, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { closeTestDb, testDb } from '../helpers/factories';

afterAll(closeTestDb);

const columns = async (table: string) =>
  (await testDb().sequelize.query<{ name: string }>('SELECT column_name AS name FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name = ?', { replacements: [table], type: QueryTypes.SELECT })).map((r) => r.name);

it('has no login_attempts table and no plans.lock_version column', async () => {
  expect(await columns('login_attempts')).toEqual([]);
  const plans = await columns('plans');
  expect(plans).toContain('current_revision');
  expect(plans).not.toContain('lock_version');
});
