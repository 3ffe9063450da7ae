/**
 * The calculations the checker's rules call (the seam is contract.ts), plus the pieces tests and
 * benchmarks use directly. Pure: no I/O, no clock, no framework.
 */
import type { CalcEntryPoints } from './contract';
import { computeFault } from './fault';
import { tolerableBodyAmps } from './body';
import { cableRating, clampRatingAt } from './ratings';
import { analyseNetwork } from './analyse';

export type * from './contract';
export { computeFault, decrementFactor, faultDurationS, parallelForceNPerM, peakFactor } from './fault';
export { tolerableBodyAmps, dalzielK, stepTouchCriteria, surfaceLayerFactor, DALZIEL_MIN_S, DALZIEL_MAX_S } from './body';
export { BARE_STRANDS_OHMS, CABLES, CLAMP_CONTACT_OHMS, conductorRadiusM, jumperImpedance, r20OhmPerM, straightWireInductanceH } from './cable';
export { cableRating, clampRatingAt, fusingKa, GRADES, gradeWithstandKa, onderdonkAmps } from './ratings';
export { barricadeRadius, BARRICADE_METHOD, hemisphereVolts, rodGroupOhms, rodSurfaceVolts, singleRodOhms, twoRodsCloseOhms, twoRodsWideOhms } from './rods';
export { analyseNetwork, DEFAULT_BODY_OHMS, factorNetwork } from './analyse';
export { assembleAdmittance, BOND_DEFAULT_OHMS, buildNetwork, DEFAULT_GROUND_OHMS, isConductive, linkImpedance, REFERENCE, ZERO_OHMS_FLOOR } from './network';
export type { Network } from './network';
export { factorSymmetric, solveBlockInPlace } from './sparse';
export { minimumDegreeOrder } from './ordering';
export { BLOCK_SIZE, solveInjections } from './batch';
export type { Injection, SolvedColumn } from './batch';
export type { LdlFactor, SymmetricEntries } from './sparse';

/** The entry points contract.ts names, checked against its type so the seam cannot drift. */
export const calc: CalcEntryPoints = { computeFault, tolerableBodyAmps, cableRating, clampRatingAt, analyseNetwork };
