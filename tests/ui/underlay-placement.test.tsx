import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  calibrateUnderlay, imagePxToPlan, planToImagePx, underlayScreenRect, type Vec2,
} from '../../src/features/underlay/lib/underlay-placement';

// Plan ↔ screen as the editor draws it (src/features/editor/canvas/view-transform.ts): y up on the plan.
const toScreen = (view: { scale: number; x: number; y: number }, p: Vec2) => [p[0] * view.scale + view.x, -p[1] * view.scale + view.y];

describe('calibrateUnderlay', () => {
  it('when A and B are 500 px apart and 25 ft apart, then the scale is 0.05 ft/px and A lands on the plan point given', () => {
    // 300-400-500 triangle: |B − A| = 500 px exactly (worked by hand).
    const r = calibrateUnderlay([100, 200], [400, 600], [10, 20], 25);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.placement.scale_ft_per_px).toBeCloseTo(0.05, 15);
    // origin = A_plan − (u·s, −v·s) = (10 − 5, 20 + 10)
    expect(r.placement.origin_ft[0]).toBeCloseTo(5, 12);
    expect(r.placement.origin_ft[1]).toBeCloseTo(30, 12);
    expect(r.placement.rotation_deg).toBe(0);
    expect(imagePxToPlan(r.placement, [100, 200])).toEqual([expect.closeTo(10, 12), expect.closeTo(20, 12)]);
    // B: 300 px right and 400 px down on the image = 15 ft east and 20 ft south on the plan.
    expect(imagePxToPlan(r.placement, [400, 600])).toEqual([expect.closeTo(25, 12), expect.closeTo(0, 12)]);
  });

  it('when no plan point is given, then the top-left corner stays where it was', () => {
    const r = calibrateUnderlay([0, 0], [0, 1200], null, 60, { origin_ft: [-4, 88] });
    expect(r).toEqual({ ok: true, placement: { origin_ft: [-4, 88], scale_ft_per_px: 0.05, rotation_deg: 0 } });
    expect(calibrateUnderlay([0, 0], [0, 1200], undefined, 60)).toMatchObject({ ok: true, placement: { origin_ft: [0, 0] } });
  });

  it('when the points coincide or are too close, or the distance is not positive, then it says which input is wrong', () => {
    expect(calibrateUnderlay([50, 50], [53, 54], null, 10)).toMatchObject({ ok: false, field: 'points' });
    expect(calibrateUnderlay([50, 50], [50, 50], null, 10)).toMatchObject({ ok: false, field: 'points' });
    expect(calibrateUnderlay([0, 0], [100, 0], null, 0)).toMatchObject({ ok: false, field: 'distance' });
    expect(calibrateUnderlay([0, 0], [100, 0], null, Number.NaN)).toMatchObject({ ok: false, field: 'distance' });
    expect(calibrateUnderlay([Number.NaN, 0], [100, 0], null, 5)).toMatchObject({ ok: false, field: 'points' });
  });

  it('when calibrated at any rotation, then A maps to its plan point and A–B measures the typed distance on the plan', () => {
    const coord = fc.double({ min: -5000, max: 5000, noNaN: true });
    fc.assert(
      fc.property(coord, coord, coord, coord, coord, coord, fc.double({ min: 0.1, max: 500, noNaN: true }), fc.double({ min: -180, max: 180, noNaN: true }),
        (ax, ay, bx, by, px, py, d, rot) => {
          fc.pre(Math.hypot(bx - ax, by - ay) >= 10);
          const r = calibrateUnderlay([ax, ay], [bx, by], [px, py], d, { rotation_deg: rot });
          expect(r.ok).toBe(true);
          if (!r.ok) return;
          const a = imagePxToPlan(r.placement, [ax, ay]);
          const b = imagePxToPlan(r.placement, [bx, by]);
          expect(Math.abs(a[0] - px)).toBeLessThan(1e-6);
          expect(Math.abs(a[1] - py)).toBeLessThan(1e-6);
          expect(Math.abs(Math.hypot(b[0] - a[0], b[1] - a[1]) - d)).toBeLessThan(1e-9 * Math.max(1, d));
        }),
    );
  });
});

describe('placement transforms', () => {
  it('when a plan point is taken to image pixels and back, then it returns to itself', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: 0.001, max: 10, noNaN: true }), fc.double({ min: -360, max: 360, noNaN: true }),
        (x, y, s, rot) => {
          const p = { origin_ft: [12, -7] as [number, number], scale_ft_per_px: s, rotation_deg: rot };
          const back = imagePxToPlan(p, planToImagePx(p, [x, y]));
          expect(Math.abs(back[0] - x)).toBeLessThan(1e-6);
          expect(Math.abs(back[1] - y)).toBeLessThan(1e-6);
        }),
    );
  });

  it('when drawn for a view, then every image pixel lands where the editor puts its plan point', () => {
    const view = { scale: 10, x: 50, y: 400 };
    const unrotated = { placement: { origin_ft: [5, 30] as [number, number], scale_ft_per_px: 0.05, rotation_deg: 0 }, width_px: 200, height_px: 100 };
    // Top-left (5, 30) ft → (5·10 + 50, −30·10 + 400) px; 200 px × 0.05 ft × 10 px/ft = 100 px wide.
    expect(underlayScreenRect(unrotated, view)).toEqual({ x: 100, y: 100, width: 100, height: 50, rotation: 0 });
    fc.assert(
      fc.property(fc.double({ min: 0, max: 200, noNaN: true }), fc.double({ min: 0, max: 100, noNaN: true }), fc.double({ min: -180, max: 180, noNaN: true }), (u, v, rot) => {
        const item = { ...unrotated, placement: { ...unrotated.placement, rotation_deg: rot } };
        const r = underlayScreenRect(item, view);
        const phi = (r.rotation * Math.PI) / 180; // clockwise on screen (Konva, canvas)
        const lu = (u / item.width_px) * r.width;
        const lv = (v / item.height_px) * r.height;
        const drawn = [r.x + lu * Math.cos(phi) - lv * Math.sin(phi), r.y + lu * Math.sin(phi) + lv * Math.cos(phi)];
        const expected = toScreen(view, imagePxToPlan(item.placement, [u, v]));
        expect(Math.abs(drawn[0] - expected[0])).toBeLessThan(1e-6);
        expect(Math.abs(drawn[1] - expected[1])).toBeLessThan(1e-6);
      }),
    );
  });
});
