/** The organisation's time zone, paper size and units: saved by an admin, by field on error, used for times on pages. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { saveSettings } from '@db/repositories/equipment-settings';
import { saveOrganisationSettings } from '@db/repositories/organisation-settings';
import { closeTestDb, makeOrganization, makePerson, makeTeam, PASSWORD, planDocument, testDb } from '../helpers/factories';
import { mailTo } from '../helpers/wait';

let admin: Client;
let lead: Client;
let reviewer: Client;
let team: Awaited<ReturnType<typeof makeTeam>>;
beforeAll(async () => {
  team = await makeTeam();
  admin = await signedIn(team.admin.email, PASSWORD);
  lead = await signedIn(team.lead.email, PASSWORD);
  reviewer = await signedIn(team.reviewer.email, PASSWORD);
});
afterAll(closeTestDb);

describe('organisation settings', () => {
  it('starts from the server zone, letter and imperial, and keeps the equipment interval unchosen after a save', async () => {
    const first = await admin.get('/api/organisation/settings');
    expect(first.body.settings).toMatchObject({ timeZoneIsDefault: true, paperSize: 'letter', units: 'imperial' });
    expect(first.body.settings.timeZone).toBe(Intl.DateTimeFormat().resolvedOptions().timeZone);
    const saved = await admin.put('/api/organisation/settings', { timeZone: 'Pacific/Kiritimati', paperSize: 'a4', units: 'metric' });
    expect(saved.status).toBe(200);
    expect((await lead.get('/api/organisation/settings')).body.settings).toEqual({ timeZone: 'Pacific/Kiritimati', timeZoneIsDefault: false, paperSize: 'a4', units: 'metric' });
    expect((await admin.get('/api/equipment/settings')).body.settings).toEqual({ testIntervalMonths: 12, intervalIsDefault: true, resistanceLimits: [] });
    // Saving the equipment settings afterwards keeps the general ones.
    await admin.put('/api/equipment/settings', { testIntervalMonths: 6 });
    expect((await admin.get('/api/organisation/settings')).body.settings.timeZone).toBe('Pacific/Kiritimati');
  });

  it('saves the first settings of a new organisation from many requests at once, general and equipment, without a 5xx', async () => {
    const fresh = await makeTeam();
    const other = await signedIn(fresh.admin.email, PASSWORD);
    // The row does not exist yet: every request finds none and inserts; one insert wins, the rest must update.
    const answers = await Promise.all([
      ...Array.from({ length: 8 }, (_, i) => other.put('/api/organisation/settings', { timeZone: i % 2 ? 'UTC' : 'Pacific/Kiritimati', paperSize: 'a4', units: 'metric' })),
      ...Array.from({ length: 4 }, () => other.put('/api/equipment/settings', { testIntervalMonths: 6 })),
    ]);
    expect(answers.map((a) => a.status)).toEqual(Array(12).fill(200));
    const settings = (await other.get('/api/organisation/settings')).body.settings;
    expect(settings).toMatchObject({ timeZoneIsDefault: false, paperSize: 'a4', units: 'metric' });
    expect((await other.get('/api/equipment/settings')).body.settings).toMatchObject({ testIntervalMonths: 6, intervalIsDefault: false });
  });

  it('stores the first settings row once when many saves of both kinds race for it (repository, over the pool)', async () => {
    for (let round = 0; round < 5; round += 1) {
      const organizationId = await makeOrganization();
      const admin = await makePerson(organizationId, 'admin');
      const saves = await Promise.allSettled([
        ...Array.from({ length: 6 }, () => saveOrganisationSettings(testDb(), organizationId, admin.id, { timeZone: 'UTC', paperSize: 'a4', units: 'metric' })),
        ...Array.from({ length: 3 }, () => saveSettings(testDb(), organizationId, admin.id, { testIntervalMonths: 6 })),
      ]);
      expect(saves.filter((s) => s.status === 'rejected').map((s) => String((s as PromiseRejectedResult).reason))).toEqual([]);
      const row = await testDb().models.OrganizationSetting.findByPk(organizationId);
      expect(row).toMatchObject({ timeZone: 'UTC', paperSize: 'a4', units: 'metric', testIntervalMonths: 6 });
    }
  });

  it('refuses a bad zone and paper size by field, and a crew lead may not save', async () => {
    const bad = await admin.put('/api/organisation/settings', { timeZone: 'Somewhere/Else', paperSize: 'legal', units: 'imperial' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(['paperSize', 'timeZone']);
    expect((await lead.put('/api/organisation/settings', { timeZone: 'UTC', paperSize: 'letter', units: 'imperial' })).status).toBe(403);
  });

  it('shows plan times in the organisation zone (UTC+14 here), not UTC', async () => {
    await admin.put('/api/organisation/settings', { timeZone: 'Pacific/Kiritimati', paperSize: 'letter', units: 'imperial' });
    const created = await lead.post('/api/plans', { title: 'Zone check pole', document: planDocument() });
    expect(created.status).toBe(201);
    const page = await lead.get('/plans');
    expect(page.body).toContain('GMT+14');
    expect(page.body).not.toMatch(/\d{2}:\d{2} UTC/);
  });

  it('shows caught mail on the admin mail page in the organisation zone, not UTC', async () => {
    await admin.put('/api/organisation/settings', { timeZone: 'Pacific/Kiritimati', paperSize: 'letter', units: 'imperial' });
    const plan = (await lead.post('/api/plans', { title: `Mail zone pole ${Date.now()}`, document: planDocument() })).body.plan;
    expect((await lead.post(`/api/plans/${plan.id}/submit`)).status).toBe(200);
    await mailTo(admin, team.reviewer.email, plan.title);
    const page = await admin.get('/admin/mail');
    expect(page.status).toBe(200);
    expect(page.body).toContain(plan.title);
    expect(page.body).toContain('GMT+14');
    expect(page.body).not.toMatch(/\d{2}:\d{2} UTC/);
  });

  it('has an admin-only settings page that names the bad field', async () => {
    expect((await lead.get('/settings')).status).toBe(403);
    const form = new URLSearchParams({ timeZone: 'Nowhere', paperSize: 'letter', units: 'imperial' }).toString();
    const page = await admin.request('POST', '/settings', { body: form, headers: { 'content-type': 'application/x-www-form-urlencoded', origin: new URL(admin.baseUrl).origin } });
    expect(page.body).toContain('Time zone must be a time zone name');
    expect((await admin.get('/api/organisation/settings')).body.settings.timeZone).toBe('Pacific/Kiritimati');
  });

  it('shows body current on the review page in milliamperes, as the editor does', async () => {
    const plan = (await lead.post('/api/plans', { title: 'Milliampere pole', document: planDocument() })).body.plan;
    expect((await lead.post(`/api/plans/${plan.id}/submit`)).status).toBe(200);
    const page = await reviewer.get(`/plans/${plan.id}/review`);
    expect(page.status).toBe(200);
    expect(page.body).toContain('Body current (mA)');
    expect(page.body).not.toContain('Body A');
    const row = /<td>W1<\/td><td>A<\/td><td>[^<]*<\/td><td>([^<]*)<\/td>/.exec(page.body);
    expect(row?.[1]).toMatch(/^\d+$/);
  });

  it('words the review page findings in feet for an organisation in feet', async () => {
    await admin.put('/api/organisation/settings', { timeZone: 'UTC', paperSize: 'letter', units: 'imperial' });
    const base = planDocument();
    const document = {
      ...base,
      nodes: [...base.nodes, { id: 'R9', kind: 'ground-rod', lengthM: 2.4384, diameterMm: 15.875, soilOhmM: 100 }],
      links: [...base.links, { id: 'jR9', kind: 'jumper', from: 'CB', to: 'R9', cable: '2/0', lengthM: 3, spanM: 2.5 }],
    };
    const plan = (await lead.post('/api/plans', { title: 'Feet findings pole', document })).body.plan;
    const stored = plan.report.findings.find((f: { rule: string }) => f.rule === 'rod-barricade');
    expect(stored.message).toMatch(/\d m\b/);
    expect((await lead.post(`/api/plans/${plan.id}/submit`)).status).toBe(200);
    const page = await reviewer.get(`/plans/${plan.id}/review`);
    const section = page.body.slice(page.body.indexOf('data-testid="review-findings"'));
    const barricade = /<code [^>]*data-rule-id="rod-barricade"[^>]*>rod-barricade<\/code>\s*<p>([^<]*)<\/p>/.exec(section);
    expect(barricade?.[1]).toMatch(/\d+ ft \d+ in/);
    expect(barricade?.[1]).not.toMatch(/\d m\b/);
    // The plan page's own list (for readers without scripts) says the same, its rule id a label beside it.
    const planPage = (await reviewer.get(`/plans/${plan.id}`)).body;
    const summary = /<code [^>]*data-rule-id="rod-barricade"[^>]*>rod-barricade<\/code>\s*<p>([^<]*)<\/p>/.exec(planPage.slice(planPage.indexOf('data-testid="plan-summary"')));
    expect(summary?.[1]).toBe(barricade?.[1]);
    // Its system data too: 0.9 m of phase spacing reads in feet and inches.
    expect(planPage.slice(planPage.indexOf('data-testid="plan-summary"'))).toMatch(/phase spacing 2 ft 11 in</);
  });

  it('lists a refused submit\'s blockers on the plan page with their rule ids as labels', async () => {
    const base = planDocument();
    const plan = (await lead.post('/api/plans', { title: 'Blocked pole', document: { ...base, links: base.links.filter((l) => l.id !== 'jC') } })).body.plan;
    const sent = await lead.form(`/plans/${plan.id}/workflow`, { action: 'submit' });
    expect(sent.headers.get('location')).toBe(`/plans/${plan.id}?problem=SUBMIT_BLOCKED`);
    const page = (await lead.get(sent.headers.get('location')!)).body;
    const list = page.slice(page.indexOf('<ul class="list-disc pl-5 text-blocker">'), page.indexOf('</ul>', page.indexOf('<ul class="list-disc pl-5 text-blocker">')));
    const items = [...list.matchAll(/<li>([^<]*) <code [^>]*data-rule-id="([a-z-]+)"/g)];
    expect(items.length).toBeGreaterThan(0);
    for (const [, sentence, rule] of items) expect(sentence).not.toContain(rule);
  });
});
