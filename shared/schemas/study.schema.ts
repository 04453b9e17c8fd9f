/**
 * The bay study request (`calc study`, calc-interface.md): the region and the option ranges.
 * Every problem names its field ("spacing_ft.step: …") so the command line, the API and the
 * screen can say which one to fix. The plan itself is read by parsePlanFile.
 */
import { z } from 'zod';

/** Most options one study may try: more is refused, naming the ranges that multiply to it. */
export const MAX_STUDY_OPTIONS = 200;
/** Most beam spacings (or counts) one range may list. */
export const MAX_RANGE_VALUES = 200;

export type StudyDirection = 'x' | 'y';

export interface StudyRegion {
  level: string;
  /** A rectangle, sides along x and y: the bays of the grid inside it (or it, as one bay). */
  polygon?: [number, number][];
  /** Several rectangles (a selection of bays). */
  polygons?: [number, number][][];
  /** Every bay of the level that has deck over its centre. */
  wholeLevel?: boolean;
}

export interface StudyRange {
  from: number;
  to: number;
  step: number;
}

export interface StudyUnitPrices {
  steel_usd_per_ton: number;
  connection_usd_each: number;
}

/** A checked study request (without the plan). */
export interface StudySpec {
  region: StudyRegion;
  /** Beam spacings tried, ft (the Infill tool's "max spacing"), or null when counts are given. */
  spacings_ft: number[] | null;
  /** Beam counts per bay tried, or null when spacings are given. */
  beamCounts: number[] | null;
  directions: StudyDirection[];
  /** Bound on the actual depth d of the region's framing, in; null = no limit. */
  depthLimits_in: (number | null)[];
  /** Steel yield stress tried, ksi (the design basis Fy; null = the plan's own). */
  Fy_ksi: (number | null)[];
  /**
   * Composite design of the region's framing tried (true = composite, false = bare steel,
   * null = as the plan has it). Absent in studies stored before the option existed: [null].
   */
  composite?: (boolean | null)[];
  unitPrices: StudyUnitPrices | null;
}

const point = z.tuple([z.number(), z.number()]);
const rangeSchema = z.object({ from: z.number(), to: z.number(), step: z.number().optional() });
const requestSchema = z.object({
  region: z.object({
    level: z.string().min(1, 'give the level id'),
    polygon: z.array(point).optional(),
    polygons: z.array(z.array(point)).optional(),
    wholeLevel: z.boolean().optional(),
  }),
  spacing_ft: rangeSchema.optional(),
  beamCount: rangeSchema.optional(),
  directions: z.array(z.enum(['x', 'y'])).optional(),
  depthLimits_in: z.array(z.number().nullable()).optional(),
  Fy_ksi: z.array(z.number().nullable()).optional(),
  composite: z.array(z.boolean({ error: 'true (composite), false (bare steel) or null (as the plan has it)' }).nullable()).optional(),
  unitPrices: z.object({ steel_usd_per_ton: z.number(), connection_usd_each: z.number() }).nullable().optional(),
});

const round6 = (v: number) => Math.round(v * 1e6) / 1e6;

/** from, from + step, … up to to (a rounding slack of 1e-9 so 6 to 15 by 0.5 reaches 15). */
function rangeValues(field: string, r: z.infer<typeof rangeSchema>, opts: { whole: boolean; unit: string; defaultStep: number }, problems: string[]): number[] {
  const step = r.step ?? opts.defaultStep;
  const bad = (m: string) => problems.push(`${field}.${m}`);
  let ok = true;
  if (!Number.isFinite(r.from) || r.from <= 0) (bad(`from: must be more than 0${opts.unit} (got ${r.from})`), (ok = false));
  if (!Number.isFinite(r.to) || r.to <= 0) (bad(`to: must be more than 0${opts.unit} (got ${r.to})`), (ok = false));
  if (!Number.isFinite(step) || step <= 0) (bad(`step: must be more than 0${opts.unit} (got ${step})`), (ok = false));
  if (opts.whole) {
    for (const [k, v] of [['from', r.from], ['to', r.to], ['step', step]] as const) if (Number.isFinite(v) && v > 0 && !Number.isInteger(v)) (bad(`${k}: must be a whole number (got ${v})`), (ok = false));
  }
  if (ok && r.from > r.to) (bad(`from: must not be more than to (${r.from} > ${r.to})`), (ok = false));
  if (!ok) return [];
  const n = Math.floor((r.to - r.from) / step + 1e-9) + 1;
  if (n > MAX_RANGE_VALUES) {
    bad(`step: ${r.from} to ${r.to} by ${step} gives ${n} values; at most ${MAX_RANGE_VALUES}`);
    return [];
  }
  return Array.from({ length: n }, (_, k) => round6(r.from + k * step));
}

function isAxisRectangle(poly: [number, number][]): boolean {
  if (poly.length !== 4 && !(poly.length === 5 && poly[0][0] === poly[4][0] && poly[0][1] === poly[4][1])) return false;
  const xs = new Set(poly.map((p) => p[0]));
  const ys = new Set(poly.map((p) => p[1]));
  if (xs.size !== 2 || ys.size !== 2) return false;
  // Each consecutive side runs along x or along y.
  for (let i = 0; i < 4; i++) {
    const a = poly[i], b = poly[(i + 1) % 4];
    if (a[0] !== b[0] && a[1] !== b[1]) return false;
  }
  return true;
}

/** Reads and checks a study request. `problems` is empty exactly when `spec` is set. */
export function parseStudySpec(json: unknown): { spec: StudySpec | null; problems: string[] } {
  const parsed = requestSchema.safeParse(json);
  if (!parsed.success) {
    return { spec: null, problems: parsed.error.issues.map((i) => `${i.path.join('.') || 'input'}: ${i.message}`) };
  }
  const v = parsed.data;
  const problems: string[] = [];

  const region = v.region;
  const kinds = [region.polygon !== undefined, region.polygons !== undefined, region.wholeLevel === true].filter(Boolean).length;
  if (kinds !== 1) problems.push('region: give exactly one of polygon (a rectangle), polygons (several bays) or wholeLevel: true');
  const rects = region.polygon ? [region.polygon] : region.polygons ?? [];
  if (region.polygons && region.polygons.length === 0) problems.push('region.polygons: give at least one bay');
  rects.forEach((poly, i) => {
    const at = region.polygon ? 'region.polygon' : `region.polygons.${i}`;
    if (!isAxisRectangle(poly)) problems.push(`${at}: must be a rectangle of 4 corners with sides along x and y`);
  });

  let spacings: number[] | null = null;
  let counts: number[] | null = null;
  if ((v.spacing_ft === undefined) === (v.beamCount === undefined)) {
    problems.push('spacing_ft: give a beam spacing range (spacing_ft) or a beam count range (beamCount), not both');
  } else if (v.spacing_ft) {
    spacings = rangeValues('spacing_ft', v.spacing_ft, { whole: false, unit: ' ft', defaultStep: 1 }, problems);
  } else if (v.beamCount) {
    counts = rangeValues('beamCount', v.beamCount, { whole: true, unit: '', defaultStep: 1 }, problems);
    if (counts.some((c) => c > 100)) problems.push('beamCount.to: at most 100 beams per bay (the Infill tool\'s limit)');
  }

  const directions = [...new Set(v.directions ?? ['x', 'y'])] as StudyDirection[];
  if (directions.length === 0) problems.push('directions: give "x", "y" or both');

  const depthLimits = [...new Set(v.depthLimits_in ?? [null])];
  if (depthLimits.length === 0) problems.push('depthLimits_in: give at least one limit, or null for none');
  depthLimits.forEach((d, i) => {
    if (d !== null && !(Number.isFinite(d) && d > 0)) problems.push(`depthLimits_in.${i}: must be more than 0 in, or null for no limit (got ${d})`);
  });

  const grades = [...new Set(v.Fy_ksi ?? [null])];
  if (grades.length === 0) problems.push('Fy_ksi: give at least one yield stress, or null for the plan\'s own');
  grades.forEach((f, i) => {
    // AISC Manual 15th ed. Table 2-4 lists W-shape grades with Fy from 36 to 70 ksi (recalled from memory).
    if (f !== null && !(Number.isFinite(f) && f >= 36 && f <= 70)) problems.push(`Fy_ksi.${i}: must be from 36 to 70 ksi (got ${f})`);
  });

  const composite = [...new Set(v.composite ?? [null])];
  if (composite.length === 0) problems.push('composite: give true (composite), false (bare steel) or both, or null for the plan\'s own');

  const prices = v.unitPrices ?? null;
  if (prices) {
    if (!(prices.steel_usd_per_ton >= 0)) problems.push('unitPrices.steel_usd_per_ton: must be 0 or more');
    if (!(prices.connection_usd_each >= 0)) problems.push('unitPrices.connection_usd_each: must be 0 or more');
  }

  const layouts = (spacings ?? counts ?? []).length;
  const total = layouts * directions.length * depthLimits.length * grades.length * composite.length;
  if (problems.length === 0 && total > MAX_STUDY_OPTIONS) {
    const field = v.spacing_ft ? 'spacing_ft' : 'beamCount';
    problems.push(
      `${field}: ${layouts} ${v.spacing_ft ? 'spacings' : 'counts'} × ${directions.length} directions × ${depthLimits.length} depth limits × ${grades.length} grades${composite.length > 1 ? ` × ${composite.length} composite choices` : ''} = ${total} options; at most ${MAX_STUDY_OPTIONS} per study (use a larger step or fewer choices)`,
    );
  }
  if (problems.length > 0) return { spec: null, problems };
  return {
    spec: {
      region: { level: region.level, ...(region.polygon ? { polygon: region.polygon } : {}), ...(region.polygons ? { polygons: region.polygons } : {}), ...(region.wholeLevel ? { wholeLevel: true } : {}) },
      spacings_ft: spacings,
      beamCounts: counts,
      directions,
      depthLimits_in: depthLimits,
      Fy_ksi: grades,
      composite,
      unitPrices: prices,
    },
    problems: [],
  };
}
