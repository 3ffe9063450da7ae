/**
 * The contract cannot drift: every rule id the checker registers is documented in docs/rules.md,
 * every id documented there is registered, and the retired ids are listed apart.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CALC_FAILED } from '@/lib/domain/checker';
import { RETIRED_RULE_IDS, RULE_IDS, RULES } from '@/lib/domain/rules/index';

const text = readFileSync(join(__dirname, '../../../docs/rules.md'), 'utf8');
const [current, retired = ''] = text.split('\n## Retired ids');
/** Rule ids in the first column of a markdown table: lines starting with "| `id` |". */
const tableIds = (section: string) => [...section.matchAll(/^\| `([a-z0-9-]+)` \|/gm)].map((m) => m[1]);

describe('docs/rules.md', () => {
  it('documents exactly the registered rule ids and calc-failed, once each', () => {
    const documented = tableIds(current);
    expect(new Set(documented).size).toBe(documented.length);
    expect([...documented].sort()).toEqual([...RULE_IDS].sort());
    expect(RULE_IDS).toEqual([...Object.keys(RULES), CALC_FAILED]);
  });

  it('lists the retired ids apart, and none of them is registered', () => {
    expect(tableIds(retired).sort()).toEqual([...RETIRED_RULE_IDS].sort());
    for (const id of RETIRED_RULE_IDS) expect(RULE_IDS).not.toContain(id);
  });

  it('gives every rule a severity', () => {
    for (const line of current.split('\n').filter((l) => /^\| `[a-z0-9-]+` \|/.test(l))) {
      expect(line.split('|')[2], line).toMatch(/blocker|warning|note/);
    }
  });
});
