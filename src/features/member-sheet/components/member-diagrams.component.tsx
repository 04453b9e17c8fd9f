// Loading, shear, moment and deflected shape of one simple-span member, drawn in SVG from the
// engine's stations (memberDiagrams). Maxima are labelled with value, unit and position.
import type { ReactNode } from 'react';
import type { MemberLoad } from '../../../../shared/engine/index';
import { formatQuantity, type UnitSystem } from '../../../lib/units';
import { intensityOutline, peakIndex, pointLoadsByPosition, type SheetDiagrams } from '../lib/member-sheet.model';

const W = 640;
const PAD_X = 28;
const PLOT_W = W - 2 * PAD_X;

type Props = {
  diagrams: SheetDiagrams;
  loads: MemberLoad[];
  span_ft: number;
  brace: number[] | 'continuous';
  units: UnitSystem;
  /** The deflection the checks report (refined between stations); labels the deflected shape. */
  deflectionTotal_in?: number | null;
};

const xOf = (x: number, span: number) => PAD_X + (span > 0 ? (x / span) * PLOT_W : 0);

function clampLabelX(x: number): number {
  return Math.min(Math.max(x, PAD_X + 70), W - PAD_X - 70);
}

function polyline(xs: number[], ys: number[]): string {
  return xs.map((x, i) => `${i === 0 ? 'M' : 'L'}${x.toFixed(2)} ${ys[i].toFixed(2)}`).join(' ');
}

/** Closed area between the curve and its baseline. */
function area(xs: number[], ys: number[], baseY: number): string {
  if (xs.length === 0) return '';
  return `M${xs[0].toFixed(2)} ${baseY} ${xs.map((x, i) => `L${x.toFixed(2)} ${ys[i].toFixed(2)}`).join(' ')} L${xs[xs.length - 1].toFixed(2)} ${baseY} Z`;
}

function Caption({ children }: { children: ReactNode }) {
  return <figcaption className="label-caps mb-1 flex flex-wrap items-baseline gap-x-2">{children}</figcaption>;
}

function LoadingPanel({ loads, span_ft, brace, units }: Omit<Props, 'diagrams' | 'deflectionTotal_in'>) {
  const outline = intensityOutline(loads, span_ft);
  const points = pointLoadsByPosition(loads);
  const wMax = Math.max(0, ...outline.map((p) => p.w_klf));
  const H = 96;
  const beamY = 76;
  const top = 30;
  const yOfW = (w: number) => beamY - 4 - (wMax > 0 ? (w / wMax) * (beamY - 4 - top) : 0);
  const outlineXs = outline.map((p) => xOf(p.x_ft, span_ft));
  const outlineYs = outline.map((p) => yOfW(p.w_klf));
  const label = `Loading, unfactored, all cases: distributed up to ${formatQuantity('lineLoad_klf', wMax, units)}${
    points.length ? `; ${points.length} point load${points.length > 1 ? 's' : ''}` : ''}`;
  return (
    <figure className="m-0">
      <Caption>
        <span>Loading (unfactored, all cases incl. self weight)</span>
        {wMax > 0 ? <span className="figures normal-case text-ink">w max {formatQuantity('lineLoad_klf', wMax, units)}</span> : null}
      </Caption>
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={label} className="w-full">
        {outline.length > 0 && wMax > 0 ? (
          <>
            <path d={area(outlineXs, outlineYs, beamY - 4)} className="fill-ink/10" />
            <path d={polyline(outlineXs, outlineYs)} className="fill-none stroke-ink" strokeWidth={1.25} />
          </>
        ) : null}
        {points.map((p) => {
          const x = xOf(p.x_ft, span_ft);
          return (
            <g key={p.x_ft}>
              <line x1={x} y1={10} x2={x} y2={beamY - 6} className="stroke-accent" strokeWidth={1.5} />
              <path d={`M${x - 4} ${beamY - 12} L${x} ${beamY - 5} L${x + 4} ${beamY - 12} Z`} className="fill-accent" />
              <text x={x + 5} y={16} className="figures fill-accent font-mono text-[11px]">
                {formatQuantity('force_kip', p.P_kip, units)}
              </text>
            </g>
          );
        })}
        <line x1={PAD_X} y1={beamY} x2={W - PAD_X} y2={beamY} className="stroke-ink" strokeWidth={3} />
        {brace === 'continuous' ? (
          <line x1={PAD_X} y1={beamY + 5} x2={W - PAD_X} y2={beamY + 5} className="stroke-ink-soft" strokeWidth={1} strokeDasharray="3 3" />
        ) : (
          brace.map((b) => (
            <path key={b} d={`M${xOf(b, span_ft) - 4} ${beamY - 4} L${xOf(b, span_ft) + 4} ${beamY + 4} M${xOf(b, span_ft) + 4} ${beamY - 4} L${xOf(b, span_ft) - 4} ${beamY + 4}`} className="stroke-ink-soft" strokeWidth={1.5} />
          ))
        )}
        {/* pin at the start, roller at the end */}
        <path d={`M${PAD_X} ${beamY + 1} l-7 12 h14 Z`} className="fill-none stroke-ink" strokeWidth={1.25} />
        <path d={`M${W - PAD_X} ${beamY + 1} l-7 10 h14 Z`} className="fill-none stroke-ink" strokeWidth={1.25} />
        <circle cx={W - PAD_X - 4} cy={beamY + 14} r={2} className="fill-ink" />
        <circle cx={W - PAD_X + 4} cy={beamY + 14} r={2} className="fill-ink" />
      </svg>
      <p className="text-[11px] text-ink-faint">
        {brace === 'continuous' ? 'Dashed: compression flange braced continuously.' : brace.length ? '×: brace points.' : 'Braced at the supports only.'}
      </p>
    </figure>
  );
}

type CurveProps = {
  title: string;
  xs_ft: number[];
  values: number[];
  span_ft: number;
  kind: 'force_kip' | 'moment_kipft' | 'length_in';
  units: UnitSystem;
  /** Positive values drawn downward (moment on the tension side, deflection). */
  downward: boolean;
  /** Overrides the printed peak value (e.g. the engine's refined deflection). */
  peakValue?: number | null;
  peakName: string;
  height: number;
};

function CurvePanel({ title, xs_ft, values, span_ft, kind, units, downward, peakValue, peakName, height }: CurveProps) {
  const H = height;
  const both = values.some((v) => v > 1e-9) && values.some((v) => v < -1e-9);
  const baseY = both ? H / 2 : downward ? 18 : H - 18;
  const vMax = Math.max(1e-12, ...values.map(Math.abs));
  const room = both ? H / 2 - 18 : H - 36;
  const sign = downward ? 1 : -1;
  const ys = values.map((v) => baseY + sign * (v / vMax) * room);
  const xs = xs_ft.map((x) => xOf(x, span_ft));
  const i = peakIndex(values);
  const shown = peakValue ?? values[i];
  const peakText = `${peakName} ${formatQuantity(kind, Math.abs(shown), units)} at ${formatQuantity('length_ft', xs_ft[i], units)}`;
  const labelY = Math.min(Math.max(ys[i] + (ys[i] > baseY ? 14 : -6), 12), H - 4);
  return (
    <figure className="m-0">
      <Caption>
        <span>{title}</span>
      </Caption>
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={`${title}: ${peakText}`} className="w-full">
        <path d={area(xs, ys, baseY)} className="fill-accent/10" />
        <line x1={PAD_X} y1={baseY} x2={W - PAD_X} y2={baseY} className="stroke-ink" strokeWidth={1} />
        <path d={polyline(xs, ys)} className="fill-none stroke-accent-strong" strokeWidth={1.75} />
        <circle cx={xs[i]} cy={ys[i]} r={2.5} className="fill-ink" />
        <text x={clampLabelX(xs[i])} y={labelY} textAnchor="middle" className="figures fill-ink font-mono text-[11px]">
          {peakText}
        </text>
      </svg>
    </figure>
  );
}

/** The four panels of the sheet's diagrams section. */
export function MemberDiagramsPanel({ diagrams, loads, span_ft, brace, units, deflectionTotal_in }: Props) {
  const vPeak = peakIndex(diagrams.V_kip);
  const vEndMax = diagrams.V_kip[vPeak];
  return (
    <div className="flex flex-col gap-3">
      <LoadingPanel loads={loads} span_ft={span_ft} brace={brace} units={units} />
      <CurvePanel
        title={`Shear V, ${diagrams.combination}`}
        xs_ft={diagrams.x_ft}
        values={diagrams.V_kip}
        span_ft={span_ft}
        kind="force_kip"
        units={units}
        downward={false}
        peakValue={vEndMax}
        peakName="max |V|"
        height={112}
      />
      <CurvePanel
        title={`Moment M, ${diagrams.combination} (drawn on the tension side)`}
        xs_ft={diagrams.x_ft}
        values={diagrams.M_kipft}
        span_ft={span_ft}
        kind="moment_kipft"
        units={units}
        downward
        peakName="max M"
        height={112}
      />
      <CurvePanel
        title={`Deflected shape, service ${diagrams.deflectionCases}`}
        xs_ft={diagrams.x_ft}
        values={diagrams.deflectionTotal_in}
        span_ft={span_ft}
        kind="length_in"
        units={units}
        downward
        peakValue={deflectionTotal_in}
        peakName="max Δ"
        height={84}
      />
    </div>
  );
}
