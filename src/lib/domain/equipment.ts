/**
 * Grounding sets as the domain sees them: calendar dates (YYYY-MM-DD strings, no clock), when a set's
 * next in-service test is due, whether it is due soon or overdue, and which of the organisation's own
 * resistance limits applies. Pure: "today" is always passed in.
 */
import type { CableSize } from '@/lib/schemas/plan';

export const SET_STATUSES = ['in-service', 'out-of-service', 'retired'] as const;
export type SetStatus = (typeof SET_STATUSES)[number];
/** A status as the pages say it. */
export const SET_STATUS_WORDS: Record<SetStatus, string> = { 'in-service': 'In service', 'out-of-service': 'Out of service', retired: 'Retired' };
/** What happened to a set, as its history says it (stored kinds: created, imported, edited, status, fault, test). */
export const SET_EVENT_WORDS: Record<string, string> = { created: 'Added', imported: 'Imported', edited: 'Edited', status: 'Status changed', fault: 'Carried fault current', test: 'Tested' };
/** The fields an edit can change, named as a crew reads them (for the history's "Changed …" line). */
export const SET_FIELD_WORDS: Record<string, string> = {
  tag: 'the tag', description: 'the description', cable: 'the cable size', lengthM: 'the length', clampKind: 'the clamp kind', clampKa: 'the clamp rating (kA)',
  clampCycles: 'the clamp rating (cycles)', connection: 'the connection', inServiceOn: 'the date it went into service', notes: 'the notes',
};
export const CLAMP_KINDS = ['grounding', 'live-line'] as const;
export type ClampKind = (typeof CLAMP_KINDS)[number];
export const CONNECTIONS = ['ferrule', 'bare-strands'] as const;
export type Connection = (typeof CONNECTIONS)[number];

/** The interval when the organisation has not chosen one: an organisation choice, not a standard's figure. */
export const DEFAULT_TEST_INTERVAL_MONTHS = 12;
/** "Due soon" means due within this many days (the 30 days). */
export const DUE_SOON_DAYS = 30;

/** What the checker and the lists need to know about one set. */
export interface SetRecord {
  tag: string;
  cable: CableSize;
  lengthM: number;
  clampKind: ClampKind;
  clampKa: number;
  clampCycles: number;
  connection: Connection;
  status: SetStatus;
  lastTestedOn: string | null;
  testDueOn: string;
}

/** One row of the organisation's resistance limits: sets of this cable up to this length. */
export interface ResistanceLimit {
  cable: CableSize;
  maxLengthM: number;
  limitMilliohms: number;
}

const DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

function daysInMonth(year: number, month1: number): number {
  return new Date(Date.UTC(year, month1, 0)).getUTCDate();
}

/** True for a real calendar date written YYYY-MM-DD (2025-02-29 is not one). */
export function isCalendarDate(text: string): boolean {
  const m = DATE.exec(text);
  if (!m) return false;
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
  return year >= 1900 && year <= 2999 && month >= 1 && month <= 12 && day >= 1 && day <= daysInMonth(year, month);
}

function parts(date: string): [number, number, number] {
  if (!isCalendarDate(date)) throw new RangeError(`not a calendar date: ${date}`);
  const [y, m, d] = date.split('-').map(Number);
  return [y, m, d];
}

const pad = (n: number, width = 2) => String(n).padStart(width, '0');

/**
 * The same day `months` later; when that month is shorter, its last day (31 January + 1 month is
 * 28 or 29 February; 29 February + 12 months is 28 February). Never rolls into the next month, so a
 * test is never due later than the interval allows.
 */
export function addMonths(date: string, months: number): string {
  const [y, m, d] = parts(date);
  const index = y * 12 + (m - 1) + months;
  const year = Math.floor(index / 12);
  const month = (index % 12) + 1;
  return `${pad(year, 4)}-${pad(month)}-${pad(Math.min(d, daysInMonth(year, month)))}`;
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  const [y1, m1, d1] = parts(from);
  const [y2, m2, d2] = parts(to);
  return Math.round((Date.UTC(y2, m2 - 1, d2) - Date.UTC(y1, m1 - 1, d1)) / 86_400_000);
}

export function addDays(date: string, days: number): string {
  const [y, m, d] = parts(date);
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

/** The next test is due one interval after the last test, or after the in-service date if never tested. */
export function testDueOn(lastTestedOn: string | null, inServiceOn: string, intervalMonths: number): string {
  return addMonths(lastTestedOn ?? inServiceOn, intervalMonths);
}

export type DueState = 'overdue' | 'soon' | 'ok';

/** Overdue once the due date has passed; due soon from DUE_SOON_DAYS before it up to the day itself. */
export function dueState(dueOn: string, today: string, soonDays = DUE_SOON_DAYS): DueState {
  const days = daysBetween(today, dueOn);
  if (days < 0) return 'overdue';
  return days <= soonDays ? 'soon' : 'ok';
}

/**
 * The organisation's limit for a set: the row for its cable with the smallest maximum length that
 * still covers the set's length. Null when the organisation has entered none that applies.
 */
export function limitFor(limits: readonly ResistanceLimit[], cable: CableSize, lengthM: number): number | null {
  const fits = limits.filter((l) => l.cable === cable && lengthM <= l.maxLengthM).sort((a, b) => a.maxLengthM - b.maxLengthM);
  return fits[0]?.limitMilliohms ?? null;
}
