/**
 * Repair step run after the zod parse (architecture habit 6). Fixes what can be fixed
 * without guessing the engineer's intent and lists each fix; lists what it could not fix
 * as problems naming the element.
 */
import type { Plan, PlanFile, PlanPolygon } from './plan.schema';
import { planProblem, type PlanProblem } from './plan-problem.schema';
import { signedAreaFt2 } from '../engine/geometry/polygon.geometry';

/** Points closer than this are the same point (plan feet). Matches the topology tolerance. */
export const REPAIR_POINT_TOLERANCE_FT = 0.01;

export interface RepairOutcome {
  plan: Plan;
  repairs: string[];
  problems: PlanProblem[];
}

function samePoint(a: readonly [number, number], b: readonly [number, number]): boolean {
  return Math.hypot(a[0] - b[0], a[1] - b[1]) <= REPAIR_POINT_TOLERANCE_FT;
}

/** Drop repeated points and a closing point equal to the first; orient counter-clockwise. */
export function repairPolygon(polygon: PlanPolygon): { polygon: PlanPolygon; removedPoints: number; reoriented: boolean } {
  const kept: PlanPolygon = [];
  for (const p of polygon) {
    if (kept.length === 0 || !samePoint(kept[kept.length - 1], p)) kept.push([p[0], p[1]]);
  }
  while (kept.length > 1 && samePoint(kept[0], kept[kept.length - 1])) kept.pop();
  const removedPoints = polygon.length - kept.length;
  const reoriented = kept.length >= 3 && signedAreaFt2(kept) < 0;
  if (reoriented) kept.reverse();
  return { polygon: kept, removedPoints, reoriented };
}

/**
 * The plan with its repairs made, and the problems no repair can make. The input is left as it
 * is (the plan is a copy) unless `inPlace`: only for a value nothing else holds, such as the
 * schema's fresh output in parsePlanFile (repairs change fields of the plan's own elements, never
 * a schema default), where the copy of a 10,000-member plan was a fifth of reading the file.
 */
export function repairPlan(input: PlanFile, { inPlace = false }: { inPlace?: boolean } = {}): RepairOutcome {
  const plan = inPlace ? input : (structuredClone(input) as PlanFile);
  const repairs: string[] = [];
  const problems: PlanProblem[] = [];

  // Ids must be unique across elements that reference each other or are named in results.
  const seen = new Map<string, string>();
  const checkUnique = (collection: string, items: { id?: string }[]) => {
    items.forEach((item, i) => {
      if (item.id === undefined) return;
      const where = `${collection}[${i}]`;
      const first = seen.get(item.id);
      if (first !== undefined) {
        problems.push(planProblem('error', 'duplicate-id', `${where}: id "${item.id}" is already used by ${first}`, { elementId: item.id, path: `${where}.id` }));
      } else seen.set(item.id, where);
    });
  };
  checkUnique('levels', plan.levels);
  checkUnique('columns', plan.columns);
  checkUnique('members', plan.members);
  checkUnique('decks', plan.decks);
  checkUnique('pointLoads', plan.pointLoads);
  checkUnique('lineLoads', plan.lineLoads);
  checkUnique('openings', plan.openings);
  // Zones and grids live in their own namespaces (referenced only by kind).
  const zoneIds = new Set<string>();
  plan.zones.forEach((z, i) => {
    if (zoneIds.has(z.id)) problems.push(planProblem('error', 'duplicate-id', `zones[${i}]: zone id "${z.id}" is used twice`, { elementId: z.id, path: `zones[${i}].id` }));
    zoneIds.add(z.id);
  });
  const gridIds = new Set<string>();
  (plan.grids ?? []).forEach((g, i) => {
    if (gridIds.has(g.id)) problems.push(planProblem('error', 'duplicate-id', `grids[${i}]: grid id "${g.id}" is used twice`, { elementId: g.id, path: `grids[${i}].id` }));
    gridIds.add(g.id);
  });

  // Missing ids on loads and openings: assign the next free "<prefix><n>".
  const assignIds = (collection: string, prefix: string, items: { id?: string }[]) => {
    let n = 1;
    items.forEach((item, i) => {
      if (item.id !== undefined) return;
      while (seen.has(`${prefix}${n}`)) n++;
      item.id = `${prefix}${n}`;
      seen.set(item.id, `${collection}[${i}]`);
      repairs.push(`${collection}[${i}]: had no id, assigned "${item.id}"`);
    });
  };
  assignIds('pointLoads', 'P', plan.pointLoads);
  assignIds('lineLoads', 'W', plan.lineLoads);
  assignIds('openings', 'O', plan.openings);

  const levelIds = new Set(plan.levels.map((l) => l.id));
  const checkLevel = (collection: string, i: number, id: string | undefined, level: string) => {
    if (!levelIds.has(level)) {
      problems.push(planProblem('error', 'unknown-level', `${collection}[${i}]${id ? ` (id ${id})` : ''}: level "${level}" is not in levels`, { elementId: id, path: `${collection}[${i}].level` }));
    }
  };
  plan.members.forEach((m, i) => checkLevel('members', i, m.id, m.level));
  plan.decks.forEach((d, i) => checkLevel('decks', i, d.id, d.level));
  plan.pointLoads.forEach((p, i) => checkLevel('pointLoads', i, p.id, p.level));
  plan.lineLoads.forEach((p, i) => checkLevel('lineLoads', i, p.id, p.level));
  plan.openings.forEach((p, i) => checkLevel('openings', i, p.id, p.level));
  plan.columns.forEach((c, i) => {
    const unique = [...new Set(c.levels)];
    if (unique.length !== c.levels.length) {
      repairs.push(`columns[${i}] (id ${c.id}): repeated level ids removed`);
      c.levels = unique;
    }
    c.levels.forEach((level, k) => {
      if (!levelIds.has(level)) {
        problems.push(planProblem('error', 'unknown-level', `columns[${i}] (id ${c.id}): level "${level}" is not in levels`, { elementId: c.id, path: `columns[${i}].levels[${k}]` }));
      }
    });
  });
  plan.decks.forEach((d, i) => {
    if (!zoneIds.has(d.zone)) {
      problems.push(planProblem('error', 'unknown-zone', `decks[${i}] (id ${d.id}): zone "${d.zone}" is not in zones`, { elementId: d.id, path: `decks[${i}].zone` }));
    }
  });

  // Shapes: trim and upper-case ("w18x35 " → "W18X35"); empty means "let the engine choose".
  plan.members.forEach((m, i) => {
    if (m.shape === null) return;
    const normal = m.shape.trim().toUpperCase();
    if (normal === '') {
      repairs.push(`members[${i}] (id ${m.id}): empty shape read as "engine selects"`);
      m.shape = null;
    } else if (normal !== m.shape) {
      repairs.push(`members[${i}] (id ${m.id}): shape "${m.shape}" written as "${normal}"`);
      m.shape = normal;
    }
  });

  // Locked column sizes: the same normalisation as member shapes.
  plan.columns.forEach((c, i) => {
    (c.tierShapes ?? []).forEach((t, k) => {
      const normal = t.shape.trim().toUpperCase();
      if (normal !== t.shape && normal !== '') {
        repairs.push(`columns[${i}] (id ${c.id}): tierShapes[${k}] shape "${t.shape}" written as "${normal}"`);
        t.shape = normal;
      }
    });
    if (c.shape == null) return;
    const normal = c.shape.trim().toUpperCase();
    if (normal === '') {
      repairs.push(`columns[${i}] (id ${c.id}): empty shape read as "engine sizes it"`);
      c.shape = null;
    } else if (normal !== c.shape) {
      repairs.push(`columns[${i}] (id ${c.id}): shape "${c.shape}" written as "${normal}"`);
      c.shape = normal;
    }
  });

  const fixPolygons = (collection: string, items: { id?: string; polygon: PlanPolygon }[]) => {
    items.forEach((item, i) => {
      const where = `${collection}[${i}] (id ${item.id})`;
      const r = repairPolygon(item.polygon);
      if (r.removedPoints > 0) repairs.push(`${where}: ${r.removedPoints} duplicate polygon point(s) removed`);
      if (r.reoriented) repairs.push(`${where}: clockwise polygon re-oriented counter-clockwise`);
      item.polygon = r.polygon;
      if (r.polygon.length < 3 || Math.abs(signedAreaFt2(r.polygon)) < REPAIR_POINT_TOLERANCE_FT ** 2) {
        problems.push(planProblem('error', 'polygon-degenerate', `${where}: polygon has no area (needs at least 3 distinct points)`, { elementId: item.id, path: `${collection}[${i}].polygon` }));
      }
    });
  };
  fixPolygons('decks', plan.decks);
  fixPolygons('openings', plan.openings);

  return { plan: plan as Plan, repairs, problems };
}
