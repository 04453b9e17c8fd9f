import { useMemo, useState } from 'react';
import { UtilisationChip } from '../../../components/ui/utilisation-chip.ui';
import { formatValue, unitLabel, type UnitSystem } from '../../../lib/units';
import { compareMarks, scheduleMarkRows, type ScheduleBasis, type ScheduleMarkRow, type ScheduleRow } from '../../../../shared/drafting/schedule.drafting';
import { ColumnChooser, type ChoosableColumn } from './column-chooser.component';
import { GOVERNING_WORDS } from './schedule-table.component';

export interface ScheduleMarkTableProps {
  rows: ScheduleRow[];
  levels: { id: string; name: string }[];
  basis: ScheduleBasis;
  units: UnitSystem;
  mayEditMarks: boolean;
  /** Gives every member of a row one mark (locked), or back to the rule with null. */
  onSaveMarks?: (memberIds: string[], mark: string | null) => Promise<void>;
  savingMark?: boolean;
}

const dash = '—';

const OPTIONAL: ChoosableColumn[] = [
  { id: 'span', label: 'Span' },
  { id: 'grid', label: 'Grid locations' },
  { id: 'reaction', label: 'Reaction envelope' },
  { id: 'governs', label: 'Governs' },
  { id: 'ratio', label: 'Ratio' },
  { id: 'camber', label: 'Camber' },
  { id: 'studs', label: 'Studs' },
  { id: 'level', label: 'Level' },
  { id: 'kind', label: 'Kind' },
];

function MarkEditor({ row, onSave, saving }: { row: ScheduleMarkRow; onSave?: ScheduleMarkTableProps['onSaveMarks']; saving?: boolean }) {
  const [editing, setEditing] = useState(false);
  const [value, setValue] = useState(row.mark);
  const what = `${row.quantity} member${row.quantity === 1 ? '' : 's'} marked ${row.mark}`;
  if (!editing) {
    return (
      <button type="button" className="rounded-[3px] px-1 text-xs text-accent hover:bg-accent-wash" aria-label={`Edit mark of the ${what}`} onClick={() => (setValue(row.mark), setEditing(true))}>
        Edit
      </button>
    );
  }
  return (
    <form
      className="flex items-center gap-1"
      onSubmit={async (e) => {
        e.preventDefault();
        await onSave?.(row.memberIds, value.trim() === '' ? null : value.trim());
        setEditing(false);
      }}
    >
      <input aria-label={`New mark for the ${what}`} className="h-7 w-20 rounded-[3px] border border-ink/60 bg-paper px-1 font-mono text-sm" value={value} maxLength={40} autoFocus onChange={(e) => setValue(e.target.value)} />
      <button type="submit" className="rounded-[3px] bg-accent px-1.5 text-xs text-white" disabled={saving}>
        Save
      </button>
      <button type="button" className="px-1 text-xs text-ink-soft" onClick={() => setEditing(false)}>
        Cancel
      </button>
    </form>
  );
}

/**
 * The schedule one row per piece mark: quantity, size, span, where the pieces are, and the
 * envelope of their end reactions (said as such). A mark carried by more than one size, span,
 * camber or stud count is split into one row each, flagged.
 */
export function ScheduleMarkTable({ rows, levels, basis, units, mayEditMarks, onSaveMarks, savingMark }: ScheduleMarkTableProps) {
  const [levelFilter, setLevelFilter] = useState('');
  const [kindFilter, setKindFilter] = useState('');
  const [hidden, setHidden] = useState<Set<string>>(() => new Set());
  const markRows = useMemo(() => scheduleMarkRows(rows).sort((a, b) => a.levelOrder - b.levelOrder || compareMarks(a.mark, b.mark)), [rows]);
  const shown = markRows.filter((r) => (!levelFilter || r.level === levelFilter) && (!kindFilter || r.kind === kindFilter));
  const show = (id: string) => !hidden.has(id);
  const kip = (v: number) => formatValue('force_kip', v, units);
  const showRoof = markRows.some((r) => r.reaction.Lr_kip || r.reaction.S_kip);
  const select = 'h-9 rounded-[3px] border border-ink/60 bg-paper px-2 text-sm';
  const th = 'border-b border-ink px-2 py-1.5 text-left align-bottom text-xs font-semibold text-ink';
  const td = 'px-2 py-1 align-top';
  const reactionCols = 3 + (showRoof ? 1 : 0);

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3" role="search" aria-label="Filter the schedule by mark">
        <label className="flex flex-col gap-1 text-sm">
          <span className="label-caps">Level</span>
          <select className={select} value={levelFilter} onChange={(e) => setLevelFilter(e.target.value)}>
            <option value="">All levels</option>
            {levels.map((l) => (
              <option key={l.id} value={l.id}>
                {l.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-sm">
          <span className="label-caps">Kind</span>
          <select className={select} value={kindFilter} onChange={(e) => setKindFilter(e.target.value)}>
            <option value="">Girders and beams</option>
            <option value="girder">Girders</option>
            <option value="beam">Beams</option>
          </select>
        </label>
        <ColumnChooser columns={OPTIONAL} hidden={hidden} onChange={setHidden} />
        <p className="ml-auto text-sm text-ink-soft" aria-live="polite">
          <span className="figures font-mono">{shown.length}</span> marks · <span className="figures font-mono">{shown.reduce((n, r) => n + r.quantity, 0)}</span> members
        </p>
      </div>
      <div className="max-h-[70vh] overflow-auto border-2 border-ink bg-paper-raised">
        <table className="figures w-full border-collapse text-sm" aria-label="Schedule by mark">
          <thead className="sticky top-0 z-10 bg-paper-sunk">
            <tr>
              <th scope="col" rowSpan={2} className={th}>Mark</th>
              <th scope="col" rowSpan={2} className={th}>Size</th>
              <th scope="col" rowSpan={2} className={th}>Qty</th>
              {show('span') ? <th scope="col" rowSpan={2} className={th}>Span ({unitLabel('length_ft', units)})</th> : null}
              {show('grid') ? <th scope="col" rowSpan={2} className={th}>Grid locations</th> : null}
              {show('reaction') ? (
                <th scope="colgroup" colSpan={reactionCols} className={th} title="The largest of each over both ends of every member of the mark">
                  Reaction, envelope of the ends ({unitLabel('force_kip', units)})
                </th>
              ) : null}
              {show('governs') ? <th scope="col" rowSpan={2} className={th}>Governs</th> : null}
              {show('ratio') ? <th scope="col" rowSpan={2} className={th}>Ratio (max)</th> : null}
              {show('camber') ? <th scope="col" rowSpan={2} className={th}>Camber ({unitLabel('length_in', units)})</th> : null}
              {show('studs') ? <th scope="col" rowSpan={2} className={th}>Studs</th> : null}
              {show('level') ? <th scope="col" rowSpan={2} className={th}>Level</th> : null}
              {show('kind') ? <th scope="col" rowSpan={2} className={th}>Kind</th> : null}
            </tr>
            <tr>
              {show('reaction') ? (
                <>
                  <th scope="col" className={th}>D</th>
                  <th scope="col" className={th}>L</th>
                  {showRoof ? <th scope="col" className={th}>Lr/S</th> : null}
                  <th scope="col" className={th}>{basis.method === 'LRFD' ? 'Factored' : 'ASD D+L'}</th>
                </>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {shown.map((r) => (
              <tr key={r.key} className="border-b border-line/70 hover:bg-accent-wash/40" data-mark={r.mark} data-quantity={r.quantity}>
                <td className={`${td} whitespace-nowrap`}>
                  <span className="flex items-center gap-1.5">
                    <span className="font-mono font-semibold">{r.mark || dash}</span>
                    {mayEditMarks ? <MarkEditor row={r} onSave={onSaveMarks} saving={savingMark} /> : null}
                  </span>
                  {r.split ? <span className="block text-xs text-danger">mark shared by another design: split</span> : null}
                </td>
                <td className={`${td} whitespace-nowrap font-mono`}>{r.size ?? 'not sized'}</td>
                <td className={`${td} font-mono`}>{r.quantity}</td>
                {show('span') ? <td className={td}>{formatValue('length_ft', r.span_ft, units)}</td> : null}
                {show('grid') ? (
                  <td className={`${td} max-w-56 text-xs`} title={r.gridLocations.join('; ')}>
                    {r.gridLocations.length === 0 ? dash : r.gridLocations.slice(0, 3).join('; ')}
                    {r.gridLocations.length > 3 ? <span className="text-ink-soft"> and {r.gridLocations.length - 3} more</span> : null}
                  </td>
                ) : null}
                {show('reaction') ? (
                  <>
                    <td className={td}>{kip(r.reaction.D_kip)}</td>
                    <td className={td}>{kip(r.reaction.L_kip)}</td>
                    {showRoof ? <td className={td}>{kip(r.reaction.Lr_kip + r.reaction.S_kip)}</td> : null}
                    <td className={td}>
                      <span className="font-semibold">{kip(r.reaction.factored_kip)}</span>
                      {r.enveloped ? <span className="ml-1 text-xs text-ink-soft" title="Largest of the ends; some ends carry less">max</span> : null}
                    </td>
                  </>
                ) : null}
                {show('governs') ? <td className={td}>{r.governing ? (GOVERNING_WORDS[r.governing] ?? r.governing) : dash}</td> : null}
                {show('ratio') ? <td className={td}>{r.ratio !== null ? <UtilisationChip ratio={r.ratio} showLabel={false} /> : dash}</td> : null}
                {show('camber') ? <td className={td}>{r.camber_in === null ? dash : formatValue('length_in', r.camber_in, units)}</td> : null}
                {show('studs') ? <td className={td}>{r.studs === null ? dash : r.studs}</td> : null}
                {show('level') ? <td className={td}>{r.levelName}</td> : null}
                {show('kind') ? <td className={td}>{r.kind}</td> : null}
              </tr>
            ))}
            {shown.length === 0 ? (
              <tr>
                <td colSpan={20} className="px-2 py-6 text-center text-ink-soft">
                  No mark matches these filters.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
