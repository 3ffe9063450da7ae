/**
 * Display units for the editor: the plan stores metres and AWG/kcmil size names (docs/plan-format.md);
 * the crew may read and type lengths in metres or in feet and inches. Pure, no formatting locale.
 */
import type { CableSize } from '../schemas/plan';

export type UnitSystem = 'metric' | 'imperial';

/** One international foot is exactly 0.3048 m. */
export const METRES_PER_FOOT = 0.3048;

export const feetFromMetres = (m: number): number => m / METRES_PER_FOOT;
export const metresFromFeet = (ft: number): number => ft * METRES_PER_FOOT;

const round = (v: number, digits: number) => {
  const f = 10 ** digits;
  return Math.round(v * f) / f;
};

/** A length in metres as the crew reads it: "3.05 m", or "10 ft 0 in" (inches rounded). */
export function formatLength(m: number, system: UnitSystem): string {
  if (system === 'metric') return `${round(m, 2)} m`;
  let totalIn = Math.round(feetFromMetres(m) * 12);
  const negative = totalIn < 0;
  totalIn = Math.abs(totalIn);
  const ft = Math.floor(totalIn / 12);
  const inches = totalIn % 12;
  return `${negative ? '-' : ''}${ft} ft ${inches} in`;
}

/** The value put in an input box for a stored length: plain metres, or feet and inches. */
export function lengthInputValue(m: number | undefined, system: UnitSystem): string {
  if (m === undefined) return '';
  return system === 'metric' ? String(round(m, 3)) : formatLength(m, 'imperial');
}

export type ParsedNumber = { ok: true; value: number } | { ok: false; message: string };

/**
 * Reads a typed length back to metres. Metric: a plain number, optionally with "m". Imperial:
 * "10", "10.5", "10 ft 6 in", "10' 6\"", "10ft6in", "6 in" or "6\"".
 */
export function parseLength(text: string, system: UnitSystem): ParsedNumber {
  // Typographic quotes from a phone keyboard read as feet and inches marks.
  const t = text.trim().toLowerCase().replace(/[‘’′]/g, "'").replace(/[“”″]/g, '"');
  if (t === '') return { ok: false, message: 'is required' };
  // A unit typed with the number wins over the chosen system: "2 m" in feet mode, "6 ft" in metres.
  const metric = /^(-?\d+(?:\.\d+)?|-?\.\d+)\s*(m|cm|mm)$/.exec(t);
  if (metric) return { ok: true, value: Number(metric[1]) / (metric[2] === 'cm' ? 100 : metric[2] === 'mm' ? 1000 : 1) };
  if (system === 'metric' && /ft|feet|foot|in|inch|'|"/.test(t)) return parseLength(t, 'imperial');
  if (system === 'metric') {
    const m = /^(-?\d+(?:\.\d+)?|-?\.\d+)\s*(m)?$/.exec(t);
    return m ? { ok: true, value: Number(m[1]) } : { ok: false, message: 'must be a length in metres, e.g. 3.5' };
  }
  const re = /^(?:(-?\d+(?:\.\d+)?)\s*(?:ft|feet|foot|')?)?\s*(?:(\d+(?:\.\d+)?)\s*(?:in|inch|inches|"|''))?$/;
  const inchesOnly = /^(\d+(?:\.\d+)?)\s*(?:in|inch|inches|"|'')$/.exec(t);
  if (inchesOnly) return { ok: true, value: metresFromFeet(Number(inchesOnly[1]) / 12) };
  const m = re.exec(t);
  if (!m || (m[1] === undefined && m[2] === undefined)) return { ok: false, message: 'must be a length in feet and inches, e.g. 10 ft 6 in' };
  const ft = m[1] === undefined ? 0 : Number(m[1]);
  const inches = m[2] === undefined ? 0 : Number(m[2]);
  if (inches >= 12 && m[1] !== undefined) return { ok: false, message: 'inches must be less than 12' };
  return { ok: true, value: metresFromFeet(ft + (ft < 0 ? -inches : inches) / 12) };
}

/** Reads a plain number (no unit conversion); blank is "is required". */
export function parseNumber(text: string): ParsedNumber {
  const t = text.trim();
  if (t === '') return { ok: false, message: 'is required' };
  const v = Number(t);
  return Number.isFinite(v) ? { ok: true, value: v } : { ok: false, message: 'must be a number' };
}

/** Nominal copper cross-sections in mm² (ASTM B8 sizes; rounded, for orientation only). */
export const CABLE_AREA_MM2: Record<CableSize, number> = {
  '4': 21.2,
  '2': 33.6,
  '1/0': 53.5,
  '2/0': 67.4,
  '3/0': 85.0,
  '4/0': 107.2,
  '250': 126.7,
  '350': 177.3,
};

/** The short tag drawn on a jumper: the size as the trade writes it ("2/0", "250"). */
export const cableTag = (size: CableSize): string => size;

/** The cable size in words: "2/0 AWG", "250 kcmil"; metric adds the copper area. */
export function cableLabel(size: CableSize, system: UnitSystem = 'imperial'): string {
  const name = size === '250' || size === '350' ? `${size} kcmil` : `${size} AWG`;
  return system === 'metric' ? `${name} (${CABLE_AREA_MM2[size]} mm²)` : name;
}

export const lengthUnit = (system: UnitSystem): string => (system === 'metric' ? 'm' : 'ft in');
