/**
 * The framing plan sheet of one level as drawing primitives (sheet-primitives.drafting.ts):
 * grid lines with bubbles and dimension strings, girders heavier than beams with size and
 * mark along each, columns with their grid marks, deck span symbols, openings, optional end
 * reactions, a graphic scale at a standard architectural scale, the title block and the
 * caution. The PDF (server/pdf) and the on-screen SVG (src/features/plan-sheet) both draw
 * this one model. Pure.
 */
import { memberSizeLabel } from './member-label.drafting';
import type { Plan, PlanGrid } from '../schemas/plan.schema';
import { formatFeetInches, gridIntersectionLabeller } from './grid-location.drafting';
import { factoredReaction, type DesignMethod } from './schedule.drafting';
import { LabelPlacer, rotatedBox, type LabelBox } from './label-placement.drafting';
import {
  estimateTextWidth,
  PT_PER_IN,
  TABLOID_LANDSCAPE,
  wrapText,
  type SheetDocument,
  type SheetPrimitive,
} from './sheet-primitives.drafting';

/** What the sheet needs of each designed member (a subset of the calc plan output). */
export interface SheetMember {
  id: string;
  mark: string;
  kind: 'girder' | 'beam';
  level: string;
  shape: string | null;
  /** Composite members: total studs and camber (in). */
  studs?: number | null;
  camber_in?: number | null;
  reactions: {
    start: { D_kip: number; L_kip: number; Lr_kip?: number; S_kip?: number };
    end: { D_kip: number; L_kip: number; Lr_kip?: number; S_kip?: number };
  };
}

export interface TitleBlockInput {
  project: string;
  projectNumber?: string | null;
  client?: string | null;
  address?: string | null;
  scheme: string;
  revision: number;
  /** ISO date (yyyy-mm-dd) the sheet was issued. */
  date: string;
  preparedBy: string;
  sheetIndex: number;
  sheetCount: number;
}

export interface PlanSheetInput {
  plan: Pick<Plan, 'levels' | 'grids' | 'columns' | 'members' | 'decks' | 'openings' | 'zones' | 'designBasis'>;
  design: {
    method: 'LRFD' | 'ASD';
    members: readonly SheetMember[];
    /** Column sizes by level (the length below each level), when the design has them. */
    columns?: readonly { id: string; levels: readonly { level: string; shape?: string | null; spliceBelow?: boolean }[] }[];
  };
  levelId: string;
  titleBlock: TitleBlockInput;
  showReactions: boolean;
  caution: string;
}

export interface ArchitecturalScale {
  /** Paper inches per foot of plan, e.g. 0.125 for 1/8" = 1'-0". */
  inPerFt: number;
  label: string;
}

/** Standard architectural scales, largest first (common practice). */
export const ARCHITECTURAL_SCALES: readonly ArchitecturalScale[] = [
  { inPerFt: 1 / 4, label: '1/4" = 1\'-0"' },
  { inPerFt: 3 / 16, label: '3/16" = 1\'-0"' },
  { inPerFt: 1 / 8, label: '1/8" = 1\'-0"' },
  { inPerFt: 3 / 32, label: '3/32" = 1\'-0"' },
  { inPerFt: 1 / 16, label: '1/16" = 1\'-0"' },
  { inPerFt: 1 / 32, label: '1/32" = 1\'-0"' },
  { inPerFt: 1 / 64, label: '1/64" = 1\'-0"' },
];

export interface PlanSheet extends SheetDocument {
  levelId: string;
  levelName: string;
  scale: ArchitecturalScale;
  /** Marks and sizes drawn on the sheet (tests and the PDF text check read them). */
  drawnMarks: string[];
  drawnSizes: string[];
}

// Sheet layout, points. Border margins, title block strip on the right, drawing area left.
const W = TABLOID_LANDSCAPE.width_pt;
const H = TABLOID_LANDSCAPE.height_pt;
const MARGIN = 0.5 * PT_PER_IN;
const MARGIN_LEFT = 0.75 * PT_PER_IN; // binding edge
const TB_W = 3 * PT_PER_IN;
const TB_X = W - MARGIN - TB_W;
const AREA = { x0: MARGIN_LEFT + 18, x1: TB_X - 18, y0: MARGIN + 18, y1: H - MARGIN - 70 };
/** Room around the framing for dimension strings and grid bubbles. */
const PLAN_PAD = 1.3 * PT_PER_IN;
const BUBBLE_R = 13;
const GAP_AT_SUPPORT = 3; // members stop short of what they frame into (drafting convention)

export const LINE_WEIGHTS = { girder: 2.0, beam: 1.0, column: 0.8, grid: 0.4, dimension: 0.45, border: 1.6, thin: 0.5 } as const;
const GRID_DASH = [18, 4, 3, 4];

export function chooseScale(extentXFt: number, extentYFt: number, availWPt: number, availHPt: number): ArchitecturalScale {
  for (const s of ARCHITECTURAL_SCALES) {
    const k = s.inPerFt * PT_PER_IN;
    if (extentXFt * k <= availWPt && extentYFt * k <= availHPt) return s;
  }
  return ARCHITECTURAL_SCALES[ARCHITECTURAL_SCALES.length - 1];
}

interface Box {
  minX: number;
  maxX: number;
  minY: number;
  maxY: number;
}

function levelExtents(input: PlanSheetInput): Box | null {
  const { plan, levelId } = input;
  const xs: number[] = [];
  const ys: number[] = [];
  for (const g of plan.grids ?? []) (g.axis === 'x' ? xs : ys).push(g.offset_ft);
  for (const m of plan.members) if (m.level === levelId) xs.push(m.start[0], m.end[0]), ys.push(m.start[1], m.end[1]);
  for (const c of plan.columns) if (c.levels.includes(levelId)) xs.push(c.x_ft), ys.push(c.y_ft);
  for (const d of plan.decks) if (d.level === levelId) for (const [x, y] of d.polygon) xs.push(x), ys.push(y);
  if (xs.length === 0 || ys.length === 0) return null;
  return { minX: Math.min(...xs), maxX: Math.max(...xs), minY: Math.min(...ys), maxY: Math.max(...ys) };
}

/** The box a sheet text covers (baseline at y; rotation in degrees about its anchor). */
export function sheetTextBox(p: Extract<SheetPrimitive, { type: 'text' }>): LabelBox {
  const w = estimateTextWidth(p.text, p.size, p.font);
  const h = p.size;
  const along = p.anchor === 'start' ? w / 2 : p.anchor === 'end' ? -w / 2 : 0;
  const rad = ((p.rotate ?? 0) * Math.PI) / 180;
  // Centre: half the width along the reading direction from the anchor, a third of the size above the baseline.
  const cx = p.x + Math.cos(rad) * along + Math.sin(rad) * (h * 0.35);
  const cy = p.y + Math.sin(rad) * along - Math.cos(rad) * (h * 0.35);
  return rotatedBox(cx, cy, w, h, rad, p.ref ?? p.text);
}

/** Reading angle of a member's text on the sheet, kept in (-90°, 90°] so text reads left to right or bottom to top. */
function readingAngle(x1: number, y1: number, x2: number, y2: number): number {
  let deg = (Math.atan2(y2 - y1, x2 - x1) * 180) / Math.PI;
  if (deg > 90) deg -= 180;
  else if (deg <= -90) deg += 180;
  if (Math.abs(deg - 90) < 1e-6) deg = -90; // vertical reads bottom to top
  return deg;
}

/** Nice length of the graphic scale: close to 2 in on paper. */
function scaleBarFeet(scale: ArchitecturalScale): number {
  const target = 2 / scale.inPerFt;
  const nice = [4, 8, 10, 16, 20, 32, 40, 64, 80, 128];
  return nice.reduce((best, n) => (Math.abs(n - target) < Math.abs(best - target) ? n : best), nice[0]);
}

export function buildPlanSheet(input: PlanSheetInput): PlanSheet {
  const { plan, design, levelId, titleBlock, showReactions } = input;
  const out: SheetPrimitive[] = [];
  const level = plan.levels.find((l) => l.id === levelId);
  const levelName = level?.name ?? levelId;
  const method: DesignMethod = design.method === 'ASD' ? 'ASD' : 'LRFD';
  const drawnMarks: string[] = [];
  const drawnSizes: string[] = [];

  // Border.
  out.push({ type: 'rect', x: MARGIN_LEFT, y: MARGIN, w: W - MARGIN - MARGIN_LEFT, h: H - 2 * MARGIN, weight: LINE_WEIGHTS.border, fill: 'none' });

  const box = levelExtents(input);
  const availW = AREA.x1 - AREA.x0 - 2 * PLAN_PAD;
  const availH = AREA.y1 - AREA.y0 - 2 * PLAN_PAD;
  const extX = box ? Math.max(box.maxX - box.minX, 1) : 1;
  const extY = box ? Math.max(box.maxY - box.minY, 1) : 1;
  const scale = chooseScale(extX, extY, availW, availH);
  const k = scale.inPerFt * PT_PER_IN; // points per foot
  const ox = AREA.x0 + (AREA.x1 - AREA.x0 - extX * k) / 2;
  const oy = AREA.y0 + (AREA.y1 - AREA.y0 - extY * k) / 2;
  const minX = box?.minX ?? 0;
  const maxY = box?.maxY ?? 0;
  const sx = (x: number) => ox + (x - minX) * k;
  const sy = (y: number) => oy + (maxY - y) * k; // plan y up, sheet y down

  if (box) {
    const left = sx(box.minX);
    const right = sx(box.maxX);
    const top = sy(box.maxY);
    const bottom = sy(box.minY);
    const grids = plan.grids ?? [];
    const xGrids = grids.filter((g) => g.axis === 'x').sort((a, b) => a.offset_ft - b.offset_ft);
    const yGrids = grids.filter((g) => g.axis === 'y').sort((a, b) => a.offset_ft - b.offset_ft);
    const reach = PLAN_PAD - BUBBLE_R * 2 - 6; // grid line runs this far past the framing, then its bubble

    const bubble = (cx: number, cy: number, label: string) => {
      out.push({ type: 'circle', cx, cy, r: BUBBLE_R, weight: 0.9, fill: 'paper' });
      const size = label.length > 2 ? 8 : 11;
      out.push({ type: 'text', x: cx, y: cy + size * 0.36, text: label, size, font: 'sans-bold', anchor: 'middle' });
    };
    for (const g of xGrids) {
      const x = sx(g.offset_ft);
      out.push({ type: 'line', x1: x, y1: top - reach, x2: x, y2: bottom + reach, weight: LINE_WEIGHTS.grid, tone: 'soft', dash: GRID_DASH });
      bubble(x, top - reach - BUBBLE_R, g.label);
      bubble(x, bottom + reach + BUBBLE_R, g.label);
    }
    for (const g of yGrids) {
      const y = sy(g.offset_ft);
      out.push({ type: 'line', x1: left - reach, y1: y, x2: right + reach, y2: y, weight: LINE_WEIGHTS.grid, tone: 'soft', dash: GRID_DASH });
      bubble(left - reach - BUBBLE_R, y, g.label);
      bubble(right + reach + BUBBLE_R, y, g.label);
    }
    dimensionStrings(out, xGrids, 'x', top, sx);
    dimensionStrings(out, yGrids, 'y', left, sy);

    // Openings: outline with a cross (drafting convention for a hole in the floor); the word
    // OPENING is placed after the member texts, where it covers none of them.
    const openingLabels: { id: string; x0: number; x1: number; y0: number; y1: number }[] = [];
    for (const o of plan.openings) {
      if (o.level !== levelId || o.polygon.length < 3) continue;
      const pts = o.polygon.map(([x, y]) => [sx(x), sy(y)] as [number, number]);
      out.push({ type: 'polygon', points: pts, weight: LINE_WEIGHTS.thin, fill: 'none', closed: true });
      const xs = pts.map((p) => p[0]);
      const ys = pts.map((p) => p[1]);
      const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
      out.push({ type: 'line', x1: x0, y1: y0, x2: x1, y2: y1, weight: LINE_WEIGHTS.thin });
      out.push({ type: 'line', x1: x0, y1: y1, x2: x1, y2: y0, weight: LINE_WEIGHTS.thin });
      openingLabels.push({ id: o.id, x0, x1, y0, y1 });
    }

    // Deck span symbols: a double-headed arrow across the span between the beams it spans to.
    const levelMembers = plan.members.filter((m) => m.level === levelId);
    for (const d of plan.decks) {
      if (d.level !== levelId || d.polygon.length < 3) continue;
      deckSymbol(out, d, levelMembers, plan.zones.find((z) => z.id === d.zone)?.name ?? null, sx, sy, k);
    }

    // Members.
    const designed = new Map(design.members.map((m) => [m.id, m]));
    for (const m of levelMembers) {
      const dm = designed.get(m.id);
      const x1 = sx(m.start[0]);
      const y1 = sy(m.start[1]);
      const x2 = sx(m.end[0]);
      const y2 = sy(m.end[1]);
      const len = Math.hypot(x2 - x1, y2 - y1);
      if (len < 1) continue;
      const ux = (x2 - x1) / len;
      const uy = (y2 - y1) / len;
      const gap = Math.min(GAP_AT_SUPPORT, len / 4);
      out.push({
        type: 'line',
        x1: x1 + ux * gap,
        y1: y1 + uy * gap,
        x2: x2 - ux * gap,
        y2: y2 - uy * gap,
        weight: m.kind === 'girder' ? LINE_WEIGHTS.girder : LINE_WEIGHTS.beam,
        ref: m.id,
      });
      const size = dm ? memberSizeLabel(dm.shape, dm.studs, dm.camber_in) : (m.shape ?? 'NOT SIZED');
      const mark = dm?.mark ?? m.mark ?? '';
      const angle = readingAngle(x1, y1, x2, y2);
      const rad = (angle * Math.PI) / 180;
      const rx = Math.cos(rad);
      const ry = Math.sin(rad);
      const nx = ry; // "up" normal of the reading direction, on the sheet
      const ny = -rx;
      const cx = (x1 + x2) / 2;
      const cy = (y1 + y2) / 2;
      const room = len - 2 * gap - 8;
      const fit = (text: string, preferred: number, font: 'mono' | 'mono-bold') =>
        Math.max(4.5, Math.min(preferred, (room / Math.max(estimateTextWidth(text, 1, font), 0.01))));
      const weightOffset = (m.kind === 'girder' ? LINE_WEIGHTS.girder : LINE_WEIGHTS.beam) / 2;
      const sizePt = fit(size, 7, 'mono');
      out.push({
        type: 'text', x: cx + nx * (2.5 + weightOffset), y: cy + ny * (2.5 + weightOffset), text: size, size: sizePt, font: 'mono', anchor: 'middle', rotate: angle, ref: m.id,
      });
      drawnSizes.push(size);
      if (mark) {
        const markPt = fit(mark, 7, 'mono-bold');
        // Below the line: offset by the cap height plus a little.
        const below = weightOffset + 2 + markPt * 0.75;
        out.push({
          type: 'text', x: cx - nx * below, y: cy - ny * below, text: mark, size: markPt, font: 'mono-bold', anchor: 'middle', rotate: angle, ref: m.id,
        });
        drawnMarks.push(mark);
      }
      if (showReactions && dm) {
        for (const end of ['start', 'end'] as const) {
          const r = dm.reactions[end];
          const { factored_kip } = factoredReaction(method, { D_kip: r.D_kip, L_kip: r.L_kip, Lr_kip: r.Lr_kip ?? 0, S_kip: r.S_kip ?? 0 });
          const text = `R=${factored_kip.toFixed(1)}`;
          const ex = end === 'start' ? x1 : x2;
          const ey = end === 'start' ? y1 : y2;
          // Along the member, inside the end; the anchor keeps the text off the support.
          const inward = end === 'start' ? 1 : -1;
          const along = gap + 3;
          const below = weightOffset + 2 + 5 * 0.75;
          const px = ex + ux * along * inward - nx * below;
          const py = ey + uy * along * inward - ny * below;
          const startsAtText = (ux * rx + uy * ry > 0) === (end === 'start');
          out.push({ type: 'text', x: px, y: py, text, size: 5, font: 'mono', anchor: startsAtText ? 'start' : 'end', rotate: angle, ref: m.id });
        }
      }
    }

    const placer = new LabelPlacer(0.5);
    for (const p of out) if (p.type === 'text' && p.ref) placer.reserve(sheetTextBox(p));
    for (const o of openingLabels) {
      const cx = (o.x0 + o.x1) / 2;
      const candidates = [o.y1 + 8, o.y0 - 3, (o.y0 + o.y1) / 2 + 2, o.y1 + 16, o.y0 - 11].map(
        (y): Extract<SheetPrimitive, { type: 'text' }> => ({ type: 'text', x: cx, y, text: 'OPENING', size: 5.5, font: 'sans', anchor: 'middle', ref: `opening:${o.id}` }),
      );
      const spot = candidates.find((c) => placer.fits(sheetTextBox(c)));
      // An opening too crowded to name keeps its cross (the drafting symbol says it all).
      if (spot) {
        placer.reserve(sheetTextBox(spot));
        out.push(spot);
      }
    }

    // Columns: a filled square at each, marked by its grid intersection.
    const columnAt = new Map((design.columns ?? []).map((c) => [c.id, c]));
    const gridMark = gridIntersectionLabeller(plan.grids);
    for (const c of plan.columns) {
      if (!c.levels.includes(levelId)) continue;
      const cx = sx(c.x_ft);
      const cy = sy(c.y_ft);
      const half = 4.5;
      out.push({ type: 'rect', x: cx - half, y: cy - half, w: 2 * half, h: 2 * half, weight: LINE_WEIGHTS.column, fill: 'ink' });
      const mark = gridMark(c.x_ft, c.y_ft) ?? c.id;
      // Above-left: member reactions sit on the other sides of a support.
      out.push({ type: 'text', x: cx - half - 2, y: cy - half - 2, text: mark, size: 5.5, font: 'sans-bold', anchor: 'end', tone: 'soft' });
      // The column size below this level, and a splice note where a new tier starts at this floor.
      // A splice at this floor shows as the length above starting a new tier (spliceBelow).
      const stack = columnAt.get(c.id)?.levels ?? [];
      const at = stack.findIndex((l) => l.level === levelId);
      const here = at >= 0 ? stack[at] : undefined;
      if (here?.shape) {
        const spliceAbove = at > 0 && stack[at - 1].spliceBelow && stack[at - 1].shape;
        out.push({ type: 'text', x: cx - half - 2, y: cy + half + 6, text: spliceAbove ? `${here.shape} · splice, ${stack[at - 1].shape} above` : here.shape, size: 5, font: 'mono', anchor: 'end', ref: c.id });
        if (!drawnSizes.includes(here.shape)) drawnSizes.push(here.shape);
      }
    }
  } else {
    out.push({
      type: 'text', x: (AREA.x0 + AREA.x1) / 2, y: (AREA.y0 + AREA.y1) / 2, text: 'Nothing is drawn on this level yet.', size: 12, font: 'sans', anchor: 'middle',
    });
  }

  drawingTitle(out, levelName, scale, level?.elevation_ft ?? null, `FP-${titleBlock.sheetIndex}`);
  titleBlockPrimitives(out, input, levelName, scale, method);
  return { ...TABLOID_LANDSCAPE, primitives: out, levelId, levelName, scale, drawnMarks, drawnSizes };
}

/** Bay dimensions between successive grid lines and the overall, outside the framing. */
function dimensionStrings(out: SheetPrimitive[], grids: PlanGrid[], axis: 'x' | 'y', edge: number, to: (ft: number) => number): void {
  if (grids.length < 2) return;
  const rows = grids.length > 2 ? [22, 40] : [22];
  const tick = (a: number, b: number) => {
    const d = 3.2;
    out.push(axis === 'x'
      ? { type: 'line', x1: a - d, y1: b + d, x2: a + d, y2: b - d, weight: 0.9 }
      : { type: 'line', x1: b - d, y1: a + d, x2: b + d, y2: a - d, weight: 0.9 });
  };
  const run = (offsetPt: number, stations: number[]) => {
    const pos = edge - offsetPt; // above the top edge (x) or left of the left edge (y)
    const a = to(stations[0]);
    const b = to(stations[stations.length - 1]);
    out.push(axis === 'x'
      ? { type: 'line', x1: a - 6, y1: pos, x2: b + 6, y2: pos, weight: LINE_WEIGHTS.dimension }
      : { type: 'line', x1: pos, y1: Math.min(a, b) - 6, x2: pos, y2: Math.max(a, b) + 6, weight: LINE_WEIGHTS.dimension });
    stations.forEach((s) => tick(to(s), pos));
    for (let i = 0; i + 1 < stations.length; i++) {
      const mid = (to(stations[i]) + to(stations[i + 1])) / 2;
      const text = formatFeetInches(stations[i + 1] - stations[i]);
      out.push(axis === 'x'
        ? { type: 'text', x: mid, y: pos - 3, text, size: 7, font: 'sans', anchor: 'middle' }
        : { type: 'text', x: pos - 3, y: mid, text, size: 7, font: 'sans', anchor: 'middle', rotate: -90 });
    }
  };
  const offsets = grids.map((g) => g.offset_ft);
  run(rows[0], offsets);
  if (rows.length > 1) run(rows[1], [offsets[0], offsets[offsets.length - 1]]);
}

function deckSymbol(
  out: SheetPrimitive[],
  deck: Plan['decks'][number],
  members: Plan['members'],
  zoneName: string | null,
  sx: (x: number) => number,
  sy: (y: number) => number,
  k: number,
): void {
  const n = deck.polygon.length;
  const cxFt = deck.polygon.reduce((s, p) => s + p[0], 0) / n;
  const cyFt = deck.polygon.reduce((s, p) => s + p[1], 0) / n;
  const along = deck.spanDirection === 'x' ? 0 : 1; // span runs along this plan axis
  const across = 1 - along;
  const c = [cxFt, cyFt];
  // Supports the deck spans between: members perpendicular to the span that pass the centroid.
  const supports: number[] = [];
  for (const m of members) {
    if (Math.abs(m.start[along] - m.end[along]) > 0.01) continue;
    const a = Math.min(m.start[across], m.end[across]);
    const b = Math.max(m.start[across], m.end[across]);
    if (c[across] >= a && c[across] <= b) supports.push(m.start[along]);
  }
  supports.sort((a, b) => a - b);
  // The bay holding the centroid; a centroid on a support takes the bay after it.
  let mid = c[along];
  let spanFt = 6;
  for (let i = 0; i + 1 < supports.length; i++) {
    const [lo, hi] = [supports[i], supports[i + 1]];
    if (hi - lo > 0.01 && c[along] >= lo && c[along] < hi) {
      mid = (lo + hi) / 2;
      spanFt = hi - lo;
      break;
    }
  }
  // Across the span: within the bay between the members that run along the span (girders),
  // 30% of the way across it, clear of the mid-length labels of the members it spans to.
  const acrossValues = deck.polygon.map((p) => p[across]);
  const acrossLo = Math.min(...acrossValues);
  const acrossHi = Math.max(...acrossValues);
  const lines = [
    acrossLo,
    acrossHi,
    ...members.filter((m) => Math.abs(m.start[across] - m.end[across]) <= 0.01).map((m) => m.start[across]),
  ]
    .filter((v) => v >= acrossLo - 0.01 && v <= acrossHi + 0.01)
    .sort((a, b) => a - b);
  let bayLo = acrossLo;
  let bayHi = acrossHi;
  for (let i = 0; i + 1 < lines.length; i++) {
    if (lines[i + 1] - lines[i] > 0.01 && c[across] >= lines[i] && c[across] <= lines[i + 1]) {
      [bayLo, bayHi] = [lines[i], lines[i + 1]];
      break;
    }
  }
  const acrossAt = bayLo + (bayHi - bayLo) * 0.3;
  const at = along === 0 ? [mid, acrossAt] : [acrossAt, mid];
  const half = Math.min(0.55 * PT_PER_IN, (spanFt * k * 0.7) / 2);
  const x = sx(at[0]);
  const y = sy(at[1]);
  const [dx, dy] = along === 0 ? [1, 0] : [0, -1];
  const x1 = x - dx * half;
  const y1 = y - dy * half;
  const x2 = x + dx * half;
  const y2 = y + dy * half;
  out.push({ type: 'line', x1, y1, x2, y2, weight: 0.7 });
  const head = (px: number, py: number, ddx: number, ddy: number) => {
    const l = 6;
    const w = 2.4;
    out.push({
      type: 'polygon',
      points: [
        [px, py],
        [px - ddx * l - ddy * w, py - ddy * l + ddx * w],
        [px - ddx * l + ddy * w, py - ddy * l - ddx * w],
      ],
      weight: 0.4,
      fill: 'ink',
      closed: true,
    });
  };
  head(x2, y2, dx, dy);
  head(x1, y1, -dx, -dy);
  // Horizontal label: beside a vertical arrow (mid-bay, clear of member labels), above a horizontal one.
  const name = zoneName ? zoneName.toUpperCase() : '';
  // Room for the label: the rest of the bay beside a vertical arrow (less the girder's own
  // label), or the span between supports above a horizontal one; the zone name is dropped when it does not fit.
  const room = along === 0 ? spanFt * k * 0.9 : (bayHi - acrossAt) * k - 5 - 12;
  const full = name ? `DECK · ${name.length > 26 ? `${name.slice(0, 25)}…` : name}` : 'DECK';
  const label = estimateTextWidth(full, 5.5, 'sans') <= room ? full : 'DECK';
  out.push(along === 0
    ? { type: 'text', x, y: y - 4, text: label, size: 5.5, font: 'sans', anchor: 'middle' }
    : { type: 'text', x: x + 5, y: y + 2, text: label, size: 5.5, font: 'sans', anchor: 'start' });
}

function drawingTitle(out: SheetPrimitive[], levelName: string, scale: ArchitecturalScale, elevationFt: number | null, sheetName: string): void {
  const x = AREA.x0 + 6;
  const y = H - MARGIN - 40;
  const title = `FRAMING PLAN — ${levelName.toUpperCase()}`;
  out.push({ type: 'circle', cx: x + 14, cy: y - 4, r: 14, weight: 1.2, fill: 'none' });
  out.push({ type: 'line', x1: x, y1: y - 4, x2: x + 28, y2: y - 4, weight: 0.6 });
  out.push({ type: 'text', x: x + 14, y: y - 7, text: '1', size: 8, font: 'sans-bold', anchor: 'middle' });
  out.push({ type: 'text', x: x + 14, y: y + 6, text: sheetName, size: 5.5, font: 'sans', anchor: 'middle' });
  out.push({ type: 'text', x: x + 36, y: y - 4, text: title, size: 13, font: 'sans-bold', anchor: 'start' });
  const tw = estimateTextWidth(title, 13, 'sans-bold');
  out.push({ type: 'line', x1: x + 36, y1: y, x2: x + 36 + tw, y2: y, weight: 1.4 });
  const elevation = elevationFt === null ? '' : `   TOP OF STEEL REFERENCE: EL. ${formatFeetInches(elevationFt)}`;
  out.push({ type: 'text', x: x + 36, y: y + 12, text: `SCALE: ${scale.label}${elevation}`, size: 7.5, font: 'sans', anchor: 'start' });

  // Graphic scale: four alternating blocks.
  const feet = scaleBarFeet(scale);
  const k = scale.inPerFt * PT_PER_IN;
  const bx = Math.max(x + 36 + tw + 30, AREA.x0 + 330);
  const by = y - 8;
  const seg = (feet / 4) * k;
  for (let i = 0; i < 4; i++) {
    out.push({ type: 'rect', x: bx + i * seg, y: by, w: seg, h: 4, weight: 0.6, fill: i % 2 === 0 ? 'ink' : 'paper' });
  }
  for (const [i, label] of [[0, '0'], [2, formatFeetInches(feet / 2).replace(/-0"$/, '')], [4, formatFeetInches(feet).replace(/-0"$/, '')]] as const) {
    out.push({ type: 'text', x: bx + i * seg, y: by + 13, text: label, size: 6.5, font: 'sans', anchor: 'middle' });
  }
  out.push({ type: 'text', x: bx + 4 * seg + 8, y: by + 5, text: 'GRAPHIC SCALE (FEET)', size: 6, font: 'sans', anchor: 'start' });
}

function titleBlockPrimitives(out: SheetPrimitive[], input: PlanSheetInput, levelName: string, scale: ArchitecturalScale, method: DesignMethod): void {
  const { titleBlock: tb, plan, caution, showReactions } = input;
  const x0 = TB_X;
  const x1 = W - MARGIN;
  const pad = 8;
  const inner = TB_W - 2 * pad;
  out.push({ type: 'line', x1: x0, y1: MARGIN, x2: x0, y2: H - MARGIN, weight: LINE_WEIGHTS.border });
  let y = MARGIN;
  const rule = (weight = 0.6) => out.push({ type: 'line', x1: x0, y1: y, x2: x1, y2: y, weight });

  // Brand band.
  y += 26;
  out.push({ type: 'text', x: x0 + pad, y, text: 'BAYWRIGHT', size: 15, font: 'sans-bold', anchor: 'start' });
  y += 11;
  out.push({ type: 'text', x: x0 + pad, y, text: 'Steel floor framing · gravity design', size: 7, font: 'sans', anchor: 'start', tone: 'soft' });
  y += 8;
  rule(1.2);

  const field = (label: string, value: string, opts: { size?: number; font?: 'sans' | 'sans-bold' | 'mono' | 'mono-bold'; lines?: number } = {}) => {
    const size = opts.size ?? 8.5;
    y += 10;
    out.push({ type: 'text', x: x0 + pad, y, text: label, size: 5.5, font: 'sans-bold', anchor: 'start', tone: 'soft' });
    const lines = wrapText(value || '—', size, opts.font ?? 'sans', inner).slice(0, opts.lines ?? 2);
    for (const line of lines) {
      y += size + 2.5;
      out.push({ type: 'text', x: x0 + pad, y, text: line, size, font: opts.font ?? 'sans', anchor: 'start' });
    }
    y += 5;
    rule();
  };
  field('PROJECT', tb.project, { size: 10, font: 'sans-bold' });
  field('PROJECT NO. / CLIENT', [tb.projectNumber, tb.client].filter(Boolean).join(' · '));
  if (tb.address) field('SITE', tb.address);
  field('SCHEME', tb.scheme, { font: 'sans-bold' });
  const basis = plan.designBasis;
  field('DESIGN BASIS', `AISC 360-16 ${method}, Fy = ${basis.Fy_ksi} ksi; ASCE 7-16 gravity combinations; live load reduction ${basis.liveLoadReduction ? 'on' : 'off'}`, { size: 7, lines: 3 });

  // Two-column block: revision/date, prepared by/scale.
  const pair = (l1: string, v1: string, l2: string, v2: string) => {
    const mid = x0 + TB_W / 2;
    y += 10;
    out.push({ type: 'text', x: x0 + pad, y, text: l1, size: 5.5, font: 'sans-bold', anchor: 'start', tone: 'soft' });
    out.push({ type: 'text', x: mid + pad, y, text: l2, size: 5.5, font: 'sans-bold', anchor: 'start', tone: 'soft' });
    y += 11;
    out.push({ type: 'text', x: x0 + pad, y, text: v1, size: 8.5, font: 'sans', anchor: 'start' });
    const v2Lines = wrapText(v2, 8.5, 'sans', TB_W / 2 - 2 * pad).slice(0, 2);
    v2Lines.forEach((line, i) => out.push({ type: 'text', x: mid + pad, y: y + i * 10.5, text: line, size: 8.5, font: 'sans', anchor: 'start' }));
    y += 6 + (v2Lines.length - 1) * 10.5;
    out.push({ type: 'line', x1: mid, y1: y - 27 - (v2Lines.length - 1) * 10.5, x2: mid, y2: y, weight: 0.6 });
    rule();
  };
  pair('REVISION', String(tb.revision), 'DATE', tb.date);
  pair('PREPARED BY', tb.preparedBy, 'SCALE', scale.label);

  // Legend.
  y += 12;
  out.push({ type: 'text', x: x0 + pad, y, text: 'LEGEND', size: 6.5, font: 'sans-bold', anchor: 'start' });
  const legendLine = (weight: number, label: string) => {
    y += 11;
    out.push({ type: 'line', x1: x0 + pad, y1: y - 2.5, x2: x0 + pad + 34, y2: y - 2.5, weight });
    out.push({ type: 'text', x: x0 + pad + 42, y, text: label, size: 7, font: 'sans', anchor: 'start' });
  };
  legendLine(LINE_WEIGHTS.girder, 'Girder — size above, mark below');
  legendLine(LINE_WEIGHTS.beam, 'Beam — size above, mark below');
  y += 11;
  out.push({ type: 'rect', x: x0 + pad + 13, y: y - 7, w: 8, h: 8, weight: 0.6, fill: 'ink' });
  out.push({ type: 'text', x: x0 + pad + 42, y, text: 'Column, marked by grid intersection', size: 7, font: 'sans', anchor: 'start' });
  y += 11;
  out.push({ type: 'line', x1: x0 + pad + 4, y1: y - 2.5, x2: x0 + pad + 30, y2: y - 2.5, weight: 0.7 });
  out.push({ type: 'polygon', points: [[x0 + pad + 30, y - 2.5], [x0 + pad + 25, y - 4.7], [x0 + pad + 25, y - 0.3]], weight: 0.4, fill: 'ink', closed: true });
  out.push({ type: 'polygon', points: [[x0 + pad + 4, y - 2.5], [x0 + pad + 9, y - 4.7], [x0 + pad + 9, y - 0.3]], weight: 0.4, fill: 'ink', closed: true });
  out.push({ type: 'text', x: x0 + pad + 42, y, text: 'Deck span direction', size: 7, font: 'sans', anchor: 'start' });
  y += 8;
  rule();

  // Notes.
  y += 12;
  out.push({ type: 'text', x: x0 + pad, y, text: 'NOTES', size: 6.5, font: 'sans-bold', anchor: 'start' });
  const notes = [
    'Marks: level prefix, G girder or B beam, number. Members with one mark share size and span.',
    showReactions
      ? `End reactions R are ${method === 'LRFD' ? 'LRFD factored (1.2D+1.6L for floors)' : 'ASD service (D+L for floors)'}, kip. Unfactored D and L are in the schedule.`
      : 'End reactions: see the member schedule (unfactored D and L, and factored).',
    'Composite members: size (total shear studs, 3/4 in. headed studs unless noted) and camber c, e.g. W18X35 (20) c=3/4"; studs uniformly spaced. Members without studs are non-composite.',
    'Dimensions are to grid lines.',
  ];
  notes.forEach((note, i) => {
    const lines = wrapText(note, 6.5, 'sans', inner - 10);
    lines.forEach((line, j) => {
      y += 8.5;
      if (j === 0) out.push({ type: 'text', x: x0 + pad, y, text: `${i + 1}.`, size: 6.5, font: 'sans', anchor: 'start' });
      out.push({ type: 'text', x: x0 + pad + 10, y, text: line, size: 6.5, font: 'sans', anchor: 'start' });
    });
  });

  // Caution box and sheet number, from the bottom up.
  const sheetBoxTop = H - MARGIN - 62;
  out.push({ type: 'line', x1: x0, y1: sheetBoxTop, x2: x1, y2: sheetBoxTop, weight: 1.2 });
  out.push({ type: 'text', x: x0 + pad, y: sheetBoxTop + 14, text: 'SHEET', size: 5.5, font: 'sans-bold', anchor: 'start', tone: 'soft' });
  out.push({ type: 'text', x: x0 + pad, y: sheetBoxTop + 44, text: `FP-${tb.sheetIndex}`, size: 26, font: 'sans-bold', anchor: 'start' });
  out.push({ type: 'text', x: x1 - pad, y: sheetBoxTop + 14, text: `${tb.sheetIndex} OF ${tb.sheetCount}`, size: 7, font: 'sans', anchor: 'end' });
  out.push({ type: 'text', x: x1 - pad, y: sheetBoxTop + 44, text: levelName.toUpperCase(), size: 9, font: 'sans-bold', anchor: 'end' });

  const cautionLines = wrapText(caution, 7, 'sans', inner - 8);
  const boxH = 22 + cautionLines.length * 9;
  const boxTop = sheetBoxTop - 8 - boxH;
  out.push({ type: 'rect', x: x0 + pad - 2, y: boxTop, w: inner + 4, h: boxH, weight: 1.4, fill: 'none' });
  out.push({ type: 'text', x: x0 + pad + 4, y: boxTop + 12, text: 'CAUTION', size: 7.5, font: 'sans-bold', anchor: 'start' });
  cautionLines.forEach((line, i) =>
    out.push({ type: 'text', x: x0 + pad + 4, y: boxTop + 23 + i * 9, text: line, size: 7, font: 'sans', anchor: 'start' }),
  );
}

/** Sheets for every level (or the ones asked for), numbered FP-1 … FP-n by the level's place in the plan. */
export function buildPlanSheets(input: Omit<PlanSheetInput, 'levelId'> & { levelIds?: string[] }): PlanSheet[] {
  const all = input.plan.levels.map((l) => l.id);
  const ids = input.levelIds ?? all;
  return ids.map((levelId) =>
    buildPlanSheet({ ...input, levelId, titleBlock: { ...input.titleBlock, sheetIndex: all.indexOf(levelId) + 1, sheetCount: all.length } }),
  );
}
