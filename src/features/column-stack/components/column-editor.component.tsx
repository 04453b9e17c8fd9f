import { useState } from 'react';
import type { ColumnSchedule, ColumnScheduleColumn } from '../../../../shared/drafting/column-schedule.drafting';
import { listWShapes, nominalDepthIn } from '../../../../shared/catalog/w-shapes.catalog';
import { Button } from '../../../components/ui/button.ui';
import type { ColumnEdit } from '../lib/column-edits';

/** Series the Column stack offers (designBasis.columns.series accepts any W depth). */
export const OFFERED_SERIES = ['W14', 'W12', 'W10', 'W8'] as const;

/** W-shapes of the allowed series, heaviest first, for a tier lock. */
function shapesOf(series: readonly string[]): string[] {
  const depths = new Set(series.map((s) => Number(s.slice(1))));
  return listWShapes()
    .filter((s) => depths.has(nominalDepthIn(s)))
    .sort((a, b) => nominalDepthIn(b) - nominalDepthIn(a) || b.W_plf - a.W_plf)
    .map((s) => s.label);
}

export interface ColumnSettingsProps {
  schedule: ColumnSchedule;
  canEdit: boolean;
  pending: boolean;
  onEdit: (edit: ColumnEdit) => void;
}

/** The settings for all columns: allowed series and splice levels. Read-only text for drafters and managers. */
export function ColumnSettings({ schedule, canEdit, pending, onEdit }: ColumnSettingsProps) {
  const s = schedule.settings;
  const [series, setSeries] = useState<string[]>(s.series);
  const [splices, setSplices] = useState<string[] | null>(s.spliceLevels);
  const levelsUp = [...schedule.levels].reverse();
  const name = new Map(schedule.levels.map((l) => [l.id, l.name]));
  if (!canEdit) {
    return (
      <section aria-label="Column settings" className="text-sm text-ink-soft" data-testid="column-settings-readonly">
        <p>
          Allowed series <strong className="text-ink">{s.series.join(', ')}</strong> · splices for all columns:{' '}
          <strong className="text-ink">{s.spliceLevels ? (s.spliceLevels.length ? s.spliceLevels.map((l) => name.get(l) ?? l).join(', ') : 'none (one tier)') : `every ${s.storeysPerTier} storeys from the bottom`}</strong>
        </p>
        <p>Read only: your role can view the column schedule but not change splices, series or sizes.</p>
      </section>
    );
  }
  return (
    <section aria-label="Column settings" className="flex flex-wrap gap-6 border border-ink/40 bg-paper px-3 py-2 text-sm" data-testid="column-settings">
      <fieldset className="flex flex-col gap-1">
        <legend className="label-caps">Allowed series</legend>
        <div className="flex gap-3">
          {OFFERED_SERIES.map((x) => (
            <label key={x} className="flex items-center gap-1">
              <input type="checkbox" checked={series.includes(x)} onChange={(e) => setSeries((v) => (e.target.checked ? [...v, x] : v.filter((y) => y !== x)))} />
              {x}
            </label>
          ))}
        </div>
        <Button variant="secondary" className="h-8 w-fit text-xs" pending={pending} disabled={series.length === 0} onClick={() => onEdit({ kind: 'series', series })}>
          Use these series
        </Button>
      </fieldset>
      <fieldset className="flex flex-col gap-1">
        <legend className="label-caps">Splices for all columns</legend>
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={splices === null} onChange={(e) => setSplices(e.target.checked ? null : [])} />
          every {s.storeysPerTier} storeys from the bottom
        </label>
        {splices !== null ? (
          <div className="flex flex-wrap gap-3">
            {levelsUp.slice(0, -1).map((l) => (
              <label key={l.id} className="flex items-center gap-1">
                <input type="checkbox" aria-label={`Splice all columns at ${l.name}`} checked={splices.includes(l.id)} onChange={(e) => setSplices((v) => (e.target.checked ? [...(v ?? []), l.id] : (v ?? []).filter((y) => y !== l.id)))} />
                {l.name}
              </label>
            ))}
          </div>
        ) : null}
        <Button variant="secondary" className="h-8 w-fit text-xs" pending={pending} onClick={() => onEdit({ kind: 'projectSplices', levels: splices })}>
          Splice all columns so
        </Button>
      </fieldset>
    </section>
  );
}

export interface ColumnEditorProps {
  schedule: ColumnSchedule;
  column: ColumnScheduleColumn;
  pending: boolean;
  onEdit: (edit: ColumnEdit) => void;
}

/** One column's splice levels and locked tier sizes (engineer and owner). */
export function ColumnEditor({ schedule, column, pending, onEdit }: ColumnEditorProps) {
  const name = new Map(schedule.levels.map((l) => [l.id, l.name]));
  const elevation = new Map(schedule.levels.map((l) => [l.id, l.elevation_ft]));
  const levelsUp = [...column.levelIds].sort((a, b) => (elevation.get(a) ?? 0) - (elevation.get(b) ?? 0));
  // A splice at the top level starts no tier: offer the levels below the top.
  const spliceable = levelsUp.slice(0, -1);
  const [own, setOwn] = useState<string[] | null>(column.ownSpliceLevels);
  const current = own ?? column.spliceLevels;
  const shapes = shapesOf(schedule.settings.series);
  const tierLevels = (tier: number) => schedule.levels.filter((_, i) => column.cells[i]?.tier === tier).map((l) => l.id);
  return (
    <section aria-label={`Splices and sizes of column ${column.mark}`} className="flex flex-col gap-2 border border-ink/40 bg-paper px-3 py-2 text-sm" data-testid="column-editor">
      <fieldset className="flex flex-col gap-1">
        <legend className="label-caps">Splices of this column (a new tier starts above the floor)</legend>
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={own === null} onChange={(e) => setOwn(e.target.checked ? null : [...column.spliceLevels])} />
          follow the splices for all columns
        </label>
        <div className="flex flex-wrap gap-3">
          {spliceable.map((l) => (
            <label key={l} className="flex items-center gap-1">
              <input
                type="checkbox"
                aria-label={`Splice ${column.mark} at ${name.get(l) ?? l}`}
                disabled={own === null}
                checked={current.includes(l)}
                onChange={(e) => setOwn((v) => (e.target.checked ? [...(v ?? []), l] : (v ?? []).filter((y) => y !== l)))}
              />
              {name.get(l) ?? l}
            </label>
          ))}
        </div>
        <Button variant="secondary" className="h-8 w-fit text-xs" pending={pending} onClick={() => onEdit({ kind: 'columnSplices', columnId: column.id, levels: own })}>
          Save splices of {column.mark}
        </Button>
      </fieldset>
      <fieldset className="flex flex-col gap-1">
        <legend className="label-caps">Tier sizes</legend>
        {column.tiers.map((t) => {
          const lock = column.tierShapes.find((x) => tierLevels(t.tier).includes(x.level));
          return (
            <label key={t.tier} className="flex items-center gap-2">
              <span className="w-14">Tier {t.tier}</span>
              <select
                aria-label={`Size of tier ${t.tier} of ${column.mark}`}
                className="h-8 rounded-[3px] border border-ink/60 bg-paper px-2 font-mono text-xs"
                value={lock?.shape ?? ''}
                disabled={pending}
                onChange={(e) => onEdit({ kind: 'tierShape', columnId: column.id, level: t.toLevel, tierLevels: tierLevels(t.tier), shape: e.target.value || null })}
              >
                <option value="">size it ({t.shape ?? 'none passes'})</option>
                {(lock && !shapes.includes(lock.shape) ? [lock.shape, ...shapes] : shapes).map((s) => (
                  <option key={s} value={s}>
                    lock {s}
                  </option>
                ))}
              </select>
            </label>
          );
        })}
      </fieldset>
    </section>
  );
}
