/**
 * Every command of the Plan editor is one named action: {id, label, shortcut, run(state) →
 * patch, undo mode}. Toolbar buttons, keyboard shortcuts and menus all dispatch the same
 * action, so they cannot drift apart. `run` is pure: it returns the parts of the state it
 * changes (or null for nothing), and `dispatch` applies the patch with the undo mode.
 */
import type { EditorPatch, PlanPoint, ToolId } from '../store/editor.types';
import type { EditorStore, EditorStoreState } from '../store/editor.store';
import {
  EditError, addColumn, addDeck, addGridLine, addLevel, addLineLoad, addMember, addOpening, addPointLoad,
  columnsAtAllIntersections, copyLevel, deleteElements, ensureZone, moveGridLine, setDeck, setGridFromSpacings, updatePointLoad, updateZone,
} from './plan-edits';
import { applyInfill, bayPolygon, findBay, infillBay, infillDirection } from '../../../../shared/engine/index';
import { fitView, panBy, zoomAt } from '../canvas/view-transform';
import type { Plan, PlanMember, PlanSlab, PlanZone } from '../../../../shared/schemas/plan.schema';

/** 'record': one undo step when the plan changes. 'none': never in the undo history. */
export type UndoMode = 'record' | 'none';

export interface ActionContext {
  undo(): void;
  redo(): void;
}

export interface EditorAction<A> {
  id: string;
  label: string;
  /** Shown in tooltips and menus. */
  shortcut?: string;
  /** KeyboardEvent keys that run it, as normalised by `keyOf` ("mod+z", "shift+g", "delete"). */
  keys?: readonly string[];
  undo: UndoMode;
  /** Changes the plan: refused (and not shown) for read-only roles. */
  edits: boolean;
  run(state: EditorStoreState, args: A, ctx: ActionContext): EditorPatch | null;
}

const action = <A = void>(a: EditorAction<A>) => a;

const toolAction = (tool: ToolId, label: string, key: string, edits = true) =>
  action({
    id: `tool.${tool}`,
    label,
    shortcut: key.toUpperCase(),
    keys: [key],
    undo: 'none',
    edits,
    run: () => ({ tool, draft: { kind: 'none' }, notice: null }),
  });

const allLevelIds = (s: EditorStoreState) => s.plan.levels.map((l) => l.id);
const ZOOM_STEP = 1.25;
const PAN_STEP_PX = 80;

export const ACTIONS = {
  // Tools
  'tool.select': toolAction('select', 'Select', 'v', false),
  'tool.grid': toolAction('grid', 'Grid', 'g'),
  'tool.column': toolAction('column', 'Column', 'c'),
  'tool.girder': toolAction('girder', 'Girder', 'r'),
  'tool.beam': toolAction('beam', 'Beam', 'b'),
  'tool.infill': toolAction('infill', 'Infill', 'i'),
  'tool.deck': toolAction('deck', 'Deck', 'd'),
  'tool.zone': toolAction('zone', 'Zone', 'z'),
  'tool.pointLoad': toolAction('pointLoad', 'Point load', 'p'),
  'tool.lineLoad': toolAction('lineLoad', 'Line load', 'l'),
  'tool.opening': toolAction('opening', 'Opening', 'o'),
  'tool.measure': toolAction('measure', 'Measure', 'm', false),
  'tool.delete': toolAction('delete', 'Delete', 'e'),

  // Edit
  'edit.undo': action({ id: 'edit.undo', label: 'Undo', shortcut: 'Ctrl+Z', keys: ['mod+z'], undo: 'none', edits: true, run: (_s, _a, ctx) => (ctx.undo(), null) }),
  'edit.redo': action({ id: 'edit.redo', label: 'Redo', shortcut: 'Ctrl+Shift+Z', keys: ['mod+shift+z', 'mod+y'], undo: 'none', edits: true, run: (_s, _a, ctx) => (ctx.redo(), null) }),
  'edit.deleteSelection': action({
    id: 'edit.deleteSelection', label: 'Delete selected', shortcut: 'Del', keys: ['delete', 'backspace'], undo: 'record', edits: true,
    run: (s) => (s.selection.length === 0 ? null : { plan: deleteElements(s.plan, s.selection), selection: [] }),
  }),
  'edit.cancel': action({
    id: 'edit.cancel', label: 'Cancel', shortcut: 'Esc', keys: ['escape'], undo: 'none', edits: false,
    run: (s) => (s.draft.kind !== 'none' ? { draft: { kind: 'none' } } : s.selection.length ? { selection: [] } : s.tool !== 'select' ? { tool: 'select' } : null),
  }),
  'edit.selectAll': action({
    id: 'edit.selectAll', label: 'Select all members on this level', shortcut: 'Ctrl+A', keys: ['mod+a'], undo: 'none', edits: false,
    run: (s) => ({ selection: s.plan.members.filter((m) => m.level === s.levelId).map((m) => m.id) }),
  }),
  'selection.set': action<{ ids: string[]; add?: boolean }>({
    id: 'selection.set', label: 'Select', undo: 'none', edits: false,
    run: (s, a) => {
      if (!a.add) return { selection: a.ids };
      const next = new Set(s.selection);
      for (const id of a.ids) if (next.has(id)) next.delete(id); else next.add(id);
      return { selection: [...next] };
    },
  }),

  // View
  'view.zoomIn': action({ id: 'view.zoomIn', label: 'Zoom in', shortcut: '+', keys: ['+', '=', 'shift++'], undo: 'none', edits: false, run: (s) => ({ view: zoomAt(s.view, ZOOM_STEP) }) }),
  'view.zoomOut': action({ id: 'view.zoomOut', label: 'Zoom out', shortcut: '−', keys: ['-', '_', 'shift+_'], undo: 'none', edits: false, run: (s) => ({ view: zoomAt(s.view, 1 / ZOOM_STEP) }) }),
  'view.fit': action({
    id: 'view.fit', label: 'Fit to view', shortcut: 'F', keys: ['f'], undo: 'none', edits: false,
    run: (s) => ({ view: fitView(s.view, levelBounds(s)) }),
  }),
  'view.panLeft': action({ id: 'view.panLeft', label: 'Pan left', shortcut: '←', keys: ['arrowleft'], undo: 'none', edits: false, run: (s) => ({ view: panBy(s.view, PAN_STEP_PX, 0) }) }),
  'view.panRight': action({ id: 'view.panRight', label: 'Pan right', shortcut: '→', keys: ['arrowright'], undo: 'none', edits: false, run: (s) => ({ view: panBy(s.view, -PAN_STEP_PX, 0) }) }),
  'view.panUp': action({ id: 'view.panUp', label: 'Pan up', shortcut: '↑', keys: ['arrowup'], undo: 'none', edits: false, run: (s) => ({ view: panBy(s.view, 0, PAN_STEP_PX) }) }),
  'view.panDown': action({ id: 'view.panDown', label: 'Pan down', shortcut: '↓', keys: ['arrowdown'], undo: 'none', edits: false, run: (s) => ({ view: panBy(s.view, 0, -PAN_STEP_PX) }) }),

  // Drawing (run by tools with the point picked on the canvas)
  'grid.add': action<{ at: PlanPoint }>({
    id: 'grid.add', label: 'Add grid line', undo: 'record', edits: true,
    run: (s, a) => ({ plan: addGridLine(s.plan, s.options.gridAxis, s.options.gridAxis === 'x' ? a.at[0] : a.at[1]) }),
  }),
  'grid.move': action<{ id: string; offset_ft: number }>({
    id: 'grid.move', label: 'Move grid line', undo: 'record', edits: true, run: (s, a) => ({ plan: moveGridLine(s.plan, a.id, a.offset_ft) }),
  }),
  'grid.fromSpacings': action<{ x: number[] | null; y: number[] | null }>({
    id: 'grid.fromSpacings', label: 'Grid from spacings', undo: 'record', edits: true,
    run: (s, a) => {
      let plan = s.plan;
      if (a.x) plan = setGridFromSpacings(plan, 'x', a.x);
      if (a.y) plan = setGridFromSpacings(plan, 'y', a.y);
      // The grid is laid out: back to Select, so the next click does not add a grid line.
      return { plan, tool: 'select', draft: { kind: 'none' } };
    },
  }),
  'column.add': action<{ at: PlanPoint }>({
    id: 'column.add', label: 'Add column', undo: 'record', edits: true, run: (s, a) => ({ plan: addColumn(s.plan, a.at, allLevelIds(s)) }),
  }),
  'column.allIntersections': action({
    id: 'column.allIntersections', label: 'Columns at all grid intersections', undo: 'record', edits: true,
    run: (s) => {
      if ((s.plan.grids ?? []).length === 0) throw new EditError('Lay out grid lines first: columns go on their intersections.');
      return { plan: columnsAtAllIntersections(s.plan, allLevelIds(s)) };
    },
  }),
  'member.add': action<{ kind: 'girder' | 'beam'; start: PlanPoint; end: PlanPoint }>({
    id: 'member.add', label: 'Add member', undo: 'record', edits: true,
    run: (s, a) => {
      const r = addMember(s.plan, s.levelId, a.kind, a.start, a.end);
      return { plan: r.plan };
    },
  }),
  'infill.bay': action<{ at: PlanPoint }>({
    id: 'infill.bay', label: 'Infill bay with beams', undo: 'record', edits: true,
    run: (s, a) => {
      const bay = findBay(s.plan, a.at);
      if (!bay) throw new EditError('Infill: click inside a bay between grid lines.');
      const o = s.options;
      const r = infillBay(s.plan, s.levelId, bay, o.infillMode === 'count' ? { direction: o.infillDirection, count: o.infillCount } : { direction: o.infillDirection, spacing_ft: o.infillSpacing_ft });
      if (!r.ok) throw new EditError(r.error);
      return { plan: applyInfill(s.plan, r), notice: { tone: 'info', text: `${r.add.length} beams at ${round2(r.spacing_ft)} ft, running ${r.direction === 'y' ? 'north–south' : 'east–west'}.` } };
    },
  }),
  'deck.bay': action<{ at: PlanPoint }>({
    id: 'deck.bay', label: 'Deck over bay', undo: 'record', edits: true,
    run: (s, a) => {
      const bay = findBay(s.plan, a.at);
      if (!bay) throw new EditError('Deck: click inside a bay between grid lines, or draw the deck outline.');
      const { plan, zoneId } = zoneFor(s);
      const beamsRun = infillDirection(s.plan.members.filter((m) => m.level === s.levelId), bay);
      const members = s.plan.members.filter((m) => m.level === s.levelId && m.kind === 'beam');
      const inside = members.filter((m) => (m.start[0] + m.end[0]) / 2 > bay.x0 && (m.start[0] + m.end[0]) / 2 < bay.x1 && (m.start[1] + m.end[1]) / 2 > bay.y0 && (m.start[1] + m.end[1]) / 2 < bay.y1);
      const runs = inside.length ? (Math.abs(inside[0].end[1] - inside[0].start[1]) > Math.abs(inside[0].end[0] - inside[0].start[0]) ? 'y' : 'x') : beamsRun;
      // Deck spans across the beams that carry it.
      const span = s.options.deckSpan === 'auto' ? (runs === 'y' ? 'x' : 'y') : s.options.deckSpan;
      const r = addDeck(plan, s.levelId, bayPolygon(bay), span, zoneId);
      return { plan: r.plan, selection: [r.id] };
    },
  }),
  'deck.polygon': action<{ polygon: PlanPoint[] }>({
    id: 'deck.polygon', label: 'Deck outline', undo: 'record', edits: true,
    run: (s, a) => {
      const { plan, zoneId } = zoneFor(s);
      const r = addDeck(plan, s.levelId, a.polygon, s.options.deckSpan === 'auto' ? 'x' : s.options.deckSpan, zoneId);
      return { plan: r.plan, selection: [r.id], draft: { kind: 'none' } };
    },
  }),
  'deck.set': action<{ id: string; spanDirection?: 'x' | 'y'; zone?: string }>({
    id: 'deck.set', label: 'Change deck', undo: 'record', edits: true,
    run: (s, a) => ({ plan: setDeck(s.plan, a.id, { ...(a.spanDirection ? { spanDirection: a.spanDirection } : {}), ...(a.zone ? { zone: a.zone } : {}) }) }),
  }),
  'deck.setSlab': action<{ id: string; slab: PlanSlab | null }>({
    id: 'deck.setSlab', label: 'Slab build-up', undo: 'record', edits: true,
    run: (s, a) => ({
      plan: {
        ...s.plan,
        decks: s.plan.decks.map((d) => {
          if (d.id !== a.id) return d;
          if (a.slab) return { ...d, slab: a.slab };
          const { slab: _slab, ...rest } = d;
          return rest;
        }),
      },
    }),
  }),
  'zone.add': action<{ zone: Omit<PlanZone, 'id'> }>({
    id: 'zone.add', label: 'Add load zone', undo: 'record', edits: true,
    run: (s, a) => {
      const r = ensureZone(s.plan, a.zone);
      return { plan: r.plan, options: { ...s.options, zoneId: r.zoneId } };
    },
  }),
  'zone.update': action<{ id: string; change: Partial<Omit<PlanZone, 'id'>> }>({
    id: 'zone.update', label: 'Change load zone', undo: 'record', edits: true, run: (s, a) => ({ plan: updateZone(s.plan, a.id, a.change) }),
  }),
  'zone.paint': action<{ deckId: string }>({
    id: 'zone.paint', label: 'Apply zone to deck', undo: 'record', edits: true,
    run: (s, a) => {
      if (!s.plan.zones.some((z) => z.id === s.options.zoneId)) throw new EditError('Zone: choose a load zone first.');
      return { plan: setDeck(s.plan, a.deckId, { zone: s.options.zoneId }), selection: [a.deckId] };
    },
  }),
  'pointLoad.add': action<{ at: PlanPoint }>({
    id: 'pointLoad.add', label: 'Add point load', undo: 'record', edits: true,
    run: (s, a) => {
      const r = addPointLoad(s.plan, s.levelId, a.at, s.options.pointLoad.D_kip, s.options.pointLoad.L_kip);
      return { plan: r.plan, selection: [r.id] };
    },
  }),
  'pointLoad.update': action<{ id: string; D_kip?: number; L_kip?: number }>({
    id: 'pointLoad.update', label: 'Change point load', undo: 'record', edits: true, run: (s, a) => ({ plan: updatePointLoad(s.plan, a.id, a) }),
  }),
  'lineLoad.add': action<{ start: PlanPoint; end: PlanPoint }>({
    id: 'lineLoad.add', label: 'Add line load', undo: 'record', edits: true,
    run: (s, a) => ({ plan: addLineLoad(s.plan, s.levelId, a.start, a.end, s.options.lineLoad.D_klf, s.options.lineLoad.L_klf).plan }),
  }),
  'opening.add': action<{ polygon: PlanPoint[] }>({
    id: 'opening.add', label: 'Add opening', undo: 'record', edits: true, run: (s, a) => ({ plan: addOpening(s.plan, s.levelId, a.polygon).plan }),
  }),
  'elements.delete': action<{ ids: string[] }>({
    id: 'elements.delete', label: 'Delete', undo: 'record', edits: true,
    run: (s, a) => ({ plan: deleteElements(s.plan, a.ids), selection: s.selection.filter((id) => !a.ids.includes(id)) }),
  }),

  'member.setShape': action<{ id: string; shape: string | null }>({
    id: 'member.setShape', label: 'Lock size', undo: 'record', edits: true,
    run: (s, a) => ({ plan: { ...s.plan, members: s.plan.members.map((m) => (m.id === a.id ? { ...m, shape: a.shape } : m)) } }),
  }),
  'member.setConstraints': action<{ id: string; maxDepth_in: number | null; minDepth_in: number | null; allowedNominalDepths: number[] | null }>({
    id: 'member.setConstraints', label: 'Depth limits', undo: 'record', edits: true,
    run: (s, a) => ({
      plan: { ...s.plan, members: s.plan.members.map((m) => (m.id === a.id ? { ...m, maxDepth_in: a.maxDepth_in, minDepth_in: a.minDepth_in, allowedNominalDepths: a.allowedNominalDepths } : m)) },
    }),
  }),
  'member.setBracing': action<{ id: string; bracing: PlanMember['bracing']; Lb_override_ft: number | null; deflectionLimits: PlanMember['deflectionLimits'] }>({
    id: 'member.setBracing', label: 'Bracing and deflection limits', undo: 'record', edits: true,
    run: (s, a) => ({
      plan: {
        ...s.plan,
        members: s.plan.members.map((m) => {
          if (m.id !== a.id) return m;
          // Absent fields follow the framing and the design basis; only what is set is written.
          const { bracing: _b, Lb_override_ft: _lb, deflectionLimits: _d, ...rest } = m;
          return {
            ...rest,
            ...(a.bracing ? { bracing: a.bracing } : {}),
            ...(a.Lb_override_ft != null ? { Lb_override_ft: a.Lb_override_ft } : {}),
            ...(a.deflectionLimits ? { deflectionLimits: a.deflectionLimits } : {}),
          };
        }),
      },
    }),
  }),
  'member.setComposite': action<{ id: string; composite: boolean | null }>({
    id: 'member.setComposite', label: 'Composite or bare steel', undo: 'record', edits: true,
    run: (s, a) => ({ plan: { ...s.plan, members: s.plan.members.map((m) => (m.id === a.id ? { ...m, composite: a.composite } : m)) } }),
  }),
  'plan.setDesignBasis': action<{ designBasis: Plan['designBasis'] }>({
    id: 'plan.setDesignBasis', label: 'Design basis', undo: 'record', edits: true, run: (s, a) => ({ plan: { ...s.plan, designBasis: a.designBasis } }),
  }),

  // Levels
  'level.show': action<{ levelId: string }>({
    id: 'level.show', label: 'Show level', undo: 'none', edits: false, run: (s, a) => (s.plan.levels.some((l) => l.id === a.levelId) ? { levelId: a.levelId, selection: [], draft: { kind: 'none' } } : null),
  }),
  'level.add': action<{ name: string; elevation_ft: number }>({
    id: 'level.add', label: 'Add level', undo: 'record', edits: true,
    run: (s, a) => {
      const r = addLevel(s.plan, a.name, a.elevation_ft);
      // Columns that run through the current level continue to the new one.
      const columns = r.plan.columns.map((c) => (c.levels.includes(s.levelId) ? { ...c, levels: [...c.levels, r.id] } : c));
      return { plan: { ...r.plan, columns }, levelId: r.id, selection: [] };
    },
  }),
  'level.copyTo': action<{ targets: string[] }>({
    id: 'level.copyTo', label: 'Copy level to other levels', undo: 'record', edits: true,
    run: (s, a) => {
      if (a.targets.length === 0) throw new EditError('Copy level: tick at least one level to copy to.');
      return { plan: copyLevel(s.plan, s.levelId, a.targets), notice: { tone: 'info', text: `Copied to ${a.targets.length} level${a.targets.length === 1 ? '' : 's'}.` } };
    },
  }),
} as const;

export type ActionId = keyof typeof ACTIONS;
type ArgsOf<K extends ActionId> = (typeof ACTIONS)[K] extends EditorAction<infer A> ? A : never;

/** The tools in toolbar order. */
export const TOOL_ACTIONS: readonly ActionId[] = [
  'tool.select', 'tool.grid', 'tool.column', 'tool.girder', 'tool.beam', 'tool.infill', 'tool.deck', 'tool.zone',
  'tool.pointLoad', 'tool.lineLoad', 'tool.opening', 'tool.measure', 'tool.delete',
];

function round2(v: number) {
  return Math.round(v * 100) / 100;
}

/** What "fit" shows: the grid and everything drawn on this level. */
export function levelBounds(s: Pick<EditorStoreState, 'plan' | 'levelId'>) {
  const xs: number[] = [];
  const ys: number[] = [];
  const add = (p: PlanPoint) => (xs.push(p[0]), ys.push(p[1]));
  for (const g of s.plan.grids ?? []) (g.axis === 'x' ? xs : ys).push(g.offset_ft);
  for (const c of s.plan.columns) if (c.levels.includes(s.levelId)) add([c.x_ft, c.y_ft]);
  for (const m of s.plan.members) if (m.level === s.levelId) (add(m.start), add(m.end));
  for (const d of s.plan.decks) if (d.level === s.levelId) d.polygon.forEach(add);
  if (xs.length === 0 && ys.length === 0) return null;
  const span = (v: number[]) => (v.length ? [Math.min(...v), Math.max(...v)] : [0, 0]);
  const [minX, maxX] = span(xs);
  const [minY, maxY] = span(ys);
  return { minX, minY, maxX, maxY };
}

function zoneFor(s: EditorStoreState) {
  if (s.plan.zones.some((z) => z.id === s.options.zoneId)) return { plan: s.plan, zoneId: s.options.zoneId };
  if (s.plan.zones[0]) return { plan: s.plan, zoneId: s.plan.zones[0].id };
  throw new EditError('Deck: add a load zone first (Zone tool).');
}

export interface DispatchResult {
  ok: boolean;
  error?: string;
}

/** Run an action against the store with its undo mode. Errors become a notice, never a crash. */
export function dispatch<K extends ActionId>(store: EditorStore, id: K, ...rest: ArgsOf<K> extends void ? [] : [ArgsOf<K>]): DispatchResult {
  const a = ACTIONS[id] as unknown as EditorAction<unknown>;
  const state = store.getState();
  if (a.edits && state.readOnly) return { ok: false, error: 'Your role can read this plan but not change it.' };
  const temporalApi = store.temporal.getState();
  let patch: EditorPatch | null;
  try {
    patch = a.run(state, rest[0], { undo: () => temporalApi.undo(), redo: () => temporalApi.redo() });
  } catch (e) {
    if (!(e instanceof EditError)) throw e;
    store.setState({ notice: { tone: 'error', text: e.message } });
    return { ok: false, error: e.message };
  }
  if (!patch) return { ok: true };
  if (a.undo === 'none') {
    const wasTracking = temporalApi.isTracking;
    if (wasTracking) temporalApi.pause();
    store.setState(patch);
    if (wasTracking) temporalApi.resume();
  } else {
    store.setState(patch.notice === undefined && 'plan' in patch ? { ...patch, notice: null } : patch);
  }
  return { ok: true };
}

/** "mod+shift+z", "delete", "g" … from a keyboard event, for matching `keys`. */
export function keyOf(e: { key: string; ctrlKey: boolean; metaKey: boolean; shiftKey: boolean; altKey: boolean }): string {
  const key = e.key.length === 1 ? e.key.toLowerCase() : e.key.toLowerCase();
  const mods = [e.ctrlKey || e.metaKey ? 'mod' : '', e.shiftKey && key.length > 1 ? 'shift' : e.shiftKey && /[a-z]/.test(key) ? 'shift' : '', e.altKey ? 'alt' : ''].filter(Boolean);
  return [...mods, key].join('+');
}

export function actionForKey(key: string): ActionId | null {
  for (const [id, a] of Object.entries(ACTIONS) as [ActionId, EditorAction<unknown>][]) if (a.keys?.includes(key)) return id;
  return null;
}
