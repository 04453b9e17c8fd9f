// A trial framing option over the plan: its bays shaded and its members dashed in the accent
// colour, so the engineer sees the option before making a scheme of it. Drawn on the
// interactive layer; the plan itself is not changed.
import type { EditorState, PlanPoint } from '../store/editor.types';
import type { PlanTheme } from './plan-theme';
import { toScreen } from './view-transform';
import { MEMBER_WIDTH_PX } from './draw-static';

export function drawStudyPreview(ctx: CanvasRenderingContext2D, s: EditorState, theme: PlanTheme): void {
  const preview = s.studyPreview;
  if (!preview || preview.levelId !== s.levelId) return;
  const S = (p: PlanPoint) => toScreen(s.view, p);
  ctx.save();
  for (const b of preview.bays) {
    const [x0, y0] = S([b.x0, b.y1]);
    const [x1, y1] = S([b.x1, b.y0]);
    ctx.fillStyle = theme.accentWash;
    ctx.globalAlpha = 0.55;
    ctx.fillRect(x0, y0, x1 - x0, y1 - y0);
    ctx.globalAlpha = 1;
    ctx.setLineDash([6, 4]);
    ctx.strokeStyle = theme.accent;
    ctx.lineWidth = 1.5;
    ctx.strokeRect(x0, y0, x1 - x0, y1 - y0);
  }
  ctx.setLineDash([10, 5]);
  ctx.lineCap = 'butt';
  for (const m of preview.members ?? []) {
    const a = S(m.start);
    const b = S(m.end);
    ctx.strokeStyle = theme.accent;
    ctx.lineWidth = MEMBER_WIDTH_PX[m.kind] + 1;
    ctx.beginPath();
    ctx.moveTo(a[0], a[1]);
    ctx.lineTo(b[0], b[1]);
    ctx.stroke();
  }
  ctx.restore();
}
