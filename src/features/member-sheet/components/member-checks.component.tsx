// Each check of one member with clause, equation, combination, demand, capacity and ratio;
// the governing one marked in words and colour; the working of each one on request.
import { Fragment, useState, type ReactNode } from 'react';
import { E_KSI, type MemberCheck, type MemberDesignResult, type MemberSegment } from '../../../../shared/engine/index';
import { UtilisationChip } from '../../../components/ui/utilisation-chip.ui';
import { formatQuantity, type QuantityKind, type UnitSystem } from '../../../lib/units';

const CHECK_TITLE: Record<MemberCheck['name'], string> = {
  flexure: 'Flexure',
  shear: 'Shear',
  deflectionLive: 'Live-load deflection',
  deflectionTotal: 'Total-load deflection',
  construction: 'Construction stage (bare steel)',
  studs: 'Studs',
};

const KIND_OF_UNIT: Record<Exclude<MemberCheck['unit'], 'count'>, QuantityKind> = { 'kip-ft': 'moment_kipft', kip: 'force_kip', in: 'length_in' };

/** A check's demand or capacity in its unit (a stud count is a plain number). */
function checkValue(c: MemberCheck, v: number, units: UnitSystem): string {
  return c.unit === 'count' ? String(Math.round(v)) : formatQuantity(KIND_OF_UNIT[c.unit], v, units);
}

function symbols(check: MemberCheck, method: 'LRFD' | 'ASD'): { demand: string; capacity: string } {
  const lrfd = method === 'LRFD';
  if (check.name === 'studs') return { demand: 'N min', capacity: 'N' };
  if (check.name === 'flexure' || check.name === 'construction') return lrfd ? { demand: 'Mu', capacity: 'φbMn' } : { demand: 'Ma', capacity: 'Mn/Ωb' };
  if (check.name === 'shear') return lrfd ? { demand: 'Vu', capacity: 'φvVn' } : { demand: 'Va', capacity: 'Vn/Ωv' };
  return { demand: 'Δ', capacity: `L/${check.limit_n ?? '?'}` };
}

const num = (v: number | null | undefined, digits = 2) => (v == null || !Number.isFinite(v) ? '—' : v.toFixed(digits));

function Row({ label, value, note }: { label: ReactNode; value: ReactNode; note?: ReactNode }) {
  return (
    <div className="contents">
      <dt className="py-0.5 text-ink-soft">{label}</dt>
      <dd className="figures m-0 whitespace-nowrap py-0.5 font-mono text-ink">{value}</dd>
      <dd className="m-0 py-0.5 text-xs text-ink-faint">{note}</dd>
    </div>
  );
}

function FlexureWorking({ c, units }: { c: MemberCheck; units: UnitSystem }) {
  const f = (kind: QuantityKind, v: number | null | undefined) => (v == null ? '—' : formatQuantity(kind, v, units));
  const lrfd = c.method === 'LRFD';
  return (
    <dl className="m-0 grid grid-cols-[auto_auto_1fr] items-baseline gap-x-5 text-sm">
      <Row label="Segment" value={`${f('length_ft', c.from_ft)} – ${f('length_ft', c.to_ft)}`} note="between brace points" />
      <Row label={<>λ = b<sub>f</sub>/2t<sub>f</sub></>} value={num(c.lambda_f)} note={`flange ${c.flangeClass ?? ''} (AISC 360-16 Table B4.1b)`} />
      <Row label={<>λ<sub>pf</sub></>} value={num(c.lambda_pf)} note="0.38√(E/Fy), Table B4.1b case 10" />
      <Row label={<>λ<sub>rf</sub></>} value={num(c.lambda_rf)} note="1.0√(E/Fy), Table B4.1b case 10" />
      <Row label={<>λ<sub>w</sub> = h/t<sub>w</sub></>} value={num(c.lambda_w)} note={<>web compact when ≤ λ<sub>pw</sub> = 3.76√(E/Fy) = {num(c.lambda_pw)}, case 15</>} />
      <Row label={<>L<sub>p</sub></>} value={f('length_ft', c.Lp_ft)} note="Eq. F2-5" />
      <Row label={<>L<sub>r</sub></>} value={f('length_ft', c.Lr_ft)} note="Eq. F2-6" />
      <Row label={<>L<sub>b</sub></>} value={f('length_ft', c.Lb_ft)} note="unbraced length of the governing segment" />
      <Row
        label={<>C<sub>b</sub></>}
        value={num(c.Cb, 3)}
        note={
          c.Lb_ft === 0 ? (
            'continuous bracing: no lateral-torsional buckling, Cb = 1.0'
          ) : c.MA_kipft != null ? (
            <>Eq. F1-1 with M<sub>A</sub> {f('moment_kipft', Math.abs(c.MA_kipft))}, M<sub>B</sub> {f('moment_kipft', Math.abs(c.MB_kipft ?? 0))}, M<sub>C</sub> {f('moment_kipft', Math.abs(c.MC_kipft ?? 0))}</>
          ) : (
            'Eq. F1-1'
          )
        }
      />
      <Row label={<>M<sub>p</sub> = F<sub>y</sub>Z<sub>x</sub></>} value={f('moment_kipft', c.Mp_kipft)} note="Eq. F2-1" />
      {c.Fcr_ksi != null ? <Row label={<>F<sub>cr</sub></>} value={f('stress_ksi', c.Fcr_ksi)} note={`Eq. F2-4, E = ${E_KSI.toLocaleString('en-US')} ksi`} /> : null}
      {c.Mn_FLB_kipft != null ? <Row label={<>M<sub>n</sub> flange local buckling</>} value={f('moment_kipft', c.Mn_FLB_kipft)} note="Eq. F3-1" /> : null}
      <Row label={<>M<sub>n</sub></>} value={f('moment_kipft', c.Mn_kipft)} note={`${c.limitState ?? ''} governs, ${c.equation}`} />
      {lrfd ? (
        <Row label={<>φ<sub>b</sub></>} value={num(c.phi)} note={<>φ<sub>b</sub>M<sub>n</sub> = {f('moment_kipft', c.capacity)} (F1)</>} />
      ) : (
        <Row label={<>Ω<sub>b</sub></>} value={num(c.omega)} note={<>M<sub>n</sub>/Ω<sub>b</sub> = {f('moment_kipft', c.capacity)} (F1)</>} />
      )}
    </dl>
  );
}

function ShearWorking({ c, units }: { c: MemberCheck; units: UnitSystem }) {
  const lrfd = c.method === 'LRFD';
  return (
    <dl className="m-0 grid grid-cols-[auto_auto_1fr] items-baseline gap-x-5 text-sm">
      <Row label={<>A<sub>w</sub> = d t<sub>w</sub></>} value={c.Aw_in2 == null ? '—' : formatQuantity('area_in2', c.Aw_in2, units)} note="G2.1" />
      <Row label={<>h/t<sub>w</sub></>} value={num(c.h_tw)} note={<>limit 2.24√(E/Fy) = {num(c.h_tw_limit)} for G2.1(a)</>} />
      <Row label="Case" value={c.shearCase ?? '—'} note={c.kv != null ? <>k<sub>v</sub> = {num(c.kv)} (no stiffeners)</> : 'rolled I-shape, G2.1(a)'} />
      <Row label={<>C<sub>v1</sub></>} value={num(c.Cv1, 3)} note={c.equation} />
      <Row label={<>V<sub>n</sub> = 0.6F<sub>y</sub>A<sub>w</sub>C<sub>v1</sub></>} value={c.Vn_kip == null ? '—' : formatQuantity('force_kip', c.Vn_kip, units)} note="Eq. G2-1" />
      {lrfd ? (
        <Row label={<>φ<sub>v</sub></>} value={num(c.phi)} note={<>φ<sub>v</sub>V<sub>n</sub> = {formatQuantity('force_kip', c.capacity, units)}</>} />
      ) : (
        <Row label={<>Ω<sub>v</sub></>} value={num(c.omega)} note={<>V<sub>n</sub>/Ω<sub>v</sub> = {formatQuantity('force_kip', c.capacity, units)}</>} />
      )}
    </dl>
  );
}

function DeflectionWorking({ c, units, span_ft }: { c: MemberCheck; units: UnitSystem; span_ft: number }) {
  return (
    <dl className="m-0 grid grid-cols-[auto_auto_1fr] items-baseline gap-x-5 text-sm">
      <Row label="Loads" value={c.loadCase ?? c.combination} note="unfactored (serviceability)" />
      <Row label="Δ max" value={formatQuantity('length_in', c.demand, units)} note={c.at_ft != null ? `at ${formatQuantity('length_ft', c.at_ft, units)}` : undefined} />
      <Row label={`L/${c.limit_n ?? '?'}`} value={formatQuantity('length_in', c.capacity, units)} note={`span ${formatQuantity('length_ft', span_ft, units)}; IBC Table 1604.3`} />
      <Row label={<>I<sub>x</sub></>} value={c.Ix_in4 == null ? '—' : formatQuantity('inertia_in4', c.Ix_in4, units)} note={`E = ${E_KSI.toLocaleString('en-US')} ksi`} />
    </dl>
  );
}

type ChecksProps = { design: MemberDesignResult; units: UnitSystem };

/** The table of checks, the governing row marked "Governs". */
export function MemberChecksTable({ design, units }: ChecksProps) {
  const [open, setOpen] = useState<Record<string, boolean>>({});
  const cols = 7;
  return (
    <table className="w-full border-collapse text-sm">
      <caption className="sr-only">Checks for {design.shape}</caption>
      <thead>
        <tr className="border-b border-ink text-left">
          <th className="label-caps py-1.5 pr-3 font-normal">Check</th>
          <th className="label-caps py-1.5 pr-3 font-normal">Clause · equation</th>
          <th className="label-caps py-1.5 pr-3 font-normal">Combination</th>
          <th className="label-caps py-1.5 pr-3 text-right font-normal">Demand</th>
          <th className="label-caps py-1.5 pr-3 text-right font-normal">Capacity</th>
          <th className="label-caps py-1.5 pr-3 text-right font-normal">Ratio</th>
          <th className="py-1.5">
            <span className="sr-only">Steps</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {design.checks.map((c) => {
          const governs = c.name === design.governing;
          const sym = symbols(c, design.method);
          const isOpen = open[c.name] ?? false;
          const workingId = `working-${c.name}`;
          return (
            <Fragment key={c.name}>
              <tr
                data-check={c.name}
                aria-current={governs ? 'true' : undefined}
                className={`border-b border-line align-top ${governs ? 'bg-accent-wash' : ''}`}
              >
                <th scope="row" className="py-2 pr-3 text-left font-medium text-ink">
                  {CHECK_TITLE[c.name]}
                  {c.limitState ? <span className="block text-xs font-normal text-ink-soft">{c.limitState}</span> : null}
                  {governs ? <span className="label-caps mt-0.5 block text-accent-strong">Governs</span> : null}
                </th>
                <td className="py-2 pr-3">
                  <span className="block">{c.clause}</span>
                  <span className="block text-xs text-ink-soft">{c.equation}</span>
                </td>
                <td className="figures whitespace-nowrap py-2 pr-3 font-mono">{c.combination}</td>
                <td className="figures whitespace-nowrap py-2 pr-3 text-right font-mono">
                  <span className="text-ink-faint">{sym.demand} </span>
                  {checkValue(c, c.demand, units)}
                </td>
                <td className="figures whitespace-nowrap py-2 pr-3 text-right font-mono">
                  <span className="text-ink-faint">{sym.capacity} </span>
                  {checkValue(c, c.capacity, units)}
                </td>
                <td className="whitespace-nowrap py-2 pr-3 text-right">
                  <UtilisationChip ratio={c.ratio} />
                </td>
                <td className="py-2 text-right">
                  <button
                    type="button"
                    aria-expanded={isOpen}
                    aria-controls={workingId}
                    // "Working" is a ratio band's name (src/lib/utilisation.ts): the link says "steps".
                    aria-label={`${isOpen ? 'Hide steps' : 'Show steps'} for ${CHECK_TITLE[c.name]}`}
                    className="rounded-[3px] px-1.5 py-0.5 text-xs text-ink-soft underline decoration-dotted hover:text-ink"
                    onClick={() => setOpen((o) => ({ ...o, [c.name]: !isOpen }))}
                  >
                    {isOpen ? 'Hide steps' : 'Show steps'}
                  </button>
                </td>
              </tr>
              {isOpen ? (
                <tr id={workingId} className="border-b border-line bg-paper-sunk/40">
                  <td colSpan={cols} className="px-3 py-2">
                    {c.name === 'flexure' ? <FlexureWorking c={c} units={units} /> : null}
                    {c.name === 'shear' ? <ShearWorking c={c} units={units} /> : null}
                    {c.name === 'deflectionLive' || c.name === 'deflectionTotal' ? <DeflectionWorking c={c} units={units} span_ft={design.span_ft} /> : null}
                  </td>
                </tr>
              ) : null}
            </Fragment>
          );
        })}
      </tbody>
    </table>
  );
}

/** Unbraced segments with their Lb and Cb and the flexure ratio in each. */
export function MemberSegmentsTable({ segments, governingIndex, units, method }: { segments: MemberSegment[]; governingIndex: number; units: UnitSystem; method: 'LRFD' | 'ASD' }) {
  const lrfd = method === 'LRFD';
  return (
    <table className="w-full border-collapse text-sm">
      <caption className="sr-only">Unbraced segments</caption>
      <thead>
        <tr className="border-b border-ink text-left">
          <th className="label-caps py-1.5 pr-3 font-normal">Segment</th>
          <th className="label-caps py-1.5 pr-3 text-right font-normal">Lb</th>
          <th className="label-caps py-1.5 pr-3 text-right font-normal">Cb</th>
          <th className="label-caps py-1.5 pr-3 font-normal">Combination</th>
          <th className="label-caps py-1.5 pr-3 text-right font-normal">{lrfd ? 'Mu' : 'Ma'}</th>
          <th className="label-caps py-1.5 pr-3 text-right font-normal">{lrfd ? 'φbMn' : 'Mn/Ωb'}</th>
          <th className="label-caps py-1.5 text-right font-normal">Ratio</th>
        </tr>
      </thead>
      <tbody>
        {segments.map((s, i) => (
          <tr key={`${s.from_ft}-${s.to_ft}`} data-segment={i} className={`border-b border-line ${i === governingIndex ? 'bg-accent-wash' : ''}`}>
            <td className="figures whitespace-nowrap py-1.5 pr-3 font-mono">
              {formatQuantity('length_ft', s.from_ft, units)} – {formatQuantity('length_ft', s.to_ft, units)}
              {i === governingIndex ? <span className="label-caps ml-2 text-accent-strong">Governs</span> : null}
            </td>
            <td className="figures py-1.5 pr-3 text-right font-mono">{formatQuantity('length_ft', s.Lb_ft, units)}</td>
            <td className="figures py-1.5 pr-3 text-right font-mono">{s.Cb.toFixed(2)}</td>
            <td className="figures py-1.5 pr-3 font-mono">{s.combination}</td>
            <td className="figures py-1.5 pr-3 text-right font-mono">{formatQuantity('moment_kipft', s.Mr_kipft, units)}</td>
            <td className="figures py-1.5 pr-3 text-right font-mono">{formatQuantity('moment_kipft', s.Mc_kipft, units)}</td>
            <td className="py-1.5 text-right">
              <UtilisationChip ratio={s.ratio} showLabel={false} />
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
