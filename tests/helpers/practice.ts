/** An approved plan made through the real API (lead writes and submits, reviewer approves), for practice tests. */
import { expect } from 'vitest';
import type { Client } from './api';
import type { PlanDocument } from '@/lib/schemas/plan';
import { planDocument } from './factories';

/** Bucket work: three phases and the neutral on a cluster bar, the bucket bonded, the worker reaching every phase. */
export function bucketDocument(): PlanDocument {
  const doc = planDocument();
  return {
    ...doc,
    nodes: [...doc.nodes.filter((n) => n.id !== 'W1'), { id: 'BK', kind: 'bucket', insulatedBoom: true }, { id: 'W1', kind: 'worker', standsOn: 'BK' }],
    links: [
      ...doc.links.filter((l) => l.kind !== 'reach'),
      { id: 'jBK', kind: 'jumper', from: 'BK', to: 'CB', cable: '2/0', lengthM: 2.5, spanM: 2 },
      { id: 'rA', kind: 'reach', from: 'W1', to: 'A' },
      { id: 'rB', kind: 'reach', from: 'W1', to: 'B' },
      { id: 'rC', kind: 'reach', from: 'W1', to: 'C' },
    ],
  };
}

export async function approvedPlan(lead: Client, reviewer: Client, document: PlanDocument = bucketDocument()): Promise<{ id: number; revision: number }> {
  const created = await lead.post('/api/plans', { title: `Practice pole ${Math.random().toString(36).slice(2, 7)}`, document });
  expect(created.status).toBe(201);
  const id = created.body.plan.id as number;
  expect((await lead.post(`/api/plans/${id}/submit`)).status).toBe(200);
  const decided = await reviewer.post(`/api/plans/${id}/review`, { decision: 'approve', teachingNote: 'Everything in reach rises together.' });
  expect(decided.status).toBe(200);
  return { id, revision: created.body.plan.currentRevision as number };
}
