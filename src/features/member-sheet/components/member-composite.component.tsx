// The composite section of a member: a drawn cross-section (slab over the steel, effective width,
// plastic neutral axis), both stages, the studs and the camber, each with its working.
import type { MemberDesignResult } from '../../../../shared/engine/index';
import { camberText } from '../../../../shared/engine/design/serviceability/camber.serviceability';
import { findWShape } from '../../../../shared/catalog/w-shapes.catalog';

const n = (v: number, d = 2) => (Number.isFinite(v) ? v.toFixed(d) : '—');

/** Cross-section to scale: effective width b of slab, deck ribs, the W-shape and the PNA line. */
export function CompositeSectionDrawing({ design }: { design: MemberDesignResult }) {
  const c = design.composite!;
  const s = findWShape(design.shape);
  if (!s) return null;
  const slabTotal = c.slabDepth_in; // top of slab to top of steel (hr + tc)
  const W = 260;
  const scale = Math.min((W - 20) / c.effectiveWidth_in, 180 / (slabTotal + s.d_in));
  const cx = W / 2;
  const top = 10;
  const bW = c.effectiveWidth_in * scale;
  const steelTop = top + slabTotal * scale;
  const pnaY = c.PNA === 'slab' ? top + (c.a_in) * scale : steelTop + c.PNA_depth_in * scale;
  const H = steelTop + s.d_in * scale + 24;
  return (
    <svg viewBox={`0 0 ${W} ${H}`} width={W} height={H} role="img" aria-label={`Composite section: effective width ${n(c.effectiveWidth_in, 1)} in, PNA in the ${c.PNA}`}>
      <rect x={cx - bW / 2} y={top} width={bW} height={slabTotal * scale} fill="currentColor" opacity={0.12} stroke="currentColor" strokeWidth={0.5} />
      <rect x={cx - bW / 2} y={top} width={bW} height={c.a_in * scale} fill="currentColor" opacity={0.25} />
      <rect x={cx - (s.bf_in * scale) / 2} y={steelTop} width={s.bf_in * scale} height={s.tf_in * scale} fill="currentColor" />
      <rect x={cx - (s.tw_in * scale) / 2} y={steelTop + s.tf_in * scale} width={Math.max(1, s.tw_in * scale)} height={(s.d_in - 2 * s.tf_in) * scale} fill="currentColor" />
      <rect x={cx - (s.bf_in * scale) / 2} y={steelTop + (s.d_in - s.tf_in) * scale} width={s.bf_in * scale} height={s.tf_in * scale} fill="currentColor" />
      <line x1={cx - bW / 2 - 4} x2={cx + bW / 2 + 4} y1={pnaY} y2={pnaY} stroke="currentColor" strokeDasharray="4 2" strokeWidth={1} />
      <text x={cx + bW / 2 - 2} y={pnaY - 2} fontSize={8} textAnchor="end" fill="currentColor">PNA</text>
      <text x={cx} y={H - 6} fontSize={8} textAnchor="middle" fill="currentColor">b = {n(c.effectiveWidth_in, 1)} in (AISC 360-16 I3.1a)</text>
    </svg>
  );
}

export function MemberCompositePanel({ design, note }: { design: MemberDesignResult | null; note?: string | null }) {
  if (!design?.composite) {
    return <p className="text-sm text-ink-soft">Bare steel{note ? `: ${note}` : ''}.</p>;
  }
  const c = design.composite;
  const rows: [string, string][] = [
    ['Studs', `${c.studs} × ${c.studDiameter_in} in headed studs, ${c.studsPerRib} per rib, at about ${n(c.spacing_in, 1)} in (I8.2d: ${n(c.spacingLimits_in.min, 1)}–${n(c.spacingLimits_in.max, 1)} in; ${c.minStuds}–${c.maxStuds} studs)`],
    ['Qn per stud (Eq. I8-1)', `min(0.5 Asa √(f′c Ec) = ${n(c.QnConcrete_kip)}, Rg Rp Asa Fu = ${n(c.QnAnchor_kip)}) = ${n(c.Qn_kip)} kip; ${c.RgRpBasis}`],
    ['Ec', `wc^1.5 √f′c = ${n(c.Ec_ksi, 0)} ksi`],
    ['Compression C (I3.2d)', `min(0.85 f′c Ac = ${n(c.Cconcrete_kip, 1)}, Fy As = ${n(c.Csteel_kip, 1)}, ΣQn = ${n(c.sumQn_kip, 1)}) = ${n(c.C_kip, 1)} kip (${c.Cgoverns}); ${n(c.percentComposite * 100, 0)} % composite (minimum ${n(c.minPercentComposite * 100, 0)} %, common practice)`],
    ['Plastic neutral axis (I3.2a)', `in the ${c.PNA}${c.PNA === 'slab' ? '' : `, ${n(c.PNA_depth_in)} in below the top of steel`}; a = ${n(c.a_in)} in, Y2 = ${n(c.Y2_in)} in`],
    ['Final stage', `Mn = ${n(c.Mn_kipft, 1)} kip-ft, Mc = ${n(c.Mc_kipft, 1)} kip-ft at ${n(c.criticalSection_ft, 1)} ft with ${c.studsToCriticalSection} studs to the nearer support`],
    ['Lower-bound I (Commentary Eq. C-I3-1)', `I_LB = ${n(c.Ilb_in4, 0)} in⁴, Y_ENA = ${n(c.Yena_in)} in; live deflection ${n(c.deflectionLive_in)} in; total ${n(c.deflectionTotal_in)} in (${c.totalDeflectionIncludes === 'superimposedDeadAndLive' ? 'superimposed dead + live' : 'dead + live, no credit for camber'})`],
    ['Construction stage (bare steel)', c.shored ? 'shored: not checked on the bare steel' : `Mr = ${n(c.construction.Mr_kipft, 1)} ≤ Mc = ${n(c.construction.Mc_kipft, 1)} kip-ft (${c.construction.combination}, ${c.construction.clause}, Lb = ${n(c.construction.Lb_ft, 1)} ft), ratio ${n(c.construction.ratio, 3)}; wet concrete, deck, self weight and construction live (common practice)`],
    ['Camber', `${c.camber_in > 0 ? camberText(c.camber_in) : 'none'}: pre-composite dead-load deflection ${n(c.preCompositeDeflection_in)} in × 0.8 = ${n(0.8 * c.preCompositeDeflection_in)} in; ${c.camberBasis}`],
  ];
  return (
    <div className="flex flex-wrap gap-4">
      <CompositeSectionDrawing design={design} />
      <dl className="grid min-w-0 flex-1 grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
        {rows.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="text-ink-soft">{k}</dt>
            <dd className="m-0 text-ink">{v}</dd>
          </div>
        ))}
        {c.notes.map((t) => (
          <div key={t} className="contents">
            <dt className="text-ink-soft">Note</dt>
            <dd className="m-0 text-ink-soft">{t}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}

const CHOICE_TEXT = { basis: 'Follow the design basis', on: 'Composite', off: 'Bare steel (non-composite)' } as const;

/**
 * Composite on or off for one member (plan file members[].composite): null follows the design
 * basis, true designs it composite where it sits under a slab, false keeps it bare steel (e.g. at
 * an opening edge, where the engineer says so). Roles that cannot edit read the choice.
 */
export function MemberCompositeChoice({ value, basisComposite, canEdit, onChange }: { value: boolean | null; basisComposite: boolean; canEdit: boolean; onChange: (v: boolean | null) => void }) {
  const key = value === null ? 'basis' : value ? 'on' : 'off';
  const basisText = `design basis: ${basisComposite ? 'composite' : 'bare steel'}`;
  if (!canEdit) {
    return (
      <p className="mb-2 text-sm text-ink-soft" data-testid="member-composite-choice">
        Composite design: {key === 'basis' ? `follows the ${basisText}` : CHOICE_TEXT[key].toLowerCase()}.
      </p>
    );
  }
  return (
    <label className="mb-2 flex flex-wrap items-center gap-2 text-sm">
      <span className="font-medium text-ink">Composite design</span>
      <select
        className="h-8 rounded-[3px] border border-line bg-paper-raised px-1 text-sm"
        value={key}
        onChange={(e) => onChange(e.target.value === 'basis' ? null : e.target.value === 'on')}
      >
        <option value="basis">{`${CHOICE_TEXT.basis} (${basisText})`}</option>
        <option value="on">{CHOICE_TEXT.on}</option>
        <option value="off">{CHOICE_TEXT.off}</option>
      </select>
    </label>
  );
}
