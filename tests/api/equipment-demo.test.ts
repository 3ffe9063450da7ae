/** The seeded demo co-operative's grounding sets: their states, their history, and plans that hang them. */
import { afterAll, beforeAll, expect, it } from 'vitest';
import type { Client } from '../helpers/api';
import { signedIn } from '../helpers/api';
import { DEMO_PASSWORD } from '../helpers/e2e';
import { closeTestDb } from '../helpers/factories';

let admin: Client;
beforeAll(async () => {
  admin = await signedIn('admin@demo.test', DEMO_PASSWORD);
});
afterAll(closeTestDb);

const demoTags = (items: { tag: string }[]) => items.map((s) => s.tag).filter((t) => /^LV-1\d\d$/.test(t)).sort();

it('has about twenty sets: a few due soon, one overdue, one out of service after a fault, one retired', async () => {
  const all = await admin.get('/api/equipment?pageSize=500');
  expect(demoTags(all.body.items)).toHaveLength(20);
  expect(demoTags((await admin.get('/api/equipment?due=soon&status=in-service&pageSize=500')).body.items)).toEqual(['LV-114', 'LV-115', 'LV-116']);
  expect(demoTags((await admin.get('/api/equipment?due=overdue&pageSize=500')).body.items)).toEqual(['LV-117']);
  expect(demoTags((await admin.get('/api/equipment?status=out-of-service&pageSize=500')).body.items)).toEqual(['LV-118']);
  expect(demoTags((await admin.get('/api/equipment?status=retired&pageSize=500')).body.items)).toEqual(['LV-119']);
  const faulted = all.body.items.find((s: { tag: string }) => s.tag === 'LV-118');
  const detail = await admin.get(`/api/equipment/${faulted.id}`);
  expect(detail.body.events[0]).toMatchObject({ kind: 'fault', toStatus: 'out-of-service' });
  expect(detail.body.tests.length).toBeGreaterThanOrEqual(2);
});

it('hangs in-date sets on the editable demo plans, and their check lists them', async () => {
  const drafts = await admin.get('/api/plans?status=draft&pageSize=100');
  const withSets = [];
  for (const p of drafts.body.items) {
    const plan = (await admin.get(`/api/plans/${p.id}`)).body.plan;
    if (plan.document.links.some((l: { equipmentId?: string }) => l.equipmentId?.startsWith('LV-'))) withSets.push(plan);
  }
  expect(withSets.length).toBeGreaterThan(0);
  const checked = await admin.post(`/api/plans/${withSets[0].id}/check`);
  expect(checked.body.report.sets.length).toBeGreaterThan(0);
  expect(checked.body.report.sets.every((s: { known: boolean; status: string; due: string }) => s.known && s.status === 'in-service' && s.due === 'ok')).toBe(true);
  expect(checked.body.report.findings.filter((f: { rule: string }) => f.rule.startsWith('set-'))).toEqual([]);
});
