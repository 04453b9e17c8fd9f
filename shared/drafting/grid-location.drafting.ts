/**
 * Grid-location text for a member, as drawings and schedules write it: the grid lines it
 * runs between, then the grid line it lies on — "B–C / 2" is a member on line 2 between
 * lines B and C. Off a grid line the nearest line below gets an offset: "1–2 / A+10'-0"".
 * Pure: plan coordinates in feet, grids from the plan file (axis 'x' = line of constant x).
 */
import type { PlanGrid, PlanPoint } from '../schemas/plan.schema';

/** A member end or line within this distance of a grid line is on it (common practice: 1/8 in). */
export const GRID_TOLERANCE_FT = 0.01;

/** Feet as feet-and-inches to the nearest 1/4 in, e.g. 10.5 → 10'-6", 0.0625 → 0'-0 3/4". */
export function formatFeetInches(valueFt: number): string {
  const sign = valueFt < 0 ? '-' : '';
  const quarters = Math.round(Math.abs(valueFt) * 48);
  const feet = Math.floor(quarters / 48);
  const inQuarters = quarters - feet * 48;
  const whole = Math.floor(inQuarters / 4);
  const frac = inQuarters % 4;
  const fracText = frac === 0 ? '' : frac === 2 ? ' 1/2' : ` ${frac}/4`;
  return `${sign}${feet}'-${whole}${fracText}"`;
}

interface Line {
  label: string;
  offset: number;
}

function linesOf(grids: readonly PlanGrid[], axis: 'x' | 'y'): Line[] {
  return grids
    .filter((g) => g.axis === axis && Number.isFinite(g.offset_ft))
    .map((g) => ({ label: g.label, offset: g.offset_ft }))
    .sort((a, b) => a.offset - b.offset);
}

/** The grid line at a coordinate, or the nearest one below with "+offset" (above with "−offset" when below them all). */
export function gridLineLabelAt(lines: readonly Line[], coordFt: number): string {
  const on = lines.find((l) => Math.abs(l.offset - coordFt) <= GRID_TOLERANCE_FT);
  if (on) return on.label;
  const below = [...lines].reverse().find((l) => l.offset < coordFt);
  if (below) return `${below.label}+${formatFeetInches(coordFt - below.offset)}`;
  const first = lines[0];
  return `${first.label}−${formatFeetInches(first.offset - coordFt)}`;
}

/** "A–B" for the grid lines at or around a range (one label when both ends are at or between the same pair). */
function rangeLabel(lines: readonly Line[], fromFt: number, toFt: number): string {
  const lo = Math.min(fromFt, toFt);
  const hi = Math.max(fromFt, toFt);
  const start = [...lines].reverse().find((l) => l.offset <= lo + GRID_TOLERANCE_FT);
  const end = lines.find((l) => l.offset >= hi - GRID_TOLERANCE_FT);
  const a = start ? start.label : gridLineLabelAt(lines, lo);
  const b = end ? end.label : gridLineLabelAt(lines, hi);
  return a === b ? a : `${a}–${b}`;
}

/**
 * Location text of a member from start to end: the perpendicular lines it runs between, then
 * the line it lies on. A sloped member gives both ranges ("A–B / 1–2"). Null when the plan
 * lacks grid lines on either axis.
 */
export function gridLocation(start: PlanPoint, end: PlanPoint, grids: readonly PlanGrid[] | undefined): string | null {
  const xLines = linesOf(grids ?? [], 'x'); // constant x: labelled 1, 2, 3 …
  const yLines = linesOf(grids ?? [], 'y'); // constant y: labelled A, B, C …
  const dx = Math.abs(end[0] - start[0]);
  const dy = Math.abs(end[1] - start[1]);
  const alongY = dx <= GRID_TOLERANCE_FT && dy > GRID_TOLERANCE_FT;
  const alongX = dy <= GRID_TOLERANCE_FT && dx > GRID_TOLERANCE_FT;
  if (alongY) {
    if (yLines.length === 0 || xLines.length === 0) return null;
    return `${rangeLabel(yLines, start[1], end[1])} / ${gridLineLabelAt(xLines, (start[0] + end[0]) / 2)}`;
  }
  if (alongX) {
    if (yLines.length === 0 || xLines.length === 0) return null;
    return `${rangeLabel(xLines, start[0], end[0])} / ${gridLineLabelAt(yLines, (start[1] + end[1]) / 2)}`;
  }
  if (yLines.length === 0 || xLines.length === 0) return null;
  return `${rangeLabel(yLines, start[1], end[1])} / ${rangeLabel(xLines, start[0], end[0])}`;
}

/** Column mark from the grid intersection it stands on ("B2"), else null. */
export function gridIntersectionLabel(xFt: number, yFt: number, grids: readonly PlanGrid[] | undefined): string | null {
  return gridIntersectionLabeller(grids)(xFt, yFt);
}

/** gridIntersectionLabel for many points of one plan: the grid lines are sorted once. */
export function gridIntersectionLabeller(grids: readonly PlanGrid[] | undefined): (xFt: number, yFt: number) => string | null {
  const xs = linesOf(grids ?? [], 'x');
  const ys = linesOf(grids ?? [], 'y');
  return (xFt, yFt) => {
    const x = xs.find((l) => Math.abs(l.offset - xFt) <= GRID_TOLERANCE_FT);
    const y = ys.find((l) => Math.abs(l.offset - yFt) <= GRID_TOLERANCE_FT);
    return x && y ? `${y.label}${x.label}` : null;
  };
}
