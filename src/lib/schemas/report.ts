/**
 * The check report, version 1 (docs/plan-format.md, "Check report"), as zod: every stored report
 * is read through `parseStoredReport` instead of being cast. The checker writes the report; this
 * schema is what a reader may rely on. Unknown extra fields pass through (later additions are
 * optional by the contract), and `reportSchemaMatchesType` below keeps schema and type in step.
 */
import { z } from 'zod';
import { SET_STATUSES } from '@/lib/domain/equipment';
import { REPORT_FORMAT, REPORT_VERSION, SEVERITIES, type CheckReport } from '@/lib/domain/report';

const figure = z.number().nullable();
const optionalFigure = figure.optional();

export const findingSchema = z.object({
  rule: z.string(),
  severity: z.enum(SEVERITIES),
  elements: z.array(z.string()),
  message: z.string(),
  basis: z.string(),
}).passthrough();

const faultSchema = z.object({
  symmetricalKa: figure,
  durationS: figure,
  decrementFactor: figure,
  asymmetricalKa: figure,
  peakFactor: figure,
  peakKa: figure,
  peakForceNPerM: figure,
  injectedKa: optionalFigure,
  lineToNeutralVolts: optionalFigure,
}).passthrough();

const zoneSchema = z.object({
  nodes: z.array(z.string()),
  grounded: z.boolean(),
  groundedOnlyViaPoleGround: z.boolean().optional(),
  poleGroundDependent: z.array(z.string()).optional(),
}).passthrough();

const contactSchema = z.object({
  worker: z.string(),
  surface: z.string(),
  touchVolts: figure,
  bodyAmps: figure,
  limitAmps: figure,
  worstPhase: z.string().nullable().optional(),
  status: z.enum(['solved', 'floating']).optional(),
  systemVoltageLimited: z.boolean().optional(),
}).passthrough();

const jumperSchema = z.object({
  link: z.string(),
  ohms: figure,
  dutyKa: figure,
  cableRatingKa: figure,
  clampRatingKa: figure,
  resistanceOhms: optionalFigure,
  reactanceOhms: optionalFigure,
  fusingKa: optionalFigure,
  currentKa: optionalFigure,
}).passthrough();

const rodSchema = z.object({
  node: z.string(),
  ohms: figure,
  method: z.string().optional(),
  barricadeRadiusM: optionalFigure,
  tolerableStepVolts: optionalFigure,
  barricadeMethod: z.string().optional(),
  currentKa: optionalFigure,
  potentialRiseVolts: optionalFigure,
}).passthrough();

const setSchema = z.object({
  tag: z.string(),
  jumpers: z.array(z.string()),
  known: z.boolean(),
  status: z.enum(SET_STATUSES).nullable(),
  lastTestedOn: z.string().nullable(),
  testDueOn: z.string().nullable(),
  due: z.enum(['overdue', 'soon', 'ok']).nullable(),
}).passthrough();

export const reportSchema = z.object({
  format: z.literal(REPORT_FORMAT),
  version: z.literal(REPORT_VERSION),
  ok: z.boolean(),
  summary: z.object({ blockers: z.number().int().min(0), warnings: z.number().int().min(0), notes: z.number().int().min(0) }),
  findings: z.array(findingSchema),
  fault: faultSchema,
  tolerableBodyAmps: figure,
  zones: z.array(zoneSchema),
  contacts: z.array(contactSchema),
  jumpers: z.array(jumperSchema),
  rods: z.array(rodSchema),
  bonds: z.array(z.object({ link: z.string(), currentKa: figure, ohmsGiven: z.boolean() }).passthrough()).optional(),
  assumptions: z.array(z.object({ element: z.string(), field: z.string(), value: figure, unit: z.string(), basis: z.string() }).passthrough()).optional(),
  sets: z.array(setSchema).optional(),
  caution: z.string(),
}).passthrough();

// Compile-time guard: what the schema yields is a CheckReport (a new required field on the type
// without one here fails the type check).
type Parsed = z.infer<typeof reportSchema>;
export const reportSchemaMatchesType = (parsed: Parsed): CheckReport => parsed;

/** Parses a report as stored (JSON text); a corrupt row is an error, never silently used. */
export function parseStoredReport(text: string): CheckReport;
export function parseStoredReport(text: string | null): CheckReport | null;
export function parseStoredReport(text: string | null): CheckReport | null {
  return text === null ? null : reportSchema.parse(JSON.parse(text));
}
