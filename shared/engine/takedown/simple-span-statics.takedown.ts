/**
 * Statics of a simple span with pinned ends (design-basis §4): resultant of each load and
 * its moment about the start give the end reactions (AISC Manual Part 3, Beam Diagrams and
 * Formulas, by superposition).
 */
import type { LoadDistribution } from './member-load.takedown';

/** Resultant (kip) and its moment about the start (kip-ft) of one load on a span of spanFt. */
export function loadResultant(load: LoadDistribution, spanFt: number): { total: number; momentAboutStart: number } {
  switch (load.kind) {
    case 'uniform':
      return { total: load.w_klf * spanFt, momentAboutStart: (load.w_klf * spanFt * spanFt) / 2 };
    case 'partial': {
      const length = load.to_ft - load.from_ft;
      const total = load.w_klf * length;
      return { total, momentAboutStart: total * (load.from_ft + length / 2) };
    }
    case 'linear': {
      // ∫ w(x) dx and ∫ w(x)·x dx for w linear from w1 at a to w2 at b.
      const a = load.from_ft;
      const b = load.to_ft;
      const length = b - a;
      return {
        total: ((load.w1_klf + load.w2_klf) / 2) * length,
        momentAboutStart: (length * (load.w1_klf * (2 * a + b) + load.w2_klf * (a + 2 * b))) / 6,
      };
    }
    case 'point':
      return { total: load.P_kip, momentAboutStart: load.P_kip * load.x_ft };
  }
}

/** End reactions of a simple span, kip (up positive), from ΣM about each end. */
export function simpleSpanReactions(loads: readonly LoadDistribution[], spanFt: number): { start: number; end: number; total: number } {
  let total = 0;
  let moment = 0;
  for (const load of loads) {
    const r = loadResultant(load, spanFt);
    total += r.total;
    moment += r.momentAboutStart;
  }
  const end = moment / spanFt;
  return { start: total - end, end, total };
}
