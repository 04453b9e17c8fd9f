import type { SchemeMember, SchemeResult } from '../../shared/engine/index';

/** How much of the scheme `calc plan` prints (calc-interface.md fields are in every view but summary). */
export type PlanOutputView = 'summary' | 'default' | 'detail';

/** Per-member fields only `--detail` prints: the full sizing record and the load list (repeated text per member). */
const DETAIL_ONLY = new Set<string>(['design', 'loads']);

function summaryMember(m: SchemeMember): Record<string, unknown> {
  // Every member carries the composite fields in calc plan's output (null where not composite).
  return { id: m.id, mark: m.mark, shape: m.shape, passes: m.passes, ratio: m.ratio, governing: m.governing, studs: m.studs ?? null, camber_in: m.camber_in ?? null, percentComposite: m.percentComposite ?? null, reactions: m.reactions };
}

/**
 * A member's keys in the order the engine writes them (scheme/design-scheme.scheme.ts), then the
 * composite fields `calc plan` always adds. The copies below are written out for members with
 * exactly these keys (a key-by-key copy of 10,000 members was a large part of `calc plan`); any
 * other member is copied key by key, so a field added to the engine is never dropped here.
 */
const ENGINE_KEYS = [
  'id', 'mark', 'kind', 'level', 'shape', 'span_ft', 'passes', 'governing', 'ratio', 'tributaryWidth_ft', 'tributaryArea_ft2',
  'reducibleArea_ft2', 'KLL', 'liveReductionFactor', 'Lb_ft', 'Cb', 'Mr_kipft', 'Mc_kipft', 'weight_plf', 'reactions', 'loads',
  'bracing', 'connections', 'design',
] as const;
const WITH_COMPOSITE = [...ENGINE_KEYS, 'studs', 'camber_in', 'percentComposite'] as const;
const WITH_COMPOSITE_NOTES = [...WITH_COMPOSITE, 'compositeNote', 'designExtras'] as const;

/** Whether the object's own enumerable keys are exactly `keys`, in that order. */
function hasKeysInOrder(o: object, keys: readonly string[]): boolean {
  let i = 0;
  for (const k in o) {
    if (!Object.prototype.hasOwnProperty.call(o, k)) return false;
    if (k !== keys[i++]) return false;
  }
  return i === keys.length;
}

/**
 * The member with studs, camber_in and percentComposite present (null where not composite), the
 * same value as `{ ...m, studs: m.studs ?? null, camber_in: m.camber_in ?? null, percentComposite: m.percentComposite ?? null }`.
 */
export function withCompositeFields(m: SchemeMember): SchemeMember {
  if (m.studs !== undefined && m.camber_in !== undefined && m.percentComposite !== undefined && 'studs' in m && 'camber_in' in m && 'percentComposite' in m) return m;
  if (hasKeysInOrder(m, ENGINE_KEYS)) {
    return {
      id: m.id, mark: m.mark, kind: m.kind, level: m.level, shape: m.shape, span_ft: m.span_ft, passes: m.passes, governing: m.governing, ratio: m.ratio,
      tributaryWidth_ft: m.tributaryWidth_ft, tributaryArea_ft2: m.tributaryArea_ft2, reducibleArea_ft2: m.reducibleArea_ft2, KLL: m.KLL,
      liveReductionFactor: m.liveReductionFactor, Lb_ft: m.Lb_ft, Cb: m.Cb, Mr_kipft: m.Mr_kipft, Mc_kipft: m.Mc_kipft, weight_plf: m.weight_plf,
      reactions: m.reactions, loads: m.loads, bracing: m.bracing, connections: m.connections, design: m.design,
      studs: null, camber_in: null, percentComposite: null,
    };
  }
  return { ...m, studs: m.studs ?? null, camber_in: m.camber_in ?? null, percentComposite: m.percentComposite ?? null };
}

/** A member as the default view prints it: composite fields present, sizing record and loads left out. One copy per member. */
function defaultMember(m: SchemeMember): Record<string, unknown> {
  if (hasKeysInOrder(m, ENGINE_KEYS)) {
    return {
      id: m.id, mark: m.mark, kind: m.kind, level: m.level, shape: m.shape, span_ft: m.span_ft, passes: m.passes, governing: m.governing, ratio: m.ratio,
      tributaryWidth_ft: m.tributaryWidth_ft, tributaryArea_ft2: m.tributaryArea_ft2, reducibleArea_ft2: m.reducibleArea_ft2, KLL: m.KLL,
      liveReductionFactor: m.liveReductionFactor, Lb_ft: m.Lb_ft, Cb: m.Cb, Mr_kipft: m.Mr_kipft, Mc_kipft: m.Mc_kipft, weight_plf: m.weight_plf,
      reactions: m.reactions, bracing: m.bracing, connections: m.connections,
      studs: null, camber_in: null, percentComposite: null,
    };
  }
  const notes = hasKeysInOrder(m, WITH_COMPOSITE_NOTES);
  if (notes || hasKeysInOrder(m, WITH_COMPOSITE)) {
    const out: Record<string, unknown> = {
      id: m.id, mark: m.mark, kind: m.kind, level: m.level, shape: m.shape, span_ft: m.span_ft, passes: m.passes, governing: m.governing, ratio: m.ratio,
      tributaryWidth_ft: m.tributaryWidth_ft, tributaryArea_ft2: m.tributaryArea_ft2, reducibleArea_ft2: m.reducibleArea_ft2, KLL: m.KLL,
      liveReductionFactor: m.liveReductionFactor, Lb_ft: m.Lb_ft, Cb: m.Cb, Mr_kipft: m.Mr_kipft, Mc_kipft: m.Mc_kipft, weight_plf: m.weight_plf,
      reactions: m.reactions, bracing: m.bracing, connections: m.connections,
      studs: m.studs ?? null, camber_in: m.camber_in ?? null, percentComposite: m.percentComposite ?? null,
    };
    if (notes) {
      out.compositeNote = m.compositeNote;
      out.designExtras = m.designExtras;
    }
    return out;
  }
  const full = withCompositeFields(m) as unknown as Record<string, unknown>;
  const out: Record<string, unknown> = {};
  for (const k of Object.keys(full)) if (!DETAIL_ONLY.has(k)) out[k] = full[k];
  return out;
}

/**
 * The document `calc plan` prints. detail: everything the engine returns. default: every field but
 * each member's sizing record and load list (`--detail` adds them). summary: per member id, mark,
 * shape, passes, ratio, governing, studs/camber (null where not composite) and reactions; columns,
 * totals, problems. Every view's members carry studs, camber_in and percentComposite
 * (calc-interface.md "Additions"), each member copied once.
 */
export function planOutput(result: SchemeResult & { repairs: string[] }, view: PlanOutputView): unknown {
  if (view === 'detail') return { ...result, members: result.members.map(withCompositeFields) };
  if (view === 'default') return { ...result, members: result.members.map(defaultMember) };
  return {
    name: result.name,
    members: result.members.map(summaryMember),
    columns: result.columns,
    totals: result.totals,
    problems: result.problems,
    caution: result.caution,
  };
}
