import type { WShape } from './w-shape.types';
import { W_SHAPES_V15 } from './w-shapes.generated';

export type { WShape } from './w-shape.types';

const byLabel = new Map<string, WShape>(W_SHAPES_V15.map((s) => [s.label.toUpperCase(), s]));

/** Normalises "w18x50", " W18 x 50 " to "W18X50". */
export function normalizeShapeLabel(label: string): string {
  return label.replace(/\s+/g, '').toUpperCase();
}

/** Typed lookup by label, case-insensitive; undefined when not in the catalog. */
export function findWShape(label: string): WShape | undefined {
  return byLabel.get(normalizeShapeLabel(label));
}

/** Like findWShape but throws a clear error for an unknown label. */
export function getWShape(label: string): WShape {
  const s = findWShape(label);
  if (!s) throw new Error(`unknown W-shape "${label}" (not in AISC Shapes Database v15.0)`);
  return s;
}

/** All shapes, in the database order (deepest series first). */
export function listWShapes(): readonly WShape[] {
  return W_SHAPES_V15;
}

/** Nominal depth in inches from the designation: W18X50 -> 18. */
export function nominalDepthIn(shape: WShape | string): number {
  const label = typeof shape === 'string' ? shape : shape.label;
  return Number(normalizeShapeLabel(label).slice(1).split('X')[0]);
}
