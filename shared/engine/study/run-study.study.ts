/**
 * Bay study (`calc study`, calc-interface.md): every framing option of the request applied to
 * the plan (applyStudyOption) and the whole plan designed with the real engine (designScheme:
 * takedown, live load reduction, AISC 360-16 sizing; no shortcut formulas). Figures per option
 * are the tonnage of the region's framing and of the whole scheme (shared/tonnage, the same
 * arithmetic as the Tonnage screen), the cost from unit prices, the deepest shape and the
 * governing check. Options are tried in a fixed order, so the same request gives the same answer.
 *
 * Speed: each design passes the previous one (`previous`), so members an option does not change
 * reuse their designs; options that lay out identically share one design.
 */
import type { Plan } from '../../schemas/plan.schema';
import type { StudySpec, StudyUnitPrices } from '../../schemas/study.schema';
import { MAX_STUDY_OPTIONS } from '../../schemas/study.schema';
import { findWShape } from '../../catalog/w-shapes.catalog';
import { columnTonnageRows, computeTonnage, type TonnageFigures } from '../../tonnage/tonnage';
import { estimateCost } from '../../tonnage/cost';
import { designScheme, SCHEME_CAUTION, type SchemeResult } from '../scheme/design-scheme.scheme';
import type { Bay } from '../layout/bay-infill.layout';
import { applyStudyOption, type StudyOptionSpec } from './apply-option.study';
import { baysAreaFt2, memberInBays, regionBays } from './study-region.study';

export class StudyInputError extends Error {
  constructor(readonly problems: string[]) {
    super(`the study cannot run: ${problems[0] ?? 'bad input'}`);
  }
}

export interface StudyFigures {
  steelWeight_lb: number;
  steel_psf: number;
  pieces: number;
  connections: number;
  /** US dollars from the unit prices; null without prices. */
  cost: number | null;
}

export interface StudyOptionResult extends StudyFigures {
  index: number;
  /** Stable name of the option, e.g. "y-s10-d18-f50". */
  id: string;
  direction: 'x' | 'y';
  /** The spacing asked for (the Infill tool's max spacing), ft; null when a count was asked. */
  spacing_ft: number | null;
  beamCount: number | null;
  depthLimit_in: number | null;
  Fy_ksi: number;
  /** Composite (true) or bare steel (false) asked for the region's framing; null = as the plan has it. */
  composite: boolean | null;
  /** Infill beams laid out in the region, and their widest actual spacing, ft. */
  beams: number | null;
  beamSpacing_ft: number | null;
  /** Deepest actual depth d of the region's framing, in (AISC Manual 15th ed. Table 1-1 values). */
  maxDepth_in: number | null;
  passes: boolean;
  /** The governing check of the region member working hardest, its mark and ratio. */
  governing: string | null;
  governingMember: string | null;
  governingRatio: number | null;
  /** Members of the whole scheme that do not pass. */
  failingMembers: number;
  /** Tonnage of the whole scheme with this option (what Tonnage shows for a scheme made from it). */
  scheme: StudyFigures;
  lightest: boolean;
  cheapest: boolean;
  shallowest: boolean;
  /** Why the option could not be laid out (figures are then 0 and it never passes). */
  error: string | null;
}

export interface StudyResult {
  level: string;
  bays: Bay[];
  /** Gross plan area of the region's bays, ft². */
  floorArea_ft2: number;
  options: StudyOptionResult[];
  /** Figures of the plan as it is, for comparison. */
  current: StudyFigures & { failingMembers: number };
  unitPrices: StudyUnitPrices | null;
  maxOptions: number;
  basis: string;
  caution: string;
}

export const STUDY_BASIS =
  'Each option is laid out by the Infill tool’s rules and the whole scheme is designed with it (gravity takedown, ' +
  'ASCE 7-16 live load reduction, AISC 360-16 sizing). Region figures cover the framing inside the bays and on their ' +
  'edges, per ft² of gross bay area; scheme figures are the Tonnage of the whole scheme. Lightest and cheapest compare ' +
  'the whole scheme, among options that pass. A steel grade option applies to the whole scheme (the design basis has ' +
  'one Fy); a composite option applies to the region’s framing, and a member with no slab build-up over it stays bare steel. Cost is steel tons × price per ton + connections × price each, two connections per member.';

export interface StudyHooks {
  /** Called after each option with how many are done. */
  onProgress?: (done: number, total: number) => void;
  /**
   * designScheme(plan) of this very plan, when the caller already has it (the screen designs
   * the plan while the panel is open): used as the comparison and the first `previous`.
   */
  base?: SchemeResult;
}

/** The options of the request in their fixed order: direction, then spacing/count, depth, grade, composite. */
export function studyOptionSpecs(spec: StudySpec): StudyOptionSpec[] {
  const out: StudyOptionSpec[] = [];
  const layouts = spec.spacings_ft ?? spec.beamCounts ?? [];
  // Studies stored before the composite option have none: the plan's own.
  const composites = spec.composite ?? [null];
  for (const direction of spec.directions) {
    for (const v of layouts) {
      for (const depthLimit_in of spec.depthLimits_in) {
        for (const Fy_ksi of spec.Fy_ksi) {
          for (const composite of composites) {
            out.push({ direction, spacing_ft: spec.spacings_ft ? v : null, beamCount: spec.beamCounts ? v : null, depthLimit_in, Fy_ksi, composite });
          }
        }
      }
    }
  }
  return out;
}

/** "y-s10-dany-f50", with "-c" (composite) or "-b" (bare steel) when the option sets it. */
function optionId(o: StudyOptionSpec, Fy: number): string {
  const layout = o.beamCount !== null ? `n${o.beamCount}` : `s${o.spacing_ft}`;
  const composite = o.composite === true ? '-c' : o.composite === false ? '-b' : '';
  return `${o.direction}-${layout}-d${o.depthLimit_in ?? 'any'}-f${Fy}${composite}`;
}

function figuresOf(t: TonnageFigures, prices: StudyUnitPrices | null): StudyFigures {
  return {
    steelWeight_lb: t.steelWeight_lb,
    steel_psf: t.steel_psf ?? 0,
    pieces: t.pieces,
    connections: t.connections,
    cost: prices ? estimateCost(t, prices).cost_usd : null,
  };
}

/** Tonnage of a designed scheme exactly as the Tonnage screen computes it. */
export function schemeStudyFigures(plan: Plan, design: SchemeResult, prices: StudyUnitPrices | null): StudyFigures {
  // Beams and girders plus the gravity columns by tier, as the Tonnage screen counts them.
  const withColumns = { ...design, members: [...design.members, ...columnTonnageRows(design as unknown as Record<string, unknown>)] };
  return figuresOf(computeTonnage(withColumns, plan.levels).totals, prices);
}

const failing = (d: SchemeResult) => d.members.filter((m) => !m.passes).length;

/** Runs the study. Throws StudyInputError naming the field when the region does not resolve. */
export function runStudy(plan: Plan, spec: StudySpec, hooks: StudyHooks = {}): StudyResult {
  const { bays, problems } = regionBays(plan, spec.region);
  if (problems.length > 0) throw new StudyInputError(problems);
  const specs = studyOptionSpecs(spec);
  if (specs.length > MAX_STUDY_OPTIONS) throw new StudyInputError([`options: ${specs.length} options; at most ${MAX_STUDY_OPTIONS} per study`]);
  const level = spec.region.level;
  const area = baysAreaFt2(bays);
  const prices = spec.unitPrices;

  const base = hooks.base ?? designScheme(plan);
  let previous = base;
  const baseFailing = failing(base);
  const byLayout = new Map<string, SchemeResult>();

  const options: StudyOptionResult[] = specs.map((o, index) => {
    const Fy = o.Fy_ksi ?? plan.designBasis.Fy_ksi;
    const common = {
      index, id: optionId(o, Fy), direction: o.direction, spacing_ft: o.spacing_ft, beamCount: o.beamCount,
      depthLimit_in: o.depthLimit_in, Fy_ksi: Fy, composite: o.composite, lightest: false, cheapest: false, shallowest: false,
    };
    const applied = applyStudyOption(plan, level, bays, o);
    if (!applied.ok) {
      hooks.onProgress?.(index + 1, specs.length);
      const zero: StudyFigures = { steelWeight_lb: 0, steel_psf: 0, pieces: 0, connections: 0, cost: null };
      return {
        ...common, ...zero, beams: null, beamSpacing_ft: null, maxDepth_in: null, passes: false, governing: null, governingMember: null,
        governingRatio: null, failingMembers: 0, scheme: zero, error: applied.error,
      };
    }
    const key = JSON.stringify([applied.plan.designBasis, applied.plan.members, applied.plan.decks]);
    let design = byLayout.get(key);
    if (!design) {
      design = designScheme(applied.plan, { previous });
      byLayout.set(key, design);
      previous = design;
    }
    const drawn = new Map(applied.plan.members.map((m) => [m.id, m]));
    const region = design.members.filter((m) => m.level === level && memberInBays(drawn.get(m.id)!, bays));
    const regionIds = new Set(region.map((m) => m.id));
    const regionT = computeTonnage({ members: region, totals: { floorArea_ft2: area } }).totals;
    let maxDepth_in = 0;
    let worst: (typeof region)[number] | null = null;
    for (const m of region) {
      const d = m.shape ? findWShape(m.shape)?.d_in ?? 0 : 0;
      if (d > maxDepth_in) maxDepth_in = d;
      if (m.ratio !== null && (!worst || m.ratio > (worst.ratio ?? -1))) worst = m;
    }
    const regionErrors = design.problems.some((p) => p.severity === 'error' && p.elementId !== undefined && regionIds.has(p.elementId));
    const schemeFailing = failing(design);
    // Passes: every member of the region passes, no error names one, and the scheme fails no more members than now.
    const passes = region.length > 0 && region.every((m) => m.passes) && !regionErrors && schemeFailing <= baseFailing;
    hooks.onProgress?.(index + 1, specs.length);
    return {
      ...common,
      ...figuresOf(regionT, prices),
      beams: applied.beams,
      beamSpacing_ft: applied.beamSpacing_ft,
      maxDepth_in,
      passes,
      governing: worst?.governing ?? null,
      governingMember: worst ? worst.mark || worst.id : null,
      governingRatio: worst?.ratio ?? null,
      failingMembers: schemeFailing,
      scheme: schemeStudyFigures(applied.plan, design, prices),
      error: null,
    };
  });

  markBest(options);
  return {
    level,
    bays,
    floorArea_ft2: area,
    options,
    current: { ...schemeStudyFigures(plan, base, prices), failingMembers: baseFailing },
    unitPrices: prices,
    maxOptions: MAX_STUDY_OPTIONS,
    basis: STUDY_BASIS,
    caution: SCHEME_CAUTION,
  };
}

/** Relative tolerance for ties (a tie marks every tied option). */
const tied = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));

/** Lightest and cheapest by the whole scheme; shallowest by the region's deepest shape, lighter first on a tie. */
export function markBest(options: StudyOptionResult[]): void {
  const ok = options.filter((o) => o.passes && o.error === null);
  if (ok.length === 0) return;
  const minW = Math.min(...ok.map((o) => o.scheme.steelWeight_lb));
  for (const o of ok) o.lightest = tied(o.scheme.steelWeight_lb, minW);
  const costed = ok.filter((o) => o.scheme.cost !== null);
  if (costed.length > 0) {
    const minC = Math.min(...costed.map((o) => o.scheme.cost!));
    for (const o of costed) o.cheapest = tied(o.scheme.cost!, minC);
  }
  const minD = Math.min(...ok.map((o) => o.maxDepth_in ?? Infinity));
  const shallow = ok.filter((o) => tied(o.maxDepth_in ?? Infinity, minD));
  const minSW = Math.min(...shallow.map((o) => o.scheme.steelWeight_lb));
  for (const o of shallow) o.shallowest = tied(o.scheme.steelWeight_lb, minSW);
}
