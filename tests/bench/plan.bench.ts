/**
 * Plan benchmarks (invented regular building of our own):
 * 1. 24 levels × ~418 members ≈ 10,000 members through takedown and design (target ≤ 1 s).
 * 2. one level of ~500 members re-designed after a one-member change, passing the previous
 *    result (target ≤ 50 ms).
 */
import { designScheme } from '../../shared/engine/scheme/design-scheme.scheme';
import { runTakedown } from '../../shared/engine/takedown/gravity-takedown.takedown';
import type { Plan, PlanMember } from '../../shared/schemas/plan.schema';

export interface PlanBenchFigures {
  members: number;
  takedownSeconds: number;
  coldDesignCpuSeconds: number;
  redesignCpuMs: number;
  coldDesignSeconds: number;
  warmDesignSeconds: number;
  passed: number;
  equilibriumErrorD: number;
  levelMembers: number;
  redesignMs: number;
  fullLevelDesignMs: number;
}

/**
 * A regular office building: bays of 30 ft in x and y, beams at 7.5 ft spanning y, girders along x,
 * deck spanning x, a corridor zone down the middle bays, two stair openings per floor, roof on top.
 */
export function regularBuildingPlan(levelsCount: number, baysX: number, baysY: number): Plan {
  const bay = 30;
  const beamsPerBay = 4;
  const levels = Array.from({ length: levelsCount }, (_, i) => ({ id: `L${i + 2}`, name: `Level ${i + 2}`, elevation_ft: 14 * (i + 1), ...(i === levelsCount - 1 ? { roof: true } : {}) }));
  const plan: Plan = {
    format: 'baywright-plan',
    version: 1,
    name: 'Bench: regular building',
    designBasis: { method: 'LRFD', Fy_ksi: 50, liveLoadReduction: true, deflectionLimits: { live: 360, total: 240 } },
    levels,
    columns: [],
    members: [],
    zones: [
      { id: 'office', name: 'Office', dead_psf: 50, superimposedDead_psf: 15, partition_psf: 15, live_psf: 50, liveReducible: true, roofLive_psf: 0, snow_psf: 0 },
      { id: 'corridor', name: 'Corridor', dead_psf: 50, superimposedDead_psf: 15, partition_psf: 0, live_psf: 80, liveReducible: true, roofLive_psf: 0, snow_psf: 0 },
      { id: 'roof', name: 'Roof', dead_psf: 45, superimposedDead_psf: 10, partition_psf: 0, live_psf: 0, liveReducible: false, roofLive_psf: 20, snow_psf: 25 },
    ],
    decks: [],
    pointLoads: [],
    lineLoads: [],
    openings: [],
  };
  const X = baysX * bay;
  const Y = baysY * bay;
  for (let i = 0; i <= baysX; i++) for (let j = 0; j <= baysY; j++) plan.columns.push({ id: `C${i}-${j}`, x_ft: i * bay, y_ft: j * bay, levels: levels.map((l) => l.id) });
  const corridorY0 = Math.floor(baysY / 2) * bay;
  for (const level of levels) {
    const L = level.id;
    const m = (id: string, kind: 'girder' | 'beam', start: [number, number], end: [number, number]): PlanMember => ({ id: `${L}-${id}`, level: L, kind, start, end, shape: null, maxDepth_in: null });
    for (let j = 0; j <= baysY; j++) for (let i = 0; i < baysX; i++) plan.members.push(m(`G${i}-${j}`, 'girder', [i * bay, j * bay], [(i + 1) * bay, j * bay]));
    for (let k = 0; k <= baysX * beamsPerBay; k++) {
      const x = (k * bay) / beamsPerBay;
      for (let j = 0; j < baysY; j++) plan.members.push(m(`B${k}-${j}`, 'beam', [x, j * bay], [x, (j + 1) * bay]));
    }
    if (level.roof) {
      plan.decks.push({ id: `${L}-d`, level: L, polygon: [[0, 0], [X, 0], [X, Y], [0, Y]], spanDirection: 'x', zone: 'roof' });
    } else {
      plan.decks.push(
        { id: `${L}-d1`, level: L, polygon: [[0, 0], [X, 0], [X, corridorY0], [0, corridorY0]], spanDirection: 'x', zone: 'office' },
        { id: `${L}-d2`, level: L, polygon: [[0, corridorY0], [X, corridorY0], [X, corridorY0 + 8], [0, corridorY0 + 8]], spanDirection: 'x', zone: 'corridor' },
        { id: `${L}-d3`, level: L, polygon: [[0, corridorY0 + 8], [X, corridorY0 + 8], [X, Y], [0, Y]], spanDirection: 'x', zone: 'office' },
      );
      plan.openings.push(
        { id: `${L}-stair1`, level: L, polygon: [[31, 2], [44, 2], [44, 20], [31, 20]] },
        { id: `${L}-stair2`, level: L, polygon: [[X - 44, Y - 20], [X - 31, Y - 20], [X - 31, Y - 2], [X - 44, Y - 2]] },
      );
      plan.lineLoads.push({ id: `${L}-facade`, level: L, start: [0, 0], end: [X, 0], D_klf: 0.4, L_klf: 0 });
      plan.pointLoads.push({ id: `${L}-unit`, level: L, x_ft: 3 * bay + 12, y_ft: 2 * bay + 14, D_kip: 3, L_kip: 0 });
    }
  }
  return plan;
}

const ms = (t0: number) => performance.now() - t0;
/** CPU milliseconds of this process since `c0` (user + system): the one-core figure on a shared machine. */
const cpuMs = (c0: NodeJS.CpuUsage) => {
  const d = process.cpuUsage(c0);
  return (d.user + d.system) / 1000;
};

export function runPlanBench(): PlanBenchFigures {
  const building = regularBuildingPlan(24, 10, 8);
  let t0 = performance.now();
  const takedown = runTakedown(building);
  const takedownSeconds = ms(t0) / 1000;
  t0 = performance.now();
  let c0 = process.cpuUsage();
  const cold = designScheme(building);
  const coldDesignSeconds = ms(t0) / 1000;
  const coldDesignCpuSeconds = cpuMs(c0) / 1000;
  t0 = performance.now();
  const warm = designScheme(building);
  const warmDesignSeconds = ms(t0) / 1000;
  void warm;

  const level = regularBuildingPlan(1, 12, 10);
  level.levels[0].roof = false;
  level.decks = [{ id: 'd', level: level.levels[0].id, polygon: [[0, 0], [360, 0], [360, 300], [0, 300]], spanDirection: 'x', zone: 'office' }];
  let t1 = performance.now();
  const first = designScheme(level);
  const fullLevelDesignMs = ms(t1);
  const changed = structuredClone(level);
  const target = changed.members.find((m) => m.kind === 'beam' && m.id.endsWith('B13-4'))!;
  target.shape = 'W21X50';
  // warm the code path once on a different change so the figure is the steady state an editor sees
  const warmup = structuredClone(level);
  warmup.members.find((m) => m.id.endsWith('B21-6'))!.shape = 'W18X40';
  designScheme(warmup, { previous: first, changedIds: [warmup.members.find((m) => m.id.endsWith('B21-6'))!.id] });
  t1 = performance.now();
  c0 = process.cpuUsage();
  const again = designScheme(changed, { previous: first, changedIds: [target.id] });
  const redesignMs = ms(t1);
  const redesignCpuMs = cpuMs(c0);

  const figures: PlanBenchFigures = {
    members: cold.members.length,
    takedownSeconds,
    coldDesignSeconds,
    coldDesignCpuSeconds,
    redesignCpuMs,
    warmDesignSeconds,
    passed: cold.members.filter((m) => m.passes).length,
    equilibriumErrorD: Math.abs(cold.equilibrium.D.applied_kip - cold.equilibrium.D.reactions_kip),
    levelMembers: again.members.length,
    redesignMs,
    fullLevelDesignMs,
  };
  void takedown;
  process.stdout.write(
    `plan (24 levels): ${figures.members} members; takedown alone ${figures.takedownSeconds.toFixed(3)} s; ` +
      `takedown + design ${figures.coldDesignSeconds.toFixed(3)} s cold (CPU ${figures.coldDesignCpuSeconds.toFixed(3)} s), ${figures.warmDesignSeconds.toFixed(3)} s second run (target ≤ 1 s); ` +
      `${figures.passed} pass; |ΣD applied − ΣD reactions| = ${figures.equilibriumErrorD.toExponential(2)} kip\n` +
      `plan (one level): ${figures.levelMembers} members; full design ${figures.fullLevelDesignMs.toFixed(1)} ms; ` +
      `re-design after one member change ${figures.redesignMs.toFixed(1)} ms (CPU ${figures.redesignCpuMs.toFixed(1)} ms; target ≤ 50 ms)\n`,
  );
  return figures;
}
