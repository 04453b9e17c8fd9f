import { planNamer } from '../../../../shared/drafting/element-names.drafting';
import { memo, useEffect, useMemo, useRef, useSyncExternalStore } from 'react';
import { useStore } from 'zustand';
import { dispatch } from '../actions/action-registry';
import type { LiveDesign } from '../design/live-design';
import type { EditorStore } from '../store/editor.store';
import { memberStatus, type MemberStatus } from './member-status';
import { formatValue, type UnitSystem } from '../../../lib/units';
import { useUnits } from '../../../lib/units-context';

type Row = { id: string; kind: 'girder' | 'beam'; span_ft: number; status: MemberStatus };

// One collator for the whole sort (localeCompare with options builds one per call: about 40 ms
// for a 520-member level, on every design). Same order as a.localeCompare(b, undefined, { numeric: true }).
const NATURAL = new Intl.Collator(undefined, { numeric: true });
const naturalMark = (a: string, b: string) => NATURAL.compare(a, b);

/**
 * Every member of the level as a table (mark, size, ratio, status in words), for reading back
 * what the canvas shows and for screen readers. Selecting a row selects the member on the
 * canvas and the other way round.
 */
export function MemberList({ store, design }: { store: EditorStore; design: LiveDesign }) {
  const plan = useStore(store, (s) => s.plan);
  const levelId = useStore(store, (s) => s.levelId);
  const selection = useStore(store, (s) => s.selection);
  const snap = useSyncExternalStore(design.subscribe, design.getSnapshot);
  const bodyRef = useRef<HTMLTableSectionElement>(null);
  const { system } = useUnits();

  const rows: Row[] = useMemo(() => {
    const out: Row[] = [];
    const names = planNamer(plan, new Map((snap.result?.members ?? []).map((x) => [x.id, x.mark])));
    for (const m of plan.members) {
      if (m.level !== levelId) continue;
      const sm = snap.byId.get(m.id);
      out.push({ id: m.id, kind: m.kind, span_ft: sm?.span_ft ?? Math.hypot(m.end[0] - m.start[0], m.end[1] - m.start[1]), status: memberStatus(m.id, sm, snap.result, snap.pending, names) });
    }
    return out.sort((a, b) => (a.kind === b.kind ? naturalMark(a.status.mark || a.id, b.status.mark || b.id) : a.kind === 'girder' ? -1 : 1));
  }, [plan, levelId, snap]);

  const selected = useMemo(() => new Set(selection), [selection]);
  useEffect(() => {
    if (selection.length !== 1) return;
    const id = typeof CSS !== 'undefined' && CSS.escape ? CSS.escape(selection[0]) : selection[0].replace(/["\\]/g, '\\$&');
    const row = bodyRef.current?.querySelector<HTMLElement>(`[data-member-id="${id}"]`);
    row?.scrollIntoView?.({ block: 'nearest' });
  }, [selection]);

  const over = rows.filter((r) => r.status.state === 'fails').length;
  const notDesigned = rows.filter((r) => r.status.state === 'not-designed').length;
  const flagged = rows.filter((r) => r.status.state === 'problem').length;

  return (
    <section aria-labelledby="member-list-heading" className="flex min-h-0 flex-col">
      <div className="flex items-baseline justify-between gap-2 border-b border-ink px-3 py-2">
        <h3 id="member-list-heading" className="label-caps">
          Members
        </h3>
        <p className="text-xs text-ink-soft" data-testid="member-summary">
          {rows.length} on this level
          {over ? <span className="text-danger"> · {over} over</span> : null}
          {notDesigned ? <span className="text-danger"> · {notDesigned} not designed</span> : null}
          {flagged ? <span className="text-danger"> · {flagged} with problems</span> : null}
          {snap.pending ? ' · designing…' : ''}
        </p>
      </div>
      {/* Layout and paint containment: with thousands of rows, a DOM change elsewhere (the scale bar
          on every zoom step) otherwise makes the browser re-walk and repaint this table. */}
      <div className="min-h-0 flex-1 overflow-auto" style={{ contain: 'content' }}>
        <table className="w-full border-collapse text-xs" aria-describedby="member-list-heading">
          <thead className="sticky top-0 bg-paper-raised">
            <tr className="border-b border-line text-left">
              <th scope="col" className="px-2 py-1.5 font-medium">Mark</th>
              <th scope="col" className="px-2 py-1.5 font-medium">Member</th>
              <th scope="col" className="px-2 py-1.5 font-medium">Size</th>
              <th scope="col" className="px-2 py-1.5 text-right font-medium">Ratio</th>
              <th scope="col" className="px-2 py-1.5 font-medium">Status</th>
            </tr>
          </thead>
          <tbody ref={bodyRef}>
            {rows.length === 0 ? (
              <tr>
                <td colSpan={5} className="px-3 py-6 text-center text-ink-soft">
                  No girders or beams on this level yet.
                </td>
              </tr>
            ) : null}
            {rows.map((r) => (
              <MemberRow key={r.id} row={r} selected={selected.has(r.id)} store={store} system={system} />
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

/** Same printed content: a new design that changes nothing in a row leaves the row alone. */
type RowProps = { row: Row; selected: boolean; store: EditorStore; system: UnitSystem };

function sameRow(a: RowProps, b: RowProps): boolean {
  const x = a.row.status;
  const y = b.row.status;
  return (
    a.selected === b.selected && a.store === b.store && a.system === b.system && a.row.id === b.row.id && a.row.kind === b.row.kind && a.row.span_ft === b.row.span_ft &&
    x.mark === y.mark && x.size === y.size && x.util.printed === y.util.printed && x.util.band === y.util.band && x.words === y.words && x.state === y.state
  );
}

/** One row; memoised so a selection change or a re-design re-renders only the rows that change. */
const MemberRow = memo(function MemberRow({ row: r, selected: isSelected, store, system }: RowProps) {
  const s = r.status;
  return (
    <tr
      data-member-id={r.id}
      data-selected={isSelected || undefined}
      className={`cursor-pointer border-b border-line/60 ${isSelected ? 'bg-accent-wash' : 'hover:bg-paper-sunk'}`}
      onClick={(e) => dispatch(store, 'selection.set', { ids: [r.id], add: e.shiftKey })}
    >
      <td className="px-2 py-1">
        <button
          type="button"
          aria-pressed={isSelected}
          className={`figures font-mono ${isSelected ? 'font-semibold text-accent' : 'text-ink'}`}
          aria-label={`Select ${s.mark || r.id}`}
          onClick={(e) => {
            e.stopPropagation();
            dispatch(store, 'selection.set', { ids: [r.id], add: e.shiftKey });
          }}
        >
          {s.mark || r.id}
        </button>
      </td>
      <td className="px-2 py-1 whitespace-nowrap text-ink-soft">
        {r.kind} <span className="figures font-mono">{spanText(r.span_ft, system)}</span>
      </td>
      <td className="figures px-2 py-1 font-mono">{s.size}</td>
      <td className="px-2 py-1 text-right">
        {s.ratio === null ? (
          <span className="text-ink-faint">—</span>
        ) : (
          <span className="figures inline-block rounded-[3px] px-1.5 font-mono" style={{ backgroundColor: s.util.colour, color: s.util.inkColour }}>
            {s.util.printed}
          </span>
        )}
      </td>
      <td className={`px-2 py-1 ${s.state === 'fails' || s.state === 'not-designed' || s.state === 'problem' ? 'text-danger' : 'text-ink-soft'}`}>{s.words}</td>
    </tr>
  );
}, sameRow);

/** Span in the reader's units: 30.0′ or 9.14 m. */
function spanText(span_ft: number, system: UnitSystem): string {
  return system === 'SI' ? `${formatValue('length_ft', span_ft, 'SI', { digits: 2 })} m` : `${span_ft.toFixed(1)}′`;
}
