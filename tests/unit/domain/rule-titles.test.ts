import { describe, expect, it } from 'vitest';
import { RETIRED_RULE_IDS, RULE_IDS } from '@/lib/domain/rules/index';
import { RULE_TITLES, ruleTitle } from '@/lib/domain/rules/titles';

describe('rule titles', () => {
  it('every rule id a report can carry, retired ones too, has a title in words', () => {
    for (const id of [...RULE_IDS, ...RETIRED_RULE_IDS]) {
      expect(RULE_TITLES[id], id).toBeTruthy();
      expect(RULE_TITLES[id], id).not.toMatch(/^[a-z]+(-[a-z]+)+$/);
    }
    expect(Object.keys(RULE_TITLES).sort()).toEqual([...RULE_IDS, ...RETIRED_RULE_IDS].sort());
  });

  it('an unknown id still reads as words', () => {
    expect(ruleTitle('cable-underrated')).toBe('Cable too small for the fault');
    expect(ruleTitle('some-new-rule')).toBe('Some new rule');
  });
});
