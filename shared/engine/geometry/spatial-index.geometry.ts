/**
 * Uniform-grid bucket index of segments in plan, so that "what lies at this point" is a
 * bucket lookup instead of a scan of every member (plans run to thousands of members).
 *
 * Cost never depends on how large the coordinates are: an item whose box covers more than
 * MAX_CELLS cells is kept in one "wide" list that every query also reads, and a query box
 * covering more than MAX_CELLS cells reads the item list instead of walking cells. So a member
 * drawn 10^8 ft long costs one list entry, not 10^7 buckets.
 */
import type { Point } from './polygon.geometry';

/** Most cells an item is bucketed under, and most cells a query walks. */
export const SPATIAL_INDEX_MAX_CELLS = 256;

/**
 * Cells x0…x1 × y0…y1, walked by count (nx × ny): past 2^53 ft/cell, ix + 1 === ix, so a loop
 * "ix <= x1; ix++" would never end.
 */
interface CellRange { x0: number; x1: number; y0: number; y1: number; nx: number; ny: number; cells: number }

export class SegmentGridIndex<T> {
  private readonly buckets = new Map<number, T[]>();
  /** Items too large to bucket (read by every query). */
  private readonly wide: T[] = [];
  /** Every item in insertion order, with the box it was inserted under (for large queries). */
  private readonly items: { item: T; x0: number; y0: number; x1: number; y1: number }[] = [];

  constructor(private readonly cellFt: number) {}

  /**
   * Numeric cell key: a small integer (cheap to hash, no number allocated) inside ±2^14 cells
   * each way, else a negative one. Far-off cells may share a key; that only merges buckets,
   * and every caller tests the candidates exactly.
   */
  private key(ix: number, iy: number): number {
    if (ix > -16384 && ix < 16384 && iy > -16384 && iy < 16384) return (ix + 16384) * 32768 + (iy + 16384);
    return -1 - ((ix + 1048576) * 2097152 + (iy + 1048576));
  }

  private range(ax: number, ay: number, bx: number, by: number, padFt: number): CellRange {
    const x0 = Math.floor((Math.min(ax, bx) - padFt) / this.cellFt);
    const x1 = Math.floor((Math.max(ax, bx) + padFt) / this.cellFt);
    const y0 = Math.floor((Math.min(ay, by) - padFt) / this.cellFt);
    const y1 = Math.floor((Math.max(ay, by) + padFt) / this.cellFt);
    const nx = x1 - x0 + 1;
    const ny = y1 - y0 + 1;
    return { x0, x1, y0, y1, nx, ny, cells: nx * ny };
  }

  /** Insert an item under every cell its segment's box (grown by padFt) touches. */
  insert(item: T, a: Point, b: Point, padFt: number): void {
    const r = this.range(a[0], a[1], b[0], b[1], padFt);
    this.items.push({ item, x0: r.x0, y0: r.y0, x1: r.x1, y1: r.y1 });
    if (!(r.cells <= SPATIAL_INDEX_MAX_CELLS)) {
      this.wide.push(item);
      return;
    }
    for (let i = 0; i < r.nx; i++) {
      for (let j = 0; j < r.ny; j++) {
        const k = this.key(r.x0 + i, r.y0 + j);
        const list = this.buckets.get(k);
        if (list) list.push(item);
        else this.buckets.set(k, [item]);
      }
    }
  }

  /** Items whose padded box may contain p (a superset: callers test exactly). */
  near(p: Point): readonly T[] {
    const bucket = this.buckets.get(this.key(Math.floor(p[0] / this.cellFt), Math.floor(p[1] / this.cellFt)));
    if (this.wide.length === 0) return bucket ?? [];
    return bucket ? [...bucket, ...this.wide] : this.wide;
  }

  /** Items (insertion order) whose cell box meets the query's: the scan used for large queries. */
  private scanItems(r: CellRange): T[] {
    const out: T[] = [];
    for (const e of this.items) if (e.x0 <= r.x1 && e.x1 >= r.x0 && e.y0 <= r.y1 && e.y1 >= r.y0) out.push(e.item);
    return out;
  }

  /**
   * The first item, in the order `inBox` lists them, for which `test` is true (or null). Items
   * under several cells are tested again there: the first match is the same.
   */
  firstInBox<A>(a: Point, b: Point, test: (item: T, arg: A) => boolean, arg: A): T | null {
    const r = this.range(a[0], a[1], b[0], b[1], 0);
    if (!(r.cells <= SPATIAL_INDEX_MAX_CELLS)) {
      for (const item of this.scanItems(r)) if (test(item, arg)) return item;
      return null;
    }
    for (let i = 0; i < r.nx; i++) {
      for (let j = 0; j < r.ny; j++) {
        const list = this.buckets.get(this.key(r.x0 + i, r.y0 + j));
        if (!list) continue;
        for (let i = 0; i < list.length; i++) if (test(list[i], arg)) return list[i];
      }
    }
    for (let i = 0; i < this.wide.length; i++) if (test(this.wide[i], arg)) return this.wide[i];
    return null;
  }

  /** Items that may touch the box [a, b] (deduplicated). */
  inBox(a: Point, b: Point): T[] {
    const r = this.range(a[0], a[1], b[0], b[1], 0);
    if (!(r.cells <= SPATIAL_INDEX_MAX_CELLS)) return this.scanItems(r);
    const out = new Set<T>();
    for (let i = 0; i < r.nx; i++) {
      for (let j = 0; j < r.ny; j++) {
        for (const item of this.buckets.get(this.key(r.x0 + i, r.y0 + j)) ?? []) out.add(item);
      }
    }
    for (const item of this.wide) out.add(item);
    return [...out];
  }
}
