/**
 * Number formatting for finding messages: the rounding a crew lead reads comfortably, units
 * always written out.
 */

import { formatLength, type UnitSystem } from '../units';

const fixed = (value: number, digits: number) => (Number.isFinite(value) ? value.toFixed(digits) : 'an unknown value of');

/** Current in kA to one decimal: "10.5 kA". */
export const kiloamps = (valueKa: number) => `${fixed(valueKa, 1)} kA`;

/** Current in A to three decimals, the precision of the Dalziel limits ("0.232 A"); one decimal from 10 A. */
export const amps = (valueA: number) => `${fixed(valueA, Math.abs(valueA) >= 10 ? 1 : 3)} A`;

/** Potential: one decimal below 10 V, whole volts below 1 kV, then kV to one decimal. */
export const volts = (valueV: number) =>
  Math.abs(valueV) >= 1000 ? `${fixed(valueV / 1000, 1)} kV` : `${fixed(valueV, Math.abs(valueV) >= 10 ? 0 : 1)} V`;

/** Length given in m, to one decimal ("1.8 m"), or in feet and inches for a crew working in feet ("5 ft 11 in"). */
export const metres = (valueM: number, units: UnitSystem = 'metric') =>
  units === 'imperial' && Number.isFinite(valueM) ? formatLength(valueM, 'imperial') : `${fixed(valueM, 1)} m`;

/** Time in s, to two decimals (cycles are fractions of a second): "0.25 s". */
export const seconds = (valueS: number) => `${fixed(valueS, 2)} s`;

/** Resistance in ohms to three significant figures. */
export const ohms = (value: number) => (Number.isFinite(value) ? `${Number(value.toPrecision(3))} Ω` : 'an unknown resistance');

/** Cable size as the trade writes it: "#2", "4/0", "250 kcmil". */
export function cableName(cable: string): string {
  if (cable.includes('/')) return cable;
  return Number(cable) >= 250 ? `${cable} kcmil` : `#${cable}`;
}

/** "A, B and C". */
export function listOf(names: string[]): string {
  if (names.length <= 1) return names.join('');
  return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** Force per length in N/m, whole newtons: "463 N/m". */
export const newtonsPerMetre = (value: number) => `${fixed(value, 0)} N/m`;

/** Resistance in milliohms to two significant figures, for small added resistances: "1 mΩ". */
export const milliohms = (valueOhms: number) => (Number.isFinite(valueOhms) ? `${Number((valueOhms * 1000).toPrecision(2))} mΩ` : 'an unknown resistance');

/** A length that may be short: millimetres below 1 m ("20 mm"), else metres to one decimal. */
export const shortLength = (valueM: number) => (Number.isFinite(valueM) && Math.abs(valueM) < 1 ? `${Number((valueM * 1000).toPrecision(3))} mm` : metres(valueM));

/** A dimensionless factor to three decimals: "1.052". */
export const factor = (value: number) => (Number.isFinite(value) ? value.toFixed(3) : 'an unknown factor');

/** A diameter in millimetres as entered: "15.875 mm". */
export const millimetres = (valueMm: number) => `${Number.isFinite(valueMm) ? Number(valueMm.toPrecision(4)) : 'an unknown'} mm`;
