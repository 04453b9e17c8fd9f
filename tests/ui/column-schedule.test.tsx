import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { ColumnScheduleTable } from '../../src/features/schedule/components/column-schedule.component';
import { buildColumnSchedule } from '../../shared/drafting/column-schedule.drafting';
import { designScheme } from '../../shared/engine/index';
import { parsePlanFile } from '../../shared/schemas/plan.schema';
import { singleBay, zone } from '../unit/takedown/plan-builder';

describe('column schedule', () => {
  const plan = singleBay(30, 30, 10, ['L2', 'L3', 'L4', 'L5'], zone('z', { dead_psf: 80, live_psf: 100 }));
  const design = designScheme(plan);
  const schedule = buildColumnSchedule(design, plan);

  it('when built, then columns run across and levels down (top first), each cell the design of the length below that level', () => {
    expect(schedule.levels.map((l) => l.id)).toEqual(['L5', 'L4', 'L3', 'L2']);
    expect(schedule.columns.map((c) => c.id)).toEqual(['C1', 'C2', 'C3', 'C4']);
    const c1 = design.columns[0];
    expect(schedule.columns[0].cells.map((c) => c?.shape)).toEqual(c1.levels.map((l) => l.shape));
    expect(schedule.columns[0].cells.map((c) => c?.spliceBelow)).toEqual([false, true, false, false]);
    expect(schedule.columnWeight_lb).toBe(design.totals.columnWeight_lb);
  });

  it('when rendered, then each cell shows its size, Pr against φcPn and the splice mark, with the ratio printed', () => {
    render(<ColumnScheduleTable schedule={schedule} method="LRFD" units="US" />);
    const table = screen.getByTestId('column-schedule');
    const l4 = design.columns[0].levels[1];
    const cell = table.querySelector('td[data-column="C1"][data-level="L4"]') as HTMLElement;
    expect(within(cell).getByText(l4.shape!)).toBeTruthy();
    expect(within(cell).getByText(`Pr ${l4.Pr_kip.toFixed(0)} / ${l4.Pc_kip!.toFixed(0)}`)).toBeTruthy();
    expect(within(cell).getByText('splice at the floor below')).toBeTruthy();
    expect(screen.getByText(/φcPn/)).toBeTruthy();
  });

  it('when the fixture plan stands on grids, then a column is marked by its grid intersection', () => {
    const fixture = parsePlanFile(JSON.parse(readFileSync(resolve(process.cwd(), 'tests/fixtures/plans/two-bay.plan.json'), 'utf8'))).plan!;
    const s = buildColumnSchedule(designScheme(fixture), fixture);
    const c = fixture.columns[0];
    expect(s.columns[0].mark).not.toBe(c.id); // named by its grid intersection (shared/drafting/grid-location.drafting.ts)
    expect(s.columns.every((c) => c.cells[0]?.shape)).toBe(true);
  });
});
