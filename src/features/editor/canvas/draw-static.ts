/**
 * Draws the committed plan of a level: deck areas tinted by load zone with span arrows,
 * openings crossed and hatched, grid lines with bubbles and dimensions, members (girders
 * heavier than beams) in the utilisation ramp with size and ratio printed, columns and loads.
 * Line work is stroked from cached paths under the view transform; text is in screen pixels
 * and culled to what is on screen.
 */
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { PlanPoint, View } from '../store/editor.types';
import { zoneTint } from '../tools/zone-presets';
import type { StaticGeometry } from './static-geometry';
import { formatValue, type UnitSystem } from '../../../lib/units';
import { MONO, SANS, lengthText, lineLoadText, pointLoadText, type PlanTheme } from './plan-theme';
import { toScreen, visibleBounds } from './view-transform';
import { memberChipTexts } from '../members/member-status';
import { LabelPlacer, rotatedBox, type LabelBox } from '../../../../shared/drafting/label-placement.drafting';

const BUBBLE_R = 11;
const LINE_PAST_PX = 26;

export const MEMBER_WIDTH_PX = { girder: 4.5, beam: 2 } as const;
/** Labels are drawn on members at least this long on screen. */
export const LABEL_MIN_PX = 80;

export interface DrawStaticOptions {
  /** Draw each member's end reactions (the Plan's Reactions toggle). */
  reactions?: boolean;
  /** Filled in when drawn: reactions printed, and those left out because no free spot was near the end. */
  stats?: { reactionsDrawn: number; reactionsHidden: number };
}

/** Returns how many member labels (size and ratio) were drawn. */
export function drawStatic(
  ctx: CanvasRenderingContext2D, plan: Plan, geo: StaticGeometry, view: View, theme: PlanTheme, system: UnitSystem = 'US', labelBoxes?: LabelBox[], options: DrawStaticOptions = {},
): number {
  // The paper is the container's background, so an underlay can show beneath.
  ctx.save();
  const extents = gridExtents(plan, geo);

  // Plan-space line work.
  ctx.save();
  ctx.transform(view.scale, 0, 0, -view.scale, view.x, view.y);
  const px = 1 / view.scale;
  for (const d of geo.decks) {
    tracePolygon(ctx, d.polygon);
    ctx.fillStyle = zoneTint(d.zoneIndex);
    ctx.globalAlpha = 0.8;
    ctx.fill();
    ctx.globalAlpha = 1;
    ctx.lineWidth = px;
    ctx.strokeStyle = theme.line;
    ctx.stroke();
  }
  // Grid lines: thin chain lines past the drawing.
  ctx.setLineDash([14 * px, 4 * px, 2 * px, 4 * px]);
  ctx.lineWidth = px;
  ctx.strokeStyle = theme.inkFaint;
  ctx.beginPath();
  const past = LINE_PAST_PX * px;
  for (const g of plan.grids ?? []) {
    if (g.axis === 'x') {
      ctx.moveTo(g.offset_ft, extents.minY - past);
      ctx.lineTo(g.offset_ft, extents.maxY + past);
    } else {
      ctx.moveTo(extents.minX - past, g.offset_ft);
      ctx.lineTo(extents.maxX + past, g.offset_ft);
    }
  }
  ctx.stroke();
  ctx.setLineDash([]);
  for (const o of geo.openings) drawOpening(ctx, o.polygon, px, theme);
  // Line loads: dashed, under the members they sit on.
  ctx.setLineDash([6 * px, 4 * px]);
  ctx.lineWidth = 3 * px;
  ctx.strokeStyle = theme.load;
  ctx.beginPath();
  for (const w of geo.lineLoads) {
    ctx.moveTo(w.start[0], w.start[1]);
    ctx.lineTo(w.end[0], w.end[1]);
  }
  ctx.stroke();
  ctx.setLineDash([]);
  ctx.lineCap = 'butt';
  for (const g of geo.members) {
    ctx.lineWidth = MEMBER_WIDTH_PX[g.kind] * px;
    ctx.strokeStyle = g.band === 'none' ? theme.inkSoft : theme.util[g.band].fill;
    ctx.stroke(g.path);
  }
  ctx.restore();

  // Screen-space symbols and text.
  const vis = visibleBounds(view);
  const margin = 40 / view.scale;
  const onScreen = (p: PlanPoint) => p[0] >= vis.minX - margin && p[0] <= vis.maxX + margin && p[1] >= vis.minY - margin && p[1] <= vis.maxY + margin;
  for (const d of geo.decks) drawDeckArrow(ctx, d, view, theme);
  drawGrid(ctx, plan, extents, view, theme, system);
  ctx.fillStyle = theme.ink;
  const colSize = Math.max(5, Math.min(12, view.scale * 1.1));
  for (const c of geo.columns) {
    if (!onScreen(c)) continue;
    const [sx, sy] = toScreen(view, c);
    ctx.fillRect(sx - colSize / 2, sy - colSize / 2, colSize, colSize);
  }
  // Text is placed so no label covers another: point-load symbols sit where the load is;
  // member labels next (moved along or across their member to clear a symbol); then the
  // load values and zone names, each in the first free spot, left out when none is free.
  const placer = new LabelPlacer(2);
  // Column marks and sizes (the length below this level), above-left of each column, once zoomed in enough to read.
  if (view.scale >= 4) {
    ctx.save();
    ctx.font = `500 10px ${MONO}`;
    ctx.textAlign = 'right';
    ctx.textBaseline = 'bottom';
    ctx.fillStyle = theme.ink;
    for (const l of geo.columnLabels) {
      if (!onScreen(l.at)) continue;
      const [sx, sy] = toScreen(view, l.at);
      const x1 = sx - colSize / 2 - 3;
      const y1 = sy - colSize / 2 - 2;
      ctx.fillText(l.text, x1, y1);
      placer.reserve({ x0: x1 - ctx.measureText(l.text).width, y0: y1 - 11, x1, y1, what: `column label ${l.text}` });
    }
    ctx.restore();
  }
  const points = geo.pointLoads.filter((p) => onScreen(p.at)).map((p) => ({ p, at: toScreen(view, p.at) }));
  for (const { p, at } of points) placer.reserve({ x0: at[0] - 8, y0: at[1] - 8, x1: at[0] + 8, y1: at[1] + 8, what: `point load ${p.id} symbol` });
  const labelled = drawMemberLabels(ctx, geo, view, theme, onScreen, placer);
  for (const { p, at } of points) drawPointLoad(ctx, at, pointLoadText(p.D_kip, p.L_kip, system), theme, placer, p.id);
  if (options.reactions) {
    const counts = drawReactions(ctx, geo, view, theme, system, onScreen, placer);
    if (options.stats) Object.assign(options.stats, counts);
  }
  ctx.font = `10px ${MONO}`;
  ctx.fillStyle = theme.load;
  ctx.textAlign = 'left';
  ctx.textBaseline = 'top';
  for (const w of geo.lineLoads) {
    const mid: PlanPoint = [(w.start[0] + w.end[0]) / 2, (w.start[1] + w.end[1]) / 2];
    if (!onScreen(mid)) continue;
    const [sx, sy] = toScreen(view, mid);
    const text = lineLoadText(w.D_klf, w.L_klf, system);
    const tw = ctx.measureText(text).width;
    const spot = placer.place([0, -20, 20, -36, 36].map((dy) => ({ x0: sx - tw / 2, y0: sy + 6 + dy, x1: sx + tw / 2, y1: sy + 18 + dy, what: `line load ${w.id}` })));
    if (spot) ctx.fillText(text, spot.x0, spot.y0);
  }
  for (const d of geo.decks) drawZoneName(ctx, d, view, theme, placer);
  labelBoxes?.push(...placer.placed);
  ctx.restore();
  return labelled;
}

export interface Extents {
  minX: number;
  maxX: number;
  minY: number;
  maxY: number;
}

export function gridExtents(plan: Plan, geo: StaticGeometry): Extents {
  const xs: number[] = [];
  const ys: number[] = [];
  for (const g of plan.grids ?? []) (g.axis === 'x' ? xs : ys).push(g.offset_ft);
  for (const c of geo.columns) (xs.push(c[0]), ys.push(c[1]));
  for (const l of geo.labels) xs.push(l.start[0], l.end[0]), ys.push(l.start[1], l.end[1]);
  if (xs.length === 0) xs.push(0);
  if (ys.length === 0) ys.push(0);
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  for (const x of xs) (minX = Math.min(minX, x), maxX = Math.max(maxX, x));
  for (const y of ys) (minY = Math.min(minY, y), maxY = Math.max(maxY, y));
  return { minX, maxX, minY, maxY };
}

function tracePolygon(ctx: CanvasRenderingContext2D, polygon: readonly PlanPoint[]) {
  ctx.beginPath();
  polygon.forEach((p, i) => (i === 0 ? ctx.moveTo(p[0], p[1]) : ctx.lineTo(p[0], p[1])));
  ctx.closePath();
}

function drawOpening(ctx: CanvasRenderingContext2D, polygon: readonly PlanPoint[], px: number, theme: PlanTheme) {
  tracePolygon(ctx, polygon);
  ctx.fillStyle = theme.paper;
  ctx.fill();
  ctx.save();
  ctx.clip();
  const xs = polygon.map((p) => p[0]);
  const ys = polygon.map((p) => p[1]);
  const x0 = Math.min(...xs);
  const x1 = Math.max(...xs);
  const y0 = Math.min(...ys);
  const y1 = Math.max(...ys);
  ctx.beginPath();
  const step = 7 * px;
  for (let t = x0 - (y1 - y0); t < x1; t += step) {
    ctx.moveTo(t, y0);
    ctx.lineTo(t + (y1 - y0), y1);
  }
  ctx.lineWidth = 0.75 * px;
  ctx.strokeStyle = theme.line;
  ctx.stroke();
  ctx.restore();
  tracePolygon(ctx, polygon);
  ctx.lineWidth = 1.25 * px;
  ctx.strokeStyle = theme.ink;
  ctx.stroke();
  // The cross of an opening, corner to corner.
  ctx.beginPath();
  ctx.moveTo(x0, y0);
  ctx.lineTo(x1, y1);
  ctx.moveTo(x0, y1);
  ctx.lineTo(x1, y0);
  ctx.stroke();
}

function drawDeckArrow(ctx: CanvasRenderingContext2D, d: StaticGeometry['decks'][number], view: View, theme: PlanTheme) {
  const xs = d.polygon.map((p) => p[0]);
  const ys = d.polygon.map((p) => p[1]);
  const cx = (Math.min(...xs) + Math.max(...xs)) / 2;
  const cy = (Math.min(...ys) + Math.max(...ys)) / 2;
  const extentFt = d.spanDirection === 'x' ? Math.max(...xs) - Math.min(...xs) : Math.max(...ys) - Math.min(...ys);
  const lenPx = Math.min(extentFt * view.scale * 0.5, 110);
  if (lenPx < 24) return;
  const [sx, sy] = toScreen(view, [cx, cy]);
  ctx.save();
  ctx.translate(sx, sy);
  if (d.spanDirection === 'y') ctx.rotate(-Math.PI / 2);
  ctx.strokeStyle = theme.inkSoft;
  ctx.fillStyle = theme.inkSoft;
  ctx.lineWidth = 1.25;
  const h = lenPx / 2;
  ctx.beginPath();
  ctx.moveTo(-h, 0);
  ctx.lineTo(h, 0);
  // The deck's crossbar: where it bears.
  ctx.moveTo(-h * 0.35, -5);
  ctx.lineTo(-h * 0.35, 5);
  ctx.moveTo(h * 0.35, -5);
  ctx.lineTo(h * 0.35, 5);
  ctx.stroke();
  for (const dir of [-1, 1]) {
    ctx.beginPath();
    ctx.moveTo(dir * h, 0);
    ctx.lineTo(dir * (h - 9), -4);
    ctx.lineTo(dir * (h - 9), 4);
    ctx.closePath();
    ctx.fill();
  }
  ctx.restore();
}

/** The zone's name in the deck's north-west corner (or another corner), where no label is. */
function drawZoneName(ctx: CanvasRenderingContext2D, d: StaticGeometry['decks'][number], view: View, theme: PlanTheme, placer: LabelPlacer) {
  const xs = d.polygon.map((p) => p[0]);
  const ys = d.polygon.map((p) => p[1]);
  const widthPx = (Math.max(...xs) - Math.min(...xs)) * view.scale;
  if (widthPx < 90) return;
  ctx.save();
  ctx.font = `italic 10px ${SANS}`;
  const tw = ctx.measureText(d.zoneName).width;
  const corners: [number, number, 'left' | 'right', 'top' | 'bottom'][] = [
    [Math.min(...xs), Math.max(...ys), 'left', 'top'],
    [Math.max(...xs), Math.max(...ys), 'right', 'top'],
    [Math.min(...xs), Math.min(...ys), 'left', 'bottom'],
    [Math.max(...xs), Math.min(...ys), 'right', 'bottom'],
  ];
  const candidates = corners.map(([x, y, h, v]) => {
    const [cx, cy] = toScreen(view, [x, y]);
    const x0 = h === 'left' ? cx + 8 : cx - 8 - tw;
    const y0 = v === 'top' ? cy + 7 : cy - 7 - 12;
    return { x0, y0, x1: x0 + tw, y1: y0 + 12, what: `zone ${d.zoneName} (deck ${d.id})` };
  });
  const spot = placer.place(candidates);
  if (spot) {
    ctx.textAlign = 'left';
    ctx.textBaseline = 'top';
    ctx.lineWidth = 4;
    ctx.strokeStyle = zoneTint(d.zoneIndex);
    ctx.fillStyle = theme.inkSoft;
    ctx.strokeText(d.zoneName, spot.x0, spot.y0);
    ctx.fillText(d.zoneName, spot.x0, spot.y0);
  }
  ctx.restore();
}

function drawGrid(ctx: CanvasRenderingContext2D, plan: Plan, ext: Extents, view: View, theme: PlanTheme, system: UnitSystem) {
  const grids = plan.grids ?? [];
  if (grids.length === 0) return;
  ctx.save();
  ctx.lineWidth = 1;
  ctx.font = `600 11px ${SANS}`;
  ctx.textAlign = 'center';
  ctx.textBaseline = 'middle';
  const bubble = (x: number, y: number, label: string) => {
    ctx.beginPath();
    ctx.arc(x, y, BUBBLE_R, 0, Math.PI * 2);
    ctx.fillStyle = theme.paper;
    ctx.fill();
    ctx.strokeStyle = theme.ink;
    ctx.stroke();
    ctx.fillStyle = theme.ink;
    ctx.fillText(label, x, y + 0.5);
  };
  const [, topY] = toScreen(view, [0, ext.maxY]);
  const [, bottomY] = toScreen(view, [0, ext.minY]);
  const [leftX] = toScreen(view, [ext.minX, 0]);
  const [rightX] = toScreen(view, [ext.maxX, 0]);
  const off = LINE_PAST_PX + BUBBLE_R;
  const xLines = grids.filter((g) => g.axis === 'x').sort((a, b) => a.offset_ft - b.offset_ft);
  const yLines = grids.filter((g) => g.axis === 'y').sort((a, b) => a.offset_ft - b.offset_ft);
  for (const g of xLines) {
    const [sx] = toScreen(view, [g.offset_ft, 0]);
    bubble(sx, topY - off, g.label);
    bubble(sx, bottomY + off, g.label);
  }
  for (const g of yLines) {
    const [, sy] = toScreen(view, [0, g.offset_ft]);
    bubble(leftX - off, sy, g.label);
    bubble(rightX + off, sy, g.label);
  }
  // Dimension strings between grid lines, outside the bubbles.
  ctx.strokeStyle = theme.inkSoft;
  ctx.fillStyle = theme.ink;
  ctx.font = `10.5px ${MONO}`;
  const dimY = topY - off - BUBBLE_R - 16;
  if (xLines.length > 1) {
    const xs = xLines.map((g) => toScreen(view, [g.offset_ft, 0])[0]);
    dimensionRow(ctx, xs, dimY, xLines, false, system);
  }
  const dimX = leftX - off - BUBBLE_R - 16;
  if (yLines.length > 1) {
    const ys = yLines.map((g) => toScreen(view, [0, g.offset_ft])[1]);
    dimensionRow(ctx, ys, dimX, yLines, true, system);
  }
  ctx.restore();
}

function dimensionRow(ctx: CanvasRenderingContext2D, at: number[], across: number, lines: { offset_ft: number }[], vertical: boolean, system: UnitSystem) {
  const pt = (a: number, b: number): [number, number] => (vertical ? [b, a] : [a, b]);
  ctx.beginPath();
  ctx.moveTo(...pt(Math.min(...at), across));
  ctx.lineTo(...pt(Math.max(...at), across));
  for (const a of at) {
    // Architectural tick: a short slash at each grid line.
    const [x, y] = pt(a, across);
    ctx.moveTo(x - 4, y + 4);
    ctx.lineTo(x + 4, y - 4);
  }
  ctx.stroke();
  for (let i = 0; i + 1 < at.length; i++) {
    const gapPx = Math.abs(at[i + 1] - at[i]);
    const text = lengthText(lines[i + 1].offset_ft - lines[i].offset_ft, system);
    if (gapPx < ctx.measureText(text).width + 8) continue;
    const mid = (at[i] + at[i + 1]) / 2;
    ctx.save();
    const [x, y] = pt(mid, across);
    ctx.translate(x, y);
    if (vertical) ctx.rotate(-Math.PI / 2);
    ctx.textAlign = 'center';
    ctx.textBaseline = 'bottom';
    ctx.fillText(text, 0, -3);
    ctx.restore();
  }
}

function drawMemberLabels(ctx: CanvasRenderingContext2D, geo: StaticGeometry, view: View, theme: PlanTheme, onScreen: (p: PlanPoint) => boolean, placer: LabelPlacer): number {
  let drawn = 0;
  ctx.save();
  ctx.font = `500 10.5px ${MONO}`;
  ctx.textBaseline = 'middle';
  for (const l of geo.labels) {
    const lengthPx = Math.hypot(l.end[0] - l.start[0], l.end[1] - l.start[1]) * view.scale;
    if (lengthPx < LABEL_MIN_PX) continue;
    const mid: PlanPoint = [(l.start[0] + l.end[0]) / 2, (l.start[1] + l.end[1]) / 2];
    if (!onScreen(mid)) continue;
    const s = l.status;
    const [ax, ay] = toScreen(view, l.start);
    const [bx, by] = toScreen(view, l.end);
    let angle = Math.atan2(by - ay, bx - ax);
    // Read from the bottom or the right, as on a drawing.
    if (angle > Math.PI / 2 + 1e-6) angle -= Math.PI;
    if (angle <= -Math.PI / 2 - 1e-6) angle += Math.PI;
    const mark = s.mark;
    const markW = mark ? ctx.measureText(mark).width + 5 : 0;
    const chip = memberChipTexts(s).find((text) => ctx.measureText(text).width + 8 + markW <= lengthPx - 12);
    if (chip === undefined) continue;
    const chipW = ctx.measureText(chip).width + 8;
    const w = chipW + markW;
    const off = MEMBER_WIDTH_PX[l.kind] / 2 + 9;
    // Candidate spots: midspan on the reading side, then the other side, then along the span.
    const spots = [0.5, 0.3, 0.7].flatMap((t) => [-1, 1].map((side) => ({ t, side })));
    const box = (t: number, side: number) => {
      const cx = ax + (bx - ax) * t - Math.sin(angle) * side * off;
      const cy = ay + (by - ay) * t + Math.cos(angle) * side * off;
      return { cx, cy, box: rotatedBox(cx, cy, w, 15, angle, `member ${l.id}`) };
    };
    let chosen = spots.map((sp) => ({ ...sp, ...box(sp.t, sp.side) })).find((c) => placer.fits(c.box));
    // Every member keeps its label (the size and ratio are the point of the plan); when no spot
    // is free it stays at midspan.
    if (!chosen) chosen = { t: 0.5, side: -1, ...box(0.5, -1) };
    placer.reserve(chosen.box);
    ctx.save();
    ctx.translate(chosen.cx, chosen.cy);
    ctx.rotate(angle);
    const x0 = -w / 2;
    if (mark) {
      ctx.fillStyle = theme.ink;
      ctx.textAlign = 'left';
      ctx.fillText(mark, x0, 0);
    }
    const colours = theme.util[s.util.band];
    ctx.fillStyle = colours.fill;
    roundRect(ctx, x0 + markW, -7.5, chipW, 15, 2.5);
    ctx.fill();
    ctx.fillStyle = colours.ink;
    ctx.textAlign = 'left';
    ctx.fillText(chip, x0 + markW + 4, 0.5);
    ctx.restore();
    if (s.state !== 'designing') drawn++;
  }
  ctx.restore();
  return drawn;
}

/**
 * Each end reaction as "R 24.3" (in the reader's force unit; the legend says which combination),
 * just inside the member end, on either side of it, nearer or farther along; a reaction with no
 * free spot is left out (and counted) rather than drawn over another label.
 */
function drawReactions(
  ctx: CanvasRenderingContext2D, geo: StaticGeometry, view: View, theme: PlanTheme, system: UnitSystem, onScreen: (p: PlanPoint) => boolean, placer: LabelPlacer,
): { reactionsDrawn: number; reactionsHidden: number } {
  let reactionsDrawn = 0;
  let reactionsHidden = 0;
  ctx.save();
  ctx.font = `600 9.5px ${MONO}`;
  ctx.textBaseline = 'middle';
  ctx.textAlign = 'left';
  for (const r of geo.reactions) {
    const [ax, ay] = toScreen(view, r.start);
    const [bx, by] = toScreen(view, r.end);
    const len = Math.hypot(bx - ax, by - ay);
    if (len < LABEL_MIN_PX) continue;
    const ux = (bx - ax) / len;
    const uy = (by - ay) / len;
    for (const end of ['start', 'end'] as const) {
      const at = end === 'start' ? r.start : r.end;
      if (!onScreen(at)) continue;
      const kip = end === 'start' ? r.startKip : r.endKip;
      const text = `R ${formatValue('force_kip', kip, system, { digits: 1 })}`;
      const tw = ctx.measureText(text).width;
      const [ex, ey] = end === 'start' ? [ax, ay] : [bx, by];
      const inward = end === 'start' ? 1 : -1;
      const candidates: LabelBox[] = [];
      for (const along of [16, 30, 46]) {
        for (const side of [1, -1]) {
          // Centre of the text box: along the member from the end, then off to one side.
          const cx = ex + ux * along * inward + -uy * side * 11;
          const cy = ey + uy * along * inward + ux * side * 11;
          candidates.push({ x0: cx - tw / 2, y0: cy - 6, x1: cx + tw / 2, y1: cy + 6, what: `reaction ${r.id} ${end}` });
        }
      }
      const spot = placer.place(candidates);
      if (!spot) {
        reactionsHidden++;
        continue;
      }
      ctx.lineWidth = 3;
      ctx.strokeStyle = theme.paper;
      ctx.fillStyle = theme.ink;
      ctx.strokeText(text, spot.x0, (spot.y0 + spot.y1) / 2);
      ctx.fillText(text, spot.x0, (spot.y0 + spot.y1) / 2);
      reactionsDrawn++;
    }
  }
  ctx.restore();
  return { reactionsDrawn, reactionsHidden };
}

function drawPointLoad(ctx: CanvasRenderingContext2D, [x, y]: [number, number], text: string, theme: PlanTheme, placer: LabelPlacer, id: string) {
  ctx.save();
  ctx.strokeStyle = theme.load;
  ctx.fillStyle = theme.paper;
  ctx.lineWidth = 1.5;
  ctx.beginPath();
  ctx.arc(x, y, 7, 0, Math.PI * 2);
  ctx.fill();
  ctx.stroke();
  ctx.beginPath();
  ctx.moveTo(x - 5, y - 5);
  ctx.lineTo(x + 5, y + 5);
  ctx.moveTo(x - 5, y + 5);
  ctx.lineTo(x + 5, y - 5);
  ctx.stroke();
  ctx.fillStyle = theme.load;
  ctx.font = `600 10px ${MONO}`;
  ctx.textBaseline = 'middle';
  const tw = ctx.measureText(text).width;
  // Right and up of the symbol, else right-down, left-up, left-down; left out when all are taken.
  const spot = placer.place(
    [[11, -9], [11, 9], [-11 - tw, -9], [-11 - tw, 9]].map(([dx, dy]) => ({ x0: x + dx, y0: y + dy - 6, x1: x + dx + tw, y1: y + dy + 6, what: `point load ${id}` })),
  );
  if (spot) {
    ctx.textAlign = 'left';
    ctx.fillText(text, spot.x0, spot.y0 + 6);
  }
  ctx.restore();
}

function roundRect(ctx: CanvasRenderingContext2D, x: number, y: number, w: number, h: number, r: number) {
  ctx.beginPath();
  ctx.moveTo(x + r, y);
  ctx.arcTo(x + w, y, x + w, y + h, r);
  ctx.arcTo(x + w, y + h, x, y + h, r);
  ctx.arcTo(x, y + h, x, y, r);
  ctx.arcTo(x, y, x + w, y, r);
  ctx.closePath();
}
