/**
 * Uniform-grid bucket index of segments in plan, so that "what lies at this point" is a
 * bucket lookup instead of a scan of every member (plans run to thousands of members).
 */
import type { Point } from './polygon.geometry';

export class SegmentGridIndex<T> {
  private readonly buckets = new Map<number, T[]>();

  constructor(private readonly cellFt: number) {}

  /** Numeric cell key; plans stay far inside ±2^20 cells. */
  private key(ix: number, iy: number): number {
    return (ix + 1048576) * 2097152 + (iy + 1048576);
  }

  /** Insert an item under every cell its segment's box (grown by padFt) touches. */
  insert(item: T, a: Point, b: Point, padFt: number): void {
    const x0 = Math.floor((Math.min(a[0], b[0]) - padFt) / this.cellFt);
    const x1 = Math.floor((Math.max(a[0], b[0]) + padFt) / this.cellFt);
    const y0 = Math.floor((Math.min(a[1], b[1]) - padFt) / this.cellFt);
    const y1 = Math.floor((Math.max(a[1], b[1]) + padFt) / this.cellFt);
    for (let ix = x0; ix <= x1; ix++) {
      for (let iy = y0; iy <= y1; iy++) {
        const k = this.key(ix, iy);
        const list = this.buckets.get(k);
        if (list) list.push(item);
        else this.buckets.set(k, [item]);
      }
    }
  }

  /** Items whose padded box may contain p (a superset: callers test exactly). */
  near(p: Point): readonly T[] {
    return this.buckets.get(this.key(Math.floor(p[0] / this.cellFt), Math.floor(p[1] / this.cellFt))) ?? [];
  }

  /** Items that may touch the box [a, b] (deduplicated). */
  inBox(a: Point, b: Point): T[] {
    const out = new Set<T>();
    const x0 = Math.floor(Math.min(a[0], b[0]) / this.cellFt);
    const x1 = Math.floor(Math.max(a[0], b[0]) / this.cellFt);
    const y0 = Math.floor(Math.min(a[1], b[1]) / this.cellFt);
    const y1 = Math.floor(Math.max(a[1], b[1]) / this.cellFt);
    for (let ix = x0; ix <= x1; ix++) {
      for (let iy = y0; iy <= y1; iy++) {
        for (const item of this.buckets.get(this.key(ix, iy)) ?? []) out.add(item);
      }
    }
    return [...out];
  }
}
