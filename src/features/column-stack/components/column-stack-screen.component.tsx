import { useState } from 'react';
import type { ColumnSchedule } from '../../../../shared/drafting/column-schedule.drafting';
import { EmptyState } from '../../../components/ui/empty-state.ui';
import { EngineerCaution } from '../../../components/ui/engineer-caution.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { Loading } from '../../../components/ui/loading.ui';
import { UtilisationChip } from '../../../components/ui/utilisation-chip.ui';
import { isApiError } from '../../../lib/api-client';
import { formatQuantity, formatValue, LB_KG, unitLabel, type UnitSystem } from '../../../lib/units';
import { UnitsSwitch, useUnits } from '../../../lib/units-context';
import { useColumnSchedule } from '../api/get-column-schedule.api';
import { useSaveColumnEdit } from '../api/save-column-settings.api';
import type { ColumnEdit } from '../lib/column-edits';
import { ColumnEditor, ColumnSettings } from './column-editor.component';
import { ColumnSheet } from './column-sheet.component';

export interface ColumnStackScheme {
  id: string;
  name: string;
  status: string;
}

export interface ColumnStackScreenProps {
  projectId: string;
  schemes: ColumnStackScheme[];
  /** Engineer and owner; the server enforces it on the plan save. */
  canEdit: boolean;
  initialSchemeId?: string | null;
  initialColumnId?: string | null;
  onOpen?: (at: { schemeId: string; columnId: string | null }) => void;
}

const whole = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const steelMass = (lb: number, units: UnitSystem) => (units === 'SI' ? `${whole.format(lb * LB_KG)} kg` : `${whole.format(lb)} lb`);

/** Column stack: the column schedule of a scheme (columns across, levels down), each column's sheet and its splices. */
export function ColumnStackScreen({ projectId, schemes, canEdit, initialSchemeId, initialColumnId, onOpen }: ColumnStackScreenProps) {
  const [schemeId, setSchemeId] = useState(() => (initialSchemeId && schemes.some((s) => s.id === initialSchemeId) ? initialSchemeId : (schemes.find((s) => s.status === 'chosen') ?? schemes[0])?.id ?? ''));
  const [columnId, setColumnId] = useState<string | null>(initialColumnId ?? null);
  const [notice, setNotice] = useState<{ text: string; error: boolean } | null>(null);
  const { system } = useUnits();
  const view = useColumnSchedule(schemeId);
  const save = useSaveColumnEdit(projectId, schemeId);

  if (schemes.length === 0) {
    return (
      <EmptyState title="No columns to show">
        The Column stack lists every column by level with its size per tier, splices and loads. It fills in when a scheme has columns on its Plan.
      </EmptyState>
    );
  }
  const open = (id: string | null) => {
    setColumnId(id);
    onOpen?.({ schemeId, columnId: id });
  };
  const edit = async (e: ColumnEdit) => {
    setNotice(null);
    try {
      const r = await save.mutateAsync(e);
      setNotice({ text: `Saved (revision ${r.revision}); the columns were designed again.`, error: false });
    } catch (err) {
      setNotice({ text: isApiError(err) ? err.message : err instanceof Error ? err.message : 'The change could not be saved.', error: true });
    }
  };
  const schedule = view.data?.columnSchedule;
  const column = schedule?.columns.find((c) => c.id === columnId) ?? null;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <label className="flex flex-col gap-1 text-sm">
          <span className="label-caps">Scheme</span>
          <select
            className="h-9 min-w-64 rounded-[3px] border border-ink/60 bg-paper px-2"
            value={schemeId}
            onChange={(e) => {
              setSchemeId(e.target.value);
              setColumnId(null);
              setNotice(null);
              onOpen?.({ schemeId: e.target.value, columnId: null });
            }}
          >
            {schemes.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
                {s.status === 'chosen' ? ' (chosen)' : ''}
              </option>
            ))}
          </select>
        </label>
        <UnitsSwitch />
      </div>
      {view.isPending ? (
        <Loading label="Reading the design…" />
      ) : view.isError ? (
        <FormAlert>The column stack could not be loaded: {view.error.message}</FormAlert>
      ) : !schedule || schedule.columns.length === 0 ? (
        <EmptyState title="No columns in this scheme">Columns placed on the Plan appear here, sized by tier.</EmptyState>
      ) : (
        <>
          <ColumnSettings key={`${schemeId}-${view.data.scheme.revision}`} schedule={schedule} canEdit={canEdit} pending={save.isPending} onEdit={edit} />
          {notice ? (
            <p role="status" className={`text-sm ${notice.error ? 'text-danger' : 'text-ink'}`}>
              {notice.text}
            </p>
          ) : null}
          {view.data.problems.some((p) => p.elementId && schedule.columns.some((c) => c.id === p.elementId)) ? (
            <FormAlert>{view.data.problems.filter((p) => schedule.columns.some((c) => c.id === p.elementId)).map((p) => p.message).join(' ')}</FormAlert>
          ) : null}
          <ColumnStackTable schedule={schedule} units={system} selected={columnId} onSelect={open} />
          {column ? (
            <ColumnSheet
              key={`${column.id}-${view.data.scheme.revision}`}
              schedule={schedule}
              column={column}
              units={system}
              onClose={() => open(null)}
              editor={canEdit ? <ColumnEditor key={`${column.id}-${view.data.scheme.revision}`} schedule={schedule} column={column} pending={save.isPending} onEdit={edit} /> : null}
            />
          ) : null}
          <EngineerCaution />
        </>
      )}
    </div>
  );
}

export interface ColumnStackTableProps {
  schedule: ColumnSchedule;
  units: UnitSystem;
  selected: string | null;
  onSelect: (columnId: string) => void;
}

/**
 * The column schedule of the Column stack: columns across, levels down (top first). A cell is
 * the length below its level: size, tier, Pr at that level against the available strength, the
 * ratio and the governing combination; a heavy rule with a splice tag marks the floor where a
 * new tier starts. The foot row gives each tier's size, ratio and governing combination.
 */
export function ColumnStackTable({ schedule, units, selected, onSelect }: ColumnStackTableProps) {
  const cap = schedule.settings.method === 'LRFD' ? 'φcPn' : 'Pn/Ωc';
  const force = unitLabel('force_kip', units);
  const name = new Map(schedule.levels.map((l) => [l.id, l.name]));
  return (
    <section aria-labelledby="column-stack-title" className="flex flex-col gap-2">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id="column-stack-title" className="font-semibold text-ink">
          Column schedule
        </h3>
        <p className="text-sm text-ink-soft">
          Columns <span className="figures font-mono text-ink">{schedule.columns.length}</span> · column steel{' '}
          <span className="figures font-mono text-ink" data-testid="column-steel">{steelMass(schedule.columnWeight_lb, units)}</span>
        </p>
      </div>
      <p className="text-sm text-ink-soft">
        Each cell is the column length below its level: size and tier, Pr (with the column&apos;s own weight) against {cap} ({force}), the ratio and the
        governing combination. AISC 360-16 Chapter E, pinned gravity columns (K = 1.0). The splice is taken at the floor, so the storey above it is
        checked with the upper size (conservative). Choose a column to open its sheet.
      </p>
      <div className="overflow-x-auto border border-ink">
        <table className="figures border-collapse text-sm" data-testid="column-stack">
          <thead className="bg-paper">
            <tr>
              <th scope="col" className="sticky left-0 bg-paper px-2 py-1 text-left label-caps">
                Level
              </th>
              {schedule.columns.map((c) => (
                <th key={c.id} scope="col" className={`px-2 py-1 text-left ${selected === c.id ? 'bg-accent/15' : ''}`}>
                  <button type="button" className="font-semibold text-accent underline" aria-pressed={selected === c.id} onClick={() => onSelect(c.id)} title={`Open the sheet of column ${c.mark}`}>
                    {c.mark}
                  </button>
                  {c.tiers.some((t) => t.locked) ? <span className="ml-1 text-xs text-ink-soft">(locked)</span> : null}
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
                      className={`px-2 py-1 ${cell.spliceBelow ? 'border-b-[3px] border-ink' : 'border-b border-ink/20'} ${selected === c.id ? 'bg-accent/5' : ''}`}
                      data-column={c.id}
                      data-level={lv.id}
                      data-tier={cell.tier ?? ''}
                    >
                      <span className="block font-mono font-semibold text-ink">{cell.shape ?? 'not sized'}</span>
                      {cell.tier !== null ? <span className="block text-xs text-ink-soft">tier {cell.tier}</span> : null}
                      <span className="block font-mono text-xs">
                        Pr {formatValue('force_kip', cell.Pr_kip, units, { digits: 0 })}
                        {cell.Pc_kip !== null ? ` / ${formatValue('force_kip', cell.Pc_kip, units, { digits: 0 })}` : ''}
                      </span>
                      {cell.ratio !== null ? <UtilisationChip ratio={cell.ratio} showLabel={false} /> : null}
                      <span className="block text-xs text-ink-soft">{cell.governing}</span>
                      {cell.spliceBelow ? <span className="block text-xs font-semibold text-ink">▾ splice</span> : null}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
          <tfoot>
            <tr className="align-top border-t-2 border-ink bg-paper">
              <th scope="row" className="sticky left-0 bg-paper px-2 py-1 text-left label-caps">
                Tiers
              </th>
              {schedule.columns.map((c) => (
                <td key={c.id} className="px-2 py-1 text-xs" data-testid={`tiers-${c.id}`}>
                  {c.tiers.map((t) => (
                    <span key={t.tier} className="block whitespace-nowrap">
                      <span className="font-mono font-semibold text-ink">{t.shape ?? '—'}</span> T{t.tier}
                      {t.ratio !== null ? ` · ${t.ratio.toFixed(2)}` : ''}
                      {t.governing ? ` · ${t.governing}` : ''}
                      {t.governingLevel ? ` below ${name.get(t.governingLevel) ?? t.governingLevel}` : ''}
                      {t.locked ? ' · locked' : ''}
                    </span>
                  ))}
                </td>
              ))}
            </tr>
          </tfoot>
        </table>
      </div>
    </section>
  );
}
