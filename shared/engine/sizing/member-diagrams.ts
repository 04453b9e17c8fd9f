import { evaluateStations, stationPositions, toSpanLoading, type SpanLoading } from '../analysis/simple-span.analysis';
import { shapeConstantsFor } from '../design/aisc360/w-shape-constants';
import { LOAD_CASES } from '../loads/combinations';
import { buildMemberContext } from './member-context';
import type { DiagramSeries, MemberDesignInput, MemberDiagrams } from './member-design.types';
import { assertValidMemberInput } from './member-input.validation';
import { deflectionIn, evaluateShape } from './shape-evaluation';

function scaled(s: SpanLoading, f: number): SpanLoading {
  return {
    spanFt: s.spanFt,
    pieces: s.pieces.map((p) => ({ ...p, qa: p.qa * f, qb: p.qb * f })),
    points: s.points.map((p) => ({ ...p, P: p.P * f })),
  };
}

function merge(parts: SpanLoading[], spanFt: number): SpanLoading {
  return { spanFt, pieces: parts.flatMap((p) => p.pieces), points: parts.flatMap((p) => p.points) };
}

/**
 * Diagrams for plotting: shear, moment and deflection at stations (100 equal intervals plus the
 * load points; two stations at a point load) for the governing flexure combination and for
 * unfactored D (with self weight when included) and L.
 */
export function memberDiagrams(input: MemberDesignInput, shape: string, intervals = 100): MemberDiagrams {
  assertValidMemberInput({ ...input, shape });
  const ctx = buildMemberContext(input);
  const k = shapeConstantsFor(shape, input.Fy_ksi)!;
  const ev = evaluateShape(ctx, k, false);
  const L = input.span_ft;
  const sw = toSpanLoading(L, input.includeSelfWeight ? [{ case: 'D', kind: 'uniform', w_klf: k.weightKlf }] : []);
  const combo = ctx.combos[ev.flexure.combo].combo;
  const gov = merge([...LOAD_CASES.map((c) => scaled(ctx.caseLoading[c], combo.factors[c])), scaled(sw, combo.factors.D)], L);
  const dead = merge([ctx.caseLoading.D, sw], L);
  // Same station set for the three series: the union of every case's critical points.
  const all = merge([...LOAD_CASES.map((c) => ctx.caseLoading[c]), sw], L);
  const positions = stationPositions(all, intervals);
  const series = (label: string, s: SpanLoading): DiagramSeries => {
    const st = evaluateStations(s, positions);
    return {
      label,
      V_kip: st.map((p) => p.vKip),
      M_kipft: st.map((p) => p.mKipFt),
      deflection_in: st.map((p) => deflectionIn(p.eiDeflectionKipFt3, k.ixIn4)),
    };
  };
  return { shape: k.label, x_ft: positions.map((p) => p.xFt), governing: series(combo.name, gov), D: series('D', dead), L: series('L', ctx.caseLoading.L) };
}

