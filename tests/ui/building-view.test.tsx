import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { buildingModel } from '../../shared/drafting/building-model.drafting';
import { BuildingView, pieceText } from '../../src/features/building-view/components/building-view.component';
import { iShapeOutline } from '../../src/features/building-view/lib/i-shape-geometry';

const plan = {
  levels: [
    { id: 'L2', name: 'Level 2', elevation_ft: 14 },
    { id: 'R', name: 'Roof', elevation_ft: 28 },
  ],
  members: [
    { id: 'm1', level: 'L2', kind: 'beam' as const, start: [0, 0] as [number, number], end: [0, 30] as [number, number], shape: null, maxDepth_in: null },
    { id: 'm2', level: 'R', kind: 'girder' as const, start: [0, 0] as [number, number], end: [30, 0] as [number, number], shape: null, maxDepth_in: null },
  ],
  columns: [{ id: 'C1', x_ft: 0, y_ft: 0, levels: ['L2', 'R'] }],
};

describe('BuildingView', () => {
  it('when the browser gives no WebGL (jsdom), then it says so and lists members and column lengths per level', () => {
    render(<BuildingView plan={plan} design={null} selection={[]} onSelect={() => undefined} />);
    const fallback = screen.getByTestId('building-view-fallback');
    expect(fallback).toHaveTextContent('The Building view needs WebGL');
    const rows = within(fallback).getAllByRole('row').slice(1).map((r) => Array.from(r.querySelectorAll('td')).map((td) => td.textContent));
    expect(rows).toEqual([
      ['Roof', '1', '1'],
      ['Level 2', '1', '1'],
    ]);
    expect(screen.getByRole('checkbox', { name: 'Roof' })).toBeChecked();
  });

  it('when a member is hovered, then the text gives mark, size and the ratio as printed, rounded up', () => {
    const model = buildingModel(plan, { members: [{ id: 'm1', mark: '2B1', shape: 'W16X26', ratio: 0.8012 }, { id: 'm2', shape: null }] });
    expect(pieceText(model, 'm1')).toBe('2B1 · beam · W16X26 · ratio 0.81 (Working)');
    expect(pieceText(model, 'm2')).toBe('m2 · girder · not sized · no ratio yet');
    expect(pieceText(model, 'C1@R')).toBe('Column C1 below R · not sized · no ratio yet');
  });
});

describe('iShapeOutline', () => {
  it('when drawn for W18X35 hanging from the top, then it is 6.00 in wide, 17.7 in deep with 0.300 in web and 0.425 in flanges', () => {
    // AISC Shapes Database v15.0, W18X35: d 17.7, bf 6.00, tw 0.300, tf 0.425 in
    const pts = iShapeOutline({ label: 'W18X35', d_in: 17.7, bf_in: 6, tw_in: 0.3, tf_in: 0.425 }, 'top');
    const xs = pts.map((p) => p[0] * 12);
    const ys = pts.map((p) => p[1] * 12);
    expect(Math.max(...xs) - Math.min(...xs)).toBeCloseTo(6, 9);
    expect(Math.max(...ys)).toBeCloseTo(0, 9); // top of steel at the level
    expect(Math.min(...ys)).toBeCloseTo(-17.7, 9);
    expect(pts[4][0] * 24).toBeCloseTo(0.3, 9); // web face at tw/2
    expect((pts[2][1] - pts[1][1]) * 12).toBeCloseTo(0.425, 9); // bottom flange thickness
    expect(pts).toHaveLength(12);
  });
});
