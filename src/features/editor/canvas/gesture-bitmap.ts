// During a pan or zoom gesture the static layer is not redrawn member by member: a bitmap of
// it taken when the gesture starts is drawn moved and scaled to the current view, and the
// full drawing comes back when the gesture ends (pointer up, or the wheel quiet for a moment).
import type { View } from '../store/editor.types';

/** How long after the last wheel step a zoom gesture ends, ms. */
export const WHEEL_GESTURE_IDLE_MS = 250;

export interface GestureBitmap {
  canvas: HTMLCanvasElement;
  /** The view the bitmap was drawn at. */
  view: View;
}

/**
 * The transform that carries the bitmap drawn at `from` onto `to`: screen q at `from` shows
 * plan point p = (q − x0)/s0 (y likewise, flipped in both), which `to` puts at k·q + (x − k·x0).
 */
export function bitmapTransform(from: View, to: View): { k: number; dx: number; dy: number } {
  const k = to.scale / from.scale;
  return { k, dx: to.x - k * from.x, dy: to.y - k * from.y };
}

/** A copy of a layer's canvas (device pixels) with the view it shows, or null when it cannot be read. */
export function snapshotLayer(source: HTMLCanvasElement | null | undefined, view: View): GestureBitmap | null {
  if (!source || source.width === 0 || source.height === 0) return null;
  const canvas = document.createElement('canvas');
  canvas.width = source.width;
  canvas.height = source.height;
  const ctx = canvas.getContext('2d');
  if (!ctx) return null;
  ctx.drawImage(source, 0, 0);
  return { canvas, view };
}

/** Draws the bitmap for `view` on a layer context already scaled to CSS pixels. */
export function drawGestureBitmap(ctx: CanvasRenderingContext2D, bitmap: GestureBitmap, view: View): void {
  const { k, dx, dy } = bitmapTransform(bitmap.view, view);
  ctx.save();
  ctx.imageSmoothingEnabled = k < 1;
  ctx.drawImage(bitmap.canvas, dx, dy, bitmap.view.width * k, bitmap.view.height * k);
  ctx.restore();
}
