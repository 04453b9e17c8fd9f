import { useId, useState } from 'react';
import { useStore } from 'zustand';
import { dispatch } from '../actions/action-registry';
import type { EditorStore } from '../store/editor.store';
import { unitLabel, type QuantityKind, type UnitSystem } from '../../../lib/units';
import { useUnits } from '../../../lib/units-context';
import { fieldText } from './field-text';
import { readQuantityField, type FieldBound } from './field-input.validator';
import { DeckSlabEditor } from './deck-slab-editor.component';
import { useDeckProfiles, useDeleteDeckProfile, useRenameDeckProfile, useSaveDeckProfile } from '../api/deck-profiles.api';
import { DeckProfileLibrary } from './deck-profile-library.component';

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
  if (deck) {
    return (
      <section aria-label="Deck area" className="flex max-h-[60%] shrink-0 flex-wrap items-center gap-3 overflow-y-auto border-t border-ink px-3 py-2 text-xs">
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
        <DeckSlab store={store} deckId={deck.id} slab={deck.slab ?? null} canEdit={canEdit} />
      </section>
    );
  }
  if (load) {
    return (
      <section aria-label="Point load" className="flex flex-wrap items-center gap-3 border-t border-ink px-3 py-2 text-xs">
        <span className="label-caps">Point load {load.id}</span>
        <InspectorQuantity key={`${id}d${load.D_kip}${system}`} label="Dead" name="Dead load" kind="force_kip" bound="nonNegative" valueUS={load.D_kip} system={system} canEdit={canEdit} onCommit={(D_kip) => dispatch(store, 'pointLoad.update', { id, D_kip })} />
        <InspectorQuantity key={`${id}l${load.L_kip}${system}`} label="Live" name="Live load" kind="force_kip" bound="nonNegative" valueUS={load.L_kip} system={system} canEdit={canEdit} onCommit={(L_kip) => dispatch(store, 'pointLoad.update', { id, L_kip })} />
      </section>
    );
  }
  if (grid) {
    return (
      <section aria-label="Grid line" className="flex flex-wrap items-center gap-3 border-t border-ink px-3 py-2 text-xs">
        <span className="label-caps">Grid line {grid.label}</span>
        {/* A grid line may sit at any offset, negative included (the schema allows any finite value). */}
        <InspectorQuantity key={`${id}${grid.offset_ft}${system}`} label={grid.axis === 'x' ? 'x' : 'y'} name={`Grid line ${grid.label} position`} kind="length_ft" bound="any" valueUS={grid.offset_ft} system={system} canEdit={canEdit} onCommit={(offset_ft) => dispatch(store, 'grid.move', { id, offset_ft })} />
      </section>
    );
  }
  return null;
}

/** The deck's slab build-up with the library from the server. */
function DeckSlab({ store, deckId, slab, canEdit }: { store: EditorStore; deckId: string; slab: import('../../../../shared/schemas/plan.schema').PlanSlab | null; canEdit: boolean }) {
  const profiles = useDeckProfiles();
  const save = useSaveDeckProfile();
  const rename = useRenameDeckProfile();
  const remove = useDeleteDeckProfile();
  const { profile: _p, ...rest } = slab ?? ({} as NonNullable<typeof slab>);
  return (
    <>
    <DeckSlabEditor
      key={deckId}
      slab={slab}
      profiles={profiles.data ?? []}
      canEdit={canEdit}
      onChange={(next) => dispatch(store, 'deck.setSlab', { id: deckId, slab: next })}
      onSaveProfile={canEdit && slab ? (name) => save.mutateAsync({ name, slab: rest as Parameters<typeof save.mutateAsync>[0]['slab'] }) : undefined}
    />
    <DeckProfileLibrary profiles={profiles.data ?? []} canEdit={canEdit} onRename={(id, name) => rename.mutateAsync({ id, name })} onDelete={(id) => remove.mutateAsync(id)} />
    </>
  );
}

/**
 * One number of the inspector, typed in the reader's units and stored in the plan's (kip, ft).
 * Read on blur or Enter: a field left as shown is not written back (the SI text is rounded;
 * the stored value is not); a value that cannot be used shows why beside the field and the
 * plan keeps its last valid value. Keyed by the stored value, so an edit or undo resets it.
 */
function InspectorQuantity(props: { label: string; name: string; kind: QuantityKind; bound: FieldBound; valueUS: number; system: UnitSystem; canEdit: boolean; onCommit: (vUS: number) => void }) {
  const { label, name, kind, bound, valueUS, system, canEdit, onCommit } = props;
  const [error, setError] = useState<string | null>(null);
  const errorId = `${useId()}-error`;
  const commit = (text: string) => {
    if (!canEdit) return;
    if (text.trim() === fieldText(kind, valueUS, system)) return setError(null);
    const r = readQuantityField(name, kind, text, system, bound);
    if (!r.ok) return setError(r.error);
    setError(null);
    if (r.value !== valueUS) onCommit(r.value);
  };
  return (
    <span className="flex flex-col gap-0.5">
      <label className="flex items-center gap-1">
        {label}, {unitLabel(kind, system)}
        <input
          readOnly={!canEdit}
          className={INPUT}
          inputMode="decimal"
          defaultValue={fieldText(kind, valueUS, system)}
          onBlur={(e) => commit(e.target.value)}
          onKeyDown={(e) => {
            // Blur reads the value, so Enter commits once.
            if (e.key === 'Enter') e.currentTarget.blur();
          }}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? errorId : undefined}
        />
      </label>
      {error ? (
        <span id={errorId} className="text-xs text-danger" aria-live="polite">
          {error}
        </span>
      ) : null}
    </span>
  );
}
