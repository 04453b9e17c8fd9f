/**
 * Column loads, cumulative from the top down (design-basis §2, calc-interface `columns`):
 * live load reduced on the column's cumulative tributary area with KLL = 4 (ASCE 7-16
 * Table 4.7-1, interior and exterior columns without cantilever slabs) and the 0.40 limit
 * once two or more floors contribute reducible live load (§4.7.2). Where a member with a
 * cantilever slab delivers to the column, KLL = 2 is used (corner column with cantilever
 * slab; conservative, as edge/corner position is not worked out).
 * Column self weight is not included (columns are not sized here).
 */
import type { Plan } from '../../schemas/plan.schema';
import { kllTable4_7_1, liveLoadReductionFactor } from '../loads/live-load-reduction.loads';
import { loadCombinations, type LoadCase } from '../loads/combinations';

export interface ColumnReceipt {
  columnId: string;
  level: string;
  D_kip: number;
  L_kip: number;
  Lreducible_kip: number;
  Lr_kip: number;
  S_kip: number;
  area_ft2: number;
  reducibleArea_ft2: number;
  cantileverSlab: boolean;
  source: string;
}

export interface ColumnLevelTakedown {
  level: string;
  D_kip: number;
  /** Reduced live load. */
  L_kip: number;
  Lunreduced_kip: number;
  Lr_kip: number;
  S_kip: number;
  tributaryArea_ft2: number;
  reducibleArea_ft2: number;
  KLL: number;
  /** Floors contributing reducible live load, this level and above. */
  floors: number;
  liveReductionFactor: number;
  Pr_kip: number;
  combination: string;
}

export interface ColumnTakedown {
  id: string;
  levels: ColumnLevelTakedown[];
}

/** Combinations by method and cases present (loadCombinations copies its list on every call). */
const combinationsByKey = new Map<string, ReturnType<typeof loadCombinations>>();

/** Required axial strength: the largest gravity combination of ASCE 7-16 §2.3.1 (LRFD) or §2.4.1 (ASD), L factor 1.0. */
export function columnRequiredAxialKip(method: 'LRFD' | 'ASD', D: number, L: number, Lr: number, S: number): { Pr_kip: number; combination: string } {
  const present: LoadCase[] = [];
  let key: string = method;
  if (D !== 0) { present.push('D'); key += 'D'; }
  if (L !== 0) { present.push('L'); key += 'L'; }
  if (Lr !== 0) { present.push('Lr'); key += 'r'; }
  if (S !== 0) { present.push('S'); key += 'S'; }
  let combos = combinationsByKey.get(key);
  if (!combos) {
    combos = loadCombinations(method, present.length ? present : ['D']);
    combinationsByKey.set(key, combos);
  }
  let bestPr = 0;
  let bestName = method === 'LRFD' ? '1.4D' : 'D';
  for (const combo of combos) {
    const f = combo.factors;
    // Sum in LOAD_CASES order (D, L, Lr, S), from 0, as the clause lists them.
    const p = 0 + f.D * D + f.L * L + f.Lr * Lr + f.S * S;
    if (p > bestPr + 1e-12) {
      bestPr = p;
      bestName = combo.name;
    }
  }
  return { Pr_kip: bestPr, combination: bestName };
}

const NO_RECEIPTS: readonly ColumnReceipt[] = [];

export function stackColumns(plan: Plan, receipts: readonly ColumnReceipt[], liveLoadReduction: boolean): ColumnTakedown[] {
  const elevation = new Map(plan.levels.map((l) => [l.id, l.elevation_ft]));
  // Receipts by column, then by level, each list in the order received.
  const byColumnLevel = new Map<string, Map<string, ColumnReceipt[]>>();
  for (const r of receipts) {
    let levels = byColumnLevel.get(r.columnId);
    if (!levels) byColumnLevel.set(r.columnId, (levels = new Map()));
    let list = levels.get(r.level);
    if (!list) levels.set(r.level, (list = []));
    list.push(r);
  }
  return plan.columns.map((column) => {
    const levels = column.levels.filter((l) => elevation.has(l)).sort((a, b) => elevation.get(b)! - elevation.get(a)!);
    let D = 0, Lred = 0, Lall = 0, Lr = 0, S = 0, area = 0, redArea = 0, floors = 0;
    let cantilever = false;
    const out: ColumnLevelTakedown[] = levels.map((level) => {
      const here = byColumnLevel.get(column.id)?.get(level) ?? NO_RECEIPTS;
      let levelRedArea = 0;
      for (const r of here) {
        D += r.D_kip;
        Lall += r.L_kip;
        Lred += r.Lreducible_kip;
        Lr += r.Lr_kip;
        S += r.S_kip;
        area += r.area_ft2;
        levelRedArea += r.reducibleArea_ft2;
        cantilever ||= r.cantileverSlab;
      }
      redArea += levelRedArea;
      if (levelRedArea > 1e-9) floors += 1;
      const KLL = cantilever ? kllTable4_7_1('corner-column-with-cantilever-slab') : kllTable4_7_1('interior-column');
      const factor = liveLoadReduction ? liveLoadReductionFactor(KLL, redArea, floors) : 1;
      const L = Lred * factor + (Lall - Lred);
      const pr = columnRequiredAxialKip(plan.designBasis.method, D, L, Lr, S);
      return {
        level,
        D_kip: D,
        L_kip: L,
        Lunreduced_kip: Lall,
        Lr_kip: Lr,
        S_kip: S,
        tributaryArea_ft2: area,
        reducibleArea_ft2: redArea,
        KLL,
        floors,
        liveReductionFactor: factor,
        Pr_kip: pr.Pr_kip,
        combination: pr.combination,
      };
    });
    return { id: column.id, levels: out };
  });
}
