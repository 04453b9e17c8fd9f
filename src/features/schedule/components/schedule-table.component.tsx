import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getExpandedRowModel,
  getFilteredRowModel,
  getGroupedRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type GroupingState,
  type SortingState,
  type VisibilityState,
} from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { UtilisationChip } from '../../../components/ui/utilisation-chip.ui';
import { formatValue, unitLabel, type UnitSystem } from '../../../lib/units';
import { compareMarks, type ScheduleBasis, type ScheduleRow } from '../../../../shared/drafting/schedule.drafting';
import { ColumnChooser, type ChoosableColumn } from './column-chooser.component';

/** Optional columns of the member view and the table columns each one covers. */
const OPTIONAL_COLUMNS: (ChoosableColumn & { leaves: string[] })[] = [
  { id: 'span', label: 'Span', leaves: ['span_ft'] },
  { id: 'grid', label: 'Grid location', leaves: ['gridLocation'] },
  { id: 'startCases', label: 'Start reaction D, L', leaves: ['start-D', 'start-L', 'start-roof'] },
  { id: 'endCases', label: 'End reaction D, L', leaves: ['end-D', 'end-L', 'end-roof'] },
  { id: 'governs', label: 'Governs', leaves: ['governing'] },
  { id: 'ratio', label: 'Ratio', leaves: ['ratio'] },
  { id: 'camber', label: 'Camber', leaves: ['camber_in'] },
  { id: 'studs', label: 'Studs', leaves: ['studs'] },
  { id: 'level', label: 'Level', leaves: ['level'] },
  { id: 'kind', label: 'Kind', leaves: ['kind'] },
];

export type GroupBy = 'none' | 'level' | 'kind';

export interface ScheduleTableProps {
  rows: ScheduleRow[];
  levels: { id: string; name: string }[];
  basis: ScheduleBasis;
  units: UnitSystem;
  /** Drafters, engineers and owners edit marks; others see them only. */
  mayEditMarks: boolean;
  onSaveMark?: (memberId: string, mark: string | null) => Promise<void>;
  savingMark?: boolean;
}

const col = createColumnHelper<ScheduleRow>();
const dash = '—';

/** The governing check in words, as on the Member sheet (the engine reports a check id). */
export const GOVERNING_WORDS: Record<string, string> = {
  flexure: 'flexure',
  shear: 'shear',
  deflectionLive: 'live-load deflection',
  deflectionTotal: 'total-load deflection',
};

function MarkCell({ row, editable, onSave, saving }: { row: ScheduleRow; editable: boolean; onSave?: ScheduleTableProps['onSaveMark']; saving?: boolean }) {
  const [editing, setEditing] = useState(false);
  const [value, setValue] = useState(row.mark);
  if (!editing) {
    return (
      <span className="flex items-center gap-1.5">
        <span className="font-mono font-semibold">{row.mark || dash}</span>
        {editable ? (
          <button
            type="button"
            className="rounded-[3px] px-1 text-xs text-accent hover:bg-accent-wash"
            aria-label={`Edit mark of member ${row.memberId}`}
            onClick={() => {
              setValue(row.mark);
              setEditing(true);
            }}
          >
            Edit
          </button>
        ) : null}
      </span>
    );
  }
  return (
    <form
      className="flex items-center gap-1"
      onSubmit={async (e) => {
        e.preventDefault();
        await onSave?.(row.memberId, value.trim() === '' ? null : value.trim());
        setEditing(false);
      }}
    >
      <input
        aria-label={`Mark of member ${row.memberId}`}
        className="h-7 w-20 rounded-[3px] border border-ink/60 bg-paper px-1 font-mono text-sm"
        value={value}
        maxLength={40}
        autoFocus
        onChange={(e) => setValue(e.target.value)}
      />
      <button type="submit" className="rounded-[3px] bg-accent px-1.5 text-xs text-white" disabled={saving}>
        Save
      </button>
      <button type="button" className="px-1 text-xs text-ink-soft" onClick={() => setEditing(false)}>
        Cancel
      </button>
    </form>
  );
}

/** The member schedule: sortable, filterable by text, level and kind, grouped by level or kind. */
export function ScheduleTable({ rows, levels, basis, units, mayEditMarks, onSaveMark, savingMark }: ScheduleTableProps) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [globalFilter, setGlobalFilter] = useState('');
  const [levelFilter, setLevelFilter] = useState('');
  const [kindFilter, setKindFilter] = useState('');
  const [groupBy, setGroupBy] = useState<GroupBy>('none');
  // The cases at each end start hidden so the table fits the window (Factored stays; the
  // chooser brings D and L back).
  const [hidden, setHidden] = useState<Set<string>>(() => new Set(['startCases', 'endCases']));
  const columnVisibility = useMemo<VisibilityState>(
    () => Object.fromEntries(OPTIONAL_COLUMNS.filter((c) => hidden.has(c.id)).flatMap((c) => c.leaves.map((leaf) => [leaf, false]))),
    [hidden],
  );

  const ft = (v: number) => formatValue('length_ft', v, units);
  const kip = (v: number) => formatValue('force_kip', v, units);
  const force = unitLabel('force_kip', units);
  const showLr = rows.some((r) => r.start.Lr_kip || r.end.Lr_kip || r.start.S_kip || r.end.S_kip);

  const columns = useMemo(() => {
    const reaction = (end: 'start' | 'end', label: string) =>
      col.group({
        id: `${end}-reaction`,
        header: `${label} (${force})`,
        columns: [
          col.accessor((r) => r[end].D_kip, { id: `${end}-D`, header: 'D', cell: (c) => kip(c.getValue()), aggregationFn: 'max' }),
          col.accessor((r) => r[end].L_kip, { id: `${end}-L`, header: 'L', cell: (c) => kip(c.getValue()), aggregationFn: 'max' }),
          ...(showLr
            ? [
                col.accessor((r) => r[end].Lr_kip + r[end].S_kip, {
                  id: `${end}-roof`,
                  header: 'Lr/S',
                  cell: (c) => kip(c.getValue()),
                  aggregationFn: 'max',
                }),
              ]
            : []),
          col.accessor((r) => r[end].factored_kip, {
            id: `${end}-factored`,
            header: basis.method === 'LRFD' ? 'Factored' : 'ASD D+L',
            cell: (c) => <span className="font-semibold">{kip(c.getValue())}</span>,
            aggregationFn: 'max',
          }),
        ],
      });
    return [
      col.accessor('mark', {
        header: 'Mark',
        sortingFn: (a, b) => compareMarks(a.original.mark, b.original.mark),
        cell: (c) => <MarkCell row={c.row.original} editable={mayEditMarks} onSave={onSaveMark} saving={savingMark} />,
      }),
      col.accessor((r) => r.size ?? '', { id: 'size', header: 'Size', cell: (c) => <span className="font-mono">{c.getValue() || 'not sized'}</span> }),
      col.accessor('span_ft', { header: `Span (${unitLabel('length_ft', units)})`, cell: (c) => ft(c.getValue()), aggregationFn: 'max' }),
      col.accessor((r) => r.gridLocation ?? '', { id: 'gridLocation', header: 'Grid location', cell: (c) => c.getValue() || dash }),
      reaction('start', 'Start reaction'),
      reaction('end', 'End reaction'),
      col.accessor((r) => (r.governing ? (GOVERNING_WORDS[r.governing] ?? r.governing) : ''), { id: 'governing', header: 'Governs', cell: (c) => c.getValue() || dash }),
      col.accessor((r) => r.ratio ?? -1, {
        id: 'ratio',
        header: 'Ratio',
        aggregationFn: 'max',
        cell: (c) => (c.getValue() >= 0 ? <UtilisationChip ratio={c.getValue()} showLabel={false} /> : dash),
      }),
      col.accessor('camber_in', { header: `Camber (${unitLabel('length_in', units)})`, cell: () => dash, enableSorting: false }),
      col.accessor('studs', { header: 'Studs', cell: () => dash, enableSorting: false }),
      col.accessor('levelName', { id: 'level', header: 'Level', filterFn: (row, _id, value) => !value || row.original.level === value }),
      col.accessor('kind', { header: 'Kind', filterFn: (row, _id, value) => !value || row.original.kind === value }),
    ];
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [units, basis.method, mayEditMarks, onSaveMark, savingMark, showLr]);

  // Stable state objects: new arrays each render would recompute the row models every render.
  const columnFilters = useMemo<ColumnFiltersState>(
    () => [...(levelFilter ? [{ id: 'level', value: levelFilter }] : []), ...(kindFilter ? [{ id: 'kind', value: kindFilter }] : [])],
    [levelFilter, kindFilter],
  );
  const grouping = useMemo<GroupingState>(() => (groupBy === 'none' ? [] : [groupBy]), [groupBy]);

  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting, globalFilter, columnFilters, grouping, expanded: true, columnVisibility },
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    globalFilterFn: (row, _id, value: string) => {
      const q = String(value).trim().toLowerCase();
      if (!q) return true;
      const r = row.original;
      return [r.mark, r.size ?? '', r.gridLocation ?? '', r.memberId, r.levelName, r.kind, r.governing ?? ''].some((s) => s.toLowerCase().includes(q));
    },
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getGroupedRowModel: getGroupedRowModel(),
    getExpandedRowModel: getExpandedRowModel(),
    groupedColumnMode: false,
    // Groups are always open; nothing for the table to reset when rows change.
    autoResetExpanded: false,
    autoResetPageIndex: false,
    // Every column sorts ascending on the first click (numbers too).
    sortDescFirst: false,
  });

  const leafCount = table.getFilteredRowModel().rows.length;
  const select = 'h-9 rounded-[3px] border border-ink/60 bg-paper px-2 text-sm';

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3" role="search" aria-label="Filter the schedule">
        <label className="flex flex-col gap-1 text-sm">
          <span className="label-caps">Find</span>
          <input
            type="search"
            className={`${select} w-56`}
            placeholder="Mark, size, grid…"
            value={globalFilter}
            onChange={(e) => setGlobalFilter(e.target.value)}
          />
        </label>
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
        <label className="flex flex-col gap-1 text-sm">
          <span className="label-caps">Group by</span>
          <select className={select} value={groupBy} onChange={(e) => setGroupBy(e.target.value as GroupBy)}>
            <option value="none">No grouping</option>
            <option value="level">Level</option>
            <option value="kind">Kind</option>
          </select>
        </label>
        <ColumnChooser columns={OPTIONAL_COLUMNS} hidden={hidden} onChange={setHidden} />
        <p className="ml-auto text-sm text-ink-soft" aria-live="polite">
          <span className="figures font-mono">{leafCount}</span> of <span className="figures font-mono">{rows.length}</span> members
        </p>
      </div>

      <div className="max-h-[70vh] overflow-auto border-2 border-ink bg-paper-raised">
        <table className="figures w-full border-collapse text-sm" aria-label="Member schedule">
          <thead className="sticky top-0 z-10 bg-paper-sunk">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const sortable = h.column.getCanSort() && !h.isPlaceholder && h.subHeaders.length === 0;
                  const dir = h.column.getIsSorted();
                  return (
                    <th
                      key={h.id}
                      colSpan={h.colSpan}
                      scope="col"
                      aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : undefined}
                      className="border-b border-ink px-2 py-1.5 text-left align-bottom text-xs font-semibold text-ink"
                    >
                      {h.isPlaceholder ? null : sortable ? (
                        <button type="button" className="inline-flex items-center gap-1 hover:underline" onClick={h.column.getToggleSortingHandler()}>
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden className="text-ink-faint">
                            {dir === 'asc' ? '▲' : dir === 'desc' ? '▼' : '↕'}
                          </span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) =>
              row.getIsGrouped() ? (
                <tr key={row.id} className="bg-paper-sunk/70" data-testid="schedule-group">
                  <th scope="rowgroup" colSpan={row.getVisibleCells().length} className="border-y border-ink/40 px-2 py-1.5 text-left font-semibold">
                    {groupBy === 'kind' ? (row.groupingValue === 'girder' ? 'Girders' : 'Beams') : String(row.groupingValue)}
                    <span className="ml-2 font-normal text-ink-soft">
                      <span className="font-mono">{row.subRows.length}</span> member{row.subRows.length === 1 ? '' : 's'}
                    </span>
                  </th>
                </tr>
              ) : (
                <tr key={row.id} className="border-b border-line/70 hover:bg-accent-wash/40" data-member={row.original.memberId}>
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className={`px-2 py-1 ${cell.column.id === 'gridLocation' ? 'max-w-40 text-xs' : 'whitespace-nowrap'}`}>
                      {cell.getIsPlaceholder() || cell.getIsAggregated() ? null : flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                </tr>
              ),
            )}
            {leafCount === 0 ? (
              <tr>
                <td colSpan={table.getVisibleLeafColumns().length} className="px-2 py-6 text-center text-ink-soft">
                  No member matches these filters.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
