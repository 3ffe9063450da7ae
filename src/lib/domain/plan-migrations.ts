/**
 * Stored plan documents are migrated on load: `migratePlan` walks a document written in an older
 * version of the format up to the current one, one registered step per version, before the plan
 * schema parses it. Version 1 is the only version so far, so the registry is empty: the checker's
 * second round and the optional system figures only added optional fields, which version-1
 * documents without them already satisfy (a test keeps such a document parsing). A change that
 * is not additive raises PLAN_VERSION and adds the step from the previous version here, with a
 * test of that step. Pure: it works on the parsed JSON value.
 */
import { PLAN_FORMAT, PLAN_VERSION } from '@/lib/schemas/plan';

export type StoredValue = Record<string, unknown>;

/** A step takes a document of version n and returns it as version n + 1. */
export type PlanStep = (document: StoredValue) => StoredValue;

/** Steps by the version they start from; `PLAN_STEPS[n]` turns version n into n + 1. */
export const PLAN_STEPS: Readonly<Record<number, PlanStep>> = {};

export class PlanVersionError extends Error {}

/**
 * Brings a stored document up to `current` (PLAN_VERSION unless a test says otherwise). A value
 * that is not a plan of this format, a version newer than the code, or a missing step is an
 * error: a stored plan is never guessed at.
 */
export function migratePlan(value: unknown, steps: Readonly<Record<number, PlanStep>> = PLAN_STEPS, current: number = PLAN_VERSION): StoredValue {
  if (!value || typeof value !== 'object' || Array.isArray(value)) throw new PlanVersionError('a stored plan is not an object');
  let document = value as StoredValue;
  if (document.format !== PLAN_FORMAT) throw new PlanVersionError(`a stored plan has format ${JSON.stringify(document.format)}, not "${PLAN_FORMAT}"`);
  let version = document.version;
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) throw new PlanVersionError(`a stored plan has version ${JSON.stringify(version)}`);
  if (version > current) throw new PlanVersionError(`a stored plan has version ${version}, newer than this code's ${current}`);
  while (version < current) {
    const step = steps[version];
    if (!step) throw new PlanVersionError(`no step migrates a plan from version ${version}`);
    document = { ...step(document), version: version + 1 };
    version += 1;
  }
  return document;
}
