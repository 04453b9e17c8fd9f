// The interactive layer: selection, handles, the tool's draft, the snap marker and the bay under the pointer.
import type { EditorState, PlanPoint, View } from '../store/editor.types';
import { findBay } from '../../../../shared/engine/index';
import { distance } from '../tools/plan-geometry';
import type { UnitSystem } from '../../../lib/units';
import { MONO, lengthText, type PlanTheme } from './plan-theme';
import { toScreen } from './view-transform';
import { MEMBER_WIDTH_PX } from './draw-static';
import { drawStudyPreview } from './draw-study-preview';

export const HANDLE_PX = 9;

export function drawOverlay(ctx: CanvasRenderingContext2D, s: EditorState, theme: PlanTheme, system: UnitSystem = 'US') {
  const { view, plan } = s;
  const S = (p: PlanPoint) => toScreen(view, p);
  ctx.save();
  ctx.lineCap = 'round';
  const selected = new Set(s.selection);
  drawStudyPreview(ctx, s, theme);

  // Bay under the pointer for the bay tools.
  if (s.hover && (s.tool === 'infill' || (s.tool === 'deck' && s.options.deckMode === 'bay'))) {
    const bay = findBay(plan, s.hover.point);
    if (bay) {
      const [x0, y0] = S([bay.x0, bay.y1]);
      const [x1, y1] = S([bay.x1, bay.y0]);
      ctx.fillStyle = withAlpha(theme.accent, 0.08);
      ctx.fillRect(x0, y0, x1 - x0, y1 - y0);
      ctx.setLineDash([5, 4]);
      ctx.strokeStyle = theme.accent;
      ctx.lineWidth = 1.5;
      ctx.strokeRect(x0, y0, x1 - x0, y1 - y0);
      ctx.setLineDash([]);
    }
  }

  if (selected.size > 0) {
    ctx.strokeStyle = theme.accent;
    for (const d of plan.decks) if (selected.has(d.id)) outline(ctx, d.polygon.map(S), theme, 2);
    for (const o of plan.openings) if (selected.has(o.id)) outline(ctx, o.polygon.map(S), theme, 2);
    for (const g of plan.grids ?? []) {
      if (!selected.has(g.id)) continue;
      ctx.strokeStyle = theme.accent;
      ctx.lineWidth = 2;
      ctx.beginPath();
      if (g.axis === 'x') {
        const [x] = S([g.offset_ft, 0]);
        ctx.moveTo(x, 0);
        ctx.lineTo(x, view.height);
      } else {
        const [, y] = S([0, g.offset_ft]);
        ctx.moveTo(0, y);
        ctx.lineTo(view.width, y);
      }
      ctx.stroke();
    }
    for (const m of plan.members) {
      if (!selected.has(m.id) || m.level !== s.levelId) continue;
      const a = S(m.start);
      const b = S(m.end);
      ctx.strokeStyle = withAlpha(theme.accent, 0.35);
      ctx.lineWidth = MEMBER_WIDTH_PX[m.kind] + 8;
      line(ctx, a, b);
      ctx.strokeStyle = theme.accent;
      ctx.lineWidth = MEMBER_WIDTH_PX[m.kind];
      line(ctx, a, b);
      if (!s.readOnly && selected.size === 1) for (const p of [a, b]) handle(ctx, p, theme);
    }
    for (const c of plan.columns) {
      if (!selected.has(c.id) || !c.levels.includes(s.levelId)) continue;
      const [x, y] = S([c.x_ft, c.y_ft]);
      ctx.strokeStyle = theme.accent;
      ctx.lineWidth = 2.5;
      ctx.strokeRect(x - 9, y - 9, 18, 18);
    }
    for (const p of plan.pointLoads) {
      if (!selected.has(p.id)) continue;
      const [x, y] = S([p.x_ft, p.y_ft]);
      ctx.strokeStyle = theme.accent;
      ctx.lineWidth = 2.5;
      ctx.beginPath();
      ctx.arc(x, y, 11, 0, Math.PI * 2);
      ctx.stroke();
    }
    for (const w of plan.lineLoads) {
      if (!selected.has(w.id)) continue;
      ctx.strokeStyle = theme.accent;
      ctx.lineWidth = 5;
      line(ctx, S(w.start), S(w.end));
    }
  }

  const hoverPt = s.hover?.point ?? null;
  const d = s.draft;
  ctx.strokeStyle = theme.accent;
  ctx.fillStyle = theme.accent;
  if (d.kind === 'segment' && hoverPt) {
    const width = s.tool === 'girder' ? MEMBER_WIDTH_PX.girder : s.tool === 'beam' ? MEMBER_WIDTH_PX.beam : 3;
    ctx.lineWidth = width;
    ctx.setLineDash(s.tool === 'lineLoad' ? [6, 4] : []);
    line(ctx, S(d.start), S(hoverPt));
    ctx.setLineDash([]);
    lengthTag(ctx, d.start, hoverPt, view, theme, system);
  }
  if (d.kind === 'measure') {
    const end = d.end ?? hoverPt;
    if (end) {
      ctx.lineWidth = 1.5;
      ctx.setLineDash([4, 3]);
      line(ctx, S(d.start), S(end));
      ctx.setLineDash([]);
      lengthTag(ctx, d.start, end, view, theme, system, true);
    }
  }
  if (d.kind === 'polygon' && d.points.length > 0) {
    const pts = [...d.points, ...(hoverPt ? [hoverPt] : [])].map(S);
    ctx.lineWidth = 1.5;
    ctx.beginPath();
    pts.forEach(([x, y], i) => (i === 0 ? ctx.moveTo(x, y) : ctx.lineTo(x, y)));
    ctx.stroke();
    for (const p of d.points.map(S)) handle(ctx, p, theme);
  }
  if ((d.kind === 'rectangle' && hoverPt) || d.kind === 'box') {
    const a = S(d.start);
    const b = S(d.kind === 'box' ? d.end : hoverPt!);
    ctx.lineWidth = 1;
    ctx.setLineDash(d.kind === 'box' ? [4, 3] : []);
    ctx.fillStyle = withAlpha(theme.accent, 0.06);
    ctx.fillRect(Math.min(a[0], b[0]), Math.min(a[1], b[1]), Math.abs(b[0] - a[0]), Math.abs(b[1] - a[1]));
    ctx.strokeRect(Math.min(a[0], b[0]), Math.min(a[1], b[1]), Math.abs(b[0] - a[0]), Math.abs(b[1] - a[1]));
    ctx.setLineDash([]);
  }

  // Snap marker: its shape says what it caught.
  if (s.hover && s.tool !== 'select' && !s.readOnly) {
    const [x, y] = S(s.hover.point);
    ctx.strokeStyle = theme.accent;
    ctx.lineWidth = 1.5;
    ctx.beginPath();
    switch (s.hover.snap) {
      case 'column':
      case 'end':
        ctx.rect(x - 6, y - 6, 12, 12);
        break;
      case 'intersection':
        ctx.moveTo(x - 7, y - 7);
        ctx.lineTo(x + 7, y + 7);
        ctx.moveTo(x - 7, y + 7);
        ctx.lineTo(x + 7, y - 7);
        break;
      case 'midpoint':
        ctx.moveTo(x, y - 7);
        ctx.lineTo(x + 7, y + 5);
        ctx.lineTo(x - 7, y + 5);
        ctx.closePath();
        break;
      case 'along':
      case 'grid':
        ctx.arc(x, y, 6, 0, Math.PI * 2);
        break;
      default:
        ctx.moveTo(x - 5, y);
        ctx.lineTo(x + 5, y);
        ctx.moveTo(x, y - 5);
        ctx.lineTo(x, y + 5);
    }
    ctx.stroke();
  }
  ctx.restore();
}

function line(ctx: CanvasRenderingContext2D, a: [number, number], b: [number, number]) {
  ctx.beginPath();
  ctx.moveTo(a[0], a[1]);
  ctx.lineTo(b[0], b[1]);
  ctx.stroke();
}

function outline(ctx: CanvasRenderingContext2D, pts: [number, number][], theme: PlanTheme, width: number) {
  ctx.beginPath();
  pts.forEach(([x, y], i) => (i === 0 ? ctx.moveTo(x, y) : ctx.lineTo(x, y)));
  ctx.closePath();
  ctx.lineWidth = width;
  ctx.strokeStyle = theme.accent;
  ctx.stroke();
}

function handle(ctx: CanvasRenderingContext2D, [x, y]: [number, number], theme: PlanTheme) {
  ctx.fillStyle = theme.paper;
  ctx.strokeStyle = theme.accent;
  ctx.lineWidth = 1.5;
  ctx.fillRect(x - HANDLE_PX / 2, y - HANDLE_PX / 2, HANDLE_PX, HANDLE_PX);
  ctx.strokeRect(x - HANDLE_PX / 2, y - HANDLE_PX / 2, HANDLE_PX, HANDLE_PX);
}

export function measureText(a: PlanPoint, b: PlanPoint, system: UnitSystem, withDeltas = false): string {
  let text = lengthText(distance(a, b), system);
  if (withDeltas) text += `  (Δx ${lengthText(Math.abs(b[0] - a[0]), system)}, Δy ${lengthText(Math.abs(b[1] - a[1]), system)})`;
  return text;
}

function lengthTag(ctx: CanvasRenderingContext2D, a: PlanPoint, b: PlanPoint, view: View, theme: PlanTheme, system: UnitSystem, withDeltas = false) {
  const [x, y] = toScreen(view, b);
  const text = measureText(a, b, system, withDeltas);
  ctx.font = `600 11px ${MONO}`;
  const w = ctx.measureText(text).width + 10;
  ctx.fillStyle = theme.ink;
  ctx.fillRect(x + 12, y + 10, w, 18);
  ctx.fillStyle = theme.paper;
  ctx.textAlign = 'left';
  ctx.textBaseline = 'middle';
  ctx.fillText(text, x + 17, y + 19.5);
}

function withAlpha(hex: string, alpha: number): string {
  const m = /^#([0-9a-f]{6})$/i.exec(hex.trim());
  if (!m) return hex;
  const n = parseInt(m[1], 16);
  return `rgba(${(n >> 16) & 255}, ${(n >> 8) & 255}, ${n & 255}, ${alpha})`;
}
