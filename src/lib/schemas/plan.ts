/**
 * The plan document, version 1 (shared/design/plan-format.md): the one zod schema that the
 * editor, the endpoints, the checker and the command line all parse with.
 * Quantities are stored in fixed SI-ish units whose names carry the unit.
 */
import { z } from 'zod';

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
] as const;
export type NodeKind = (typeof NODE_KINDS)[number];

export const LINK_KINDS = ['jumper', 'bond', 'reach'] as const;
export type LinkKind = (typeof LINK_KINDS)[number];

/** Copper grounding cable sizes, AWG or kcmil; "4" is listed so the minimum-size rule can name it. */
export const CABLE_SIZES = ['4', '2', '1/0', '2/0', '3/0', '4/0', '250', '350'] as const;
export type CableSize = (typeof CABLE_SIZES)[number];

export const MATERIALS = ['wood', 'steel', 'concrete', 'fiberglass'] as const;
export type Material = (typeof MATERIALS)[number];

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
    z.object({ ...nodeBase, kind: z.literal('hardware') }).passthrough(),
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
      })
      .passthrough(),
    z.object({ ...nodeBase, kind: z.literal('earth') }).passthrough(),
    z
      .object({
        ...nodeBase,
        kind: z.literal('bucket'),
        insulatedBoom: z.boolean({ invalid_type_error: 'must be true or false' }).optional(),
      })
      .passthrough(),
    z.object({ ...nodeBase, kind: z.literal('truck'), groundOhms: groundOhms() }).passthrough(),
    z.object({ ...nodeBase, kind: z.literal('mat') }).passthrough(),
    z.object({ ...nodeBase, kind: z.literal('pole-ground') }).passthrough(),
    // A new worker stands nowhere until the user says where (the check blocks until then).
    z.object({ ...nodeBase, kind: z.literal('worker'), standsOn: id().optional() }).passthrough(),
  ],
  {
    errorMap: (issue, ctx) =>
      issue.code === 'invalid_union_discriminator'
        ? { message: `must be one of ${NODE_KINDS.join(', ')}` }
        : issue.code === 'invalid_type'
          ? { message: 'must be an object' }
          : { message: ctx.defaultError },
  },
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
      })
      .passthrough(),
    z.object({ ...linkBase, kind: z.literal('bond'), ohms: ohms() }).passthrough(),
    z.object({ ...linkBase, kind: z.literal('reach') }).passthrough(),
  ],
  {
    errorMap: (issue, ctx) =>
      issue.code === 'invalid_union_discriminator'
        ? { message: `must be one of ${LINK_KINDS.join(', ')}` }
        : issue.code === 'invalid_type'
          ? { message: 'must be an object' }
          : { message: ctx.defaultError },
  },
);
export type PlanLink = z.infer<typeof linkSchema>;
export type LinkOf<K extends LinkKind> = Extract<PlanLink, { kind: K }>;

/** An issue with its path as zod keeps it (keys and indexes). */
export interface RawIssue {
  path: (string | number)[];
  message: string;
}

type LooseNode = { id?: unknown; kind?: unknown; standsOn?: unknown; count?: unknown; spacingM?: unknown };
type LooseLink = { id?: unknown; kind?: unknown; from?: unknown; to?: unknown };
const asList = (value: unknown): Record<string, unknown>[] =>
  Array.isArray(value) ? value.map((item) => (item && typeof item === 'object' ? (item as Record<string, unknown>) : {})) : [];

/**
 * Cross-field rules that a per-field schema cannot state: unique ids, references, rod groups,
 * reach links. Works on the raw input, so a document with a wrong type in one field still gets
 * its broken references reported in the same answer.
 */
export function findReferenceIssues(input: unknown): RawIssue[] {
  const issues: RawIssue[] = [];
  const doc = input && typeof input === 'object' ? (input as Record<string, unknown>) : {};
  const nodes = asList(doc.nodes) as LooseNode[];
  const links = asList(doc.links) as LooseLink[];
  const nodesReadable = Array.isArray(doc.nodes);
  const nodeById = new Map<string, LooseNode>();
  nodes.forEach((node, i) => {
    if (typeof node.id !== 'string') return;
    if (nodeById.has(node.id)) issues.push({ path: ['nodes', i, 'id'], message: `duplicate id "${node.id}"` });
    else nodeById.set(node.id, node);
  });
  nodes.forEach((node, i) => {
    if (node.kind === 'worker' && typeof node.standsOn === 'string') {
      const target = nodeById.get(node.standsOn);
      if (!target) issues.push({ path: ['nodes', i, 'standsOn'], message: `no node with id "${node.standsOn}"` });
      else if (target.kind === 'worker') issues.push({ path: ['nodes', i, 'standsOn'], message: 'a worker cannot stand on a worker' });
    }
    if (node.kind === 'ground-rod' && typeof node.count === 'number' && node.count > 1 && node.spacingM === undefined) {
      issues.push({ path: ['nodes', i, 'spacingM'], message: 'is required when count is more than 1' });
    }
  });
  const linkIds = new Set<string>();
  links.forEach((link, i) => {
    if (typeof link.id === 'string') {
      if (nodeById.has(link.id) || linkIds.has(link.id)) issues.push({ path: ['links', i, 'id'], message: `duplicate id "${link.id}"` });
      linkIds.add(link.id);
    }
    // With no readable node list, every reference would be "missing": report the list once instead.
    for (const end of nodesReadable ? (['from', 'to'] as const) : []) {
      const ref = link[end];
      if (typeof ref === 'string' && !nodeById.has(ref)) issues.push({ path: ['links', i, end], message: `no node with id "${ref}"` });
    }
    if (typeof link.from === 'string' && link.from === link.to) issues.push({ path: ['links', i, 'to'], message: 'must differ from "from"' });
    const fromKind = typeof link.from === 'string' ? nodeById.get(link.from)?.kind : undefined;
    const toKind = typeof link.to === 'string' ? nodeById.get(link.to)?.kind : undefined;
    if (link.kind === 'reach' && fromKind !== undefined && fromKind !== 'worker') {
      issues.push({ path: ['links', i, 'from'], message: 'a reach link starts at a worker' });
    }
    if ((link.kind === 'jumper' || link.kind === 'bond') && (fromKind === 'worker' || toKind === 'worker')) {
      issues.push({ path: ['links', i, 'kind'], message: 'a worker is joined to surfaces by reach links only; a worker is never a bonding path' });
    }
  });
  return issues;
}

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
  const result = planSchema.safeParse(input);
  if (!result.success) for (const issue of result.error.issues) ctx.addIssue({ ...issue, code: 'custom', message: issue.message });
  for (const issue of findReferenceIssues(input)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
  return result.success ? result.data : z.NEVER;
});
