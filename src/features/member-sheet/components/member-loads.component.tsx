// The loads one member carries, each with where it came from (the takedown's `source` text:
// deck strip and tributary width, framing members, zone, live load reduction), plus the
// tributary figures used for ASCE 7-16 §4.7 and the unfactored end reactions.
import type { MemberDesignResult, MemberLoad, SchemeMember } from '../../../../shared/engine/index';
import { describeLoadSource, type SourceNames } from '../../../../shared/drafting/load-source.drafting';
import { formatQuantity, type UnitSystem } from '../../../lib/units';

/** A load's source in the reader's units (SI: figures converted; US: as the engine wrote them). */
export function loadSourceText(source: string, units: UnitSystem, names?: SourceNames): string {
  const q = units === 'SI' ? (kind: Parameters<typeof formatQuantity>[0], v: number) => formatQuantity(kind, v, 'SI', kind === 'length_ft' ? { digits: 2 } : {}) : null;
  return describeLoadSource(source, q, names);
}

const CASE_NAME: Record<MemberLoad['case'], string> = { D: 'Dead', L: 'Live', Lr: 'Roof live', S: 'Snow' };

function magnitude(l: MemberLoad, units: UnitSystem): string {
  switch (l.kind) {
    case 'uniform':
    case 'partial':
      return formatQuantity('lineLoad_klf', l.w_klf, units);
    case 'linear':
      return `${formatQuantity('lineLoad_klf', l.w1_klf, units)} → ${formatQuantity('lineLoad_klf', l.w2_klf, units)}`;
    case 'point':
      return formatQuantity('force_kip', l.P_kip, units);
  }
}

function position(l: MemberLoad, span_ft: number, units: UnitSystem): string {
  switch (l.kind) {
    case 'uniform':
      return `full span (${formatQuantity('length_ft', span_ft, units)})`;
    case 'partial':
    case 'linear':
      return `${formatQuantity('length_ft', l.from_ft, units)} – ${formatQuantity('length_ft', l.to_ft, units)}`;
    case 'point':
      return `at ${formatQuantity('length_ft', l.x_ft, units)}`;
  }
}

const KIND_NAME: Record<MemberLoad['kind'], string> = { uniform: 'uniform', partial: 'partial uniform', linear: 'linearly varying', point: 'point' };

export function MemberLoadsTable({ member, units }: { member: SchemeMember; units: UnitSystem }) {
  return (
    <div className="flex flex-col gap-2">
      <dl className="figures m-0 grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4">
        <div>
          <dt className="label-caps">Tributary width</dt>
          <dd className="m-0 font-mono">{formatQuantity('length_ft', member.tributaryWidth_ft, units)}</dd>
        </div>
        <div>
          <dt className="label-caps">Tributary area</dt>
          <dd className="m-0 font-mono">{formatQuantity('area_ft2', member.tributaryArea_ft2, units)}</dd>
        </div>
        <div>
          <dt className="label-caps" title="Area of reducible live load carried (ASCE 7-16 Eq. 4.7-1)">
            A<sub>T</sub> · K<sub>LL</sub>
          </dt>
          <dd className="m-0 font-mono">
            {formatQuantity('area_ft2', member.reducibleArea_ft2, units)} · {member.KLL}
          </dd>
        </div>
        <div>
          <dt className="label-caps">Live load factor</dt>
          <dd className="m-0 font-mono">
            {member.liveReductionFactor.toFixed(3)}
            <span className="ml-1 font-sans text-xs text-ink-faint">{member.liveReductionFactor < 1 ? 'ASCE 7-16 Eq. 4.7-1' : 'not reduced'}</span>
          </dd>
        </div>
      </dl>
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">Loads on the member and where they come from</caption>
        <thead>
          <tr className="border-b border-ink text-left">
            <th className="label-caps py-1.5 pr-3 font-normal">Case</th>
            <th className="label-caps py-1.5 pr-3 font-normal">Load</th>
            <th className="label-caps py-1.5 pr-3 text-right font-normal">Magnitude</th>
            <th className="label-caps py-1.5 pr-3 font-normal">Where</th>
            <th className="label-caps py-1.5 font-normal">From</th>
          </tr>
        </thead>
        <tbody>
          {member.loads.map((l, i) => (
            <tr key={i} className="border-b border-line align-top" data-load={i}>
              <td className="py-1.5 pr-3">
                <span className="font-mono">{l.case}</span> <span className="text-xs text-ink-soft">{CASE_NAME[l.case]}</span>
              </td>
              <td className="py-1.5 pr-3">{KIND_NAME[l.kind]}</td>
              <td className="figures whitespace-nowrap py-1.5 pr-3 text-right font-mono">{magnitude(l, units)}</td>
              <td className="figures whitespace-nowrap py-1.5 pr-3 font-mono">{position(l, member.span_ft, units)}</td>
              <td className="py-1.5 text-ink-soft">{l.source ? loadSourceText(l.source, units) : '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function MemberReactionsTable({ design, member, units }: { design: MemberDesignResult | null; member: SchemeMember; units: UnitSystem }) {
  const ends = ['start', 'end'] as const;
  const cases = (['D', 'L', 'Lr', 'S'] as const).filter((c) => ends.some((e) => Math.abs(member.reactions[e][`${c}_kip`]) > 1e-9) || c === 'D' || c === 'L');
  return (
    <table className="w-full border-collapse text-sm">
      <caption className="sr-only">End reactions, unfactored</caption>
      <thead>
        <tr className="border-b border-ink text-left">
          <th className="label-caps py-1.5 pr-3 font-normal">End</th>
          {cases.map((c) => (
            <th key={c} className="label-caps py-1.5 pr-3 text-right font-normal">
              {c}
            </th>
          ))}
          <th className="label-caps py-1.5 font-normal">Bears on</th>
        </tr>
      </thead>
      <tbody>
        {ends.map((e) => (
          <tr key={e} className="border-b border-line">
            <td className="py-1.5 pr-3">{e === 'start' ? 'Start' : 'End'}</td>
            {cases.map((c) => (
              <td key={c} className="figures py-1.5 pr-3 text-right font-mono">
                {formatQuantity('force_kip', member.reactions[e][`${c}_kip`], units)}
              </td>
            ))}
            <td className="py-1.5 font-mono">{member.reactions[e].supportedBy ?? '—'}</td>
          </tr>
        ))}
      </tbody>
      <tfoot>
        <tr>
          <td colSpan={cases.length + 2} className="pt-1 text-xs text-ink-faint">
            Unfactored. D includes the member's own weight{design ? '' : ' as far as it is known'}; L is after this member's live load reduction.
          </td>
        </tr>
      </tfoot>
    </table>
  );
}
