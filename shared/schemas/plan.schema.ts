/**
 * The Baywright plan file ("baywright-plan", version 2; version 1 files migrate on read): the scheme the app exports and
 * imports and `calc plan` reads. Field names follow shared/reference/calc-interface.md and
 * are a contract: fields may be added, none renamed.
 *
 * Loading a file = migrations (plan-migrations.ts) → zod parse (this file) → repair
 * (plan-repair.ts). `parsePlanFile` runs all three.
 *
 * Grids: axis 'x' is a line of constant x (offset_ft is its x), labelled 1, 2, 3 … from
 * low x to high x; axis 'y' is a line of constant y, labelled A, B, C … from low y.
 */
import { z } from 'zod';
import { migratePlanDocument, CURRENT_PLAN_VERSION, PLAN_MIGRATIONS, type PlanMigration } from './plan-migrations';
import { repairPlan } from './plan-repair';
import { planProblem, type PlanProblem } from './plan-problem.schema';
import { formatJsonPath, jsonTooDeepAt, MAX_JSON_DEPTH } from './json-depth';
import {
  PLAN_LIMITS, alongSpanFt, boundedList, coordinateFt, deflectionDenominator, depthIn, elevationFt, fyKsi, lineLoadKlf,
  nonNegativeMagnitude, planLimitProblems, pointLoadKip, positiveMagnitude, pressurePsf, studCount,
} from './plan-limits';

export type { PlanProblem } from './plan-problem.schema';
export { CURRENT_PLAN_VERSION } from './plan-migrations';
export const PLAN_FORMAT = 'baywright-plan' as const;

const LIMIT = PLAN_LIMITS.counts;
const positive = positiveMagnitude;
const nonNegative = nonNegativeMagnitude;

export const pointSchema = z.tuple([coordinateFt, coordinateFt]);
export type PlanPoint = z.infer<typeof pointSchema>;

export const polygonSchema = boundedList(pointSchema, LIMIT.polygonPoints, 'points');
export type PlanPolygon = z.infer<typeof polygonSchema>;

/**
 * designBasis.composite (plan file version 2, calc-interface.md "Additions"). Version 1 files
 * migrate to enabled: false. studEquivalentWeight_lb is the steel weight one stud counts as
 * when selection compares shapes (design-basis §6a, common practice about 10 lb).
 */
export const compositeSettingsSchema = z.object({
  enabled: z.boolean(),
  studDiameter_in: positive.default(0.75),
  studFu_ksi: positive.default(65),
  minPercentComposite: z.number().min(0).max(1).default(0.25),
  constructionLive_psf: pressurePsf.default(20),
  shored: z.boolean().default(false),
  camber: z.boolean().default(true),
  studEquivalentWeight_lb: nonNegative.optional(),
});
export type PlanCompositeSettings = z.infer<typeof compositeSettingsSchema>;

/** The defaults of calc-interface.md "Additions" (what a version 1 file migrates to, with enabled: false). */
export const DEFAULT_COMPOSITE_SETTINGS: PlanCompositeSettings = {
  enabled: false,
  studDiameter_in: 0.75,
  studFu_ksi: 65,
  minPercentComposite: 0.25,
  constructionLive_psf: 20,
  shored: false,
  camber: true,
};

/**
 * designBasis.columns (project settings for gravity columns, design-basis §8): the allowed
 * series (default W14, W12, W10), storeys per tier (default 2, common practice), splice levels
 * for every column that does not set its own, and whether an upper tier may be heavier than
 * the one below it (default false, common practice).
 */
export const columnSettingsSchema = z.object({
  series: boundedList(z.string().regex(/^W\d{1,2}$/, 'a W-shape series such as "W14"'), 12, 'series').min(1, 'choose at least one series').optional(),
  storeysPerTier: z.number().int().min(1).max(6).optional(),
  spliceLevels: boundedList(z.string().min(1), LIMIT.columnLevels, 'splice levels').nullable().optional(),
  allowHeavierAbove: z.boolean().optional(),
});
export type PlanColumnSettings = z.infer<typeof columnSettingsSchema>;

export const designBasisSchema = z.object({
  method: z.enum(['LRFD', 'ASD']),
  Fy_ksi: fyKsi.default(50),
  liveLoadReduction: z.boolean(),
  deflectionLimits: z.object({
    live: deflectionDenominator.nullable(),
    total: deflectionDenominator.nullable(),
  }),
  /** What "total" deflection includes (design-basis §5): all dead + live, or superimposed dead + live. */
  totalDeflectionIncludes: z.enum(['deadAndLive', 'superimposedDeadAndLive']).optional(),
  /** Composite beams (AISC 360-16 Chapter I; design-basis §6, §6a). Absent = not composite. */
  composite: compositeSettingsSchema.optional(),
  /** Gravity columns (AISC 360-16 Chapter E; design-basis §8). Absent = the defaults below. */
  columns: columnSettingsSchema.optional(),
});
export type PlanDesignBasis = z.infer<typeof designBasisSchema>;


export const levelSchema = z.object({
  id: z.string().min(1),
  name: z.string(),
  elevation_ft: elevationFt,
  /** A roof level: its live load is roof live (Lr), not reduced by ASCE 7-16 §4.7. */
  roof: z.boolean().optional(),
});
export type PlanLevel = z.infer<typeof levelSchema>;

export const gridSchema = z.object({
  id: z.string().min(1),
  axis: z.enum(['x', 'y']),
  label: z.string(),
  offset_ft: coordinateFt,
});
export type PlanGrid = z.infer<typeof gridSchema>;

export const columnTierShapeSchema = z.object({
  level: z.string().min(1, 'the level of a length in the tier'),
  shape: z.string().min(1, 'a W-shape such as W14X90'),
});
export type PlanColumnTierShape = z.infer<typeof columnTierShapeSchema>;

export const columnSchema = z.object({
  id: z.string().min(1),
  x_ft: coordinateFt,
  y_ft: coordinateFt,
  /** Level ids at which the column supports framing. */
  levels: boundedList(z.string().min(1), LIMIT.columnLevels, 'levels'),
  /** Version 2: a locked column size, or null (or absent) to size it. */
  shape: z.string().nullable().optional(),
  /** Version 2 (optional): level ids where a new column tier starts. */
  spliceLevels: boundedList(z.string().min(1), LIMIT.columnLevels, 'splice levels').optional(),
  /**
   * Optional: locked tier sizes. Each entry locks the tier holding the column length below
   * `level` (one of the column's levels) to `shape`, checked and never replaced; it takes
   * precedence over `shape` for that tier. The lock follows the length when splices move.
   */
  tierShapes: boundedList(columnTierShapeSchema, LIMIT.columnLevels, 'tier sizes').optional(),
});
export type PlanColumn = z.infer<typeof columnSchema>;

/** Same shape as the sizing engine's Bracing. */
export const bracingSchema = z.union([
  z.literal('continuous'),
  z.literal('none'),
  z.object({ points_ft: boundedList(alongSpanFt, LIMIT.bracingPoints, 'brace points') }),
]);
export type PlanBracing = z.infer<typeof bracingSchema>;

/**
 * Per-member deflection limits (design-basis §5: limits are "editable per project"; this lets
 * the engineer tighten or set one member, e.g. live span/600 under cladding). Denominators n of
 * span/n; a number sets that limit on this member, null or absent follows designBasis.deflectionLimits.
 * A member cannot switch a check off: null means "as the design basis says", never "not checked".
 */
export const memberDeflectionLimitsSchema = z.object({
  live: deflectionDenominator.nullable().optional(),
  total: deflectionDenominator.nullable().optional(),
});
export type PlanMemberDeflectionLimits = z.infer<typeof memberDeflectionLimitsSchema>;

export const memberSchema = z.object({
  id: z.string().min(1),
  level: z.string().min(1),
  kind: z.enum(['girder', 'beam']),
  start: pointSchema,
  end: pointSchema,
  /** Locked shape (e.g. "W18X35") or null to let the engine select. */
  shape: z.string().nullable(),
  /** Bound on the actual depth d, in. */
  maxDepth_in: depthIn.nullable(),
  minDepth_in: depthIn.nullable().optional(),
  allowedNominalDepths: boundedList(depthIn, LIMIT.nominalDepths, 'nominal depths').nullable().optional(),
  Lb_override_ft: alongSpanFt.nullable().optional(),
  /** Bracing override; without it the engine derives bracing from deck and framing. */
  bracing: bracingSchema.nullable().optional(),
  /** Per-member deflection limits; null (or absent) follows the design basis (see memberDeflectionLimitsSchema). */
  deflectionLimits: memberDeflectionLimitsSchema.nullable().optional(),
  mark: z.string().nullable().optional(),
  markLocked: z.boolean().optional(),
  /** Version 2: null (or absent) follows designBasis.composite; true/false forces composite on/off. */
  composite: z.boolean().nullable().optional(),
  /** Version 2: null (or absent) designs the studs; a count is checked (total on the member). */
  studs: studCount.nullable().optional(),
});
export type PlanMember = z.infer<typeof memberSchema>;

export const zoneSchema = z.object({
  id: z.string().min(1),
  name: z.string(),
  dead_psf: pressurePsf,
  superimposedDead_psf: pressurePsf,
  partition_psf: pressurePsf,
  live_psf: pressurePsf,
  liveReducible: z.boolean(),
  roofLive_psf: pressurePsf,
  snow_psf: pressurePsf,
});
export type PlanZone = z.infer<typeof zoneSchema>;

/**
 * decks[].slab (version 2): concrete on fluted deck. Where present the slab weight comes from
 * it and replaces the zone's dead_psf (calc-interface.md "Additions").
 */
export const slabSchema = z.object({
  ribHeight_in: positive,
  toppingThickness_in: positive,
  ribAvgWidth_in: positive,
  ribSpacing_in: positive,
  concreteWeight_pcf: positive,
  fc_ksi: positive,
  deckWeight_psf: nonNegative,
  /** The library profile it started from (Baywright's own names), for the screens only. */
  profile: z.string().optional(),
}).refine((s) => s.ribAvgWidth_in <= s.ribSpacing_in, { message: 'ribAvgWidth_in must not exceed ribSpacing_in', path: ['ribAvgWidth_in'] });
export type PlanSlab = z.infer<typeof slabSchema>;

export const deckSchema = z.object({
  id: z.string().min(1),
  level: z.string().min(1),
  polygon: polygonSchema,
  spanDirection: z.enum(['x', 'y']),
  zone: z.string().min(1),
  slab: slabSchema.optional(),
});
export type PlanDeck = z.infer<typeof deckSchema>;

export const pointLoadSchema = z.object({
  id: z.string().min(1).optional(),
  level: z.string().min(1),
  x_ft: coordinateFt,
  y_ft: coordinateFt,
  D_kip: pointLoadKip.default(0),
  L_kip: pointLoadKip.default(0),
  Lr_kip: pointLoadKip.optional(),
  S_kip: pointLoadKip.optional(),
});
export type PlanPointLoad = z.infer<typeof pointLoadSchema>;

export const lineLoadSchema = z.object({
  id: z.string().min(1).optional(),
  level: z.string().min(1),
  start: pointSchema,
  end: pointSchema,
  D_klf: lineLoadKlf.default(0),
  L_klf: lineLoadKlf.default(0),
  Lr_klf: lineLoadKlf.optional(),
  S_klf: lineLoadKlf.optional(),
});
export type PlanLineLoad = z.infer<typeof lineLoadSchema>;

export const openingSchema = z.object({
  id: z.string().min(1).optional(),
  level: z.string().min(1),
  polygon: polygonSchema,
});
export type PlanOpening = z.infer<typeof openingSchema>;

export const planSchema = z.object({
  format: z.literal(PLAN_FORMAT),
  version: z.literal(2),
  name: z.string(),
  designBasis: designBasisSchema,
  grids: boundedList(gridSchema, LIMIT.grids, 'grid lines').optional(),
  levels: boundedList(levelSchema, LIMIT.levels, 'levels'),
  columns: boundedList(columnSchema, LIMIT.columns, 'columns').default([]),
  members: boundedList(memberSchema, LIMIT.members, 'members').default([]),
  zones: boundedList(zoneSchema, LIMIT.zones, 'zones').default([]),
  decks: boundedList(deckSchema, LIMIT.decks, 'decks').default([]),
  pointLoads: boundedList(pointLoadSchema, LIMIT.pointLoads, 'point loads').default([]),
  lineLoads: boundedList(lineLoadSchema, LIMIT.lineLoads, 'line loads').default([]),
  openings: boundedList(openingSchema, LIMIT.openings, 'openings').default([]),
});
/** A plan as parsed (defaults applied; ids on loads/openings may still be missing before repair). */
export type PlanFile = z.infer<typeof planSchema>;
/** What the file may contain before defaults (for writers). */
export type PlanFileInput = z.input<typeof planSchema>;

/** After repair every point load, line load and opening has an id. */
export type PlanPointLoadRepaired = PlanPointLoad & { id: string };
export type PlanLineLoadRepaired = PlanLineLoad & { id: string };
export type PlanOpeningRepaired = PlanOpening & { id: string };
export type Plan = Omit<PlanFile, 'pointLoads' | 'lineLoads' | 'openings'> & {
  pointLoads: PlanPointLoadRepaired[];
  lineLoads: PlanLineLoadRepaired[];
  openings: PlanOpeningRepaired[];
};

export interface ParsePlanResult {
  /** Null when the file could not be read as a plan (problems say why). */
  plan: Plan | null;
  /** What the repair step fixed, one sentence each. */
  repairs: string[];
  /** What could not be parsed or repaired; severity 'error' means the plan must not be designed. */
  problems: PlanProblem[];
}

const COLLECTIONS = ['levels', 'columns', 'members', 'zones', 'decks', 'pointLoads', 'lineLoads', 'openings', 'grids'] as const;

/** "members[3] (id m7).start" from a zod issue path, naming the element id when the raw input has one. */
export function describeIssuePath(raw: unknown, path: readonly PropertyKey[]): { path: string; elementId?: string } {
  let text = '';
  let elementId: string | undefined;
  let node: unknown = raw;
  path.forEach((key, i) => {
    if (typeof key === 'number') {
      text += `[${key}]`;
      node = Array.isArray(node) ? node[key] : undefined;
      if (i === 1 && node && typeof node === 'object' && typeof (node as { id?: unknown }).id === 'string') {
        elementId = (node as { id: string }).id;
        text += ` (id ${elementId})`;
      }
    } else {
      text += (text ? '.' : '') + String(key);
      node = node && typeof node === 'object' ? (node as Record<string, unknown>)[String(key)] : undefined;
    }
  });
  return elementId === undefined ? { path: text || '(file)' } : { path: text, elementId };
}

/**
 * Read a plan document (already JSON-parsed): migrations, then the zod parse, then repair.
 * Never throws on bad input: the problems say what is wrong and where.
 */
export function parsePlanFile(json: unknown, migrations: readonly PlanMigration[] = PLAN_MIGRATIONS): ParsePlanResult {
  const tooDeep = jsonTooDeepAt(json);
  if (tooDeep) {
    const path = formatJsonPath(tooDeep) || '(file)';
    return { plan: null, repairs: [], problems: [planProblem('error', 'plan-invalid', `${path}: nested more than ${MAX_JSON_DEPTH} levels deep`, { path })] };
  }
  const migrated = migratePlanDocument(json, migrations);
  if (!migrated.ok) return { plan: null, repairs: [], problems: [migrated.problem] };
  const parsed = planSchema.safeParse(migrated.document);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => {
      const where = describeIssuePath(migrated.document, issue.path);
      return planProblem('error', 'plan-invalid', `${where.path}: ${issue.message}`, where);
    });
    return { plan: null, repairs: migrated.applied, problems };
  }
  // The schema's output is a fresh value (every object and list is built by the parse), so it is repaired in place.
  const repaired = repairPlan(parsed.data, { inPlace: true });
  const problems = [...repaired.problems, ...planLimitProblems(repaired.plan)];
  return { plan: repaired.plan, repairs: [...migrated.applied, ...repaired.repairs], problems };
}

/** The plan as it is written to a file (export); parsePlanFile(exportPlanFile(p)).plan deep-equals p. */
export function exportPlanFile(plan: Plan): PlanFileInput {
  return JSON.parse(JSON.stringify(plan)) as PlanFileInput;
}

export const PLAN_COLLECTIONS = COLLECTIONS;
