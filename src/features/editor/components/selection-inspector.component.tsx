import { useStore } from 'zustand';
import { dispatch } from '../actions/action-registry';
import type { EditorStore } from '../store/editor.store';

const INPUT = 'h-8 w-20 rounded-[3px] border border-line bg-paper-raised px-2 text-xs figures font-mono text-ink focus:border-accent focus:outline-none';

/** Properties of one selected deck, load or grid line (members have the Member sheet). */
export function SelectionInspector({ store, canEdit }: { store: EditorStore; canEdit: boolean }) {
  const plan = useStore(store, (s) => s.plan);
  const selection = useStore(store, (s) => s.selection);
  if (selection.length !== 1) return null;
  const id = selection[0];
  const deck = plan.decks.find((d) => d.id === id);
  const load = plan.pointLoads.find((p) => p.id === id);
  const grid = (plan.grids ?? []).find((g) => g.id === id);
  const commitNumber = (value: string, run: (v: number) => void) => {
    const v = Number(value);
    if (value.trim() !== '' && Number.isFinite(v)) run(v);
  };
  if (deck) {
    return (
      <section aria-label="Deck area" className="flex flex-wrap items-center gap-3 border-t border-ink px-3 py-2 text-xs">
        <span className="label-caps">Deck {deck.id}</span>
        <label className="flex items-center gap-1">
          Spans
          <select disabled={!canEdit} className="h-8 rounded-[3px] border border-line bg-paper-raised px-1 text-xs" value={deck.spanDirection} onChange={(e) => dispatch(store, 'deck.set', { id, spanDirection: e.target.value as 'x' | 'y' })}>
            <option value="x">east–west</option>
            <option value="y">north–south</option>
          </select>
        </label>
        <label className="flex items-center gap-1">
          Zone
          <select disabled={!canEdit} className="h-8 rounded-[3px] border border-line bg-paper-raised px-1 text-xs" value={deck.zone} onChange={(e) => dispatch(store, 'deck.set', { id, zone: e.target.value })}>
            {plan.zones.map((z) => (
              <option key={z.id} value={z.id}>{z.name}</option>
            ))}
          </select>
        </label>
      </section>
    );
  }
  if (load) {
    return (
      <section aria-label="Point load" className="flex flex-wrap items-center gap-3 border-t border-ink px-3 py-2 text-xs">
        <span className="label-caps">Point load {load.id}</span>
        <label className="flex items-center gap-1">
          Dead, kip
          <input key={`d${load.D_kip}`} readOnly={!canEdit} className={INPUT} defaultValue={load.D_kip} onBlur={(e) => commitNumber(e.target.value, (D_kip) => D_kip !== load.D_kip && dispatch(store, 'pointLoad.update', { id, D_kip }))} />
        </label>
        <label className="flex items-center gap-1">
          Live, kip
          <input key={`l${load.L_kip}`} readOnly={!canEdit} className={INPUT} defaultValue={load.L_kip} onBlur={(e) => commitNumber(e.target.value, (L_kip) => L_kip !== load.L_kip && dispatch(store, 'pointLoad.update', { id, L_kip }))} />
        </label>
      </section>
    );
  }
  if (grid) {
    return (
      <section aria-label="Grid line" className="flex flex-wrap items-center gap-3 border-t border-ink px-3 py-2 text-xs">
        <span className="label-caps">Grid line {grid.label}</span>
        <label className="flex items-center gap-1">
          {grid.axis === 'x' ? 'x' : 'y'}, ft
          <input key={grid.offset_ft} readOnly={!canEdit} className={INPUT} defaultValue={grid.offset_ft} onBlur={(e) => commitNumber(e.target.value, (offset_ft) => offset_ft !== grid.offset_ft && dispatch(store, 'grid.move', { id, offset_ft }))} />
        </label>
      </section>
    );
  }
  return null;
}
