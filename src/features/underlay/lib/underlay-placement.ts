// Where an underlay image sits on the plan, and how it is calibrated. Pure functions.
//
// Conventions (shared with the server's placement fields):
//   image pixels (u, v): u to the right, v DOWN, (0, 0) the top-left corner of the image;
//   plan feet (x, y): x east, y NORTH (up), as in the plan file and the editor's view;
//   placement: origin_ft = plan point of the image's top-left corner, scale_ft_per_px,
//   rotation_deg counter-clockwise on the plan about that corner.
// So with rotation 0: x = ox + u·s, y = oy − v·s.
import type { UnderlayPlacement } from '../api/underlay.schema';

export type Vec2 = readonly [number, number];

const rad = (deg: number) => (deg * Math.PI) / 180;

function rotate([x, y]: Vec2, deg: number): [number, number] {
  if (deg === 0) return [x, y];
  const c = Math.cos(rad(deg));
  const s = Math.sin(rad(deg));
  return [x * c - y * s, x * s + y * c];
}

/** Image pixel → plan feet. */
export function imagePxToPlan(p: UnderlayPlacement, px: Vec2): [number, number] {
  const [dx, dy] = rotate([px[0] * p.scale_ft_per_px, -px[1] * p.scale_ft_per_px], p.rotation_deg);
  return [p.origin_ft[0] + dx, p.origin_ft[1] + dy];
}

/** Plan feet → image pixel (the inverse of imagePxToPlan). */
export function planToImagePx(p: UnderlayPlacement, plan: Vec2): [number, number] {
  const [ex, ey] = rotate([plan[0] - p.origin_ft[0], plan[1] - p.origin_ft[1]], -p.rotation_deg);
  return [ex / p.scale_ft_per_px, -ey / p.scale_ft_per_px];
}

export type CalibrationResult =
  | { ok: true; placement: UnderlayPlacement }
  | { ok: false; field: 'points' | 'distance'; error: string };

/** Two picks closer than this cannot set a scale with any accuracy. */
export const MIN_CALIBRATION_PX = 10;

/**
 * Scale and origin from two points picked on the image (pxA, pxB, image pixels) and the real
 * distance between them (ft). With planA_ft, the image is moved so that pxA lands on that plan
 * point (e.g. a grid intersection); without it, the image's top-left corner stays at
 * options.origin_ft (default the current origin, else 0,0). Rotation is kept (default 0).
 */
export function calibrateUnderlay(
  pxA: Vec2,
  pxB: Vec2,
  planA_ft: Vec2 | null | undefined,
  distance_ft: number,
  options: { rotation_deg?: number; origin_ft?: Vec2 } = {},
): CalibrationResult {
  if (![...pxA, ...pxB].every(Number.isFinite)) return { ok: false, field: 'points', error: 'Pick both points on the image' };
  const lengthPx = Math.hypot(pxB[0] - pxA[0], pxB[1] - pxA[1]);
  if (lengthPx < MIN_CALIBRATION_PX) {
    return { ok: false, field: 'points', error: `Pick two points at least ${MIN_CALIBRATION_PX} px apart on the image (far apart is more accurate)` };
  }
  if (!Number.isFinite(distance_ft) || distance_ft <= 0) return { ok: false, field: 'distance', error: 'Enter the real distance between the two points' };
  const scale = distance_ft / lengthPx;
  const rotation = options.rotation_deg ?? 0;
  let origin: [number, number];
  if (planA_ft) {
    const [dx, dy] = rotate([pxA[0] * scale, -pxA[1] * scale], rotation);
    origin = [planA_ft[0] - dx, planA_ft[1] - dy];
  } else {
    origin = [options.origin_ft?.[0] ?? 0, options.origin_ft?.[1] ?? 0];
  }
  return { ok: true, placement: { origin_ft: origin, scale_ft_per_px: scale, rotation_deg: rotation } };
}

/** The editor's view (editor.types View): screen = (x·scale + vx, −y·scale + vy). */
export interface PlanView {
  scale: number;
  x: number;
  y: number;
}

/**
 * Where to draw the image on screen for a view: top-left corner, size in screen px, and the
 * rotation in Konva's sense (degrees clockwise on screen).
 */
export function underlayScreenRect(
  u: { placement: UnderlayPlacement; width_px: number; height_px: number },
  view: PlanView,
): { x: number; y: number; width: number; height: number; rotation: number } {
  const p = u.placement;
  return {
    x: p.origin_ft[0] * view.scale + view.x,
    y: -p.origin_ft[1] * view.scale + view.y,
    width: u.width_px * p.scale_ft_per_px * view.scale,
    height: u.height_px * p.scale_ft_per_px * view.scale,
    rotation: p.rotation_deg === 0 ? 0 : -p.rotation_deg,
  };
}

/** Draws an underlay on a 2D canvas (for a canvas that is not Konva). */
export function drawUnderlay(
  ctx: CanvasRenderingContext2D,
  image: CanvasImageSource,
  u: { placement: UnderlayPlacement; width_px: number; height_px: number; opacity: number; visible: boolean },
  view: PlanView,
): void {
  if (!u.visible) return;
  const r = underlayScreenRect(u, view);
  ctx.save();
  ctx.globalAlpha = u.opacity;
  ctx.translate(r.x, r.y);
  if (r.rotation) ctx.rotate(rad(r.rotation));
  ctx.drawImage(image, 0, 0, r.width, r.height);
  ctx.restore();
}
