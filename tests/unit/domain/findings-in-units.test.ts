import { describe, expect, it } from 'vitest';
import { findingsInUnits } from '@/lib/domain/findings-in-units';
import type { Finding } from '@/lib/domain/report';

const f = (rule: string, elements: string[], message: string): Finding => ({ rule, severity: 'note', elements, message, basis: 'b' }) as Finding;

describe('findings in the reader\'s units', () => {
  it('takes the re-worded message only for the same finding at the same place', () => {
    const stored = [f('rod-barricade', ['R1'], 'Keep people 3.7 m away.'), f('lead-slack', ['j2'], 'Lead j2 is 1.2 m too long.')];
    const reworded = [f('rod-barricade', ['R1'], 'Keep people 12 ft 2 in away.'), f('lead-slack', ['j3'], 'Lead j3 is 4 ft too long.')];
    expect(findingsInUnits(stored, reworded).map((x) => x.message)).toEqual(['Keep people 12 ft 2 in away.', 'Lead j2 is 1.2 m too long.']);
    expect(findingsInUnits(stored, [])).toEqual(stored);
  });
});
