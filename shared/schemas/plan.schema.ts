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

export type { PlanProblem } from './plan-problem.schema';
export { CURRENT_PLAN_VERSION } from './plan-migrations';
export const PLAN_FORMAT = 'baywright-plan' as const;

const finite = z.number();
const nonNegative = z.number().nonnegative();
const positive = z.number().positive();

export const pointSchema = z.tuple([finite, finite]);
export type PlanPoint = z.infer<typeof pointSchema>;

export const polygonSchema = z.array(pointSchema);
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
  constructionLive_psf: nonNegative.default(20),
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

export const designBasisSchema = z.object({
  method: z.enum(['LRFD', 'ASD']),
  Fy_ksi: positive.default(50),
  liveLoadReduction: z.boolean(),
  deflectionLimits: z.object({
    live: positive.nullable(),
    total: positive.nullable(),
  }),
  /** What "total" deflection includes (design-basis §5): all dead + live, or superimposed dead + live. */
  totalDeflectionIncludes: z.enum(['deadAndLive', 'superimposedDeadAndLive']).optional(),
  /** Composite beams (AISC 360-16 Chapter I; design-basis §6, §6a). Absent = not composite. */
  composite: compositeSettingsSchema.optional(),
});
export type PlanDesignBasis = z.infer<typeof designBasisSchema>;


export const levelSchema = z.object({
  id: z.string().min(1),
  name: z.string(),
  elevation_ft: finite,
  /** A roof level: its live load is roof live (Lr), not reduced by ASCE 7-16 §4.7. */
  roof: z.boolean().optional(),
});
export type PlanLevel = z.infer<typeof levelSchema>;

export const gridSchema = z.object({
  id: z.string().min(1),
  axis: z.enum(['x', 'y']),
  label: z.string(),
  offset_ft: finite,
});
export type PlanGrid = z.infer<typeof gridSchema>;

export const columnSchema = z.object({
  id: z.string().min(1),
  x_ft: finite,
  y_ft: finite,
  /** Level ids at which the column supports framing. */
  levels: z.array(z.string().min(1)),
  /** Version 2: a locked column size, or null (or absent) to size it. */
  shape: z.string().nullable().optional(),
  /** Version 2 (optional): level ids where a new column tier starts. */
  spliceLevels: z.array(z.string().min(1)).optional(),
});
export type PlanColumn = z.infer<typeof columnSchema>;

/** Same shape as the sizing engine's Bracing. */
export const bracingSchema = z.union([
  z.literal('continuous'),
  z.literal('none'),
  z.object({ points_ft: z.array(nonNegative) }),
]);
export type PlanBracing = z.infer<typeof bracingSchema>;

export const memberSchema = z.object({
  id: z.string().min(1),
  level: z.string().min(1),
  kind: z.enum(['girder', 'beam']),
  start: pointSchema,
  end: pointSchema,
  /** Locked shape (e.g. "W18X35") or null to let the engine select. */
  shape: z.string().nullable(),
  /** Bound on the actual depth d, in. */
  maxDepth_in: positive.nullable(),
  minDepth_in: positive.nullable().optional(),
  allowedNominalDepths: z.array(positive).nullable().optional(),
  Lb_override_ft: nonNegative.nullable().optional(),
  /** Bracing override; without it the engine derives bracing from deck and framing. */
  bracing: bracingSchema.nullable().optional(),
  mark: z.string().nullable().optional(),
  markLocked: z.boolean().optional(),
  /** Version 2: null (or absent) follows designBasis.composite; true/false forces composite on/off. */
  composite: z.boolean().nullable().optional(),
  /** Version 2: null (or absent) designs the studs; a count is checked (total on the member). */
  studs: z.number().int().nonnegative().nullable().optional(),
});
export type PlanMember = z.infer<typeof memberSchema>;

export const zoneSchema = z.object({
  id: z.string().min(1),
  name: z.string(),
  dead_psf: nonNegative,
  superimposedDead_psf: nonNegative,
  partition_psf: nonNegative,
  live_psf: nonNegative,
  liveReducible: z.boolean(),
  roofLive_psf: nonNegative,
  snow_psf: nonNegative,
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
  x_ft: finite,
  y_ft: finite,
  D_kip: finite.default(0),
  L_kip: finite.default(0),
  Lr_kip: finite.optional(),
  S_kip: finite.optional(),
});
export type PlanPointLoad = z.infer<typeof pointLoadSchema>;

export const lineLoadSchema = z.object({
  id: z.string().min(1).optional(),
  level: z.string().min(1),
  start: pointSchema,
  end: pointSchema,
  D_klf: finite.default(0),
  L_klf: finite.default(0),
  Lr_klf: finite.optional(),
  S_klf: finite.optional(),
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
  grids: z.array(gridSchema).optional(),
  levels: z.array(levelSchema),
  columns: z.array(columnSchema).default([]),
  members: z.array(memberSchema).default([]),
  zones: z.array(zoneSchema).default([]),
  decks: z.array(deckSchema).default([]),
  pointLoads: z.array(pointLoadSchema).default([]),
  lineLoads: z.array(lineLoadSchema).default([]),
  openings: z.array(openingSchema).default([]),
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
  const repaired = repairPlan(parsed.data);
  return { plan: repaired.plan, repairs: [...migrated.applied, ...repaired.repairs], problems: repaired.problems };
}

/** The plan as it is written to a file (export); parsePlanFile(exportPlanFile(p)).plan deep-equals p. */
export function exportPlanFile(plan: Plan): PlanFileInput {
  return JSON.parse(JSON.stringify(plan)) as PlanFileInput;
}

export const PLAN_COLLECTIONS = COLLECTIONS;
