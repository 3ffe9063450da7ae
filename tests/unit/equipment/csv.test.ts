/** The inventory CSV: round trip through the export format, and every problem as `line N.column`. */
import { describe, expect, it } from 'vitest';
import { inventoryFromCsv, inventoryToCsv, parseInventoryCsv } from '@/lib/schemas/equipment-csv';

const HEADER = 'tag,description,cable,lengthM,clampKind,clampKa,clampCycles,connection,inServiceOn,status,statusReason,lastTestedOn';
const GOOD = 'GS-01,Phase set,2/0,3,grounding,27,15,ferrule,2024-05-01,in-service,,2026-01-10';

describe('parseInventoryCsv', () => {
  it('reads good rows with their line numbers', () => {
    const result = parseInventoryCsv(`${HEADER}\n${GOOD}\n\nGS-02,,4/0,6.5,live-line,43,30,bare-strands,2025-02-01,,,\n`);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.rows.map((r) => [r.body.tag, r.line, r.body.lengthM, r.body.status])).toEqual([['GS-01', 2, 3, 'in-service'], ['GS-02', 4, 6.5, 'in-service']]);
  });

  it('reports every bad row at once', () => {
    const lines = [
      HEADER,
      GOOD,
      ',no tag,2/0,3,grounding,27,15,ferrule,2024-05-01,,,', // 3 tag
      'GS-03,,3/8,3,grounding,27,15,ferrule,2024-05-01,,,', // 4 cable
      'GS-04,,2/0,three,grounding,27,15,ferrule,2024-05-01,,,', // 5 lengthM
      'GS-05,,2/0,3,grounding,27,15,ferrule,2025-02-29,,,', // 6 inServiceOn
      'GS-01,,2/0,3,grounding,27,15,ferrule,2024-05-01,,,', // 7 duplicate tag
      'GS-06,,2/0,3,grounding,27,15,ferrule,2024-05-01,retired,,', // 8 statusReason
    ];
    const result = parseInventoryCsv(lines.join('\n'));
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues.map((i) => i.path)).toEqual(['line 3.tag', 'line 4.cable', 'line 5.lengthM', 'line 6.inServiceOn', 'line 7.tag', 'line 8.statusReason']);
    expect(result.issues[4].message).toMatch(/already on line 2/);
  });

  it('names unknown and missing columns on line 1', () => {
    const result = parseInventoryCsv('tag,cable,colour\nGS-1,2/0,red\n');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues.map((i) => i.path)).toEqual(expect.arrayContaining(['line 1.colour', 'line 1.lengthM', 'line 1.inServiceOn']));
  });

  it('names the line of a row with the wrong number of cells', () => {
    const result = parseInventoryCsv(`${HEADER}\n${GOOD}\nGS-02,too,few\n`);
    expect(result).toMatchObject({ ok: false, issues: [{ path: 'line 3.(row)' }] });
  });

  it.each(['S{"~BNp', 'tag,"cable', 'a"b,c'])('names line 1 when the header itself cannot be read (%s), never throws', (text) => {
    expect(parseInventoryCsv(text)).toMatchObject({ ok: false, issues: [{ path: 'line 1.(header)' }] });
  });
});

describe('export format', () => {
  it('round-trips and keeps the due dates the export wrote', () => {
    const csv = inventoryToCsv([
      { tag: 'GS-9', description: '=cmd()', cable: '2/0', lengthM: 3, clampKind: 'grounding', clampKa: 27, clampCycles: 15, connection: 'ferrule', inServiceOn: '2024-01-31', status: 'in-service', statusReason: null, lastTestedOn: '2026-01-31', testDueOn: '2026-07-31', notes: null },
    ]);
    expect(csv.split('\n')[1]).toContain("'=cmd()");
    const read = inventoryFromCsv(csv);
    expect(read).toMatchObject({ ok: true, sets: [{ tag: 'GS-9', testDueOn: '2026-07-31', lastTestedOn: '2026-01-31' }] });
  });
  it('computes a due date when the file has none', () => {
    const read = inventoryFromCsv(`${HEADER}\n${GOOD}\n`, 12);
    expect(read).toMatchObject({ ok: true, sets: [{ testDueOn: '2027-01-10' }] });
  });
});
