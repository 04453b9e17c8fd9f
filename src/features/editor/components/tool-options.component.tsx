import { Fragment, useId, useState, type ReactNode } from 'react';
import { useStore } from 'zustand';
import { Button } from '../../../components/ui/button.ui';
import { dispatch } from '../actions/action-registry';
import type { EditorStore } from '../store/editor.store';
import type { ToolOptions } from '../store/editor.types';
import { parseGridSpacings } from '../tools/grid-spacings.parser';
import { ZONE_PRESETS } from '../tools/zone-presets';
import { fieldText } from './field-text';
import { formatQuantity, unitLabel, type QuantityKind, type UnitSystem } from '../../../lib/units';
import { readCountField, readQuantityField, type FieldBound } from './field-input.validator';
import { useUnits } from '../../../lib/units-context';

const HINTS: Partial<Record<string, string>> = {
  select: 'Click to select, Shift-click to add, drag on empty paper for a box. Drag a selected member’s end square to move it.',
  girder: 'Click the start, then the end; it snaps to columns, grid intersections and members. Keeps drawing from the last end; Esc stops.',
  beam: 'Click the start, then the end; it snaps to columns, grid intersections, member ends and points along members. Esc stops.',
  column: 'Click a grid intersection (or anywhere) to place a column through every level.',
  opening: 'Click two opposite corners.',
  measure: 'Click two points to measure between them.',
  delete: 'Click an element to delete it (Undo brings it back).',
  lineLoad: 'Click the start and end of the line load.',
  pointLoad: 'Click where the load sits.',
};

const INPUT = 'h-8 w-20 rounded-[3px] border border-line bg-paper-raised px-2 text-xs text-ink figures font-mono focus:border-accent focus:outline-none';
const SELECT = 'h-8 rounded-[3px] border border-line bg-paper-raised px-1.5 text-xs text-ink focus:border-accent focus:outline-none';

function Field({ label, children }: { label: string; children: (id: string) => ReactNode }) {
  const id = useId();
  return (
    <span className="flex items-center gap-1.5 text-xs">
      <label htmlFor={id} className="text-ink-soft">
        {label}
      </label>
      {children(id)}
    </span>
  );
}

/** Text under a field saying why its value cannot be used; the input points at it. */
function FieldError({ id, error }: { id: string; error: string | null }) {
  return error ? (
    <span id={id} className="text-xs text-danger" aria-live="polite">
      {error}
    </span>
  ) : null;
}

type FieldRead = { ok: true; value: number } | { ok: false; error: string };

/**
 * One checked input: what is typed is read by `read`; a value that cannot be used says why
 * under the field (aria-invalid + aria-describedby) and is not handed on, so the last valid
 * one stays.
 */
function CheckedInput({ label, inputMode, initialText, read, onValue, onValidity }: {
  label: string;
  inputMode: 'numeric' | 'decimal';
  initialText: string;
  read: (text: string) => FieldRead;
  onValue: (v: number) => void;
  onValidity?: (valid: boolean) => void;
}) {
  const [text, setText] = useState(initialText);
  const [error, setError] = useState<string | null>(null);
  const errorId = `${useId()}-error`;
  return (
    <span className="flex flex-col gap-0.5">
      <Field label={label}>
        {(id) => (
          <input
            id={id}
            className={INPUT}
            inputMode={inputMode}
            value={text}
            onChange={(e) => {
              setText(e.target.value);
              const r = read(e.target.value);
              onValidity?.(r.ok);
              if (!r.ok) return setError(r.error);
              setError(null);
              onValue(r.value);
            }}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? errorId : undefined}
          />
        )}
      </Field>
      <FieldError id={errorId} error={error} />
    </span>
  );
}

/** A whole count (Beams per bay); a value that is not one shows why and is not used. */
function CountField({ label, value, onValue, min }: { label: string; value: number; onValue: (v: number) => void; min: number }) {
  return (
    <CheckedInput
      label={label}
      inputMode="numeric"
      initialText={String(value)}
      read={(text) => readCountField(label, text, min)}
      onValue={onValue}
    />
  );
}

type QuantityFieldProps = {
  label: string;
  /** How the message names the field ("Dead load"); the label when not given. */
  name?: string;
  kind: QuantityKind;
  valueUS: number;
  onValue: (vUS: number) => void;
  bound: FieldBound;
  /** Told whether the text shown can be used, for a button that reads the last valid values. */
  onValidity?: (valid: boolean) => void;
};

/**
 * A number of a quantity kind in the reader's units (label "Dead, kN" when SI is shown); what
 * is typed is read with parseQuantity and handed on in the plan's US unit. A field left alone
 * keeps the exact US value it was given; a value that cannot be used says why under the field
 * and is not handed on, so the last valid one stays.
 */
function QuantityField(props: QuantityFieldProps) {
  const { system } = useUnits();
  // Keyed by kind too: a field of another quantity in the same place is a new field, never
  // the old one's text (a point load's 7 kip is not a line load's 7 kip/ft).
  return <QuantityInput key={`${system}-${props.kind}`} {...props} system={system} />;
}

function QuantityInput({ label, name, kind, valueUS, onValue, bound, onValidity, system }: QuantityFieldProps & { system: UnitSystem }) {
  return (
    <CheckedInput
      label={`${label}, ${unitLabel(kind, system)}`}
      inputMode="decimal"
      initialText={fieldText(kind, valueUS, system)}
      read={(text) => readQuantityField(name ?? label, kind, text, system, bound)}
      onValue={onValue}
      onValidity={onValidity}
    />
  );
}

/** The options of the active tool, under the level bar. */
export function ToolOptionsBar({ store }: { store: EditorStore }) {
  const tool = useStore(store, (s) => s.tool);
  const options = useStore(store, (s) => s.options);
  const zones = useStore(store, (s) => s.plan.zones);
  const set = (patch: Partial<ToolOptions>) => store.setState({ options: { ...store.getState().options, ...patch } });

  let body: ReactNode = HINTS[tool] ? <p className="text-xs text-ink-soft">{HINTS[tool]}</p> : null;
  if (tool === 'grid') body = <GridOptions store={store} axis={options.gridAxis} onAxis={(gridAxis) => set({ gridAxis })} />;
  if (tool === 'column') {
    body = (
      <>
        <Button variant="secondary" className="h-8 text-xs" onClick={() => dispatch(store, 'column.allIntersections')}>
          Columns at all intersections
        </Button>
        <p className="text-xs text-ink-soft">{HINTS.column}</p>
      </>
    );
  }
  if (tool === 'infill') {
    body = (
      <>
        <Field label="Beams run">
          {(id) => (
            <select id={id} className={SELECT} value={options.infillDirection} onChange={(e) => set({ infillDirection: e.target.value as ToolOptions['infillDirection'] })}>
              <option value="auto">between the girders</option>
              <option value="y">north–south</option>
              <option value="x">east–west</option>
            </select>
          )}
        </Field>
        <Field label="By">
          {(id) => (
            <select id={id} className={SELECT} value={options.infillMode} onChange={(e) => set({ infillMode: e.target.value as ToolOptions['infillMode'] })}>
              <option value="spacing">spacing</option>
              <option value="count">count</option>
            </select>
          )}
        </Field>
        {options.infillMode === 'spacing' ? (
          <QuantityField key="s" label="Max spacing" kind="length_ft" bound="positive" valueUS={options.infillSpacing_ft} onValue={(infillSpacing_ft) => set({ infillSpacing_ft })} />
        ) : (
          <CountField key="c" label="Beams per bay" value={options.infillCount} onValue={(infillCount) => set({ infillCount })} min={1} />
        )}
        <p className="text-xs text-ink-soft">Click a bay to fill it; clicking again replaces its beams.</p>
      </>
    );
  }
  if (tool === 'deck') {
    body = (
      <>
        <Field label="Draw">
          {(id) => (
            <select id={id} className={SELECT} value={options.deckMode} onChange={(e) => set({ deckMode: e.target.value as ToolOptions['deckMode'] })}>
              <option value="bay">a bay (click inside)</option>
              <option value="polygon">an outline (click corners)</option>
            </select>
          )}
        </Field>
        <Field label="Deck spans">
          {(id) => (
            <select id={id} className={SELECT} value={options.deckSpan} onChange={(e) => set({ deckSpan: e.target.value as ToolOptions['deckSpan'] })}>
              <option value="auto">across the beams</option>
              <option value="x">east–west</option>
              <option value="y">north–south</option>
            </select>
          )}
        </Field>
        <ZoneSelect store={store} label="Load zone" />
        {zones.length === 0 ? <p className="text-xs text-danger">Add a load zone with the Zone tool first.</p> : null}
      </>
    );
  }
  if (tool === 'zone') body = <ZoneOptions store={store} />;
  if (tool === 'pointLoad') {
    body = (
      <>
        <QuantityField label="Dead" name="Dead load" kind="force_kip" bound="nonNegative" valueUS={options.pointLoad.D_kip} onValue={(D_kip) => set({ pointLoad: { ...store.getState().options.pointLoad, D_kip } })} />
        <QuantityField label="Live" name="Live load" kind="force_kip" bound="nonNegative" valueUS={options.pointLoad.L_kip} onValue={(L_kip) => set({ pointLoad: { ...store.getState().options.pointLoad, L_kip } })} />
        <p className="text-xs text-ink-soft">{HINTS.pointLoad}</p>
      </>
    );
  }
  if (tool === 'lineLoad') {
    body = (
      <>
        <QuantityField label="Dead" name="Dead load" kind="lineLoad_klf" bound="nonNegative" valueUS={options.lineLoad.D_klf} onValue={(D_klf) => set({ lineLoad: { ...store.getState().options.lineLoad, D_klf } })} />
        <QuantityField label="Live" name="Live load" kind="lineLoad_klf" bound="nonNegative" valueUS={options.lineLoad.L_klf} onValue={(L_klf) => set({ lineLoad: { ...store.getState().options.lineLoad, L_klf } })} />
        <p className="text-xs text-ink-soft">{HINTS.lineLoad}</p>
      </>
    );
  }
  return (
    <div className="flex min-h-11 flex-wrap items-center gap-x-4 gap-y-2 border-b border-ink bg-paper px-3 py-1.5" aria-label="Tool options" role="group">
      {/* Keyed by tool: each tool's fields start from that tool's own stored values. */}
      <Fragment key={tool}>{body}</Fragment>
    </div>
  );
}

function GridOptions({ store, axis, onAxis }: { store: EditorStore; axis: 'x' | 'y'; onAxis: (a: 'x' | 'y') => void }) {
  const { system } = useUnits();
  const u = unitLabel('length_ft', system);
  const [xText, setXText] = useState('');
  const [yText, setYText] = useState('');
  const [errors, setErrors] = useState<{ x?: string; y?: string }>({});
  const xId = useId();
  const yId = useId();
  const apply = (e: React.FormEvent) => {
    e.preventDefault();
    const x = xText.trim() ? parseGridSpacings(xText, system) : null;
    const y = yText.trim() ? parseGridSpacings(yText, system) : null;
    const next = { x: x && !x.ok ? x.error : undefined, y: y && !y.ok ? y.error : undefined };
    if (!x && !y) next.x = `Enter spacings for at least one direction, for example ${system === 'SI' ? '3@9.144' : '3@30'}.`;
    setErrors(next);
    if (next.x || next.y) return;
    dispatch(store, 'grid.fromSpacings', { x: x && x.ok ? x.spacings_ft : null, y: y && y.ok ? y.spacings_ft : null });
  };
  return (
    <form className="flex flex-wrap items-start gap-x-3 gap-y-1" onSubmit={apply} aria-label="Grid from spacings">
      <div className="flex flex-col">
        <span className="flex items-center gap-1.5 text-xs">
          <label htmlFor={xId} className="text-ink-soft">
            Bays 1, 2, 3 … (east–west), {u}
          </label>
          <input id={xId} className={`${INPUT} w-32`} placeholder={system === 'SI' ? '3@9.144, 2@8.534' : '3@30, 2@28'} value={xText} onChange={(e) => setXText(e.target.value)} aria-invalid={!!errors.x || undefined} aria-describedby={errors.x ? `${xId}-e` : undefined} />
        </span>
        {errors.x ? <span id={`${xId}-e`} className="text-xs text-danger">{errors.x}</span> : null}
      </div>
      <div className="flex flex-col">
        <span className="flex items-center gap-1.5 text-xs">
          <label htmlFor={yId} className="text-ink-soft">
            Bays A, B, C … (north–south), {u}
          </label>
          <input id={yId} className={`${INPUT} w-32`} placeholder={system === 'SI' ? '2@10.973' : '2@36'} value={yText} onChange={(e) => setYText(e.target.value)} aria-invalid={!!errors.y || undefined} aria-describedby={errors.y ? `${yId}-e` : undefined} />
        </span>
        {errors.y ? <span id={`${yId}-e`} className="text-xs text-danger">{errors.y}</span> : null}
      </div>
      <Button type="submit" variant="secondary" className="h-8 text-xs">
        Grid from spacings
      </Button>
      <Field label="Click adds">
        {(id) => (
          <select id={id} className={SELECT} value={axis} onChange={(e) => onAxis(e.target.value as 'x' | 'y')}>
            <option value="x">a numbered line (north–south)</option>
            <option value="y">a lettered line (east–west)</option>
          </select>
        )}
      </Field>
    </form>
  );
}

function ZoneSelect({ store, label }: { store: EditorStore; label: string }) {
  const zones = useStore(store, (s) => s.plan.zones);
  const zoneId = useStore(store, (s) => s.options.zoneId);
  const { system } = useUnits();
  return (
    <Field label={label}>
      {(id) => (
        <select id={id} className={SELECT} value={zoneId} onChange={(e) => store.setState({ options: { ...store.getState().options, zoneId: e.target.value } })}>
          {zones.length === 0 ? <option value="">none yet</option> : null}
          {zones.map((z) => (
            <option key={z.id} value={z.id}>
              {z.name} — {system === 'SI' ? formatQuantity('pressure_psf', z.live_psf || z.roofLive_psf, system) : `${z.live_psf || z.roofLive_psf} psf`} live
            </option>
          ))}
        </select>
      )}
    </Field>
  );
}

function ZoneOptions({ store }: { store: EditorStore }) {
  const [key, setKey] = useState(ZONE_PRESETS[0].key);
  const preset = ZONE_PRESETS.find((p) => p.key === key)!;
  const [values, setValues] = useState(preset.zone);
  // Fields whose text cannot be used: the zone is not added from the last valid values behind them.
  const [invalid, setInvalid] = useState<string[]>([]);
  const choose = (k: string) => {
    setKey(k);
    setValues(ZONE_PRESETS.find((p) => p.key === k)!.zone);
    setInvalid([]);
  };
  const num = (field: 'live_psf' | 'partition_psf' | 'superimposedDead_psf' | 'dead_psf' | 'roofLive_psf', label: string) => (
    <QuantityField
      key={`${key}-${field}`}
      label={label}
      name={/live$/i.test(label) ? `${label} load` : label}
      kind="pressure_psf"
      bound="nonNegative"
      valueUS={values[field]}
      onValue={(v) => setValues((old) => ({ ...old, [field]: v }))}
      onValidity={(valid) => setInvalid((old) => (valid ? old.filter((f) => f !== field) : old.includes(field) ? old : [...old, field]))}
    />
  );
  return (
    <>
      <Field label="Occupancy">
        {(id) => (
          <select id={id} className={SELECT} value={key} onChange={(e) => choose(e.target.value)}>
            {ZONE_PRESETS.map((p) => (
              <option key={p.key} value={p.key}>
                {p.label}
              </option>
            ))}
          </select>
        )}
      </Field>
      {key === 'roof' ? num('roofLive_psf', 'Roof live') : num('live_psf', 'Live')}
      {num('partition_psf', 'Partitions')}
      {num('superimposedDead_psf', 'Superimposed dead')}
      {num('dead_psf', 'Slab and deck')}
      <Button variant="secondary" className="h-8 text-xs" disabled={invalid.length > 0} onClick={() => dispatch(store, 'zone.add', { zone: values })}>
        Use this zone
      </Button>
      <ZoneSelect store={store} label="Paint with" />
      <p className="w-full text-[11px] text-ink-faint">{preset.source}. Click a deck area to give it the zone.</p>
    </>
  );
}
