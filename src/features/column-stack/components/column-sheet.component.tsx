import { useMemo } from 'react';
import type { ColumnSchedule, ColumnScheduleColumn } from '../../../../shared/drafting/column-schedule.drafting';
import { columnWorking, type ColumnWorking, type ColumnWorkingLength } from '../../../../shared/engine/index';
import { Button } from '../../../components/ui/button.ui';
import { EngineerCaution } from '../../../components/ui/engineer-caution.ui';
import { UtilisationChip } from '../../../components/ui/utilisation-chip.ui';
import { formatQuantity, formatValue, unitLabel, type UnitSystem } from '../../../lib/units';

const f1 = (n: number) => (Number.isFinite(n) ? n.toFixed(1) : '∞');
const f3 = (n: number) => n.toFixed(3);

/** The working of one column from the schedule's own cells (the same data the schedule shows). */
export function workingOf(schedule: ColumnSchedule, column: ColumnScheduleColumn): ColumnWorking {
  const cells = schedule.levels.map((lv, i) => ({ lv, cell: column.cells[i] })).filter((x) => x.cell !== null);
  return columnWorking({
    method: schedule.settings.method,
    Fy_ksi: schedule.settings.Fy_ksi,
    series: schedule.settings.series,
    allowHeavierAbove: schedule.settings.allowHeavierAbove,
    lengths: cells.map(({ lv, cell }) => ({
      level: lv.id, bottomLevel: cell!.bottomLevel, Lc_ft: cell!.Lc_ft, tier: cell!.tier,
      D_kip: cell!.D_kip, L_kip: cell!.L_kip, Lr_kip: cell!.Lr_kip, S_kip: cell!.S_kip, selfWeight_kip: cell!.selfWeight_kip,
    })),
    tiers: column.tiers.map((t) => ({ tier: t.tier, shape: t.shape, locked: t.locked })),
  });
}

export interface ColumnSheetProps {
  schedule: ColumnSchedule;
  column: ColumnScheduleColumn;
  units: UnitSystem;
  onClose?: () => void;
  /** Splice and tier-lock controls (engineer and owner), composed by the screen. */
  editor?: React.ReactNode;
}

/**
 * A column's sheet: per tier, every length with Pr per combination, Lc from the level
 * elevations, Lc/r about both axes, Fe (Eq. E3-4), Fcr (Eq. E3-2 or E3-3 against 4.71√(E/Fy)),
 * E7 where an element is slender, the available strength, the ratio, and the lighter shapes
 * tried with why each failed.
 */
export function ColumnSheet({ schedule, column, units, onClose, editor }: ColumnSheetProps) {
  const working = useMemo(() => workingOf(schedule, column), [schedule, column]);
  const name = new Map(schedule.levels.map((l) => [l.id, l.name]));
  const elevation = new Map(schedule.levels.map((l) => [l.id, l.elevation_ft]));
  const lvl = (id: string | null) => (id === null ? 'the base (0 ft)' : name.get(id) ?? id);
  const cap = working.method === 'LRFD' ? 'φcPn' : 'Pn/Ωc';
  const force = (kip: number) => formatQuantity('force_kip', kip, units, { digits: 1 });
  const stress = (ksi: number) => (Number.isFinite(ksi) ? formatQuantity('stress_ksi', ksi, units) : '∞');
  const len = (ft: number) => formatQuantity('length_ft', ft, units, { digits: 2 });

  return (
    <article aria-labelledby={`column-sheet-${column.id}`} className="flex flex-col gap-3 border-2 border-ink bg-paper-raised p-4" data-testid="column-sheet">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={`column-sheet-${column.id}`} className="text-lg font-semibold text-ink">
          Column {column.mark}
          <span className="ml-2 text-sm font-normal text-ink-soft">
            {working.tiers.length} tier{working.tiers.length === 1 ? '' : 's'} · {working.method} · Fy {formatQuantity('stress_ksi', working.Fy_ksi, units)} · series {working.series.join(', ')}
          </span>
        </h3>
        {onClose ? (
          <Button variant="quiet" className="h-8 text-xs" onClick={onClose}>
            Close sheet
          </Button>
        ) : null}
      </header>
      <p className="text-sm text-ink-soft">
        AISC 360-16 Chapter E, pinned gravity column (K = 1.0, Lc = storey height from the level elevations, the same about both axes).
        Pr is the largest ASCE 7-16 {working.method === 'LRFD' ? '§2.3.1' : '§2.4.1'} combination of the loads collected down to the length, with
        the column&apos;s own weight above the length&apos;s bottom as dead load. Fcr by Eq. E3-2 when Lc/r ≤ 4.71√(E/Fy) ={' '}
        <span className="figures font-mono text-ink">{f1(working.e3Limit)}</span>, else Eq. E3-3.
      </p>
      {editor}
      {working.tiers.map((t) => (
        <section key={t.tier} aria-label={`Tier ${t.tier}`} className="flex flex-col gap-2 border-t border-ink pt-2" data-testid={`column-sheet-tier-${t.tier}`}>
          <h4 className="flex flex-wrap items-center gap-2 font-semibold text-ink">
            <span>Tier {t.tier}</span>
            <span className="font-mono">{t.shape ?? 'not sized'}</span>
            <span className="text-xs font-normal text-ink-soft">
              {t.locked ? 'locked: checked, not replaced' : 'lightest passing shape'} · from {lvl(t.fromLevel)} up to {lvl(t.toLevel)}
            </span>
            {t.ratio !== null ? <UtilisationChip ratio={t.ratio} /> : null}
            {t.governingLevel ? <span className="text-xs font-normal text-ink-soft">governs below {lvl(t.governingLevel)}</span> : null}
          </h4>
          {t.lengths.map((l) => (
            <LengthWorking key={l.level} l={l} cap={cap} lvl={lvl} elevation={elevation} force={force} stress={stress} len={len} units={units} />
          ))}
          {t.lighter.length > 0 ? (
            <div className="text-sm">
              <p className="label-caps">Lighter shapes tried</p>
              <ul className="figures font-mono text-xs" data-testid={`lighter-tier-${t.tier}`}>
                {t.lighter.map((x) => (
                  <li key={x.shape}>
                    {x.shape}: {x.ratio !== null ? `ratio ${f3(x.ratio)} — ` : ''}
                    <span className="font-sans">{x.failsAt ? x.reason.replace(`below ${x.failsAt}`, `below ${lvl(x.failsAt)}`) : x.reason}</span>
                  </li>
                ))}
              </ul>
            </div>
          ) : !t.locked ? (
            <p className="text-xs text-ink-soft">No lighter shape of the allowed series exists.</p>
          ) : null}
        </section>
      ))}
      <EngineerCaution />
    </article>
  );
}

function LengthWorking({
  l, cap, lvl, elevation, force, stress, len, units,
}: {
  l: ColumnWorkingLength;
  cap: string;
  lvl: (id: string | null) => string;
  elevation: Map<string, number>;
  force: (kip: number) => string;
  stress: (ksi: number) => string;
  len: (ft: number) => string;
  units: UnitSystem;
}) {
  const s = l.strength;
  const top = elevation.get(l.level) ?? 0;
  const bottom = l.bottomLevel === null ? 0 : elevation.get(l.bottomLevel) ?? 0;
  const axes = [s.x, s.y];
  return (
    <div className="flex flex-col gap-1 border-l-2 border-ink/30 pl-3 text-sm" data-testid={`column-length-${l.level}`}>
      <p className="font-medium text-ink">
        Length below {lvl(l.level)}: Lc = {len(top)} − {len(bottom)} = <span className="figures font-mono">{len(l.Lc_ft)}</span> (to {lvl(l.bottomLevel)})
      </p>
      <table className="figures w-fit border-collapse font-mono text-xs">
        <caption className="sr-only">Pr per combination</caption>
        <tbody>
          {l.combinations.map((c) => (
            <tr key={c.name} className={c.name === l.governing ? 'font-semibold text-ink' : 'text-ink-soft'}>
              <th scope="row" className="pr-3 text-left font-normal">{c.name}</th>
              <td className="pr-3 text-right">{force(c.Pr_kip)}</td>
              <td className="font-sans">{c.name === l.governing ? 'governs' : ''}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-xs text-ink-soft">includes column self weight {force(l.selfWeight_kip)} (dead)</p>
      <table className="figures w-fit border-collapse text-xs">
        <thead>
          <tr className="label-caps">
            <th className="pr-3 text-left">Axis</th>
            <th className="pr-3 text-right">r ({unitLabel('length_in', units)})</th>
            <th className="pr-3 text-right">Lc/r</th>
            <th className="pr-3 text-right">Fe (E3-4)</th>
            <th className="pr-3 text-right">Fcr</th>
            <th className="pr-3 text-left">because</th>
            <th className="pr-3 text-right">Pn</th>
          </tr>
        </thead>
        <tbody className="font-mono">
          {axes.map((a) => (
            <tr key={a.axis} className={a.axis === s.governingAxis ? 'font-semibold text-ink' : 'text-ink-soft'}>
              <th scope="row" className="pr-3 text-left">{a.axis}</th>
              <td className="pr-3 text-right">{formatValue('length_in', a.rIn, units, { digits: 2 })}</td>
              <td className="pr-3 text-right">{f1(a.slenderness)}</td>
              <td className="pr-3 text-right">{stress(a.feKsi)}</td>
              <td className="pr-3 text-right">{stress(a.fcrKsi)}</td>
              <td className="whitespace-nowrap pr-3 font-sans">
                {a.equation}: {f1(a.slenderness)} {a.equation === 'Eq. E3-2' ? '≤' : '>'} {f1(a.limit)}
              </td>
              <td className="pr-3 text-right">{force(a.pnKip)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {s.section === 'E7' ? (
        <p className="text-xs" data-testid="column-e7">
          AISC 360-16 E7 (slender element per Table B4.1a):{' '}
          {s[s.governingAxis].web
            ? `web h/tw ${f1(s[s.governingAxis].web!.lambda)} against λr ${f1(s[s.governingAxis].web!.lambdaR)}, ${s[s.governingAxis].web!.equation}: he = ${formatValue('length_in', s[s.governingAxis].web!.beIn, units, { digits: 2 })} of ${formatValue('length_in', s[s.governingAxis].web!.bIn, units, { digits: 2 })} ${unitLabel('length_in', units)}; `
            : ''}
          Ae = {formatQuantity('area_in2', s[s.governingAxis].areaIn2, units)}, Pn = Fcr Ae (Eq. E7-1).
        </p>
      ) : null}
      <p className="text-sm">
        {s.limitState} ({s.clause}, {s.equation}): {cap} = {s.section === 'E3' ? 'Fcr Ag' : 'Fcr Ae'}
        {cap === 'φcPn' ? ` × ${s.phi}` : ` / ${s.omega}`} = <span className="figures font-mono font-semibold">{force(s.pcKip)}</span>; ratio Pr/{cap} ={' '}
        <span className="figures font-mono">{force(l.Pr_kip)}</span> / <span className="figures font-mono">{force(s.pcKip)}</span> ={' '}
        <UtilisationChip ratio={l.ratio} showLabel={false} /> {l.passes ? 'passes' : 'fails'}
      </p>
    </div>
  );
}
