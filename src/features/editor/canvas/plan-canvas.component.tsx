import { planNamer } from '../../../../shared/drafting/element-names.drafting';
import { useEffect, useMemo, useRef, useState, useSyncExternalStore } from 'react';
import { Layer, Shape, Stage } from 'react-konva';
import type Konva from 'konva';
import { useStore } from 'zustand';
import type { EditorStore } from '../store/editor.store';
import type { LiveDesign } from '../design/live-design';
import type { ToolController } from '../tools/tool-controller';
import { buildStaticGeometry, type StaticGeometry } from './static-geometry';
import { drawStatic } from './draw-static';
import { drawGestureBitmap, snapshotLayer, type GestureBitmap } from './gesture-bitmap';
import { GestureLifecycle } from './gesture-lifecycle';
import { drawOverlay } from './draw-overlay';
import { readPlanTheme, type PlanTheme } from './plan-theme';
import { scaleBar } from './view-transform';
import { pickAt } from '../tools/hit-test.tool';
import { memberStatus } from '../members/member-status';
import { toPlan } from './view-transform';
import { unitLabel, type UnitSystem } from '../../../lib/units';
import { useUnits } from '../../../lib/units-context';

export type PlanViewArgs = { scale: number; x: number; y: number };

type Props = {
  store: EditorStore;
  design: LiveDesign;
  controller: ToolController;
  label: string;
  /** Konva nodes drawn under the plan (underlay images), given the view. */
  renderUnderlay?: (view: PlanViewArgs) => React.ReactNode;
};

/**
 * The Plan canvas: a static layer for the committed drawing (not listening, redrawn from a
 * cached geometry only when the plan, the design or the view changes) and an interactive
 * layer for selection, drafts and handles. Pointer input is handled on the container and
 * hit-tested with plain geometry, so neither layer needs Konva's hit graph.
 */
export function PlanCanvas({ store, design, controller, label, renderUnderlay }: Props) {
  const containerRef = useRef<HTMLDivElement>(null);
  const staticLayer = useRef<Konva.Layer>(null);
  const overlayLayer = useRef<Konva.Layer>(null);
  const geometry = useRef<StaticGeometry | null>(null);
  const theme = useRef<PlanTheme | null>(null);
  const [size, setSize] = useState({ width: 800, height: 560 });
  const tool = useStore(store, (s) => s.tool);
  const readOnly = useStore(store, (s) => s.readOnly);
  const [panning, setPanning] = useState(false);
  // The static layer's bitmap while a pan or zoom gesture runs (gesture-bitmap.ts).
  const gesture = useRef<GestureBitmap | null>(null);
  // From the first step of a pan or zoom to the end of its last part (gesture-lifecycle.ts).
  const lifecycle = useMemo(
    () =>
      new GestureLifecycle({
        step: () => {
          if (!gesture.current) gesture.current = snapshotLayer(staticLayer.current?.getNativeCanvasElement(), store.getState().view);
        },
        end: () => {
          if (!gesture.current) return;
          gesture.current = null;
          staticLayer.current?.batchDraw();
        },
        panning: () => controller.panning,
      }),
    [store, controller],
  );
  useEffect(() => () => lifecycle.dispose(), [lifecycle]);
  const tooltip = useTooltip(store, design, containerRef);
  // Labels on the canvas are written in the reader's units; the layers read this ref when drawn.
  const { system } = useUnits();
  const systemRef = useRef<UnitSystem>(system);
  systemRef.current = system;
  useEffect(() => {
    staticLayer.current?.batchDraw();
    overlayLayer.current?.batchDraw();
  }, [system]);

  // Size follows the container.
  useEffect(() => {
    const el = containerRef.current;
    if (!el) return;
    const apply = () => {
      const width = Math.max(200, Math.floor(el.clientWidth));
      const height = Math.max(200, Math.floor(el.clientHeight));
      setSize({ width, height });
      const view = store.getState().view;
      if (view.width !== width || view.height !== height) store.setState({ view: { ...view, width, height } });
    };
    apply();
    if (typeof ResizeObserver === 'undefined') return;
    const ro = new ResizeObserver(apply);
    ro.observe(el);
    return () => ro.disconnect();
  }, [store]);

  // Redraw on change, without re-rendering React.
  useEffect(() => {
    theme.current = readPlanTheme();
    const rebuild = () => {
      const s = store.getState();
      gesture.current = null; // the drawing changed: the bitmap no longer shows it
      geometry.current = buildStaticGeometry(s.plan, s.levelId, design.getSnapshot());
    };
    rebuild();
    staticLayer.current?.batchDraw();
    overlayLayer.current?.batchDraw();
    let last = store.getState();
    const unsubStore = store.subscribe((s) => {
      const prev = last;
      last = s;
      if (s.plan !== prev.plan || s.levelId !== prev.levelId) {
        rebuild();
        staticLayer.current?.batchDraw();
      } else if (s.view !== prev.view || s.showReactions !== prev.showReactions) staticLayer.current?.batchDraw();
      if (s.view !== prev.view || s.selection !== prev.selection || s.draft !== prev.draft || s.hover !== prev.hover || s.tool !== prev.tool || s.plan !== prev.plan || s.studyPreview !== prev.studyPreview) {
        overlayLayer.current?.batchDraw();
      }
    });
    const unsubDesign = design.subscribe(() => {
      rebuild();
      staticLayer.current?.batchDraw();
    });
    return () => {
      unsubStore();
      unsubDesign();
    };
  }, [store, design]);

  // Wheel must be non-passive to keep the page from scrolling while zooming.
  useEffect(() => {
    const el = containerRef.current;
    if (!el) return;
    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      lifecycle.wheel();
      const r = el.getBoundingClientRect();
      controller.wheel({ sx: e.clientX - r.left, sy: e.clientY - r.top, deltaY: e.deltaY, deltaX: e.deltaX, ctrl: e.ctrlKey });
    };
    el.addEventListener('wheel', onWheel, { passive: false });
    return () => el.removeEventListener('wheel', onWheel);
  }, [controller, lifecycle]);

  const local = (e: React.PointerEvent | React.MouseEvent) => {
    const r = containerRef.current!.getBoundingClientRect();
    return { sx: e.clientX - r.left, sy: e.clientY - r.top, shift: e.shiftKey, button: e.button };
  };

  const cursor = panning ? 'grab' : tool === 'select' || readOnly ? 'default' : 'crosshair';

  return (
    <div
      ref={containerRef}
      data-testid="plan-canvas"
      role="img"
      aria-label={label}
      tabIndex={0}
      className="relative h-full w-full touch-none overflow-hidden bg-paper-raised outline-none select-none"
      // Strict containment (sized by its parent anyway): the scale bar changing on zoom lays out
      // and paints this box alone, not the rest of the page.
      style={{ cursor, contain: 'strict' }}
      onPointerDown={(e) => {
        containerRef.current?.focus();
        (e.target as Element).setPointerCapture?.(e.pointerId);
        controller.down(local(e));
        lifecycle.pointerDown();
        setPanning(controller.panning);
      }}
      onPointerMove={(e) => {
        controller.move(local(e));
        if (!controller.panning && e.buttons === 0) tooltip.move(local(e));
      }}
      onPointerUp={(e) => {
        controller.up(local(e));
        lifecycle.pointerUp();
        setPanning(controller.panning);
      }}
      onPointerLeave={() => {
        controller.leave();
        tooltip.hide();
      }}
      // Space is released on the editor around the canvas (it clears the controller's hold there,
      // after this handler); the gesture may end once it has.
      onKeyUp={(e) => {
        if (e.key === ' ') queueMicrotask(() => lifecycle.spaceUp());
      }}
      onDoubleClick={() => controller.doubleClick()}
      onContextMenu={(e) => e.preventDefault()}
    >
      <Stage width={size.width} height={size.height} listening={false}>
        {renderUnderlay ? (
          <Layer listening={false}>
            <UnderlayNodes store={store} render={renderUnderlay} />
          </Layer>
        ) : null}
        <Layer ref={staticLayer} listening={false}>
          <Shape
            listening={false}
            perfectDrawEnabled={false}
            sceneFunc={(ctx) => {
              const g = geometry.current;
              if (!g || !theme.current) return;
              const view = store.getState().view;
              const t0 = performance.now();
              const bitmap = gesture.current;
              if (bitmap && bitmap.view.width === view.width && bitmap.view.height === view.height) {
                drawGestureBitmap(ctx._context, bitmap, view);
                (globalThis as { __planBitmapProbe?: number[] }).__planBitmapProbe?.push(performance.now() - t0);
                const el = containerRef.current;
                if (el) {
                  el.dataset.viewScale = String(view.scale);
                  el.dataset.viewX = String(view.x);
                  el.dataset.viewY = String(view.y);
                }
                return;
              }
              const stats = { reactionsDrawn: 0, reactionsHidden: 0 };
              const showReactions = !!store.getState().showReactions;
              const labelled = drawStatic(ctx._context, store.getState().plan, g, view, theme.current, systemRef.current, undefined, { reactions: showReactions, stats });
              // Performance probe: a test may set window.__planDrawProbe = [] to collect draw times.
              (globalThis as { __planDrawProbe?: number[] }).__planDrawProbe?.push(performance.now() - t0);
              // Read-back for tests and tools: the view and how many members carry a printed size.
              const el = containerRef.current;
              if (el) {
                el.dataset.viewScale = String(view.scale);
                el.dataset.viewX = String(view.x);
                el.dataset.viewY = String(view.y);
                el.dataset.labelledMembers = String(labelled);
                el.dataset.members = String(g.memberCount);
                el.dataset.units = systemRef.current;
                el.dataset.reactionsDrawn = String(showReactions ? stats.reactionsDrawn : 0);
                el.dataset.reactionsHidden = String(showReactions ? stats.reactionsHidden : 0);
              }
            }}
          />
        </Layer>
        <Layer ref={overlayLayer} listening={false}>
          <Shape
            listening={false}
            perfectDrawEnabled={false}
            sceneFunc={(ctx) => {
              if (theme.current) drawOverlay(ctx._context, store.getState(), theme.current, systemRef.current);
            }}
          />
        </Layer>
      </Stage>
      <ScaleIndicator store={store} system={system} />
      <ReactionsLegend store={store} design={design} system={system} />
      {tooltip.content ? (
        <div
          role="tooltip"
          className="pointer-events-none absolute z-10 max-w-72 rounded-[3px] border border-ink bg-paper-raised px-2 py-1 text-xs text-ink shadow"
          style={{ left: tooltip.content.x + 14, top: tooltip.content.y + 14 }}
        >
          {tooltip.content.text}
        </div>
      ) : null}
    </div>
  );
}

/** Re-renders with the view (only the underlay does; the plan layers redraw without React). */
function UnderlayNodes({ store, render }: { store: EditorStore; render: (view: PlanViewArgs) => React.ReactNode }) {
  const scale = useStore(store, (s) => s.view.scale);
  const x = useStore(store, (s) => s.view.x);
  const y = useStore(store, (s) => s.view.y);
  return <>{render({ scale, x, y })}</>;
}

/** What the R figures on the Plan are, shown while they are drawn. */
function ReactionsLegend({ store, design, system }: { store: EditorStore; design: LiveDesign; system: UnitSystem }) {
  const show = useStore(store, (s) => !!s.showReactions);
  const snap = useSyncExternalStore(design.subscribe, design.getSnapshot);
  if (!show) return null;
  const method = snap.result?.method === 'ASD' ? 'ASD' : 'LRFD';
  return (
    <p data-testid="reactions-legend" className="pointer-events-none absolute bottom-3 left-3 rounded-[2px] bg-paper-raised/90 px-1.5 py-1 text-[11px] text-ink">
      R = end reaction, {method === 'LRFD' ? 'LRFD factored' : 'ASD service'} (governing ASCE 7-16 combination), {unitLabel('force_kip', system)}. Zoom in where one is left out.
    </p>
  );
}

function ScaleIndicator({ store, system }: { store: EditorStore; system: UnitSystem }) {
  const scale = useStore(store, (s) => s.view.scale);
  const bar = scaleBar(scale, system);
  return (
    <div data-testid="scale-indicator" className="pointer-events-none absolute right-3 bottom-3 flex flex-col items-end gap-0.5 rounded-[2px] bg-paper-raised/85 px-1.5 py-1">
      <div className="flex" style={{ width: bar.px }}>
        <div className="h-1.5 flex-1 border border-ink bg-ink" />
        <div className="h-1.5 flex-1 border border-l-0 border-ink" />
      </div>
      <span className="figures font-mono text-[10px] text-ink">{bar.text}</span>
    </div>
  );
}

/** A tooltip naming the member under the pointer: mark, size, ratio and status in words. */
function useTooltip(store: EditorStore, design: LiveDesign, containerRef: React.RefObject<HTMLDivElement | null>) {
  const [content, setContent] = useState<{ x: number; y: number; text: string } | null>(null);
  useSyncExternalStore(design.subscribe, design.getSnapshot);
  // The text names what was under the pointer when it last moved: an edit (the plan changes
  // under a still pointer: delete, undo, a typed size) or another level shown makes it stale,
  // so it goes until the pointer moves again.
  useEffect(() => {
    let last = store.getState();
    return store.subscribe((s) => {
      const prev = last;
      last = s;
      if (s.plan !== prev.plan || s.levelId !== prev.levelId) setContent(null);
    });
  }, [store]);
  return {
    content,
    hide: () => setContent(null),
    move: (p: { sx: number; sy: number }) => {
      const s = store.getState();
      if (!containerRef.current) return;
      const hit = pickAt(s.plan, s.levelId, toPlan(s.view, p.sx, p.sy), 6 / s.view.scale, ['member']);
      if (!hit) {
        if (content) setContent(null);
        return;
      }
      const snap = design.getSnapshot();
      const m = s.plan.members.find((x) => x.id === hit.id)!;
      const names = planNamer(s.plan, new Map((snap.result?.members ?? []).map((x) => [x.id, x.mark])));
      const st = memberStatus(hit.id, snap.byId.get(hit.id), snap.result, snap.pending, names);
      const ratio = st.ratio === null ? '' : ` · ratio ${st.util.printed}`;
      const text = `${names.member(m.id) ?? m.kind} · ${st.size}${ratio} · ${st.words}`;
      if (!content || content.text !== text || Math.abs(content.x - p.sx) > 2 || Math.abs(content.y - p.sy) > 2) setContent({ x: p.sx, y: p.sy, text });
    },
  };
}
