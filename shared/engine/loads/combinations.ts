/**
 * Gravity load combinations, ASCE 7-16 §2.3.1 (strength design, LRFD) and §2.4.1
 * (allowable stress design, ASD). Only the load cases present are combined.
 */
export type LoadCase = 'D' | 'L' | 'Lr' | 'S';
export const LOAD_CASES: readonly LoadCase[] = ['D', 'L', 'Lr', 'S'];

export type LoadFactors = Record<LoadCase, number>;

export interface LoadCombination {
  /** e.g. "1.2D+1.6L+0.5S"; terms of absent cases are left out. */
  name: string;
  /** ASCE 7-16 clause and combination number, e.g. "ASCE 7-16 §2.3.1 (2)". */
  clause: string;
  factors: LoadFactors;
}

export interface CombinationOptions {
  /**
   * ASCE 7-16 §2.3.1 exception 1: the load factor on L in combinations 3 and 4 may be 0.5
   * where L0 ≤ 100 psf, except garages and assembly. Default false: 1.0L (conservative).
   */
  liveLoadFactorHalf?: boolean;
}

/** Terms keep the order written in ASCE 7-16; a factor of 1 is written "1.0" in LRFD, omitted in ASD. */
function make(
  clause: string, terms: [LoadCase, number][], present: ReadonlySet<LoadCase>, method: 'LRFD' | 'ASD',
): LoadCombination | null {
  const factors: LoadFactors = { D: 0, L: 0, Lr: 0, S: 0 };
  const names: string[] = [];
  for (const [c, v] of terms) {
    if (v > 0 && present.has(c)) {
      factors[c] = v;
      names.push(`${v === 1 ? (method === 'LRFD' ? '1.0' : '') : String(v)}${c}`);
    }
  }
  
  if (names.length === 0) return null;
  return { name: names.join('+'), clause, factors };
}

/** True when every factor of a is ≤ b's and the two differ (a cannot govern for loads ≥ 0). */
function dominated(a: LoadFactors, b: LoadFactors): boolean {
  let less = false;
  for (const c of LOAD_CASES) {
    if (a[c] > b[c]) return false;
    if (a[c] < b[c]) less = true;
  }
  return less;
}

/**
 * Combinations for the cases present. Identical ones are merged and a combination whose every
 * factor is ≤ another's is dropped: with gravity loads (all ≥ 0) its moments, shears and
 * deflections are pointwise smaller and every check ratio is monotone in them, so it cannot govern.
 */
const cache = new Map<string, LoadCombination[]>();

/**
 * The cached list itself, frozen (list, combinations and factors): for callers that only read
 * it, many times (a reaction per member end on every redraw), without a copy each time.
 */
export function sharedLoadCombinations(
  method: 'LRFD' | 'ASD', casesPresent: Iterable<LoadCase>, options: CombinationOptions = {},
): readonly Readonly<LoadCombination>[] {
  const present = new Set(casesPresent);
  let key = method === 'LRFD' ? (options.liveLoadFactorHalf ? 'LRFD½' : 'LRFD') : 'ASD';
  for (const c of LOAD_CASES) if (present.has(c)) key += `|${c}`;
  let list = cache.get(key);
  if (!list) {
    list = buildCombinations(method, present, options);
    for (const c of list) {
      Object.freeze(c.factors);
      Object.freeze(c);
    }
    Object.freeze(list);
    cache.set(key, list);
  }
  return list;
}

export function loadCombinations(
  method: 'LRFD' | 'ASD', casesPresent: Iterable<LoadCase>, options: CombinationOptions = {},
): LoadCombination[] {
  const list = sharedLoadCombinations(method, casesPresent, options);
  // Callers get their own copies, free to change.
  const out: LoadCombination[] = [];
  for (const c of list) out.push({ name: c.name, clause: c.clause, factors: { D: c.factors.D, L: c.factors.L, Lr: c.factors.Lr, S: c.factors.S } });
  return out;
}

function buildCombinations(
  method: 'LRFD' | 'ASD', present: ReadonlySet<LoadCase>, options: CombinationOptions,
): LoadCombination[] {
  const raw: (LoadCombination | null)[] = [];
  if (method === 'LRFD') {
    const l34 = options.liveLoadFactorHalf ? 0.5 : 1.0;
    raw.push(make('ASCE 7-16 §2.3.1 (1)', [['D', 1.4]], present, method));
    raw.push(make('ASCE 7-16 §2.3.1 (2)', [['D', 1.2], ['L', 1.6], ['Lr', 0.5]], present, method));
    raw.push(make('ASCE 7-16 §2.3.1 (2)', [['D', 1.2], ['L', 1.6], ['S', 0.5]], present, method));
    raw.push(make('ASCE 7-16 §2.3.1 (3)', [['D', 1.2], ['Lr', 1.6], ['L', l34]], present, method));
    raw.push(make('ASCE 7-16 §2.3.1 (3)', [['D', 1.2], ['S', 1.6], ['L', l34]], present, method));
  } else {
    raw.push(make('ASCE 7-16 §2.4.1 (1)', [['D', 1]], present, method));
    raw.push(make('ASCE 7-16 §2.4.1 (2)', [['D', 1], ['L', 1]], present, method));
    raw.push(make('ASCE 7-16 §2.4.1 (3)', [['D', 1], ['Lr', 1]], present, method));
    raw.push(make('ASCE 7-16 §2.4.1 (3)', [['D', 1], ['S', 1]], present, method));
    raw.push(make('ASCE 7-16 §2.4.1 (4)', [['D', 1], ['L', 0.75], ['Lr', 0.75]], present, method));
    raw.push(make('ASCE 7-16 §2.4.1 (4)', [['D', 1], ['L', 0.75], ['S', 0.75]], present, method));
  }
  const unique: LoadCombination[] = [];
  for (const c of raw) if (c && !unique.some((u) => u.name === c.name)) unique.push(c);
  return unique.filter((c) => !unique.some((o) => o !== c && dominated(c.factors, o.factors)));
}
