import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { designScheme } from '../../shared/engine/index';
import { overlappingPairs, type LabelBox } from '../../shared/drafting/label-placement.drafting';
import { buildDemoBuildingPlan } from '../../server/db/demo-building.builder';
import { parsePlanFile } from '../../shared/schemas/plan.schema';
import { buildStaticGeometry } from '../../src/features/editor/canvas/static-geometry';
import { drawStatic } from '../../src/features/editor/canvas/draw-static';
import { readPlanTheme } from '../../src/features/editor/canvas/plan-theme';
import { PlanEditor } from '../../src/features/editor/components/plan-editor.component';
import type { SavePlanOutcome } from '../../src/features/editor/api/save-plan.api';
import { renderWithProviders, testSession } from '../../src/testing/test-utils';
import { KIP_KN } from '../../src/lib/units';

// Issue 16 item 14: end reactions on the Plan as an on-screen option, in the units chosen,
// placed where they cover no other label.

const plan = buildDemoBuildingPlan({ name: 'Scheme A', beamSpacing_ft: 10 });
const result = designScheme(plan);
const snapshot = { result, plan, byId: new Map(result.members.map((m) => [m.id, m])), pending: false, error: null, lastEditToSizesMs: null, lastEngineMs: null };

function draw(levelId: string, scale: number, system: 'US' | 'SI', reactions: boolean) {
  const ctx = document.createElement('canvas').getContext('2d')!;
  const boxes: LabelBox[] = [];
  const stats = { reactionsDrawn: 0, reactionsHidden: 0 };
  const fill = vi.spyOn(ctx, 'fillText');
  drawStatic(ctx, plan, buildStaticGeometry(plan, levelId, snapshot), { scale, x: 60, y: 820, width: 1000, height: 860 }, readPlanTheme(), system, boxes, { reactions, stats });
  return { boxes, stats, texts: fill.mock.calls.map((c) => String(c[0])) };
}

describe('end reactions on the Plan canvas (demo building, every level)', () => {
  it('when reactions are on at a normal zoom, then they are drawn and no label overlaps another (members aside)', () => {
    for (const level of plan.levels) {
      for (const scale of [6, 8]) {
        const { boxes, stats } = draw(level.id, scale, 'US', true);
        expect(stats.reactionsDrawn, `${level.id}@${scale}`).toBeGreaterThan(0);
        const clash = overlappingPairs(boxes).filter(([a, b]) => !(a.what?.startsWith('member') && b.what?.startsWith('member')));
        expect(clash.map(([a, b]) => `${level.id}@${scale}: ${a.what} × ${b.what}`)).toEqual([]);
      }
    }
  });

  it('when reactions are off, then none is drawn', () => {
    const { boxes, stats, texts } = draw(plan.levels[0].id, 8, 'US', false);
    expect(stats.reactionsDrawn).toBe(0);
    expect(boxes.some((b) => b.what?.startsWith('reaction'))).toBe(false);
    expect(texts.some((t) => t.startsWith('R '))).toBe(false);
  });

  it('when a beam end is printed, then the figure is its governing LRFD combination of D and L, in kip or kN', () => {
    const level = plan.levels[0].id;
    const beam = result.members.find((m) => m.level === level && m.kind === 'beam' && m.reactions.start.Lr_kip === 0 && m.reactions.start.S_kip === 0)!;
    const r = beam.reactions.start;
    // ASCE 7-16 §2.3.1: max(1.4D, 1.2D + 1.6L) for D and L only.
    const expectedKip = Math.max(1.4 * r.D_kip, 1.2 * r.D_kip + 1.6 * r.L_kip);
    const geo = buildStaticGeometry(plan, level, snapshot).reactions.find((x) => x.id === beam.id)!;
    expect(geo.startKip).toBeCloseTo(expectedKip, 9);
    const us = draw(level, 8, 'US', true).texts;
    expect(us).toContain(`R ${expectedKip.toFixed(1)}`);
    // NIST SP 811 Appendix B: 1 kip = 4.448 222 kN.
    const si = draw(level, 8, 'SI', true).texts;
    expect(si).toContain(`R ${(expectedKip * KIP_KN).toFixed(1)}`);
  });
});

describe('Reactions toggle on the Plan', () => {
  it.each([
    ['engineer', true],
    ['drafter', false],
  ] as const)('when a %s presses Reactions, then it is pressed and the legend names the combination and unit', async (role, canEdit) => {
    const raw = JSON.parse(readFileSync(resolve(__dirname, '../fixtures/plans/two-bay.plan.json'), 'utf8'));
    const save = vi.fn(async (): Promise<SavePlanOutcome> => ({ kind: 'saved', revision: 2, repairs: [] }));
    renderWithProviders(<PlanEditor schemeId="s1" schemeName="Scheme A" plan={parsePlanFile(raw).plan!} revision={1} canEdit={canEdit} save={save} />, { session: testSession(role) });
    const toggle = screen.getByRole('button', { name: 'Reactions' });
    expect(toggle).toHaveAttribute('aria-pressed', 'false');
    expect(screen.queryByTestId('reactions-legend')).not.toBeInTheDocument();
    await userEvent.click(toggle);
    expect(toggle).toHaveAttribute('aria-pressed', 'true');
    await waitFor(() => expect(screen.getByTestId('reactions-legend')).toHaveTextContent('R = end reaction, LRFD factored (governing ASCE 7-16 combination), kip.'));
    await userEvent.click(toggle);
    expect(screen.queryByTestId('reactions-legend')).not.toBeInTheDocument();
    // A view choice: nothing is saved.
    expect(save).not.toHaveBeenCalled();
  });
});
