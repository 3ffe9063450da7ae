import { describe, expect, it } from 'vitest';
import { organisationSettingsBody } from '@/lib/schemas/organisation';

describe('organisation settings body', () => {
  it('takes an IANA zone, a paper size and units', () => {
    expect(organisationSettingsBody.parse({ timeZone: ' America/Denver ', paperSize: 'a4', units: 'metric' })).toEqual({ timeZone: 'America/Denver', paperSize: 'a4', units: 'metric' });
  });

  it('names each bad field', () => {
    const r = organisationSettingsBody.safeParse({ timeZone: 'Mountain Time', paperSize: 'legal', units: 'cubits' });
    expect(r.success).toBe(false);
    const byField = Object.fromEntries(r.error!.issues.map((i) => [i.path.join('.'), i.message]));
    expect(byField).toEqual({
      timeZone: 'must be a time zone name such as America/Chicago',
      paperSize: 'must be letter or a4',
      units: 'must be imperial or metric',
    });
  });
});
