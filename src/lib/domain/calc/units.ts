/**
 * Branded numbers for the quantities where a mix-up is dangerous: kiloamperes against
 * amperes, and a rod's radius against its diameter. A plain number must be converted on
 * purpose (`kiloamps(10)`), so passing amperes where kiloamperes are expected fails to compile.
 */
declare const brand: unique symbol;
type Brand<T, B extends string> = T & { readonly [brand]: B };

export type Kiloamps = Brand<number, 'kA'>;
export type Amps = Brand<number, 'A'>;
export type RadiusM = Brand<number, 'radius m'>;

export const kiloamps = (value: number): Kiloamps => value as Kiloamps;
export const amps = (value: number): Amps => value as Amps;
export const toAmps = (value: Kiloamps): Amps => (value * 1000) as Amps;
export const toKiloamps = (value: Amps): Kiloamps => (value / 1000) as Kiloamps;

/** Radius in metres from a diameter in millimetres (rods are specified by diameter, formulas want radius). */
export const radiusFromDiameterMm = (diameterMm: number): RadiusM => (diameterMm / 2000) as RadiusM;
/** Radius in metres from a diameter in inches. */
export const radiusFromDiameterIn = (diameterIn: number): RadiusM => ((diameterIn * 0.0254) / 2) as RadiusM;

/** Permeability of free space, H/m (the pre-2019 exact value; the present SI value differs by 1e-10). */
export const MU0_H_PER_M = 4e-7 * Math.PI;

/** Angular frequency, rad/s. */
export const omega = (frequencyHz: number): number => 2 * Math.PI * frequencyHz;
