// The plan ↔ screen transform. Plan y points north (up); screen y points down.
import type { PlanPoint, View } from '../store/editor.types';
import type { Bounds } from '../tools/plan-geometry';
import { FT_M, type UnitSystem } from '../../../lib/units';

export const MIN_SCALE = 0.5; // px per ft
export const MAX_SCALE = 200;

export function toScreen(view: View, p: PlanPoint): [number, number] {
  return [p[0] * view.scale + view.x, -p[1] * view.scale + view.y];
}

export function toPlan(view: View, sx: number, sy: number): [number, number] {
  return [(sx - view.x) / view.scale, -(sy - view.y) / view.scale];
}

/** Zoom by a factor keeping the plan point under (sx, sy) where it is. */
export function zoomAt(view: View, factor: number, sx = view.width / 2, sy = view.height / 2): View {
  const scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, view.scale * factor));
  const k = scale / view.scale;
  return { ...view, scale, x: sx - (sx - view.x) * k, y: sy - (sy - view.y) * k };
}

export function panBy(view: View, dx: number, dy: number): View {
  return { ...view, x: view.x + dx, y: view.y + dy };
}

/** The view that shows these plan bounds with a margin for grid bubbles. */
/** Room outside the drawing for grid bubbles and dimension strings. */
export const FIT_MARGIN_PX = 104;

export function fitView(view: View, bounds: Bounds | null, marginPx = FIT_MARGIN_PX): View {
  if (!bounds) return { ...view, scale: 8, x: marginPx, y: view.height - marginPx };
  const w = Math.max(bounds.maxX - bounds.minX, 1);
  const h = Math.max(bounds.maxY - bounds.minY, 1);
  const scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, Math.min((view.width - 2 * marginPx) / w, (view.height - 2 * marginPx) / h)));
  const cx = (bounds.minX + bounds.maxX) / 2;
  const cy = (bounds.minY + bounds.maxY) / 2;
  return { ...view, scale, x: view.width / 2 - cx * scale, y: view.height / 2 + cy * scale };
}

/** The plan rectangle on screen (for culling). */
export function visibleBounds(view: View): Bounds {
  const [x0, y1] = toPlan(view, 0, 0);
  const [x1, y0] = toPlan(view, view.width, view.height);
  return { minX: x0, minY: y0, maxX: x1, maxY: y1 };
}

/** A round length for the scale bar: about `targetPx` long on screen. */
export function scaleBarLength(scale: number, targetPx = 120): number {
  const raw = targetPx / scale;
  const pow = 10 ** Math.floor(Math.log10(raw));
  for (const m of [1, 2, 5, 10]) if (m * pow >= raw * 0.7) return m * pow;
  return 10 * pow;
}

/** The scale bar: a round length in the reader's unit (ft or m), its width on screen and its caption. */
export function scaleBar(scale_pxPerFt: number, system: UnitSystem): { length: number; px: number; text: string } {
  const perUnit = system === 'SI' ? scale_pxPerFt / FT_M : scale_pxPerFt;
  const unit = system === 'SI' ? 'm' : 'ft';
  const length = scaleBarLength(perUnit);
  return { length, px: length * perUnit, text: `${length} ${unit} · ${perUnit >= 10 ? perUnit.toFixed(0) : perUnit.toFixed(1)} px/${unit}` };
}
