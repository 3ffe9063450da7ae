/**
 * Times as the organisation reads them: every page formats a stored instant through here, in the
 * organisation's IANA time zone (Organisation settings), never by slicing an ISO string in UTC.
 * Pure: takes the instant and the zone; no clock.
 */

/** True when the runtime knows this IANA zone name ("America/Chicago", "UTC"). */
export function isTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

function parts(at: Date, zone: string): Record<string, string> {
  const out: Record<string, string> = {};
  const fmt = new Intl.DateTimeFormat('en-US', {
    timeZone: zone, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZoneName: 'short',
  });
  for (const p of fmt.formatToParts(at)) out[p.type] = p.value;
  return out;
}

/** The calendar day in the zone: "2026-03-08". */
export function formatDate(at: Date, zone: string): string {
  const p = parts(at, zone);
  return `${p.year}-${p.month}-${p.day}`;
}

/**
 * The day a whole-day date (a set's test due date) is judged on: the later of UTC's day and the
 * zone's, so a date past in either is past, and with no zone known, UTC's day.
 */
export function judgingDate(at: Date, zone?: string): string {
  const utc = at.toISOString().slice(0, 10);
  const local = zone && isTimeZone(zone) ? formatDate(at, zone) : utc;
  return local > utc ? local : utc;
}

/** The 24-hour time of day in the zone: "01:30". */
export function formatTime(at: Date, zone: string): string {
  const p = parts(at, zone);
  return `${p.hour}:${p.minute}`;
}

/** Day, 24-hour time and the zone's short name: "2026-03-08 01:30 CST". */
export function formatDateTime(at: Date, zone: string): string {
  const p = parts(at, zone);
  return `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute} ${p.timeZoneName}`;
}

/** How long something has waited, in the largest fitting unit: "35 min", "5 h", "3 days" ("—" with no start). */
export function formatWaiting(since: Date | null, now: Date): string {
  if (!since) return '—';
  const minutes = Math.max(0, Math.round((now.getTime() - since.getTime()) / 60000));
  if (minutes < 60) return `${minutes} min`;
  const hours = Math.round(minutes / 60);
  return hours < 48 ? `${hours} h` : `${Math.round(hours / 24)} days`;
}
