import { describe, expect, it } from 'vitest';
import * as units from '@/lib/domain/units';
import * as findings from '@/lib/domain/rules/format';
import * as brands from '@/lib/domain/calc/units';

// Conversion factors are exact by definition (NIST SP 811, appendix B): 1 ft = 0.3048 m,
// 1 in = 25.4 mm, 1 lb = 0.45359237 kg, 1 lbf = 4.4482216152605 N.
describe('display units', () => {
  it('writes force per length in N/m or lbf/ft', () => {
    expect(units.formatForcePerLength(463, 'metric')).toBe('463 N/m');
    // 463 × 0.3048 / 4.4482216 = 31.73
    expect(units.formatForcePerLength(463, 'imperial')).toBe('31.7 lbf/ft');
    expect(units.formatForcePerLength(1 / (0.3048 / 4.4482216152605), 'imperial')).toBe('1.0 lbf/ft');
  });

  it('writes rod diameters in inches and body weight in pounds for imperial', () => {
    expect(units.formatDiameter(15.875, 'imperial')).toBe('0.625 in');
    expect(units.formatDiameter(15.875, 'metric')).toBe('15.88 mm');
    expect(units.formatWeight(70, 'imperial')).toBe('154 lb');
    expect(units.formatWeight(50, 'metric')).toBe('50 kg');
  });

  it('writes body current in whole milliamperes, as the editor does', () => {
    expect(units.formatMilliamps(0.2324)).toBe('232 mA');
    expect(units.formatMilliamps(null)).toBe('— mA');
  });

  it('is the one module the finding messages use, and its names do not collide with the brands', () => {
    expect(findings.amps).toBe(units.formatAmps);
    expect(findings.metres).toBe(units.formatMetres);
    expect(findings.formatKiloamps).toBe(units.formatKiloamps);
    const displayNames = Object.keys(units);
    expect(Object.keys(brands).filter((name) => displayNames.includes(name))).toEqual([]);
    expect('kiloamps' in findings).toBe(false);
  });
});
