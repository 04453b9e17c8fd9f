import { describe, expect, it } from 'vitest';
import { ACTIONS, actionForKey, dispatch, keyOf } from '../../../src/features/editor/actions/action-registry';
import { beginGesture, createEditorStore } from '../../../src/features/editor/store/editor.store';
import { moveMemberEnd } from '../../../src/features/editor/actions/plan-edits';
import { emptyGridPlan, twoBayPlan } from './plan-fixture';

const history = (store: ReturnType<typeof createEditorStore>) => store.temporal.getState().pastStates.length;

describe('editor actions and undo', () => {
  it('when a girder is added, then undo removes it and redo brings it back, one step each', () => {
    const store = createEditorStore({ plan: emptyGridPlan() });
    expect(dispatch(store, 'member.add', { kind: 'girder', start: [0, 0], end: [30, 0] })).toEqual({ ok: true });
    expect(store.getState().plan.members).toHaveLength(1);
    expect(history(store)).toBe(1);
    dispatch(store, 'edit.undo');
    expect(store.getState().plan.members).toHaveLength(0);
    dispatch(store, 'edit.redo');
    expect(store.getState().plan.members.map((m) => [m.kind, m.start, m.end])).toEqual([['girder', [0, 0], [30, 0]]]);
  });

  it('when the view, tool or selection change, then nothing is added to the undo history', () => {
    const store = createEditorStore({ plan: twoBayPlan() });
    dispatch(store, 'tool.girder');
    dispatch(store, 'view.zoomIn');
    dispatch(store, 'view.panLeft');
    dispatch(store, 'selection.set', { ids: ['b2'] });
    expect(store.getState().tool).toBe('girder');
    expect(store.getState().selection).toEqual(['b2']);
    expect(history(store)).toBe(0);
  });

  it('when a member end is dragged through many positions, then the drag is one undo step', () => {
    const store = createEditorStore({ plan: twoBayPlan() });
    const original = store.getState().plan;
    const end = beginGesture(store);
    for (const y of [30, 31, 32, 33, 34]) store.setState({ plan: moveMemberEnd(store.getState().plan, 'b2', 'end', [10, y]) });
    end();
    expect(history(store)).toBe(1);
    expect(store.getState().plan.members.find((m) => m.id === 'b2')!.end).toEqual([10, 34]);
    store.temporal.getState().undo();
    expect(store.getState().plan).toBe(original);
  });

  it('when a drag ends where it began, then no undo step is recorded', () => {
    const store = createEditorStore({ plan: twoBayPlan() });
    const end = beginGesture(store);
    end();
    expect(history(store)).toBe(0);
  });

  it('when the grid comes from spacings and columns go on every intersection, then 4 × 3 columns exist', () => {
    const store = createEditorStore({ plan: { ...emptyGridPlan(), grids: [] } });
    dispatch(store, 'grid.fromSpacings', { x: [30, 30, 30], y: [28, 28] });
    dispatch(store, 'column.allIntersections');
    const { plan } = store.getState();
    expect((plan.grids ?? []).map((g) => `${g.label}@${g.offset_ft}`)).toEqual(['1@0', '2@30', '3@60', '4@90', 'A@0', 'B@28', 'C@56']);
    expect(plan.columns).toHaveLength(12);
    expect(plan.columns.every((c) => c.levels.join() === 'L2')).toBe(true);
    expect(history(store)).toBe(2);
  });

  it('when an edit is impossible, then the action reports why and the plan is unchanged', () => {
    const store = createEditorStore({ plan: { ...emptyGridPlan(), grids: [] } });
    const before = store.getState().plan;
    expect(dispatch(store, 'column.allIntersections')).toEqual({ ok: false, error: 'Lay out grid lines first: columns go on their intersections.' });
    expect(store.getState().notice).toEqual({ tone: 'error', text: 'Lay out grid lines first: columns go on their intersections.' });
    expect(store.getState().plan).toBe(before);
  });

  it('when the plan is read-only, then editing actions are refused but viewing ones run', () => {
    const store = createEditorStore({ plan: twoBayPlan(), readOnly: true });
    expect(dispatch(store, 'edit.deleteSelection').ok).toBe(false);
    expect(dispatch(store, 'member.add', { kind: 'beam', start: [5, 0], end: [5, 36] }).ok).toBe(false);
    expect(store.getState().plan.members).toHaveLength(11);
    expect(dispatch(store, 'view.zoomOut').ok).toBe(true);
  });

  it('when a bay is infilled, then the beams are added and the notice says how many and which way', () => {
    const store = createEditorStore({ plan: emptyGridPlan() });
    dispatch(store, 'member.add', { kind: 'girder', start: [0, 0], end: [30, 0] });
    dispatch(store, 'member.add', { kind: 'girder', start: [0, 36], end: [30, 36] });
    store.setState({ options: { ...store.getState().options, infillSpacing_ft: 10 } });
    dispatch(store, 'infill.bay', { at: [12, 12] });
    expect(store.getState().plan.members.filter((m) => m.kind === 'beam')).toHaveLength(2);
    expect(store.getState().notice?.text).toBe('2 beams at 10 ft, running north–south.');
  });

  it('when a level is copied to another, then its framing appears there with new ids', () => {
    const store = createEditorStore({ plan: twoBayPlan() });
    dispatch(store, 'level.add', { name: 'Level 3', elevation_ft: 28 });
    const l3 = store.getState().levelId;
    dispatch(store, 'level.show', { levelId: 'L2' });
    dispatch(store, 'level.copyTo', { targets: [l3] });
    const { plan } = store.getState();
    const copied = plan.members.filter((m) => m.level === l3);
    expect(copied).toHaveLength(11);
    expect(new Set([...plan.members.map((m) => m.id)]).size).toBe(22);
    expect(plan.decks.filter((d) => d.level === l3)).toHaveLength(1);
    expect(plan.columns.every((c) => c.levels.includes(l3))).toBe(true);
  });

  it('when the same key is pressed, then the same action runs as from the toolbar', () => {
    expect(actionForKey(keyOf({ key: 'r', ctrlKey: false, metaKey: false, shiftKey: false, altKey: false }))).toBe('tool.girder');
    expect(actionForKey(keyOf({ key: 'Z', ctrlKey: true, metaKey: false, shiftKey: true, altKey: false }))).toBe('edit.redo');
    expect(actionForKey(keyOf({ key: 'z', ctrlKey: false, metaKey: true, shiftKey: false, altKey: false }))).toBe('edit.undo');
    expect(actionForKey(keyOf({ key: '+', ctrlKey: false, metaKey: false, shiftKey: true, altKey: false }))).toBe('view.zoomIn');
    expect(actionForKey(keyOf({ key: 'Delete', ctrlKey: false, metaKey: false, shiftKey: false, altKey: false }))).toBe('edit.deleteSelection');
  });

  it('when listing shortcuts, then no two actions share a key', () => {
    const keys = Object.values(ACTIONS).flatMap((a) => ('keys' in a && a.keys ? [...a.keys] : []));
    expect(new Set(keys).size).toBe(keys.length);
  });
});

describe('grid from spacings on an existing grid', () => {
  it('when the spacings change, then the lines keep their ids and move, extra lines go', () => {
    // Fixture x lines g1, g2, g3 at 0, 30, 60 ft.
    const store = createEditorStore({ plan: twoBayPlan() });
    dispatch(store, 'grid.fromSpacings', { x: [25], y: null });
    const xs = (store.getState().plan.grids ?? []).filter((g) => g.axis === 'x');
    expect(xs.map((g) => [g.id, g.label, g.offset_ft])).toEqual([['g1', '1', 0], ['g2', '2', 25]]);
  });
});

describe('Grid from spacings', () => {
  it('when the grid is laid out from spacings, then the Select tool is active again', async () => {
    const { emptyGridPlan } = await import('./plan-fixture');
    const store = createEditorStore({ plan: emptyGridPlan() });
    dispatch(store, 'tool.grid');
    expect(store.getState().tool).toBe('grid');
    dispatch(store, 'grid.fromSpacings', { x: [30, 30], y: [36] });
    expect(store.getState().tool).toBe('select');
    expect((store.getState().plan.grids ?? []).filter((g) => g.axis === 'x')).toHaveLength(3);
  });
});
