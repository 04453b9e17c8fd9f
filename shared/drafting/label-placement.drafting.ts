/**
 * Labels that do not overlap: each label is offered with its candidate positions (best first)
 * and takes the first that overlaps nothing placed before it; a label with no free position is
 * left out (the less important one, since labels are offered in order of importance). Boxes
 * are axis-aligned, in whatever units the caller draws in. Pure.
 */
export interface LabelBox {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
  /** What the label is, for tests and debugging ("member b4", "zone Office"). */
  what?: string;
}

export function boxesOverlap(a: LabelBox, b: LabelBox, gap = 0): boolean {
  return a.x0 < b.x1 + gap && b.x0 < a.x1 + gap && a.y0 < b.y1 + gap && b.y0 < a.y1 + gap;
}

/** The axis-aligned box of a w × h text box centred at (cx, cy) and turned by `angle` radians. */
export function rotatedBox(cx: number, cy: number, w: number, h: number, angle: number, what?: string): LabelBox {
  const c = Math.abs(Math.cos(angle));
  const s = Math.abs(Math.sin(angle));
  const hw = (w * c + h * s) / 2;
  const hh = (w * s + h * c) / 2;
  return { x0: cx - hw, y0: cy - hh, x1: cx + hw, y1: cy + hh, what };
}

export class LabelPlacer {
  readonly placed: LabelBox[] = [];
  constructor(private readonly gap = 1) {}

  /** Whether a box is clear of everything placed. */
  fits(box: LabelBox): boolean {
    return !this.placed.some((p) => boxesOverlap(p, box, this.gap));
  }

  /** Keeps a box whatever it overlaps (the labels that must show, placed first). */
  reserve(box: LabelBox): void {
    this.placed.push(box);
  }

  /** The first candidate clear of everything placed (and keeps it), or null to leave it out. */
  place(candidates: readonly LabelBox[]): LabelBox | null {
    for (const c of candidates) {
      if (this.fits(c)) {
        this.placed.push(c);
        return c;
      }
    }
    return null;
  }
}

/** Every pair of boxes that overlap (for tests: an empty list means the labels are clear). */
export function overlappingPairs(boxes: readonly LabelBox[]): [LabelBox, LabelBox][] {
  const out: [LabelBox, LabelBox][] = [];
  for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) if (boxesOverlap(boxes[i], boxes[j])) out.push([boxes[i], boxes[j]]);
  return out;
}
