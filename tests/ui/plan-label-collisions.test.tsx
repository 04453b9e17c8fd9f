import { describe, expect, it } from 'vitest';
import { designScheme } from '../../shared/engine/index';
import { boxesOverlap, overlappingPairs, type LabelBox } from '../../shared/drafting/label-placement.drafting';
import { buildPlanSheet, sheetTextBox } from '../../shared/drafting/plan-sheet.drafting';
import { buildDemoBuildingPlan } from '../../server/db/demo-building.builder';
import { buildStaticGeometry } from '../../src/features/editor/canvas/static-geometry';
import { drawStatic } from '../../src/features/editor/canvas/draw-static';
import { readPlanTheme } from '../../src/features/editor/canvas/plan-theme';
import { SCHEME_CAUTION } from '../../shared/engine/index';

// The demo building (invented), every level, drawn as a person first sees it: labels must not cover each other.
const plan = buildDemoBuildingPlan({ name: 'Scheme A', beamSpacing_ft: 10 });
const result = designScheme(plan);

function canvasBoxes(levelId: string, scale: number): LabelBox[] {
  const snapshot = { result, plan, byId: new Map(result.members.map((m) => [m.id, m])), pending: false, error: null, lastEditToSizesMs: null, lastEngineMs: null };
  const ctx = document.createElement('canvas').getContext('2d')!;
  const boxes: LabelBox[] = [];
  drawStatic(ctx, plan, buildStaticGeometry(plan, levelId, snapshot), { scale, x: 60, y: 820, width: 1000, height: 860 }, readPlanTheme(), 'US', boxes);
  return boxes;
}

describe('label collisions on the demo plan', () => {
  it('when each level is drawn on the canvas at a normal zoom, then no zone name, load value or symbol overlaps another label', () => {
    for (const level of plan.levels) {
      for (const scale of [6, 8]) {
        const boxes = canvasBoxes(level.id, scale);
        expect(boxes.length).toBeGreaterThan(0);
        const clash = overlappingPairs(boxes).filter(([a, b]) => !(a.what?.startsWith('member') && b.what?.startsWith('member')));
        expect(clash.map(([a, b]) => `${level.id}@${scale}: ${a.what} × ${b.what}`)).toEqual([]);
      }
    }
  });

  it('when the plan sheet is drawn, then no OPENING note covers a member’s size, mark or reaction', () => {
    const withOpening = plan.levels.filter((l) => plan.openings.some((o) => o.level === l.id));
    expect(withOpening.length).toBeGreaterThan(0);
    for (const level of withOpening) {
      const sheet = buildPlanSheet({ plan, design: result, levelId: level.id, titleBlock: { project: 'P', projectNumber: '1', client: 'C', scheme: 'A', revision: 1, date: '2026-01-01', preparedBy: 'E', sheetIndex: 1, sheetCount: 1 }, showReactions: true, caution: SCHEME_CAUTION });
      const texts = sheet.primitives.filter((p) => p.type === 'text') as Extract<(typeof sheet.primitives)[number], { type: 'text' }>[];
      const memberBoxes = texts.filter((t) => t.ref && !t.ref.startsWith('opening:')).map(sheetTextBox);
      const openings = texts.filter((t) => t.text === 'OPENING').map(sheetTextBox);
      for (const o of openings) expect(memberBoxes.filter((m) => boxesOverlap(o, m)).map((m) => m.what)).toEqual([]);
    }
  });
});
