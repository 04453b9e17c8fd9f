import { useStore } from 'zustand';
import { dispatch } from '../actions/action-registry';
import type { EditorStore } from '../store/editor.store';
import { parseQuantity, unitLabel, type QuantityKind } from '../../../lib/units';
import { useUnits } from '../../../lib/units-context';
import { fieldText } from './field-text';

const INPUT = 'h-8 w-20 rounded-[3px] border border-line bg-paper-raised px-2 text-xs figures font-mono text-ink focus:border-accent focus:outline-none';

/** Properties of one selected deck, load or grid line (members have the Member sheet). */
export function SelectionInspector({ store, canEdit }: { store: EditorStore; canEdit: boolean }) {
  const plan = useStore(store, (s) => s.plan);
  const selection = useStore(store, (s) => s.selection);
  const { system } = useUnits();
  if (selection.length !== 1) return null;
  const id = selection[0];
  const deck = plan.decks.find((d) => d.id === id);
  const load = plan.pointLoads.find((p) => p.id === id);
  const grid = (plan.grids ?? []).find((g) => g.id === id);
  // Typed in the reader's units, stored in the plan's (kip, ft).
  // A field left as shown is not written back (the SI text is rounded; the stored value is not).
  const commitNumber = (kind: QuantityKind, value: string, storedUS: number, run: (v: number) => void) => {
    if (value.trim() === fieldText(kind, storedUS, system)) return;
    const r = parseQuantity(kind, value, system);
    if (r.ok) run(r.value);
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
          Dead, {unitLabel('force_kip', system)}
          <input key={`d${load.D_kip}${system}`} readOnly={!canEdit} className={INPUT} defaultValue={fieldText('force_kip', load.D_kip, system)} onBlur={(e) => commitNumber('force_kip', e.target.value, load.D_kip, (D_kip) => D_kip !== load.D_kip && dispatch(store, 'pointLoad.update', { id, D_kip }))} />
        </label>
        <label className="flex items-center gap-1">
          Live, {unitLabel('force_kip', system)}
          <input key={`l${load.L_kip}${system}`} readOnly={!canEdit} className={INPUT} defaultValue={fieldText('force_kip', load.L_kip, system)} onBlur={(e) => commitNumber('force_kip', e.target.value, load.L_kip, (L_kip) => L_kip !== load.L_kip && dispatch(store, 'pointLoad.update', { id, L_kip }))} />
        </label>
      </section>
    );
  }
  if (grid) {
    return (
      <section aria-label="Grid line" className="flex flex-wrap items-center gap-3 border-t border-ink px-3 py-2 text-xs">
        <span className="label-caps">Grid line {grid.label}</span>
        <label className="flex items-center gap-1">
          {grid.axis === 'x' ? 'x' : 'y'}, {unitLabel('length_ft', system)}
          <input key={`${grid.offset_ft}${system}`} readOnly={!canEdit} className={INPUT} defaultValue={fieldText('length_ft', grid.offset_ft, system)} onBlur={(e) => commitNumber('length_ft', e.target.value, grid.offset_ft, (offset_ft) => offset_ft !== grid.offset_ft && dispatch(store, 'grid.move', { id, offset_ft }))} />
        </label>
      </section>
    );
  }
  return null;
}
