/** The island's calls to the API, each answer turned into a small tagged result (never a throw). */
import type { CheckReport } from '@/lib/domain/report';
import type { PlanDocument, PlanIssue } from '@/lib/schemas/plan';

export interface ServerPlan {
  id: number;
  title: string;
  status: 'draft' | 'submitted' | 'returned' | 'approved';
  currentRevision: number;
  document: PlanDocument;
  report: CheckReport | null;
  [key: string]: unknown;
}

/**
 * Answers that retrying cannot fix: the session ended (401), this person may not do this (403),
 * or the plan is bigger than the server takes (413). They are never "offline".
 */
export type RefusedResult = { kind: 'signed-out' } | { kind: 'forbidden'; message: string } | { kind: 'too-large'; message: string };

export type CheckResult = { kind: 'ok'; report: CheckReport } | { kind: 'invalid'; issues: PlanIssue[] } | { kind: 'offline' } | RefusedResult | { kind: 'error'; message: string };
export type SaveResult =
  | { kind: 'saved'; plan: ServerPlan }
  | { kind: 'stale'; currentRevision: number; current: ServerPlan | null }
  | { kind: 'not-editable' }
  | { kind: 'invalid'; issues: PlanIssue[] }
  | { kind: 'offline' }
  | RefusedResult
  | { kind: 'error'; message: string };

export interface EditorApi {
  check(doc: PlanDocument, signal?: AbortSignal, units?: 'metric' | 'imperial'): Promise<CheckResult>;
  save(planId: number, body: { expectedRevision: number; title?: string; document: PlanDocument }): Promise<SaveResult>;
}

type ErrorBody = { error?: { code?: string; message?: string; issues?: PlanIssue[]; currentRevision?: number; current?: ServerPlan } };

async function send(fetchImpl: typeof fetch, url: string, init: RequestInit): Promise<{ status: number; body: unknown } | 'offline'> {
  try {
    const res = await fetchImpl(url, { ...init, headers: { 'content-type': 'application/json', accept: 'application/json' }, credentials: 'same-origin' });
    let body: unknown = null;
    try {
      body = await res.json();
    } catch {
      body = null;
    }
    return { status: res.status, body };
  } catch (err) {
    if ((err as Error).name === 'AbortError') throw err;
    return 'offline';
  }
}

/** The refusals retrying cannot fix, by status; null for any other answer. */
function refused(status: number, body: unknown): RefusedResult | null {
  const message = (body as ErrorBody)?.error?.message;
  if (status === 401) return { kind: 'signed-out' };
  if (status === 403) return { kind: 'forbidden', message: message ?? 'You may not change this plan.' };
  if (status === 413) return { kind: 'too-large', message: 'This plan is too large for the server to take. Remove elements you do not need, or split the structure into two plans.' };
  return null;
}

export function createApi(fetchImpl: typeof fetch = (...a) => fetch(...a), base = ''): EditorApi {
  return {
    async check(doc, signal, units = 'metric') {
      const r = await send(fetchImpl, `${base}/api/check?units=${units}`, { method: 'POST', body: JSON.stringify(doc), signal });
      if (r === 'offline' || r.status >= 502) return { kind: 'offline' };
      if (r.status === 200) return { kind: 'ok', report: r.body as CheckReport };
      const no = refused(r.status, r.body);
      if (no) return no;
      const err = (r.body as ErrorBody)?.error;
      if (r.status === 400 && err?.issues) return { kind: 'invalid', issues: err.issues };
      return { kind: 'error', message: err?.message ?? `The check answered ${r.status}.` };
    },
    async save(planId, body) {
      const r = await send(fetchImpl, `${base}/api/plans/${planId}`, { method: 'PUT', body: JSON.stringify(body) });
      if (r === 'offline' || r.status >= 502) return { kind: 'offline' };
      if (r.status === 200) return { kind: 'saved', plan: (r.body as { plan: ServerPlan }).plan };
      const no = refused(r.status, r.body);
      if (no) return no;
      const err = (r.body as ErrorBody)?.error;
      if (r.status === 409 && err?.code === 'STALE_REVISION') return { kind: 'stale', currentRevision: err.currentRevision ?? err.current?.currentRevision ?? body.expectedRevision, current: err.current ?? null };
      if (r.status === 409 && err?.code === 'NOT_EDITABLE') return { kind: 'not-editable' };
      if (r.status === 400 && err?.issues) return { kind: 'invalid', issues: err.issues };
      return { kind: 'error', message: err?.message ?? `Saving answered ${r.status}.` };
    },
  };
}
