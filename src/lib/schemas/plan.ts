/**
 * The plan document, version 1 (docs/plan-format.md): the one zod schema that the
 * editor, the endpoints, the checker and the command line all parse with.
 * Quantities are stored in fixed SI-ish units whose names carry the unit.
 */
import { z } from 'zod';
import { findDepthIssue } from './depth';
import { findReferenceIssues } from './plan-references';

export { findReferenceIssues, type RawIssue } from './plan-references';

export const PLAN_FORMAT = 'bondmap-plan' as const;
export const PLAN_VERSION = 1 as const;

export const NODE_KINDS = [
  'phase',
  'neutral',
  'shield-wire',
  'structure',
  'crossarm',
  'hardware',
  'cluster-bar',
  'ground-rod',
  'earth',
  'bucket',
  'truck',
  'mat',
  'pole-ground',
  'worker',
  'supply-end',
] as const;
export type NodeKind = (typeof NODE_KINDS)[number];

export const LINK_KINDS = ['jumper', 'bond', 'reach'] as const;
export type LinkKind = (typeof LINK_KINDS)[number];

/** Copper grounding cable sizes, AWG or kcmil; "4" is listed so the minimum-size rule can name it. */
export const CABLE_SIZES = ['4', '2', '1/0', '2/0', '3/0', '4/0', '250', '350'] as const;
export type CableSize = (typeof CABLE_SIZES)[number];

export const MATERIALS = ['wood', 'steel', 'concrete', 'fiberglass'] as const;
export type Material = (typeof MATERIALS)[number];

/** How the rods of a group stand (docs/plan-format.md); absent: the most compact of the three is assumed. */
export const ROD_ARRANGEMENTS = ['line', 'ring', 'grid'] as const;
export type RodArrangement = (typeof ROD_ARRANGEMENTS)[number];

/** What a jumper's clamps are made for, and how its cable is terminated in them (docs/plan-format.md). */
export const CLAMP_KINDS = ['grounding', 'live-line'] as const;
export const CONNECTIONS = ['ferrule', 'bare-strands'] as const;

const finite = () => z.number({ invalid_type_error: 'must be a number', required_error: 'is required' }).finite('must be a finite number');
const positive = () => finite().positive('must be greater than 0');
const id = () =>
  z
    .string({ invalid_type_error: 'must be a string', required_error: 'is required' })
    .trim()
    .min(1, 'must not be empty')
    .max(64, 'must be at most 64 characters');
const label = () => z.string({ invalid_type_error: 'must be a string' }).max(200, 'must be at most 200 characters');

export const systemSchema = z
  .object({
    nominalKv: positive().max(1200, 'must be at most 1200 kV').optional(),
    frequencyHz: z.union([z.literal(50), z.literal(60)], {
      errorMap: () => ({ message: 'must be 50 or 60' }),
    }),
    // Fault data comes from the system operator for each job: a new plan starts without it and the
    // check blocks (rule system-data-missing) until it is entered, so nothing is checked on a guess.
    faultKa: positive().max(200, 'must be at most 200 kA').optional(),
    clearingCycles: positive().max(300, 'must be at most 300 cycles').optional(),
    xOverR: finite().min(0, 'must be 0 or more').max(100, 'must be at most 100').optional(),
    phaseSpacingM: positive().max(100, 'must be at most 100 m').optional(),
  }, { required_error: 'is required', invalid_type_error: 'must be an object' })
  .passthrough();
export type PlanSystem = z.infer<typeof systemSchema>;

export const criteriaSchema = z
  .object({
    bodyKg: z
      .union([z.literal(50), z.literal(70)], { errorMap: () => ({ message: 'must be 50 or 70' }) })
      .optional(),
    bodyOhms: positive().max(100000, 'must be at most 100000 ohms').optional(),
  }, { invalid_type_error: 'must be an object' })
  .passthrough();
export type PlanCriteria = z.infer<typeof criteriaSchema>;

const position = z.object({ x: finite(), y: finite() }).passthrough();

/** The messages of a node or link union: an unknown kind names the known ones; a non-object says so. */
const kindErrors =
  (kinds: readonly string[]): z.ZodErrorMap =>
  (issue, ctx) =>
    issue.code === 'invalid_union_discriminator'
      ? { message: `must be one of ${kinds.join(', ')}` }
      : issue.code === 'invalid_type'
        ? { message: 'must be an object' }
        : { message: ctx.defaultError };

const nodeBase = {
  id: id(),
  label: label().optional(),
  position: position.optional(),
};
const groundOhms = () => positive().max(1e6, 'must be at most 1000000 ohms').optional();
const material = z.enum(MATERIALS, {
  errorMap: () => ({ message: `must be one of ${MATERIALS.join(', ')}` }),
});

export const nodeSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ ...nodeBase, kind: z.literal('phase'), phase: label().optional() }).passthrough(),
    z.object({ ...nodeBase, kind: z.literal('neutral'), groundOhms: groundOhms() }).passthrough(),
    z.object({ ...nodeBase, kind: z.literal('shield-wire'), groundOhms: groundOhms() }).passthrough(),
    z
      .object({ ...nodeBase, kind: z.literal('structure'), material, groundOhms: groundOhms() })
      .passthrough(),
    z.object({ ...nodeBase, kind: z.literal('crossarm'), material }).passthrough(),
    z.object({ ...nodeBase, kind: z.literal('hardware'), groundOhms: groundOhms() }).passthrough(),
    z.object({ ...nodeBase, kind: z.literal('cluster-bar') }).passthrough(),
    z
      .object({
        ...nodeBase,
        kind: z.literal('ground-rod'),
        lengthM: positive().max(100, 'must be at most 100 m'),
        diameterMm: positive().max(200, 'must be at most 200 mm'),
        soilOhmM: positive().max(1e6, 'must be at most 1000000 ohm-metres'),
        count: z.number({ invalid_type_error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1').max(100, 'must be at most 100').optional(),
        spacingM: positive().max(1000, 'must be at most 1000 m').optional(),
        workDistanceM: finite().min(0, 'must be 0 or more').max(10000, 'must be at most 10000 m').optional(),
        arrangement: z.enum(ROD_ARRANGEMENTS, { errorMap: () => ({ message: `must be one of ${ROD_ARRANGEMENTS.join(', ')}` }) }).optional(),
      })
      .passthrough(),
    z.object({ ...nodeBase, kind: z.literal('earth') }).passthrough(),
    z
      .object({
        ...nodeBase,
        kind: z.literal('bucket'),
        insulatedBoom: z.boolean({ invalid_type_error: 'must be true or false' }).optional(),
        onTruck: id().optional(),
      })
      .passthrough(),
    z.object({ ...nodeBase, kind: z.literal('truck'), groundOhms: groundOhms() }).passthrough(),
    z.object({ ...nodeBase, kind: z.literal('mat') }).passthrough(),
    z.object({ ...nodeBase, kind: z.literal('pole-ground') }).passthrough(),
    // A new worker stands nowhere until the user says where (the check blocks until then).
    z.object({ ...nodeBase, kind: z.literal('worker'), standsOn: id().optional() }).passthrough(),
    z
      .object({
        ...nodeBase,
        kind: z.literal('supply-end'),
        phases: z.array(id(), { invalid_type_error: 'must be a list', required_error: 'is required' }).min(1, 'must name at least one phase').max(12, 'must name at most 12 phases'),
      })
      .passthrough(),
  ],
  { errorMap: kindErrors(NODE_KINDS) },
);
export type PlanNode = z.infer<typeof nodeSchema>;
export type NodeOf<K extends NodeKind> = Extract<PlanNode, { kind: K }>;

const linkBase = { id: id(), from: id(), to: id(), label: label().optional() };
const ohms = () => finite().min(0, 'must be 0 or more').max(1e6, 'must be at most 1000000 ohms').optional();

export const linkSchema = z.discriminatedUnion(
  'kind',
  [
    z
      .object({
        ...linkBase,
        kind: z.literal('jumper'),
        cable: z.enum(CABLE_SIZES, {
          errorMap: () => ({ message: `must be one of ${CABLE_SIZES.join(', ')}` }),
        }),
        lengthM: positive().max(1000, 'must be at most 1000 m'),
        spanM: finite().min(0, 'must be 0 or more').max(1000, 'must be at most 1000 m').optional(),
        clampKa: positive().max(500, 'must be at most 500 kA').optional(),
        clampCycles: positive().max(300, 'must be at most 300 cycles').optional(),
        ohms: ohms(),
        equipmentId: id().optional(),
        clampKind: z.enum(CLAMP_KINDS, { errorMap: () => ({ message: `must be one of ${CLAMP_KINDS.join(', ')}` }) }).optional(),
        connection: z.enum(CONNECTIONS, { errorMap: () => ({ message: `must be one of ${CONNECTIONS.join(', ')}` }) }).optional(),
      })
      .passthrough(),
    z
      .object({ ...linkBase, kind: z.literal('bond'), ohms: ohms(), span: z.boolean({ invalid_type_error: 'must be true or false' }).optional() })
      .passthrough(),
    z.object({ ...linkBase, kind: z.literal('reach') }).passthrough(),
  ],
  { errorMap: kindErrors(LINK_KINDS) },
);
export type PlanLink = z.infer<typeof linkSchema>;
export type LinkOf<K extends LinkKind> = Extract<PlanLink, { kind: K }>;

export const MAX_NODES = 20000;
export const MAX_LINKS = 40000;

export const planSchema = z
  .object({
    format: z.literal(PLAN_FORMAT, { errorMap: () => ({ message: `must be "${PLAN_FORMAT}"` }) }),
    version: z.literal(PLAN_VERSION, { errorMap: () => ({ message: `must be ${PLAN_VERSION}` }) }),
    title: z
      .string({ required_error: 'is required', invalid_type_error: 'must be a string' })
      .trim()
      .min(1, 'must not be empty')
      .max(200, 'must be at most 200 characters'),
    system: systemSchema,
    criteria: criteriaSchema.optional(),
    nodes: z.array(nodeSchema, { invalid_type_error: 'must be a list', required_error: 'is required' }).max(MAX_NODES, `must hold at most ${MAX_NODES} nodes`),
    links: z.array(linkSchema, { invalid_type_error: 'must be a list', required_error: 'is required' }).max(MAX_LINKS, `must hold at most ${MAX_LINKS} links`),
  }, { invalid_type_error: 'must be a plan document (a JSON object)' })
  .passthrough();
export type PlanDocument = z.infer<typeof planSchema>;

export interface PlanIssue {
  /** Dotted path into the document, e.g. `nodes[3].standsOn`. */
  path: string;
  message: string;
}

/** Renders a zod path the way the contract prints it: `nodes[3].standsOn`. */
export function formatIssuePath(path: (string | number)[]): string {
  return path.reduce<string>(
    (out, part) => (typeof part === 'number' ? `${out}[${part}]` : out ? `${out}.${part}` : part),
    '',
  ) || '(document)';
}

export function toPlanIssues(error: z.ZodError): PlanIssue[] {
  return error.issues.map((issue) => ({ path: formatIssuePath(issue.path), message: issue.message }));
}

export type ParseResult = { ok: true; plan: PlanDocument } | { ok: false; issues: PlanIssue[] };

/**
 * Parses an unknown value as a plan document, returning every problem by path (field types and
 * cross-references together) rather than throwing.
 */
export function parsePlan(input: unknown): ParseResult {
  const tooDeep = findDepthIssue(input);
  if (tooDeep) return { ok: false, issues: [{ path: formatIssuePath(tooDeep.path), message: tooDeep.message }] };
  const result = planSchema.safeParse(input);
  const references = findReferenceIssues(input).map((i) => ({ path: formatIssuePath(i.path), message: i.message }));
  const issues = [...(result.success ? [] : toPlanIssues(result.error)), ...references];
  return result.success && issues.length === 0 ? { ok: true, plan: result.data } : { ok: false, issues };
}

/**
 * The whole plan document as one zod schema, field types and cross-references together, for
 * nesting in request bodies (`document.nodes[3].standsOn: no node with id "B9"`).
 */
export const planDocumentSchema = z.unknown().transform((input, ctx): PlanDocument => {
  if (input === undefined) {
    ctx.addIssue({ code: 'custom', message: 'is required' });
    return z.NEVER;
  }
  const tooDeep = findDepthIssue(input);
  if (tooDeep) {
    ctx.addIssue({ code: 'custom', path: tooDeep.path, message: tooDeep.message });
    return z.NEVER;
  }
  const result = planSchema.safeParse(input);
  if (!result.success) for (const issue of result.error.issues) ctx.addIssue({ ...issue, code: 'custom', message: issue.message });
  for (const issue of findReferenceIssues(input)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
  return result.success ? result.data : z.NEVER;
});
