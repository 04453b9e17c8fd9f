/**
 * Loads on a member as the takedown builds them. Structurally the sizing engine's
 * MemberLoad (shared/engine/index.ts) plus `reducible`, which marks live load that
 * ASCE 7-16 §4.7 may reduce (partitions and non-reducible zones are never marked).
 */
export type LoadCase = 'D' | 'L' | 'Lr' | 'S';

export type LoadDistribution =
  | { kind: 'uniform'; w_klf: number }
  | { kind: 'partial'; w_klf: number; from_ft: number; to_ft: number }
  | { kind: 'linear'; w1_klf: number; w2_klf: number; from_ft: number; to_ft: number }
  | { kind: 'point'; P_kip: number; x_ft: number };

export type TakedownLoad = LoadDistribution & { case: LoadCase; source: string; reducible?: boolean };

/**
 * Tributary area carried, ft², distributed like a load (ft²/ft or ft² at a point) so that it
 * passes to the supports in proportion to the reactions (design-basis §2).
 * `of`: 'all' is every deck area carried; 'reducibleLive' only area whose live load §4.7 may reduce.
 */
export type AreaLoad = LoadDistribution & { of: 'all' | 'reducibleLive' };

export const LOAD_CASES: readonly LoadCase[] = ['D', 'L', 'Lr', 'S'];

type PartialOf<T> = T & { kind: 'partial'; w_klf: number; from_ft: number; to_ft: number };

const byFrom = (a: { from_ft: number }, b: { from_ft: number }) => a.from_ft - b.from_ft;

/** The same load written as a full-length uniform one: every key in its order, without from/to. */
function asUniform<T>(p: PartialOf<T>): T {
  const out: Record<string, unknown> = {};
  for (const k in p) {
    if (k === 'from_ft' || k === 'to_ft') continue;
    out[k] = k === 'kind' ? 'uniform' : (p as Record<string, unknown>)[k];
  }
  return out as T;
}

/**
 * Join partial loads that continue each other with the same intensity, case and source
 * (a deck cut into bands by an opening elsewhere), and write a full-length one as uniform.
 * Loads left as they were are returned as the same objects.
 */
export function mergeContiguousLoads<T extends LoadDistribution>(loads: readonly T[], spanFt: number, sameKind: (a: T, b: T) => boolean): T[] {
  const partials: PartialOf<T>[] = [];
  let fullLength = false;
  for (let i = 0; i < loads.length; i++) {
    const l = loads[i];
    if (l.kind !== 'partial') continue;
    partials.push(l as PartialOf<T>);
    if (l.from_ft <= 1e-9 && l.to_ft >= spanFt - 1e-9) fullLength = true;
  }
  if (partials.length < 2 && !fullLength) return loads.slice();
  partials.sort(byFrom);
  const out: T[] = [];
  const consumed: boolean[] = new Array(partials.length).fill(false);
  for (let i = 0; i < partials.length; i++) {
    if (consumed[i]) continue;
    consumed[i] = true;
    const first = partials[i];
    let toFt = first.to_ft;
    for (let j = 0; j < partials.length; j++) {
      if (consumed[j]) continue;
      const p = partials[j];
      if (Math.abs(p.from_ft - toFt) < 1e-9 && Math.abs(p.w_klf - first.w_klf) <= 1e-12 * Math.max(1, Math.abs(p.w_klf)) && sameKind(first, p)) {
        toFt = p.to_ft;
        consumed[j] = true;
      }
    }
    if (first.from_ft <= 1e-9 && toFt >= spanFt - 1e-9) out.push(asUniform(first));
    else out.push(toFt === first.to_ft ? first : { ...first, to_ft: toFt });
  }
  // Distributed loads first (merged, by position), then the others in their original order.
  for (let i = 0; i < loads.length; i++) if (loads[i].kind !== 'partial') out.push(loads[i]);
  return out;
}
