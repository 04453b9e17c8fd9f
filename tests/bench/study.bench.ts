/**
 * Bay study benchmarks (invented regular building of our own, from plan.bench.ts):
 * 1. one 30 ft × 40 ft bay of a 3 × 3-bay level, 10 spacings × 2 directions (20 options) — target ≤ 1 s;
 * 2. a whole level of ~600 members, 10 spacings × 2 directions (20 options) — target ≤ 10 s.
 * Each figure is wall and CPU time of this process, judged on CPU (the cores are shared).
 */
import { runStudy } from '../../shared/engine/study/run-study.study';
import { parseStudySpec } from '../../shared/schemas/study.schema';
import type { Plan } from '../../shared/schemas/plan.schema';
import { regularBuildingPlan, type Timing } from './plan.bench';

export const TARGET_BAY_STUDY_MS = 1000;
export const TARGET_LEVEL_STUDY_MS = 10000;

const cpuNow = () => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};

function timed<T>(run: () => T): { value: T; timing: Timing } {
  const c0 = cpuNow();
  const t0 = performance.now();
  const value = run();
  return { value, timing: { wallMs: performance.now() - t0, cpuMs: cpuNow() - c0 } };
}

/** The regular building's plan with every y coordinate × k (30 ft bays become 30 × 30k). */
export function stretchY(plan: Plan, k: number): Plan {
  const p = (q: [number, number]): [number, number] => [q[0], q[1] * k];
  return {
    ...plan,
    columns: plan.columns.map((c) => ({ ...c, y_ft: c.y_ft * k })),
    members: plan.members.map((m) => ({ ...m, start: p(m.start), end: p(m.end) })),
    decks: plan.decks.map((d) => ({ ...d, polygon: d.polygon.map(p) })),
    openings: plan.openings.map((o) => ({ ...o, polygon: o.polygon.map(p) })),
    pointLoads: plan.pointLoads.map((l) => ({ ...l, y_ft: l.y_ft * k })),
    lineLoads: plan.lineLoads.map((l) => ({ ...l, start: p(l.start), end: p(l.end) })),
  };
}

/** One level of 30 ft × 40 ft bays (3 × 3), offices, no openings or roof. */
export function bayStudyPlan(): Plan {
  const plan = regularBuildingPlan(1, 3, 3);
  plan.levels[0].roof = false;
  plan.openings = [];
  plan.decks = [{ id: 'd', level: plan.levels[0].id, polygon: [[0, 0], [90, 0], [90, 90], [0, 90]], spanDirection: 'x', zone: 'office' }];
  return stretchY(plan, 40 / 30);
}

export function levelStudyPlan(): Plan {
  const plan = regularBuildingPlan(1, 12, 10);
  plan.levels[0].roof = false;
  plan.decks = [{ id: 'd', level: plan.levels[0].id, polygon: [[0, 0], [360, 0], [360, 300], [0, 300]], spanDirection: 'x', zone: 'office' }];
  return plan;
}

const verdict = (t: Timing, targetMs: number) => `${t.cpuMs <= targetMs ? 'PASS' : 'FAIL'} on CPU (wall ${t.wallMs <= targetMs ? 'within' : 'over'} target)`;
const fmt = (t: Timing) => `wall ${t.wallMs.toFixed(0)} ms, CPU ${t.cpuMs.toFixed(0)} ms`;

export function runStudyBench(): { bay: Timing; level: Timing } {
  const bayPlan = bayStudyPlan();
  const baySpec = parseStudySpec({ region: { level: bayPlan.levels[0].id, polygon: [[30, 40], [60, 40], [60, 80], [30, 80]] }, spacing_ft: { from: 6, to: 15, step: 1 }, directions: ['x', 'y'] }).spec!;
  const bay = timed(() => runStudy(bayPlan, baySpec));
  const levelPlan = levelStudyPlan();
  const levelSpec = parseStudySpec({ region: { level: levelPlan.levels[0].id, wholeLevel: true }, spacing_ft: { from: 6, to: 15, step: 1 }, directions: ['x', 'y'] }).spec!;
  const level = timed(() => runStudy(levelPlan, levelSpec));
  process.stdout.write(
    `study (one 30 ft × 40 ft bay, ${bayPlan.members.length}-member level): ${bay.value.options.length} options, ${bay.value.options.filter((o) => o.passes).length} pass; ` +
      `${fmt(bay.timing)}; target ≤ ${TARGET_BAY_STUDY_MS} ms: ${verdict(bay.timing, TARGET_BAY_STUDY_MS)}\n` +
      `study (whole level, ${levelPlan.members.length} members, ${level.value.bays.length} bays): ${level.value.options.length} options, ${level.value.options.filter((o) => o.passes).length} pass; ` +
      `${fmt(level.timing)}; target ≤ ${TARGET_LEVEL_STUDY_MS} ms: ${verdict(level.timing, TARGET_LEVEL_STUDY_MS)}\n`,
  );
  return { bay: bay.timing, level: level.timing };
}
