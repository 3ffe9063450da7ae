import { describe, expect, it } from 'vitest';
import { bodyCurrentQuestion, cableRatingQuestion, gradeNumbers, type AnswerKey } from '@/lib/domain/practice';
import { checkPlan } from '@/lib/domain/checker';
import { makePlan, bucketNodes, bucketLinks, patchElement } from '../../helpers/plan-factory';
import { bucket, crew } from './plans';

describe('bodyCurrentQuestion', () => {
  it('15 cycles at 60 Hz, 50 kg: the right choice is 0.232 A among three common mistakes', () => {
    const q = bodyCurrentQuestion(bucket())!;
    // IEEE Std 80 (Dalziel), engineering.md §2 table: t 0.25 s → 0.2320 A (50 kg), 0.3140 A (70 kg).
    // [calc] 15 cycles read at 50 Hz: t 0.3 s → 0.116/√0.3 = 0.2118 A; k/t without the root: 0.116/0.25 = 0.464 A.
    expect(q.choices.map((c) => c.value)).toEqual([0.212, 0.232, 0.314, 0.464]);
    expect(q.correctIndex).toBe(1);
    expect(q.choices[q.correctIndex].value).toBe(Number(checkPlan(bucket()).tolerableBodyAmps!.toPrecision(3)));
    expect(q.reasons[2]).toMatch(/70 kg/);
  });

  it('70 kg criteria: the 50 kg figure becomes the wrong answer', () => {
    const q = bodyCurrentQuestion(makePlan({ nodes: bucketNodes(), links: bucketLinks(), criteria: { bodyKg: 70 } }))!;
    // IEEE Std 80, engineering.md §2: 0.3140 A (70 kg) at 0.25 s; 0.2320 A is the 50 kg mistake.
    expect(q.choices[q.correctIndex].value).toBe(0.314);
    expect(q.choices.map((c) => c.value)).toContain(0.232);
  });
});

describe('cableRatingQuestion', () => {
  it('a 2/0 jumper at 15 cycles: 27 kA, against the 3/0 row, the 30-cycle column and the fusing current', () => {
    const q = cableRatingQuestion(bucket(), 'jA')!;
    // Grade table (ASTM F855 as reproduced secondhand, engineering.md §4; mem-grade, verify):
    // 2/0 withstand 27 kA (15 cycles), 20 kA (30 cycles); 3/0 withstand 34 kA (15 cycles).
    // Onderdonk fusing of 2/0 at 0.25 s on 98 % area [calc] ≈ 37.5 kA (table's ultimate column: 37).
    const values = q.choices.map((c) => c.value);
    expect(values[0]).toBe(20);
    expect(values[1]).toBe(27);
    expect(values[2]).toBe(34);
    expect(values[3]).toBeGreaterThanOrEqual(37);
    expect(values[3]).toBeLessThan(38);
    expect(q.correctIndex).toBe(1);
    const jumper = checkPlan(bucket()).jumpers.find((j) => j.link === 'jA')!;
    expect(q.choices[q.correctIndex].value).toBe(Number(jumper.cableRatingKa!.toPrecision(3)));
  });

  it('No. 4 swapped in: grade 1 scaled by area, 14 × 41,740/66,360 = 8.81 kA', () => {
    const plan = makePlan({ nodes: bucketNodes(), links: patchElement(bucketLinks(), 'jA', { cable: '4' }) });
    const q = cableRatingQuestion(plan, 'jA')!;
    // [calc] from the grade 1 withstand (14 kA at 15 cycles, secondhand) and NEC Table 8 areas.
    expect(q.choices[q.correctIndex].value).toBe(8.81);
    expect(q.choices.map((c) => c.value)).toContain(14);
  });

  it('refuses a link that is not a jumper', () => {
    expect(cableRatingQuestion(bucket(), 'rA')).toBeNull();
  });
});

describe('gradeNumbers', () => {
  const numbers = bodyCurrentQuestion(crew())!;
  const key: AnswerKey = { planted: [], elements: [], linkIds: {}, numbers };
  it('the exact choice scores 100, any other 0 with the right one named', () => {
    expect(gradeNumbers(key, numbers.correctIndex)).toMatchObject({ score: 100, missed: [] });
    const other = (numbers.correctIndex + 1) % 4;
    expect(gradeNumbers(key, other)).toEqual({ score: 0, found: [], missed: [numbers.choices[numbers.correctIndex].label], wrong: [numbers.choices[other].label] });
  });
});

describe('the practice plans', () => {
  it('start clear, as an approved plan does', () => {
    expect(checkPlan(bucket()).summary.blockers).toBe(0);
    expect(checkPlan(crew()).summary.blockers).toBe(0);
  });
});
