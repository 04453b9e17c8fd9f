import { describe, expect, it } from 'vitest';
import { dispatch } from '../../../src/features/editor/actions/action-registry';
import { toScreen } from '../../../src/features/editor/canvas/view-transform';
import { createEditorStore } from '../../../src/features/editor/store/editor.store';
import { createToolController } from '../../../src/features/editor/tools/tool-controller';
import type { PlanPoint } from '../../../src/features/editor/store/editor.types';
import { emptyGridPlan, twoBayPlan } from './plan-fixture';

// A fixed view: 10 px per ft, plan origin at (50, 500) on screen.
function setup(plan = emptyGridPlan()) {
  const store = createEditorStore({ plan });
  store.setState({ view: { scale: 10, x: 50, y: 500, width: 900, height: 600 } });
  const tools = createToolController(store);
  const at = (p: PlanPoint, extra: { shift?: boolean } = {}) => {
    const [sx, sy] = toScreen(store.getState().view, p);
    return { sx, sy, button: 0, ...extra };
  };
  const click = (p: PlanPoint, extra: { shift?: boolean } = {}) => {
    tools.move(at(p, extra));
    tools.down(at(p, extra));
    tools.up(at(p, extra));
  };
  return { store, tools, at, click };
}

describe('tools on the canvas', () => {
  it('when girders are clicked column to column, then they chain from the last end and snap to the grid', () => {
    const { store, click } = setup();
    dispatch(store, 'tool.girder');
    click([0.3, -0.2]);
    click([29.8, 0.4]);
    click([60.2, 0.1]);
    dispatch(store, 'edit.cancel');
    expect(store.getState().plan.members.map((m) => [m.kind, m.start, m.end])).toEqual([
      ['girder', [0, 0], [30, 0]],
      ['girder', [30, 0], [60, 0]],
    ]);
    expect(store.getState().draft).toEqual({ kind: 'none' });
    expect(store.temporal.getState().pastStates).toHaveLength(2);
  });

  it('when an opening is drawn corner to corner, then it is a rectangle on this level', () => {
    const { store, click } = setup();
    dispatch(store, 'tool.opening');
    click([12, 4]);
    click([18, 10]);
    expect(store.getState().plan.openings.map((o) => o.polygon)).toEqual([[[12, 4], [18, 4], [18, 10], [12, 10]]]);
  });

  it('when a deck outline is clicked round and closed on its first corner, then a deck with the zone exists', () => {
    const { store, click } = setup();
    store.setState({ options: { ...store.getState().options, deckMode: 'polygon', deckSpan: 'y' } });
    dispatch(store, 'tool.deck');
    // Corners away from grid lines (within 1 ft they would snap onto them).
    for (const p of [[5, 5], [20, 5], [20, 15], [5, 15], [5, 5]] as PlanPoint[]) click(p);
    const decks = store.getState().plan.decks;
    expect(decks).toHaveLength(1);
    expect(decks[0]).toMatchObject({ level: 'L2', spanDirection: 'y', zone: 'office', polygon: [[5, 5], [20, 5], [20, 15], [5, 15]] });
  });

  it('when measuring, then nothing is added to the plan and the draft holds both points', () => {
    const { store, click } = setup();
    const before = store.getState().plan;
    dispatch(store, 'tool.measure');
    click([0, 0]);
    click([30, 36]);
    expect(store.getState().plan).toBe(before);
    expect(store.getState().draft).toEqual({ kind: 'measure', start: [0, 0], end: [30, 36] });
  });

  it('when a box is dragged over part of the plan, then the members wholly inside are selected', () => {
    const { store, tools, at } = setup(twoBayPlan());
    tools.down(at([-1, -1]));
    tools.move(at([25, 37]));
    tools.up(at([25, 37]));
    // Inside 0–25 ft: beams b1 (x 0), b2 (10), b3 (20), columns C-A1, C-B1 and point load p1 at (15, 20);
    // the girders reach 30 ft and are left out.
    expect([...store.getState().selection].sort()).toEqual(['C-A1', 'C-B1', 'b1', 'b2', 'b3', 'p1']);
  });

  it('when a selected member’s end is dragged, then it moves with snapping and the drag is one undo step', () => {
    const { store, tools, at } = setup(twoBayPlan());
    dispatch(store, 'selection.set', { ids: ['b2'] });
    tools.down(at([10, 36]));
    for (const y of [35, 33, 31, 30.1]) tools.move(at([10, y]));
    tools.up(at([10, 30.1]));
    expect(store.getState().plan.members.find((m) => m.id === 'b2')!.end).toEqual([10, 30]);
    expect(store.temporal.getState().pastStates).toHaveLength(1);
    dispatch(store, 'edit.undo');
    expect(store.getState().plan.members.find((m) => m.id === 'b2')!.end).toEqual([10, 36]);
  });

  it('when the delete tool clicks a member, then it is gone and undo brings it back', () => {
    const { store, click } = setup(twoBayPlan());
    dispatch(store, 'tool.delete');
    click([10, 18.3]);
    expect(store.getState().plan.members.some((m) => m.id === 'b2')).toBe(false);
    dispatch(store, 'edit.undo');
    expect(store.getState().plan.members.some((m) => m.id === 'b2')).toBe(true);
  });

  it('when the plan is read only, then clicks select but never draw', () => {
    const store = createEditorStore({ plan: twoBayPlan(), readOnly: true });
    store.setState({ view: { scale: 10, x: 50, y: 500, width: 900, height: 600 }, tool: 'girder' });
    const tools = createToolController(store);
    const [sx, sy] = toScreen(store.getState().view, [10, 18]);
    tools.down({ sx, sy, button: 0 });
    tools.up({ sx, sy, button: 0 });
    expect(store.getState().plan.members).toHaveLength(11);
    expect(store.getState().selection).toEqual(['b2']);
  });
});
