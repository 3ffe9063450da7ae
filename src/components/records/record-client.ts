/**
 * Everything the field screen sends to the server, in one small module: each entry gets a
 * clientId (a UUID made here) and the device's time, so a repeat is recorded once. The offline
 * work (next) replaces `send` with a queue and keeps the same calls.
 */
import type { EntryBody } from '@/lib/domain/field-record';

export interface ApiFailure {
  ok: false;
  status: number;
  code: string;
  message: string;
  items?: string[];
  issues?: { path: string; message: string }[];
}
export type ApiResult<T> = { ok: true; status: number; body: T } | ApiFailure;

async function call<T>(path: string, init: RequestInit = {}): Promise<ApiResult<T>> {
  let response: Response;
  try {
    response = await fetch(path, { credentials: 'same-origin', ...init });
  } catch {
    return { ok: false, status: 0, code: 'OFFLINE', message: 'No connection: nothing was sent. Try again when you have signal.' };
  }
  const body = await response.json().catch(() => null);
  if (response.ok) return { ok: true, status: response.status, body: body as T };
  const error = (body as { error?: Omit<ApiFailure, 'ok' | 'status'> } | null)?.error;
  return { ok: false, status: response.status, code: error?.code ?? 'UNKNOWN', message: error?.message ?? `The server answered ${response.status}.`, items: error?.items, issues: error?.issues };
}

/** Makes an entry ready to send: a new clientId and the time on this device. */
export function stampEntry(body: EntryBody, now = new Date()): EntryBody & { clientId: string; at: string } {
  return { ...body, clientId: crypto.randomUUID(), at: now.toISOString() };
}

/** Sends one stamped entry; sending the same stamped entry again is safe (answered with the stored one). */
export function send<T = unknown>(recordId: number, stamped: EntryBody & { clientId: string; at: string }): Promise<ApiResult<T>> {
  return call<T>(`/api/records/${recordId}/entries`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(stamped) });
}

export function fetchRecord<T>(recordId: number): Promise<ApiResult<{ record: T }>> {
  return call(`/api/records/${recordId}`);
}

export function closeRecord<T>(recordId: number): Promise<ApiResult<{ record: T }>> {
  return call(`/api/records/${recordId}/close`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' });
}

/** Uploads a photo; the clientId makes a repeat (after a lost answer) get the stored photo back. */
export function uploadPhoto(recordId: number, file: File, caption: string, clientId?: string): Promise<ApiResult<{ id: number }>> {
  const form = new FormData();
  form.set('photo', file);
  if (caption) form.set('caption', caption);
  if (clientId) form.set('clientId', clientId);
  return call(`/api/records/${recordId}/photos`, { method: 'POST', body: form });
}
