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

/** Day, 24-hour time and the zone's short name: "2026-03-08 01:30 CST". */
export function formatDateTime(at: Date, zone: string): string {
  const p = parts(at, zone);
  return `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute} ${p.timeZoneName}`;
}
