/**
 * Bounds on every coordinate, magnitude and count of a plan file, so that no file (typed by
 * hand, imported or sent to the API) can make the engine run without end, overflow to
 * Infinity/NaN, or exhaust memory. The bounds are far outside any building the engine
 * designs and each message names the bound. Checked by the zod schema (plan.schema.ts) and,
 * for rules that need more than one field, by `planLimitProblems` after the repair step.
 */
import { z } from 'zod';
import { findWShape } from '../catalog/w-shapes.catalog';
import { FY_RANGE_KSI, MEMBER_MAX_SPAN_FT } from '../engine/sizing/member-input.validation';
import { planProblem, type PlanProblem } from './plan-problem.schema';

export const PLAN_LIMITS = {
  /** Plan extent: every x and y within ± this of the origin, ft. */
  coordinate_ft: 10_000,
  /** Level elevations within ± this, ft. */
  elevation_ft: 5_000,
  /** Longest member, ft: the sizing engine's simple-span limit. */
  span_ft: MEMBER_MAX_SPAN_FT,
  /** Zone pressures, psf. */
  pressure_psf: 2_000,
  /** Placed point loads, kip per case. */
  pointLoad_kip: 10_000,
  /** Placed line loads, klf per case. */
  lineLoad_klf: 1_000,
  /** Deflection limit denominators (span / n). */
  deflectionDenominator: 100_000,
  /** Depth limits, in. (the deepest W-shape is about 44 in.). */
  depth_in: 100,
  /** Any other magnitude (slab and stud properties): far past any real value, so nothing overflows. */
  magnitude: 1_000_000,
  /** Studs on one member. */
  studs: 10_000,
  counts: {
    levels: 200,
    grids: 2_000,
    columns: 20_000,
    members: 50_000,
    zones: 1_000,
    decks: 20_000,
    pointLoads: 20_000,
    lineLoads: 20_000,
    openings: 20_000,
    polygonPoints: 1_000,
    columnLevels: 200,
    bracingPoints: 100,
    nominalDepths: 50,
  },
} as const;

const number = (what: string) => z.number({ error: `must be a number (${what})` });
const within = (max: number, unit: string, what: string) =>
  number(what)
    .min(-max, { error: `must be within ±${max} ${unit} (${what})` })
    .max(max, { error: `must be within ±${max} ${unit} (${what})` });
const upTo = (max: number, unit: string, what: string) =>
  number(what)
    .min(0, { error: `must be 0 or more (${what})` })
    .max(max, { error: `must be at most ${max}${unit ? ` ${unit}` : ''} (${what})` });

/** A plan coordinate, ft. */
export const coordinateFt = within(PLAN_LIMITS.coordinate_ft, 'ft', 'plan extent');
export const elevationFt = within(PLAN_LIMITS.elevation_ft, 'ft', 'level elevation');
export const pressurePsf = upTo(PLAN_LIMITS.pressure_psf, 'psf', 'area load');
/** Placed loads stay signed here: a negative one is refused on save by gravityLoadProblems with its own message. */
export const pointLoadKip = within(PLAN_LIMITS.pointLoad_kip, 'kip', 'point load');
export const lineLoadKlf = within(PLAN_LIMITS.lineLoad_klf, 'klf', 'line load');
export const fyKsi = number('yield stress')
  .min(FY_RANGE_KSI.min, { error: `must be between ${FY_RANGE_KSI.min} and ${FY_RANGE_KSI.max} ksi` })
  .max(FY_RANGE_KSI.max, { error: `must be between ${FY_RANGE_KSI.min} and ${FY_RANGE_KSI.max} ksi` });
export const deflectionDenominator = number('span/n denominator')
  .positive({ error: 'must be a positive span/n denominator or null' })
  .max(PLAN_LIMITS.deflectionDenominator, { error: `must be at most ${PLAN_LIMITS.deflectionDenominator} (span/n denominator)` });
export const depthIn = number('depth')
  .positive({ error: 'must be a positive depth in inches' })
  .max(PLAN_LIMITS.depth_in, { error: `must be at most ${PLAN_LIMITS.depth_in} in` });
export const alongSpanFt = upTo(PLAN_LIMITS.span_ft, 'ft', 'position along the member');
/** Other magnitudes (slab, stud and composite settings). */
export const positiveMagnitude = number('magnitude')
  .positive({ error: 'must be more than 0' })
  .max(PLAN_LIMITS.magnitude, { error: `must be at most ${PLAN_LIMITS.magnitude}` });
export const nonNegativeMagnitude = upTo(PLAN_LIMITS.magnitude, '', 'magnitude');
export const studCount = number('stud count')
  .int({ error: 'must be a whole number of studs' })
  .min(0, { error: 'must be 0 or more (stud count)' })
  .max(PLAN_LIMITS.studs, { error: `must be at most ${PLAN_LIMITS.studs} studs` });

/** A list of at most `max` items, the message naming what it counts. */
export function boundedList<T extends z.ZodType>(item: T, max: number, what: string) {
  return z.array(item).max(max, { error: `must have at most ${max} ${what}` });
}

const at = (collection: string, i: number, id: string | undefined) => `${collection}[${i}]${id ? ` (id ${id.slice(0, 40)})` : ''}`;
const fmt = (v: number) => String(Math.round(v * 1000) / 1000);

/**
 * Rules on a parsed, repaired plan that need more than one field: member spans within the
 * engine's limit, brace points within the span, locked shapes known to the catalog. Errors:
 * the file is refused (calc exit 2, API 422), each naming the member and field.
 */
export function planLimitProblems(plan: {
  members: readonly { id: string; start: readonly [number, number]; end: readonly [number, number]; shape: string | null; bracing?: unknown }[];
}): PlanProblem[] {
  const problems: PlanProblem[] = [];
  plan.members.forEach((m, i) => {
    const where = at('members', i, m.id);
    const span = Math.hypot(m.end[0] - m.start[0], m.end[1] - m.start[1]);
    if (span > PLAN_LIMITS.span_ft) {
      problems.push(planProblem('error', 'member-too-long', `${where}.end: the member is ${fmt(span)} ft long; members must be at most ${PLAN_LIMITS.span_ft} ft (simple spans)`, { elementId: m.id, path: `members[${i}].end` }));
    }
    if (m.shape !== null && !findWShape(m.shape)) {
      problems.push(planProblem('error', 'shape-unknown', `${where}.shape: unknown W-shape "${m.shape.slice(0, 40)}" (not in AISC Shapes Database v15.0)`, { elementId: m.id, path: `members[${i}].shape` }));
    }
    const b = m.bracing as { points_ft?: number[] } | null | undefined;
    if (b && typeof b === 'object' && Array.isArray(b.points_ft)) {
      b.points_ft.forEach((x, k) => {
        if (x > span) {
          problems.push(planProblem('error', 'brace-outside-span', `${where}.bracing.points_ft[${k}]: ${fmt(x)} ft is outside the span 0–${fmt(span)} ft`, { elementId: m.id, path: `members[${i}].bracing.points_ft[${k}]` }));
        }
      });
    }
  });
  return problems;
}
