import type { Plan } from './plan.schema';

/** A new id with this prefix unused anywhere in the plan (ids are unique across collections). */
export function nextId(plan: Plan, prefix: string, taken: Set<string> = usedIds(plan)): string {
  for (let n = 1; ; n++) {
    const id = `${prefix}${n}`;
    if (!taken.has(id)) {
      taken.add(id);
      return id;
    }
  }
}

export function usedIds(plan: Plan): Set<string> {
  const ids = new Set<string>();
  for (const list of [plan.levels, plan.columns, plan.members, plan.decks, plan.pointLoads, plan.lineLoads, plan.openings, plan.zones, plan.grids ?? []]) {
    for (const item of list) ids.add(item.id);
  }
  return ids;
}
