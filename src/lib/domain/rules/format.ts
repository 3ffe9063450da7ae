/**
 * Number formatting for finding messages. The quantities come from the one display module,
 * src/lib/domain/units.ts (also used by the pages and the editor), under the short names the rules use.
 */

export {
  formatAmps as amps,
  formatVolts as volts,
  formatMetres as metres,
  formatSeconds as seconds,
  formatOhms as ohms,
  formatMilliohms as milliohms,
  formatShortLength as shortLength,
  formatFactor as factor,
  formatMillimetres as millimetres,
  formatKiloamps,
  formatDiameter as diameter,
  formatForcePerLength as forcePerLength,
} from '@/lib/domain/units';

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
