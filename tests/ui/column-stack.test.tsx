import { fireEvent, render, screen, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { ColumnStackTable } from '../../src/features/column-stack/components/column-stack-screen.component';
import { ColumnSheet, workingOf } from '../../src/features/column-stack/components/column-sheet.component';
import { ColumnEditor, ColumnSettings } from '../../src/features/column-stack/components/column-editor.component';
import { applyColumnEdit } from '../../src/features/column-stack/lib/column-edits';
import { buildColumnSchedule } from '../../shared/drafting/column-schedule.drafting';
import { designScheme } from '../../shared/engine/index';
import { singleBay, zone } from '../unit/takedown/plan-builder';

const plan = singleBay(30, 30, 12, ['L2', 'L3', 'L4', 'L5'], zone('z', { dead_psf: 80, live_psf: 100 }));
const design = designScheme(plan);
const schedule = buildColumnSchedule(design, plan);

describe('Column stack', () => {
  it('when the schedule is shown, then every column is sized by tier with a splice mark and a tier summary row, and a header opens its sheet', () => {
    const onSelect = vi.fn();
    render(<ColumnStackTable schedule={schedule} units="US" selected={null} onSelect={onSelect} />);
    const table = screen.getByTestId('column-stack');
    for (const c of design.columns) {
      const foot = screen.getByTestId(`tiers-${c.id}`);
      for (const t of c.tiers) expect(within(foot).getByText(t.shape!)).toBeTruthy();
    }
    const c1 = design.columns[0];
    const l4 = c1.levels.find((l) => l.level === 'L4')!;
    const cell = table.querySelector(`td[data-column="${c1.id}"][data-level="L4"]`) as HTMLElement;
    expect(within(cell).getByText(`Pr ${l4.Pr_kip.toFixed(0)} / ${l4.Pc_kip!.toFixed(0)}`)).toBeTruthy();
    expect(within(table.querySelector(`td[data-column="${c1.id}"][data-level="L4"]`) as HTMLElement).getByText('▾ splice')).toBeTruthy(); // default tiers of two storeys: splice at L3 (common practice)
    fireEvent.click(within(table).getAllByRole('button')[0]);
    expect(onSelect).toHaveBeenCalledWith(schedule.columns[0].id);
  });

  it('when a column sheet is open, then each tier shows Pr per combination, Lc from the elevations, Lc/r and Fe about both axes, the Fcr equation and the lighter shapes tried', () => {
    const column = schedule.columns[0];
    render(<ColumnSheet schedule={schedule} column={column} units="US" />);
    const sheet = screen.getByTestId('column-sheet');
    const top = design.columns[0].levels[0];
    const length = within(sheet).getByTestId('column-length-L5');
    // Lc = 56 − 42 = 14 ft from the level elevations (the plan builder stacks 14 ft storeys).
    expect(length.textContent).toMatch(/Lc = 56\.00 ft − 42\.00 ft = 14\.00 ft/);
    expect(within(length).getByText('1.2D+1.6L')).toBeTruthy();
    expect(within(length).getByText('governs')).toBeTruthy();
    const w0 = workingOf(schedule, column).tiers[0].lengths[0].strength;
    // Each axis prints its branch against 4.71√(E/Fy) = 113.4 at Fy = 50 ksi (AISC 360-16 E3, worked by hand).
    for (const a of [w0.x, w0.y]) {
      const sign = a.slenderness <= 113.4 ? '≤' : '>';
      expect(a.equation).toBe(sign === '≤' ? 'Eq. E3-2' : 'Eq. E3-3');
      expect(within(length).getByText(`${a.equation}: ${a.slenderness.toFixed(1)} ${sign} 113.4`)).toBeTruthy();
      // AISC 360-16 Eq. E3-4 worked by hand: Fe = π²E/(Lc/r)².
      expect(a.feKsi).toBeCloseTo((Math.PI ** 2 * 29000) / (168 / a.rIn) ** 2, 9);
      expect(within(length).getByText(`${a.feKsi.toFixed(1)} ksi`)).toBeTruthy();
    }
    expect(within(length).getByText(`${top.Pr_kip.toFixed(1)} kip`, { selector: 'span' })).toBeTruthy();
    const w = workingOf(schedule, column);
    expect(w.tiers[0].lengths[0].Pr_kip).toBeCloseTo(top.Pr_kip, 9);
    expect(w.tiers[0].lengths[0].strength.pcKip).toBeCloseTo(top.Pc_kip!, 9);
    const lighter = within(sheet).getByTestId('lighter-tier-2');
    expect(lighter.textContent).toMatch(/ratio \d\.\d{3} — Pr .* > φcPn/);
  });

  it('when a drafter opens the Column stack, then the settings are read only', () => {
    render(<ColumnSettings schedule={schedule} canEdit={false} pending={false} onEdit={() => undefined} />);
    expect(screen.getByTestId('column-settings-readonly').textContent).toMatch(/Read only/);
    expect(screen.queryByRole('checkbox')).toBeNull();
  });

  it('when an engineer moves a splice of one column, then the edit names the column and its new splice levels', () => {
    const onEdit = vi.fn();
    const column = schedule.columns[0];
    render(<ColumnEditor schedule={schedule} column={column} pending={false} onEdit={onEdit} />);
    fireEvent.click(screen.getByLabelText('follow the splices for all columns'));
    fireEvent.click(screen.getByLabelText(`Splice ${column.mark} at L3`));
    fireEvent.click(screen.getByLabelText(`Splice ${column.mark} at L4`));
    fireEvent.click(screen.getByRole('button', { name: `Save splices of ${column.mark}` }));
    expect(onEdit).toHaveBeenCalledWith({ kind: 'columnSplices', columnId: column.id, levels: ['L4'] });
  });

  it('when a column edit is applied to the plan, then splices, series and tier locks land in the plan file fields and the design follows', () => {
    const id = plan.columns[0].id;
    const moved = applyColumnEdit(plan, { kind: 'columnSplices', columnId: id, levels: ['L4'] });
    expect(moved.columns[0].spliceLevels).toEqual(['L4']);
    expect(plan.columns[0].spliceLevels).toBeUndefined(); // pure: the input plan is unchanged
    const d = designScheme(moved).columns[0];
    expect(d.levels.map((l) => l.tier)).toEqual([2, 1, 1, 1]); // a new tier starts above L4
    const followed = applyColumnEdit(moved, { kind: 'columnSplices', columnId: id, levels: null });
    expect('spliceLevels' in followed.columns[0]).toBe(false);
    const all = applyColumnEdit(plan, { kind: 'projectSplices', levels: ['L4', 'L2'] });
    expect(all.designBasis.columns?.spliceLevels).toEqual(['L2', 'L4']);
    const w14 = applyColumnEdit(plan, { kind: 'series', series: ['W12', 'W14'] });
    expect(w14.designBasis.columns?.series).toEqual(['W14', 'W12']);
    expect(designScheme(applyColumnEdit(plan, { kind: 'series', series: ['W14'] })).columns.every((c) => c.tiers.every((t) => t.shape!.startsWith('W14X')))).toBe(true);
    const locked = applyColumnEdit(plan, { kind: 'tierShape', columnId: id, level: 'L5', tierLevels: ['L5', 'L4'], shape: 'w14x120' });
    expect(locked.columns[0].tierShapes).toEqual([{ level: 'L5', shape: 'W14X120' }]);
    const relocked = applyColumnEdit(locked, { kind: 'tierShape', columnId: id, level: 'L5', tierLevels: ['L5', 'L4'], shape: 'W14X132' });
    expect(relocked.columns[0].tierShapes).toEqual([{ level: 'L5', shape: 'W14X132' }]);
    expect('tierShapes' in applyColumnEdit(locked, { kind: 'tierShape', columnId: id, level: 'L4', tierLevels: ['L5', 'L4'], shape: null }).columns[0]).toBe(false);
    expect(() => applyColumnEdit(plan, { kind: 'series', series: [] })).toThrow(/at least one/);
  });
});
