/** Shared pieces of the field-record tests: an approved plan, entry bodies, mail look-up. */
import { randomUUID } from 'node:crypto';
import { expect } from 'vitest';
import type { Client } from './api';
import { planDocument } from './factories';

export async function approvedPlan(lead: Client, reviewer: Client, title = `Record pole ${randomUUID().slice(0, 6)}`): Promise<number> {
  const created = await lead.post('/api/plans', { title, document: planDocument() });
  expect(created.status).toBe(201);
  const id = created.body.plan.id as number;
  expect((await lead.post(`/api/plans/${id}/submit`)).status).toBe(200);
  expect((await reviewer.post(`/api/plans/${id}/review`, { decision: 'approve' })).status).toBe(200);
  return id;
}

let minute = 0;
/** An entry body with a fresh clientId and a device time. */
export function entry<T extends Record<string, unknown>>(type: string, body: T = {} as T) {
  minute += 1;
  return { clientId: randomUUID(), at: new Date(Date.UTC(2026, 4, 4, 7, 0) + minute * 60_000).toISOString(), type, ...body };
}

export const BRIEFING = ['plan-reviewed', 'hazards-discussed', 'sets-inspected', 'contacts-cleaned', 'detector-proved'];
export const passingTest = () => entry('voltage-test', { detector: 'Invented detector 7', detectorCheckedBefore: true, detectorCheckedAfter: true, phases: { A: 'absent', B: 'absent', C: 'absent' } });
export const JUMPERS = ['jA', 'jB', 'jC', 'jN'];

/** Signs on, ticks the briefing and records a passing test; returns nothing, fails on any refusal. */
export async function readyToInstall(client: Client, recordId: number, leadId: string): Promise<void> {
  const steps = [entry('sign-on', { people: [leadId], visitors: [] }), ...BRIEFING.map((item) => entry('briefing', { item, by: leadId })), passingTest()];
  for (const step of steps) {
    const response = await client.post(`/api/records/${recordId}/entries`, step);
    expect(response.status, `${step.type}: ${response.text}`).toBe(201);
  }
}

export { mailTo } from './wait';
