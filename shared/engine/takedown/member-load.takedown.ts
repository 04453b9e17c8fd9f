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

/**
 * Join partial loads that continue each other with the same intensity, case and source
 * (a deck cut into bands by an opening elsewhere), and write a full-length one as uniform.
 */
export function mergeContiguousLoads<T extends LoadDistribution>(loads: readonly T[], spanFt: number, sameKind: (a: T, b: T) => boolean): T[] {
  if (loads.filter((l) => l.kind === 'partial').length < 2 && !loads.some((l) => l.kind === 'partial' && l.from_ft <= 1e-9 && l.to_ft >= spanFt - 1e-9)) return [...loads];
  const out: T[] = [];
  const partials = loads.filter((l) => l.kind === 'partial').sort((a, b) => (a as { from_ft: number }).from_ft - (b as { from_ft: number }).from_ft);
  const consumed = new Set<T>();
  for (const first of partials) {
    if (consumed.has(first)) continue;
    consumed.add(first);
    const merged = { ...first } as T & { kind: 'partial'; w_klf: number; from_ft: number; to_ft: number };
    for (const next of partials) {
      if (consumed.has(next)) continue;
      const p = next as unknown as { w_klf: number; from_ft: number; to_ft: number };
      if (Math.abs(p.from_ft - merged.to_ft) < 1e-9 && Math.abs(p.w_klf - merged.w_klf) <= 1e-12 * Math.max(1, Math.abs(p.w_klf)) && sameKind(first, next)) {
        merged.to_ft = p.to_ft;
        consumed.add(next);
      }
    }
    if (merged.from_ft <= 1e-9 && merged.to_ft >= spanFt - 1e-9) {
      const { from_ft: _f, to_ft: _t, ...rest } = merged;
      out.push({ ...rest, kind: 'uniform' } as unknown as T);
    } else out.push(merged);
  }
  // Distributed loads first (merged, by position), then the others in their original order.
  return [...out, ...loads.filter((l) => l.kind !== 'partial')];
}
