/**
 * Pointer handling for the Plan canvas: each tool is a small state machine over the store's
 * `draft`. Every change to the plan goes through a named action (dispatch), so a click on the
 * canvas and a menu entry do the same thing. Screen pixels in, plan feet inside.
 */
import { dispatch } from '../actions/action-registry';
import { moveMemberEnd } from '../actions/plan-edits';
import { beginGesture, type EditorStore } from '../store/editor.store';
import type { PlanPoint } from '../store/editor.types';
import { HANDLE_PX } from '../canvas/draw-overlay';
import { panBy, toPlan, toScreen, zoomAt } from '../canvas/view-transform';
import { pickAt, pickInBox } from './hit-test.tool';
import { distance, rectanglePolygon } from './plan-geometry';
import { snapPoint } from './snapping.tool';

export const SNAP_PX = 10;
export const PICK_PX = 7;

export interface PointerInput {
  sx: number;
  sy: number;
  shift?: boolean;
  /** 0 primary, 1 middle, 2 secondary. */
  button?: number;
}

type Gesture =
  | { kind: 'pan'; lastX: number; lastY: number }
  | { kind: 'dragEnd'; memberId: string; end: 'start' | 'end'; finish: () => void }
  | { kind: 'box'; start: PlanPoint; shift: boolean };

export function createToolController(store: EditorStore) {
  let gesture: Gesture | null = null;
  let spaceHeld = false;

  const planAt = (p: PointerInput): PlanPoint => toPlan(store.getState().view, p.sx, p.sy);
  const snapped = (p: PointerInput, ignoreId?: string) => {
    const s = store.getState();
    return snapPoint(s.plan, s.levelId, planAt(p), { tolerance_ft: SNAP_PX / s.view.scale, ignoreId });
  };

  function handleAt(p: PointerInput): { memberId: string; end: 'start' | 'end' } | null {
    const s = store.getState();
    if (s.readOnly || s.selection.length !== 1) return null;
    const m = s.plan.members.find((x) => x.id === s.selection[0] && x.level === s.levelId);
    if (!m) return null;
    for (const end of ['start', 'end'] as const) {
      const [hx, hy] = toScreen(s.view, m[end]);
      if (Math.abs(hx - p.sx) <= HANDLE_PX && Math.abs(hy - p.sy) <= HANDLE_PX) return { memberId: m.id, end };
    }
    return null;
  }

  function down(p: PointerInput) {
    const s = store.getState();
    if (spaceHeld || p.button === 1) {
      gesture = { kind: 'pan', lastX: p.sx, lastY: p.sy };
      return;
    }
    if (p.button === 2) {
      store.setState({ draft: { kind: 'none' } });
      return;
    }
    const raw = planAt(p);
    const tol = PICK_PX / s.view.scale;
    const tool = s.readOnly && s.tool !== 'measure' ? 'select' : s.tool;
    switch (tool) {
      case 'select': {
        const h = handleAt(p);
        if (h) {
          gesture = { kind: 'dragEnd', ...h, finish: beginGesture(store) };
          return;
        }
        const hit = pickAt(s.plan, s.levelId, raw, tol);
        if (hit) dispatch(store, 'selection.set', { ids: [hit.id], add: p.shift });
        else {
          gesture = { kind: 'box', start: raw, shift: !!p.shift };
          store.setState({ draft: { kind: 'box', start: raw, end: raw } });
        }
        return;
      }
      case 'grid': {
        const hit = pickAt(s.plan, s.levelId, raw, tol, ['grid']);
        if (hit) dispatch(store, 'selection.set', { ids: [hit.id] });
        else dispatch(store, 'grid.add', { at: snapped(p).point });
        return;
      }
      case 'column':
        dispatch(store, 'column.add', { at: snapped(p).point });
        return;
      case 'girder':
      case 'beam':
      case 'lineLoad': {
        const at = snapped(p).point;
        if (s.draft.kind !== 'segment') {
          store.setState({ draft: { kind: 'segment', start: at } });
          return;
        }
        const start = s.draft.start;
        const r = tool === 'lineLoad' ? dispatch(store, 'lineLoad.add', { start, end: at }) : dispatch(store, 'member.add', { kind: tool, start, end: at });
        // Members chain from the last end; a line load is one stroke.
        if (r.ok) store.setState({ draft: tool === 'lineLoad' ? { kind: 'none' } : { kind: 'segment', start: at } });
        return;
      }
      case 'infill':
        dispatch(store, 'infill.bay', { at: raw });
        return;
      case 'deck': {
        if (s.options.deckMode === 'bay') {
          dispatch(store, 'deck.bay', { at: raw });
          return;
        }
        const at = snapped(p).point;
        const pts = s.draft.kind === 'polygon' ? s.draft.points : [];
        if (pts.length >= 3 && distance(at, pts[0]) <= SNAP_PX / s.view.scale) {
          dispatch(store, 'deck.polygon', { polygon: pts });
          return;
        }
        store.setState({ draft: { kind: 'polygon', points: [...pts, at] } });
        return;
      }
      case 'zone': {
        const hit = pickAt(s.plan, s.levelId, raw, tol, ['deck']);
        if (hit) dispatch(store, 'zone.paint', { deckId: hit.id });
        else store.setState({ notice: { tone: 'error', text: 'Zone: click a deck area to give it this load zone.' } });
        return;
      }
      case 'pointLoad':
        dispatch(store, 'pointLoad.add', { at: snapped(p).point });
        return;
      case 'opening': {
        const at = snapped(p).point;
        if (s.draft.kind !== 'rectangle') store.setState({ draft: { kind: 'rectangle', start: at } });
        else {
          const r = dispatch(store, 'opening.add', { polygon: rectanglePolygon(s.draft.start, at) });
          if (r.ok) store.setState({ draft: { kind: 'none' } });
        }
        return;
      }
      case 'measure': {
        const at = snapped(p).point;
        if (s.draft.kind === 'measure' && s.draft.end === null) store.setState({ draft: { kind: 'measure', start: s.draft.start, end: at } });
        else store.setState({ draft: { kind: 'measure', start: at, end: null } });
        return;
      }
      case 'delete': {
        const hit = pickAt(s.plan, s.levelId, raw, tol);
        if (hit) dispatch(store, 'elements.delete', { ids: [hit.id] });
        return;
      }
    }
  }

  function move(p: PointerInput) {
    const s = store.getState();
    if (gesture?.kind === 'pan') {
      store.setState({ view: panBy(s.view, p.sx - gesture.lastX, p.sy - gesture.lastY) });
      gesture.lastX = p.sx;
      gesture.lastY = p.sy;
      return;
    }
    if (gesture?.kind === 'dragEnd') {
      const snap = snapped(p, gesture.memberId);
      store.setState({ plan: moveMemberEnd(s.plan, gesture.memberId, gesture.end, snap.point), hover: { point: snap.point, snap: snap.kind } });
      return;
    }
    if (gesture?.kind === 'box') {
      store.setState({ draft: { kind: 'box', start: gesture.start, end: planAt(p) } });
      return;
    }
    if (s.tool === 'select' || s.readOnly) {
      store.setState({ hover: { point: planAt(p), snap: null } });
      return;
    }
    const snap = snapped(p);
    store.setState({ hover: { point: snap.point, snap: snap.kind } });
  }

  function up(p: PointerInput) {
    const g = gesture;
    gesture = null;
    if (!g) return;
    if (g.kind === 'dragEnd') g.finish();
    if (g.kind === 'box') {
      const s = store.getState();
      const end = planAt(p);
      store.setState({ draft: { kind: 'none' } });
      const [ax, ay] = toScreen(s.view, g.start);
      const dragged = Math.hypot(p.sx - ax, p.sy - ay) > 3;
      if (!dragged) {
        if (!g.shift) dispatch(store, 'selection.set', { ids: [] });
        return;
      }
      const ids = pickInBox(s.plan, s.levelId, {
        minX: Math.min(g.start[0], end[0]), maxX: Math.max(g.start[0], end[0]),
        minY: Math.min(g.start[1], end[1]), maxY: Math.max(g.start[1], end[1]),
      });
      dispatch(store, 'selection.set', g.shift ? { ids: ids.filter((id) => !s.selection.includes(id)), add: true } : { ids });
    }
  }

  function doubleClick() {
    const s = store.getState();
    if (s.tool === 'deck' && s.draft.kind === 'polygon' && s.draft.points.length >= 3) dispatch(store, 'deck.polygon', { polygon: s.draft.points });
  }

  function wheel(p: PointerInput & { deltaY: number; deltaX?: number; ctrl?: boolean }) {
    const s = store.getState();
    const factor = Math.exp(-p.deltaY * (p.ctrl ? 0.01 : 0.0015));
    store.setState({ view: zoomAt(s.view, factor, p.sx, p.sy) });
  }

  function leave() {
    if (!gesture) store.setState({ hover: null });
  }

  return {
    down, move, up, doubleClick, wheel, leave,
    setSpace(held: boolean) {
      spaceHeld = held;
    },
    get panning() {
      return gesture?.kind === 'pan' || spaceHeld;
    },
    /** Enter closes a polygon being drawn. */
    commitDraft() {
      doubleClick();
    },
  };
}

export type ToolController = ReturnType<typeof createToolController>;
