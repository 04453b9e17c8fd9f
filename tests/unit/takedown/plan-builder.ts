/** Small builders for test plans (invented bays of our own). */
import type { Plan, PlanMember, PlanZone } from '../../../shared/schemas/plan.schema';

export function zone(id: string, p: Partial<PlanZone> = {}): PlanZone {
  return { id, name: id, dead_psf: 50, superimposedDead_psf: 0, partition_psf: 0, live_psf: 50, liveReducible: true, roofLive_psf: 0, snow_psf: 0, ...p };
}

export function member(id: string, kind: 'girder' | 'beam', start: [number, number], end: [number, number], level = 'L2', extra: Partial<PlanMember> = {}): PlanMember {
  return { id, level, kind, start, end, shape: null, maxDepth_in: null, ...extra };
}

export function emptyPlan(levels: string[] = ['L2']): Plan {
  return {
    format: 'baywright-plan',
    version: 2,
    name: 'test',
    designBasis: { method: 'LRFD', Fy_ksi: 50, liveLoadReduction: true, deflectionLimits: { live: 360, total: 240 } },
    levels: levels.map((id, i) => ({ id, name: id, elevation_ft: 14 * (i + 1) })),
    columns: [],
    members: [],
    zones: [],
    decks: [],
    pointLoads: [],
    lineLoads: [],
    openings: [],
  };
}

/**
 * One bay W × H ft with columns at the corners, girders along x at y = 0 and y = H, and beams
 * along y at x = 0, s, 2s, … W; deck spanning x. Levels share the same framing.
 */
export function singleBay(W = 30, H = 36, s = 10, levels: string[] = ['L2'], z: PlanZone = zone('office')): Plan {
  const plan = emptyPlan(levels);
  plan.zones.push(z);
  for (const [id, x, y] of [['C1', 0, 0], ['C2', W, 0], ['C3', 0, H], ['C4', W, H]] as const) plan.columns.push({ id, x_ft: x, y_ft: y, levels: [...levels] });
  for (const level of levels) {
    const p = levels.length > 1 ? `${level}-` : '';
    plan.members.push(member(`${p}G1`, 'girder', [0, 0], [W, 0], level), member(`${p}G2`, 'girder', [0, H], [W, H], level));
    for (let x = 0, i = 0; x <= W + 1e-9; x += s, i++) plan.members.push(member(`${p}B${i}`, 'beam', [x, 0], [x, H], level));
    plan.decks.push({ id: `${p}d1`, level, polygon: [[0, 0], [W, 0], [W, H], [0, H]], spanDirection: 'x', zone: z.id });
  }
  return plan;
}
