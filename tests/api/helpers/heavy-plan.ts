import { regularBuildingPlan } from '../../bench/plan.bench';
import type { Plan } from '../../../shared/schemas/plan.schema';

/**
 * A plan whose design takes seconds (invented building): the bench's regular building with a
 * point load of its own on every beam, so no two members share a design and the memo cannot
 * shorten the run. About 330 kB as JSON, well inside the 2 MB body limit.
 */
export function heavyPlan(levels = 12): Plan {
  const plan = regularBuildingPlan(levels, 6, 4);
  let k = 0;
  for (const m of plan.members) {
    if (m.kind !== 'beam') continue;
    k++;
    const f = ((k * 7919) % 997) / 997;
    plan.pointLoads.push({ id: `hp${k}`, level: m.level, x_ft: m.start[0], y_ft: m.start[1] + 1 + f * 28, D_kip: 1 + f, L_kip: 0.5 + f / 2 });
  }
  return plan;
}
