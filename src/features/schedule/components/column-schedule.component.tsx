import type { ColumnSchedule } from '../../../../shared/drafting/column-schedule.drafting';
import { UtilisationChip } from '../../../components/ui/utilisation-chip.ui';
import { formatQuantity, formatValue, LB_KG, unitLabel, type UnitSystem } from '../../../lib/units';

const whole = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
/** Steel weight in lb (US) or kg (SI, NIST SP 811 factor). */
const steelMass = (lb: number, units: UnitSystem) => (units === 'SI' ? `${whole.format(lb * LB_KG)} kg` : `${whole.format(lb)} lb`);

export interface ColumnScheduleTableProps {
  schedule: ColumnSchedule;
  method: 'LRFD' | 'ASD';
  units: UnitSystem;
}

/**
 * Column schedule: columns across, levels down (top first). Each cell is the column length below
 * that level: its size, tier, Lc, Pr against the available strength with the ratio, and the
 * governing combination; a heavy rule with "splice" marks the floor where a new tier starts.
 */
export function ColumnScheduleTable({ schedule, method, units }: ColumnScheduleTableProps) {
  if (schedule.columns.length === 0) return null;
  const capacity = method === 'LRFD' ? 'φcPn' : 'Pn/Ωc';
  const force = unitLabel('force_kip', units);
  return (
    <section aria-labelledby="column-schedule-title" className="flex flex-col gap-2">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="column-schedule-title" className="font-semibold text-ink">
          Column schedule
        </h2>
        <p className="text-sm text-ink-soft">
          Columns <span className="figures font-mono text-ink">{schedule.columns.length}</span> · column steel{' '}
          <span className="figures font-mono text-ink">{steelMass(schedule.columnWeight_lb, units)}</span>
        </p>
      </div>
      <p className="text-sm text-ink-soft">
        Each cell is the column length below its level: size and tier, Lc, Pr (with column self weight) against {capacity} ({force}),
        the ratio and the governing combination. AISC 360-16 Chapter E, pinned gravity columns (K = 1.0); tiers of two storeys unless
        splice levels are set (common practice). The splice is taken at the floor, so the storey above it is checked with the upper size
        (conservative).
      </p>
      <div className="overflow-x-auto">
        <table className="figures border-collapse text-sm" data-testid="column-schedule">
          <thead>
            <tr>
              <th scope="col" className="sticky left-0 bg-paper px-2 py-1 text-left label-caps">
                Level
              </th>
              {schedule.columns.map((c) => (
                <th key={c.id} scope="col" className="px-2 py-1 text-left" title={`Column ${c.id}`}>
                  <span className="font-semibold text-ink">{c.mark}</span>
                  {c.locked ? <span className="ml-1 text-xs text-ink-soft">(locked)</span> : null}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {schedule.levels.map((lv, row) => (
              <tr key={lv.id} className="align-top">
                <th scope="row" className="sticky left-0 bg-paper px-2 py-1 text-left font-normal text-ink">
                  {lv.name}
                  <span className="block text-xs text-ink-soft">{formatQuantity('length_ft', lv.elevation_ft, units)}</span>
                </th>
                {schedule.columns.map((c) => {
                  const cell = c.cells[row];
                  if (!cell) return <td key={c.id} className="px-2 py-1 text-ink-soft">—</td>;
                  return (
                    <td
                      key={c.id}
                      className={`px-2 py-1 ${cell.spliceBelow ? 'border-b-[3px] border-ink' : 'border-b border-ink/20'}`}
                      data-column={c.id}
                      data-level={lv.id}
                    >
                      <span className="block font-mono font-semibold text-ink">{cell.shape ?? 'not sized'}</span>
                      {cell.tier !== null ? (
                        <span className="block text-xs text-ink-soft">
                          tier {cell.tier} · Lc {formatQuantity('length_ft', cell.Lc_ft, units)}
                        </span>
                      ) : null}
                      <span className="block font-mono text-xs">
                        Pr {formatValue('force_kip', cell.Pr_kip, units, { digits: 0 })}
                        {cell.Pc_kip !== null ? ` / ${formatValue('force_kip', cell.Pc_kip, units, { digits: 0 })}` : ''}
                      </span>
                      {cell.ratio !== null ? <UtilisationChip ratio={cell.ratio} showLabel={false} /> : null}
                      <span className="block text-xs text-ink-soft">{cell.governing}</span>
                      {cell.spliceBelow ? <span className="block text-xs font-semibold text-ink">splice at the floor below</span> : null}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
