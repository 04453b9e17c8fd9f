/**
 * Uniform-grid bucket index of segments in plan, so that "what lies at this point" is a
 * bucket lookup instead of a scan of every member (plans run to thousands of members).
 */
import type { Point } from './polygon.geometry';

export class SegmentGridIndex<T> {
  private readonly buckets = new Map<number, T[]>();

  constructor(private readonly cellFt: number) {}

  /**
   * Numeric cell key: a small integer (cheap to hash, no number allocated) inside ±2^14 cells
   * each way, else a negative one (plans stay far inside ±2^20 cells); the two never meet.
   */
  private key(ix: number, iy: number): number {
    if (ix > -16384 && ix < 16384 && iy > -16384 && iy < 16384) return (ix + 16384) * 32768 + (iy + 16384);
    return -1 - ((ix + 1048576) * 2097152 + (iy + 1048576));
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

  /**
   * The first item, in the order `inBox` lists them, for which `test` is true (or null). Items
   * under several cells are tested again there: the first match is the same.
   */
  firstInBox<A>(a: Point, b: Point, test: (item: T, arg: A) => boolean, arg: A): T | null {
    const x0 = Math.floor(Math.min(a[0], b[0]) / this.cellFt);
    const x1 = Math.floor(Math.max(a[0], b[0]) / this.cellFt);
    const y0 = Math.floor(Math.min(a[1], b[1]) / this.cellFt);
    const y1 = Math.floor(Math.max(a[1], b[1]) / this.cellFt);
    for (let ix = x0; ix <= x1; ix++) {
      for (let iy = y0; iy <= y1; iy++) {
        const list = this.buckets.get(this.key(ix, iy));
        if (!list) continue;
        for (let i = 0; i < list.length; i++) if (test(list[i], arg)) return list[i];
      }
    }
    return null;
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
