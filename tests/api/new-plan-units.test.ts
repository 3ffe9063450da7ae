/**
 * The new-plan form asks the phase spacing in the organisation's units: feet and inches (default
 * a round 3 ft) for a crew in feet, metres otherwise, and reads what the keypad gives.
 * 1 ft = 0.3048 m exactly (NIST SP 811).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, PASSWORD, testDb } from '../helpers/factories';

let admin: Client;
let lead: Client;
beforeAll(async () => {
  const team = await makeTeam();
  admin = await signedIn(team.admin.email, PASSWORD);
  lead = await signedIn(team.lead.email, PASSWORD);
});
afterAll(closeTestDb);

const fields = (spacing: string) => ({ starter: 'empty', title: `Spacing pole ${spacing}`, structure: '', nominalKv: '12.47', frequencyHz: '60', faultKa: '10', clearingCycles: '15', xOverR: '10', phaseSpacingM: spacing });
const spacingOf = async (location: string | null) => {
  const id = Number(/\/plans\/(\d+)$/.exec(location ?? '')?.[1]);
  const revision = await testDb().models.PlanRevision.findOne({ where: { planId: id, number: 1 } });
  const document = typeof revision!.document === 'string' ? JSON.parse(revision!.document) : revision!.document;
  return document.system.phaseSpacingM as number;
};

describe('phase spacing on the new-plan form', () => {
  it('is asked in feet and inches for a crew in feet, 3 ft by default, and reads 6\'6" and 2 m', async () => {
    await admin.put('/api/organisation/settings', { timeZone: 'UTC', paperSize: 'letter', units: 'imperial' });
    const page = (await lead.get('/plans/new')).body;
    expect(page).toContain('Phase spacing (ft in)');
    expect(page).toMatch(/name="phaseSpacingM"[^>]*value="3 ft 0 in"/);
    const feet = await lead.form('/plans/new', fields('6\'6"'));
    expect(feet.status).toBe(303);
    expect(await spacingOf(feet.headers.get('location'))).toBeCloseTo(6.5 * 0.3048, 9);
    const metres = await lead.form('/plans/new', fields('2 m'));
    expect(await spacingOf(metres.headers.get('location'))).toBeCloseTo(2, 9);
  });

  it('names the field when the spacing cannot be read, and keeps what was typed', async () => {
    const bad = await lead.form('/plans/new', fields('six feet'));
    expect(bad.status).not.toBe(303);
    expect(bad.body).toContain('Phase spacing must be a length in feet and inches');
    expect(bad.body).toContain('value="six feet"');
  });

  it('is asked in metres for a crew in metres', async () => {
    await admin.put('/api/organisation/settings', { timeZone: 'UTC', paperSize: 'letter', units: 'metric' });
    const page = (await lead.get('/plans/new')).body;
    expect(page).toContain('Phase spacing (m)');
    expect(page).toMatch(/name="phaseSpacingM"[^>]*value="0.9"/);
    expect(await spacingOf((await lead.form('/plans/new', fields('1.2'))).headers.get('location'))).toBeCloseTo(1.2, 9);
  });
});
