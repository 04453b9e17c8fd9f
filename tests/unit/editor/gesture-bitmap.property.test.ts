import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bitmapTransform } from '../../../src/features/editor/canvas/gesture-bitmap';
import { panBy, toScreen, zoomAt } from '../../../src/features/editor/canvas/view-transform';
import type { View } from '../../../src/features/editor/store/editor.types';

const view = (scale: number, x: number, y: number): View => ({ scale, x, y, width: 1200, height: 800 }) as View;

describe('gesture bitmap transform', () => {
  it('when the view is panned and zoomed from the bitmap view, then every plan point of the bitmap lands where the new view draws it', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 200, noNaN: true }),
        fc.double({ min: -5000, max: 5000, noNaN: true }),
        fc.double({ min: -5000, max: 5000, noNaN: true }),
        fc.array(fc.oneof(fc.record({ zoom: fc.double({ min: 0.5, max: 2, noNaN: true }), sx: fc.integer({ min: 0, max: 1200 }), sy: fc.integer({ min: 0, max: 800 }) }), fc.record({ dx: fc.integer({ min: -400, max: 400 }), dy: fc.integer({ min: -400, max: 400 }) })), { maxLength: 12 }),
        fc.tuple(fc.double({ min: -500, max: 500, noNaN: true }), fc.double({ min: -500, max: 500, noNaN: true })),
        (scale, x, y, steps, p) => {
          const from = view(scale, x, y);
          let to = from;
          for (const s of steps) to = 'zoom' in s ? zoomAt(to, s.zoom, s.sx, s.sy) : panBy(to, s.dx, s.dy);
          const { k, dx, dy } = bitmapTransform(from, to);
          const [qx, qy] = toScreen(from, p);
          const [ex, ey] = toScreen(to, p);
          const tol = 1e-6 * Math.max(1, Math.abs(ex), Math.abs(ey));
          expect(Math.abs(k * qx + dx - ex)).toBeLessThanOrEqual(tol);
          expect(Math.abs(k * qy + dy - ey)).toBeLessThanOrEqual(tol);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('when the view has not changed, then the bitmap is drawn where it was taken, unscaled', () => {
    expect(bitmapTransform(view(8, 104, 696), view(8, 104, 696))).toEqual({ k: 1, dx: 0, dy: 0 });
  });
});
