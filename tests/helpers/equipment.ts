/** Grounding sets for the server tests: a set body, dates relative to today, a CSV post. */
import { addDays, addMonths } from '@/lib/domain/equipment';
import { formatDate, runtimeTimeZone } from '@/lib/time-format';
import type { Client } from './api';

/** Today as the server judges it for an organisation that has not chosen a zone (the server's own). */
export const today = () => formatDate(new Date(), runtimeTimeZone());
export const monthsAgo = (months: number, plusDays = 0) => addDays(addMonths(today(), -months), plusDays);
let counter = 0;
export const uniqueTag = (prefix = 'T') => `${prefix}-${Date.now().toString(36)}-${(counter += 1)}`;

export function setBody(overrides: Record<string, unknown> = {}) {
  return {
    tag: uniqueTag(),
    description: 'Invented phase set',
    cable: '2/0',
    lengthM: 3,
    clampKind: 'grounding',
    clampKa: 27,
    clampCycles: 15,
    connection: 'ferrule',
    inServiceOn: monthsAgo(24),
    lastTestedOn: monthsAgo(2),
    ...overrides,
  };
}

export function postCsv(client: Client, csv: string) {
  return client.request('POST', '/api/equipment/import', { body: csv, headers: { 'content-type': 'text/csv' } });
}

export const CSV_HEADER = 'tag,description,cable,lengthM,clampKind,clampKa,clampCycles,connection,inServiceOn,status,statusReason,lastTestedOn';
