import { describe, expect, it } from 'vitest';
import { designScheme } from '../../shared/engine/index';
import { buildStaticGeometry } from '../../src/features/editor/canvas/static-geometry';
import { drawStatic } from '../../src/features/editor/canvas/draw-static';
import { readPlanTheme } from '../../src/features/editor/canvas/plan-theme';
import { memberChipTexts, memberStatus } from '../../src/features/editor/members/member-status';
import { twoBayPlan } from '../unit/editor/plan-fixture';

type Events = { __clearEvents(): void; __getEvents(): { type: string; props: { text?: string } }[] };

/** The texts drawn on the canvas for the two-bay plan at 8 px/ft (a normal zoom). */
function drawnTexts(plan = twoBayPlan()) {
  const result = designScheme(plan);
  const snapshot = { result, plan, byId: new Map(result.members.map((m) => [m.id, m])), pending: false, error: null, lastEditToSizesMs: null, lastEngineMs: null };
  const canvas = document.createElement('canvas');
  canvas.width = 800;
  canvas.height = 600;
  const ctx = canvas.getContext('2d')!;
  (ctx as unknown as Events).__clearEvents();
  drawStatic(ctx, plan, buildStaticGeometry(plan, 'L2', snapshot), { scale: 8, x: 100, y: 500, width: 800, height: 600 }, readPlanTheme(), 'US');
  return { result, texts: (ctx as unknown as Events).__getEvents().filter((e) => e.type === 'fillText').map((e) => e.props.text ?? '') };
}

describe('Plan labels of failing members', () => {
  it('when a locked W16X26 is over, then the plan writes its size and ratio like any other member, without the failure sentence', () => {
    const plan = twoBayPlan();
    // A W16X26 is too light for this 36 ft office beam (locked by the engineer).
    plan.members = plan.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W16X26' } : m));
    const { result, texts } = drawnTexts(plan);
    const b2 = result.members.find((m) => m.id === 'b2')!;
    expect(b2.passes).toBe(false);
    const status = memberStatus('b2', b2, result, false);
    expect(Number(status.util.printed)).toBeGreaterThan(1);
    expect(texts).toContain(`W16X26 ${status.util.printed}`);
    expect(texts.some((t) => /over:|flexure|deflection/.test(t))).toBe(false);
  });

  it('when a member is over, problem or not designed, then its label candidates are short and never carry a reason', () => {
    const plan = twoBayPlan();
    plan.members = plan.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W16X26' } : m));
    const result = designScheme(plan);
    const s = memberStatus('b2', result.members.find((m) => m.id === 'b2'), result, false);
    expect(memberChipTexts(s)).toEqual([`W16X26 ${s.util.printed}`, 'W16X26']);
    expect(memberChipTexts({ ...s, state: 'problem' })).toEqual([`W16X26 ${s.util.printed} problem`, 'W16X26 problem']);
    expect(memberChipTexts({ ...s, state: 'not-designed' })).toEqual(['not designed']);
  });
});
