/**
 * Statics of a simple span with pinned ends (design-basis §4): resultant of each load and
 * its moment about the start give the end reactions (AISC Manual Part 3, Beam Diagrams and
 * Formulas, by superposition).
 */
import type { LoadDistribution } from './member-load.takedown';

/**
 * Moment about the start of the load last passed to `resultantKip` (kip-ft). A shared slot
 * rather than a returned object: the takedown calls this for every load of every member.
 */
export const lastResultant = { momentAboutStartKipFt: 0 };

/** Resultant (kip) of one load on a span of spanFt; its moment about the start goes to `lastResultant`. */
export function resultantKip(load: LoadDistribution, spanFt: number): number {
  switch (load.kind) {
    case 'uniform': {
      const total = load.w_klf * spanFt;
      lastResultant.momentAboutStartKipFt = (load.w_klf * spanFt * spanFt) / 2;
      return total;
    }
    case 'partial': {
      const length = load.to_ft - load.from_ft;
      const total = load.w_klf * length;
      lastResultant.momentAboutStartKipFt = total * (load.from_ft + length / 2);
      return total;
    }
    case 'linear': {
      // ∫ w(x) dx and ∫ w(x)·x dx for w linear from w1 at a to w2 at b.
      const a = load.from_ft;
      const b = load.to_ft;
      const length = b - a;
      lastResultant.momentAboutStartKipFt = (length * (load.w1_klf * (2 * a + b) + load.w2_klf * (a + 2 * b))) / 6;
      return ((load.w1_klf + load.w2_klf) / 2) * length;
    }
    case 'point':
      lastResultant.momentAboutStartKipFt = load.P_kip * load.x_ft;
      return load.P_kip;
  }
}

/** Resultant (kip) and its moment about the start (kip-ft) of one load on a span of spanFt. */
export function loadResultant(load: LoadDistribution, spanFt: number): { total: number; momentAboutStart: number } {
  const total = resultantKip(load, spanFt);
  return { total, momentAboutStart: lastResultant.momentAboutStartKipFt };
}

/** End reactions of a simple span, kip (up positive), from ΣM about each end. */
export function simpleSpanReactions(loads: readonly LoadDistribution[], spanFt: number): { start: number; end: number; total: number } {
  let total = 0;
  let moment = 0;
  for (let i = 0; i < loads.length; i++) {
    total += resultantKip(loads[i], spanFt);
    moment += lastResultant.momentAboutStartKipFt;
  }
  const end = moment / spanFt;
  return { start: total - end, end, total };
}
