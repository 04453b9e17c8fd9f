import { useId, useState } from 'react';
import { useStore } from 'zustand';
import { Button } from '../../../components/ui/button.ui';
import { dispatch } from '../actions/action-registry';
import type { EditorStore } from '../store/editor.store';
import { formatElevation, parseQuantity, unitLabel } from '../../../lib/units';
import { useUnits } from '../../../lib/units-context';
import { fieldText } from './field-text';

const INPUT = 'h-8 rounded-[3px] border border-line bg-paper-raised px-2 text-xs text-ink focus:border-accent focus:outline-none';

/** Which level is shown; for editors, adding a level and copying this one to others (typical floors). */
export function LevelBar({ store, canEdit }: { store: EditorStore; canEdit: boolean }) {
  const levels = useStore(store, (s) => s.plan.levels);
  const levelId = useStore(store, (s) => s.levelId);
  const [panel, setPanel] = useState<'none' | 'add' | 'copy'>('none');
  const selectId = useId();
  const { system } = useUnits();
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label htmlFor={selectId} className="label-caps">
        Level
      </label>
      <select id={selectId} className={`${INPUT} min-w-36 font-medium`} value={levelId} onChange={(e) => dispatch(store, 'level.show', { levelId: e.target.value })}>
        {[...levels].reverse().map((l) => (
          <option key={l.id} value={l.id}>
            {l.name} · EL {formatElevation(l.elevation_ft, system)}
          </option>
        ))}
      </select>
      {canEdit ? (
        <>
          <Button variant="quiet" className="h-8 text-xs" aria-expanded={panel === 'add'} onClick={() => setPanel(panel === 'add' ? 'none' : 'add')}>
            Add level…
          </Button>
          <Button variant="quiet" className="h-8 text-xs" aria-expanded={panel === 'copy'} disabled={levels.length < 2} onClick={() => setPanel(panel === 'copy' ? 'none' : 'copy')}>
            Copy level to…
          </Button>
        </>
      ) : null}
      {panel === 'add' ? <AddLevelForm store={store} onDone={() => setPanel('none')} /> : null}
      {panel === 'copy' ? <CopyLevelForm store={store} onDone={() => setPanel('none')} /> : null}
    </div>
  );
}

function AddLevelForm({ store, onDone }: { store: EditorStore; onDone: () => void }) {
  const levels = store.getState().plan.levels;
  const top = levels[levels.length - 1];
  const [name, setName] = useState(`Level ${levels.length + 1}`);
  const { system } = useUnits();
  const suggested_ft = top ? top.elevation_ft + 14 : 0;
  const [elevation, setElevation] = useState(() => fieldText('length_ft', suggested_ft, system));
  const [error, setError] = useState<string | null>(null);
  const nameId = useId();
  const elId = useId();
  return (
    <form
      className="flex items-center gap-2"
      aria-label="Add level"
      onSubmit={(e) => {
        e.preventDefault();
        // Typed in the reader's units; the plan keeps feet.
        const r = elevation.trim() === fieldText('length_ft', suggested_ft, system) ? { ok: true as const, value: suggested_ft } : parseQuantity('length_ft', elevation, system);
        setError(r.ok ? null : r.error);
        if (r.ok && dispatch(store, 'level.add', { name, elevation_ft: r.value }).ok) onDone();
      }}
    >
      <label htmlFor={nameId} className="text-xs text-ink-soft">Name</label>
      <input id={nameId} className={`${INPUT} w-28`} value={name} onChange={(e) => setName(e.target.value)} />
      <label htmlFor={elId} className="text-xs text-ink-soft">Elevation, {unitLabel('length_ft', system)}</label>
      <input id={elId} className={`${INPUT} w-16 font-mono`} value={elevation} onChange={(e) => setElevation(e.target.value)} aria-invalid={error ? true : undefined} title={error ?? undefined} />
      {error ? <span className="text-xs text-danger">{error}</span> : null}
      <Button type="submit" variant="secondary" className="h-8 text-xs">Add</Button>
    </form>
  );
}

function CopyLevelForm({ store, onDone }: { store: EditorStore; onDone: () => void }) {
  const levels = store.getState().plan.levels;
  const from = store.getState().levelId;
  const [targets, setTargets] = useState<string[]>([]);
  return (
    <form
      className="flex flex-wrap items-center gap-3 rounded-[3px] border border-line bg-paper-raised px-2 py-1"
      aria-label="Copy level to other levels"
      onSubmit={(e) => {
        e.preventDefault();
        if (dispatch(store, 'level.copyTo', { targets }).ok) onDone();
      }}
    >
      <span className="text-xs text-ink-soft">Replaces the framing, deck and loads drawn on:</span>
      {levels
        .filter((l) => l.id !== from)
        .map((l) => (
          <label key={l.id} className="flex items-center gap-1 text-xs">
            <input type="checkbox" checked={targets.includes(l.id)} onChange={(e) => setTargets((t) => (e.target.checked ? [...t, l.id] : t.filter((x) => x !== l.id)))} />
            {l.name}
          </label>
        ))}
      <Button type="submit" variant="secondary" className="h-8 text-xs">Copy</Button>
    </form>
  );
}
