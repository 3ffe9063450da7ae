import { describe, expect, it } from 'vitest';
import { formatDate, formatDateTime, formatWaiting, isTimeZone } from '@/lib/time-format';

// One fixed instant read in several zones; offsets from the IANA tz database (public).
const instant = new Date('2026-07-01T03:30:00Z');

describe('formatDateTime', () => {
  it('shows the same instant in each zone, with the day changing across the date line', () => {
    expect(formatDateTime(instant, 'UTC')).toBe('2026-07-01 03:30 UTC');
    expect(formatDateTime(instant, 'America/Chicago')).toBe('2026-06-30 22:30 CDT');
    expect(formatDate(instant, 'America/Chicago')).toBe('2026-06-30');
    expect(formatDate(instant, 'Pacific/Auckland')).toBe('2026-07-01');
    expect(formatDateTime(instant, 'Asia/Kolkata')).toMatch(/^2026-07-01 09:00 /);
  });

  it('follows the daylight-saving change (US: 2026-03-08 02:00 local becomes 03:00)', () => {
    // 07:59 UTC is 01:59 CST; one minute later the clocks jump to 03:00 CDT.
    expect(formatDateTime(new Date('2026-03-08T07:59:00Z'), 'America/Chicago')).toBe('2026-03-08 01:59 CST');
    expect(formatDateTime(new Date('2026-03-08T08:00:00Z'), 'America/Chicago')).toBe('2026-03-08 03:00 CDT');
  });

  it('writes midnight as 00, not 24', () => {
    expect(formatDateTime(new Date('2026-01-15T06:00:00Z'), 'America/Chicago')).toBe('2026-01-15 00:00 CST');
  });
});

describe('isTimeZone', () => {
  it('knows IANA names and refuses others', () => {
    expect(isTimeZone('Europe/Berlin')).toBe(true);
    expect(isTimeZone('Mars/Olympus')).toBe(false);
    expect(isTimeZone('')).toBe(false);
  });
});

describe('formatWaiting', () => {
  const now = new Date('2026-07-01T12:00:00Z');
  const ago = (minutes: number) => new Date(now.getTime() - minutes * 60_000);
  it('says minutes under an hour, hours under two days, then days', () => {
    expect(formatWaiting(null, now)).toBe('—');
    expect(formatWaiting(ago(0), now)).toBe('0 min');
    expect(formatWaiting(ago(59), now)).toBe('59 min');
    expect(formatWaiting(ago(60), now)).toBe('1 h');
    expect(formatWaiting(ago(47 * 60), now)).toBe('47 h');
    expect(formatWaiting(ago(48 * 60), now)).toBe('2 days');
    // A start a little in the future (clock skew) is no wait, not a negative one.
    expect(formatWaiting(new Date(now.getTime() + 30_000), now)).toBe('0 min');
  });
});
