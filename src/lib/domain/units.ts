/**
 * Display units for the editor: the plan stores metres and AWG/kcmil size names (docs/plan-format.md);
 * the crew may read and type lengths in metres or in feet and inches. Pure, no formatting locale.
 */
import type { CableSize } from '@/lib/schemas/plan';

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

/**
 * A stored length written so that parseLength reads back exactly the same metres: feet and inches
 * when it is a whole number of inches (what an imperial user typed), else metres with "m" (a
 * length imported in metres is not rounded to the inch on its way back).
 */
export function exactLengthText(m: number, system: UnitSystem): string {
  if (system === 'metric') return String(m);
  const inches = feetFromMetres(m) * 12;
  return Math.abs(inches - Math.round(inches)) < 1e-6 ? formatLength(m, 'imperial') : `${m} m`;
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

/*
 * Quantities as the crew reads them: the one set of formatters for findings, pages and the editor.
 * Rounding a crew lead reads comfortably, units always written out.
 */
const fixed = (value: number, digits: number) => (Number.isFinite(value) ? value.toFixed(digits) : 'an unknown value of');

/** One pound-force is exactly 4.4482216152605 N (0.45359237 kg × 9.80665 m/s²). */
export const NEWTONS_PER_POUND_FORCE = 4.4482216152605;
/** One avoirdupois pound is exactly 0.45359237 kg. */
export const KILOGRAMS_PER_POUND = 0.45359237;

/** A figure of the tables (plan page, drawer, print sheet, PDF): up to `digits` decimals, grouped; `missing` when there is none. */
export const formatFigure = (v: number | null | undefined, digits = 2, missing = '—'): string =>
  v === null || v === undefined ? missing : v.toLocaleString('en', { maximumFractionDigits: digits });

/** Current in kA to one decimal: "10.5 kA". Display only; the branded constructor lives in calc/units.ts. */
export const formatKiloamps = (valueKa: number) => `${fixed(valueKa, 1)} kA`;
/** Current in A to three decimals, the precision of the Dalziel limits ("0.232 A"); one decimal from 10 A. */
export const formatAmps = (valueA: number) => `${fixed(valueA, Math.abs(valueA) >= 10 ? 1 : 3)} A`;
/** Body current given in A, written in whole milliamperes as the editor shows it: "232 mA". */
export const milliampsNumber = (valueA: number | null | undefined) => (valueA === null || valueA === undefined || !Number.isFinite(valueA) ? '—' : `${Math.round(valueA * 1000)}`);
export const formatMilliamps = (valueA: number | null | undefined) => `${milliampsNumber(valueA)} mA`;
/** Potential: one decimal below 10 V, whole volts below 1 kV, then kV to one decimal. */
export const formatVolts = (valueV: number) =>
  Math.abs(valueV) >= 1000 ? `${fixed(valueV / 1000, 1)} kV` : `${fixed(valueV, Math.abs(valueV) >= 10 ? 0 : 1)} V`;
/** Length given in m, to one decimal ("1.8 m"), or in feet and inches for a crew working in feet ("5 ft 11 in"). */
export const formatMetres = (valueM: number, units: UnitSystem = 'metric') =>
  units === 'imperial' && Number.isFinite(valueM) ? formatLength(valueM, 'imperial') : `${fixed(valueM, 1)} m`;
/** Time in s, to two decimals (cycles are fractions of a second): "0.25 s". */
export const formatSeconds = (valueS: number) => `${fixed(valueS, 2)} s`;
/** Resistance in ohms to three significant figures. */
export const formatOhms = (value: number) => (Number.isFinite(value) ? `${Number(value.toPrecision(3))} Ω` : 'an unknown resistance');
/** Resistance in milliohms to two significant figures, for small added resistances: "1 mΩ". */
export const formatMilliohms = (valueOhms: number) => (Number.isFinite(valueOhms) ? `${Number((valueOhms * 1000).toPrecision(2))} mΩ` : 'an unknown resistance');
/** Force per length given in N/m: whole newtons per metre ("463 N/m"), or pounds-force per foot to one decimal ("31.7 lbf/ft"). */
export const formatForcePerLength = (valueNPerM: number, units: UnitSystem = 'metric') =>
  units === 'imperial' ? `${fixed((valueNPerM * METRES_PER_FOOT) / NEWTONS_PER_POUND_FORCE, 1)} lbf/ft` : `${fixed(valueNPerM, 0)} N/m`;
/** A length that may be short: millimetres below 1 m ("20 mm"), else metres to one decimal; in feet, inches below a foot ("0.787 in"), else feet and inches. */
export const formatShortLength = (valueM: number, units: UnitSystem = 'metric') => {
  if (units === 'imperial' && Number.isFinite(valueM)) return Math.abs(valueM) < METRES_PER_FOOT ? `${Number((valueM / 0.0254).toPrecision(3))} in` : formatLength(valueM, 'imperial');
  return Number.isFinite(valueM) && Math.abs(valueM) < 1 ? `${Number((valueM * 1000).toPrecision(3))} mm` : formatMetres(valueM);
};
/** A dimensionless factor to three decimals: "1.052". */
export const formatFactor = (value: number) => (Number.isFinite(value) ? value.toFixed(3) : 'an unknown factor');
/** A diameter in millimetres as entered: "15.875 mm". */
export const formatMillimetres = (valueMm: number) => `${Number.isFinite(valueMm) ? Number(valueMm.toPrecision(4)) : 'an unknown'} mm`;
/** A rod diameter given in mm: as entered in mm, or in inches to three decimals ("0.625 in"). */
export const formatDiameter = (valueMm: number, units: UnitSystem = 'metric') =>
  units === 'imperial' && Number.isFinite(valueMm) ? `${Number((valueMm / 25.4).toFixed(3))} in` : formatMillimetres(valueMm);
/** A body weight given in kg: whole kilograms, or whole pounds. */
export const formatWeight = (valueKg: number, units: UnitSystem = 'metric') =>
  units === 'imperial' ? `${fixed(valueKg / KILOGRAMS_PER_POUND, 0)} lb` : `${fixed(valueKg, 0)} kg`;
