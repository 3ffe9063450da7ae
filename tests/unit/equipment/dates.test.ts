/** Due dates with fixed dates: month ends and leap days (Gregorian calendar rules). */
import { describe, expect, it } from 'vitest';
import { addDays, addMonths, daysBetween, dueState, isCalendarDate, limitFor, testDueOn } from '@/lib/domain/equipment';

describe('addMonths', () => {
  it.each([
    ['2026-01-15', 12, '2027-01-15'],
    ['2026-01-31', 1, '2026-02-28'], // shorter month: its last day, never 3 March
    ['2028-01-31', 1, '2028-02-29'], // 2028 is a leap year
    ['2028-02-29', 12, '2029-02-28'], // leap day + a year: 28 February
    ['2028-02-29', 48, '2032-02-29'], // four years on: a leap day again
    ['2026-08-31', 6, '2027-02-28'],
    ['2026-03-31', 1, '2026-04-30'],
    ['2026-12-31', 1, '2027-01-31'], // across a year end
    ['2026-11-30', 3, '2027-02-28'],
    ['2099-02-28', 12, '2100-02-28'], // 2100 is not a leap year (divisible by 100, not 400)
    ['2099-12-31', 2, '2100-02-28'],
    ['2399-12-31', 2, '2400-02-29'], // 2400 is (divisible by 400)
    ['2026-05-20', 0, '2026-05-20'],
    ['2026-03-31', -1, '2026-02-28'],
  ])('%s + %i months is %s', (from, months, expected) => {
    expect(addMonths(from, months)).toBe(expected);
  });

  it('refuses a date that does not exist', () => {
    expect(() => addMonths('2026-02-29', 1)).toThrow(/not a calendar date/);
  });
});

describe('calendar dates', () => {
  it.each(['2028-02-29', '2026-12-31', '2000-02-29'])('%s is a date', (d) => expect(isCalendarDate(d)).toBe(true));
  it.each(['2026-02-29', '1900-02-29', '2026-13-01', '2026-04-31', '2026-1-01', '26-01-01', '2026-01-00', ''])('%s is not', (d) => expect(isCalendarDate(d)).toBe(false));
  it('counts days across a leap day', () => {
    expect(daysBetween('2028-02-28', '2028-03-01')).toBe(2);
    expect(daysBetween('2026-02-28', '2026-03-01')).toBe(1);
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01');
  });
});

describe('due state and due date', () => {
  it('counts from the last test, or from the in-service date when never tested', () => {
    expect(testDueOn('2026-03-31', '2020-01-01', 6)).toBe('2026-09-30');
    expect(testDueOn(null, '2028-02-29', 12)).toBe('2029-02-28');
  });
  it('is overdue the day after the due date, due soon within 30 days', () => {
    expect(dueState('2026-06-30', '2026-06-30')).toBe('soon');
    expect(dueState('2026-06-30', '2026-07-01')).toBe('overdue');
    expect(dueState('2026-07-31', '2026-07-01')).toBe('soon');
    expect(dueState('2026-08-01', '2026-07-01')).toBe('ok');
  });
});

describe('limitFor', () => {
  const limits = [
    { cable: '2/0' as const, maxLengthM: 3, limitMilliohms: 1.5 },
    { cable: '2/0' as const, maxLengthM: 10, limitMilliohms: 4 },
    { cable: '4/0' as const, maxLengthM: 10, limitMilliohms: 3 },
  ];
  it('takes the shortest row that covers the length, for the same cable', () => {
    expect(limitFor(limits, '2/0', 2.5)).toBe(1.5);
    expect(limitFor(limits, '2/0', 3)).toBe(1.5);
    expect(limitFor(limits, '2/0', 3.1)).toBe(4);
    expect(limitFor(limits, '4/0', 6)).toBe(3);
  });
  it('has none when the organisation entered none that applies', () => {
    expect(limitFor(limits, '2/0', 12)).toBeNull();
    expect(limitFor(limits, '1/0', 1)).toBeNull();
    expect(limitFor([], '2/0', 1)).toBeNull();
  });
});
