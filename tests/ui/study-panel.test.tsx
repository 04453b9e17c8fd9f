import { act, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { StudyPanel } from '../../src/features/bay-study/components/study-panel.component';
import { StudyRunner } from '../../src/features/bay-study/study/study-runner';
import { renderWithProviders } from '../../src/testing/test-utils';
import { twoBayPlan } from '../unit/editor/plan-fixture';
import { UnitsProvider, storeUnitSystem } from '../../src/lib/units-context';
import { parseStudySpec } from '../../shared/schemas/study.schema';
import { runStudy } from '../../shared/engine/study/run-study.study';

function renderPanel(over: Partial<Parameters<typeof StudyPanel>[0]> = {}, units?: 'SI') {
  const setPreview = vi.fn();
  const plan = twoBayPlan();
  const wrap = (el: React.ReactElement) => (units ? <UnitsProvider system={units}>{el}</UnitsProvider> : el);
  renderWithProviders(
    wrap(<StudyPanel
      projectId="p1"
      schemeId="s1"
      plan={plan}
      levelId="L2"
      selection={['b5']}
      savedRevision={1}
      saved
      canEdit
      prices={{ steel_usd_per_ton: 4200, connection_usd_each: 350 }}
      tonnageHref="/projects/p1/tonnage"
      setPreview={setPreview}
      close={() => undefined}
      runner={new StudyRunner(false)}
      {...over}
    />),
  );
  return { setPreview, plan };
}

describe('Trial framings panel', () => {
  it('when a beam of the east bay is selected, then the study starts from that bay and shades it on the plan', () => {
    const { setPreview } = renderPanel();
    expect(screen.getByRole('checkbox', { name: 'Bay 2–3 / A–B (30 × 36 ft)' })).toBeChecked();
    expect(screen.getByRole('checkbox', { name: 'Bay 1–2 / A–B (30 × 36 ft)' })).not.toBeChecked();
    expect(setPreview).toHaveBeenLastCalledWith({ levelId: 'L2', bays: [{ x0: 30, x1: 60, y0: 0, y1: 36 }], members: null });
  });

  it('when the spacing is negative, then the field is named and nothing runs', async () => {
    renderPanel();
    await userEvent.clear(screen.getByLabelText('From'));
    await userEvent.type(screen.getByLabelText('From'), '-4');
    await userEvent.click(screen.getByRole('button', { name: 'Run study' }));
    expect(screen.getByRole('alert')).toHaveTextContent('spacing_ft.from: must be more than 0 ft (got -4)');
    expect(screen.queryByTestId('study-results')).toBeNull();
  });

  it('when the study runs 8–10 ft both ways, then six options are listed with the lightest marked and the caution shown; preview draws the option', async () => {
    const { setPreview } = renderPanel();
    await userEvent.clear(screen.getByLabelText('From'));
    await userEvent.type(screen.getByLabelText('From'), '8');
    await userEvent.clear(screen.getByLabelText('To'));
    await userEvent.type(screen.getByLabelText('To'), '10');
    await userEvent.click(screen.getByRole('button', { name: 'Run study' }));
    const results = await screen.findByTestId('study-results', {}, { timeout: 20000 });
    const rows = within(results).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(6);
    expect(within(results).getAllByText('Lightest').length).toBeGreaterThan(0);
    expect(results).toHaveTextContent('licensed engineer, who must check them');
    // 30 ft wide bay, beams running N–S at ≤ 10 ft: ceil(30 / 10) = 3 spaces, 2 beams at 10 ft (the Infill tool's rule).
    const row = rows.find((r) => r.getAttribute('data-option-id') === 'y-s10-dany-f50')!;
    expect(row).toHaveTextContent('2 @ 10 ft');
    await userEvent.click(within(row).getByRole('button', { name: /^Preview/ }));
    await waitFor(() => expect(setPreview.mock.lastCall?.[0]?.members?.length).toBeGreaterThan(0));
    const drawn = setPreview.mock.lastCall![0].members as { start: number[]; end: number[]; kind: string }[];
    expect(drawn.filter((m) => m.kind === 'beam' && m.start[0] === m.end[0] && m.start[0] > 30 && m.start[0] < 60).map((m) => m.start[0])).toEqual([40, 50]);
  }, 30000);

  it('when SI units are chosen, then bays, spacings, steel per area, tonnage, depths and Fy read in m, kg/m², tonnes, mm and MPa', async () => {
    const { plan } = renderPanel({}, 'SI');
    // 30 ft = 9.144 m, 36 ft = 10.9728 m (NIST SP 811 App. B: 1 ft = 0.3048 m exactly)
    expect(screen.getByRole('checkbox', { name: 'Bay 2–3 / A–B (9.14 × 10.97 m)' })).toBeChecked();
    expect(screen.getByText('Max spacing, m')).toBeInTheDocument();
    // Fy 50 ksi × 6.894757 MPa/ksi = 344.7 MPa (NIST SP 811 App. B)
    expect(screen.getByLabelText('Steel grades')).toHaveValue('345');
    await userEvent.clear(screen.getByLabelText('From'));
    await userEvent.type(screen.getByLabelText('From'), '3.5');
    await userEvent.clear(screen.getByLabelText('To'));
    await userEvent.type(screen.getByLabelText('To'), '3.5');
    await userEvent.click(screen.getByRole('button', { name: 'Run study' }));
    const results = await screen.findByTestId('study-results', {}, { timeout: 20000 });
    const table = within(results).getByRole('table', { name: 'Trial framing options' });
    for (const h of ['Bay kg/m²', 'Scheme tonnes', 'Max d, mm']) expect(within(table).getByRole('columnheader', { name: h })).toBeInTheDocument();
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(2);
    // 3.5 m = 11.48294 ft: the same option the engine gives for that spacing, Fy 345 MPa read as 50.0 ksi (rounded down).
    const r = parseStudySpec({ region: { level: 'L2', polygons: [[[30, 0], [60, 0], [60, 36], [30, 36]]] }, spacing_ft: { from: 3.5 / 0.3048, to: 3.5 / 0.3048, step: 0.5 / 0.3048 }, directions: ['x', 'y'], Fy_ksi: [50], unitPrices: { steel_usd_per_ton: 4200, connection_usd_each: 350 } });
    const expected = runStudy(plan, r.spec!).options.find((o) => o.direction === 'y')!;
    const row = rows.find((x) => x.textContent!.startsWith('N–S ≤ 3.50 m'))!;
    const cells = within(row).getAllByRole('cell').map((c) => c.textContent);
    // 30 ft bay at ≤ 11.48 ft: ceil(30 / 11.48) = 3 spaces, 2 beams at 10 ft = 3.05 m (the Infill tool's rule)
    expect(cells[1]).toBe('2 @ 3.05 m');
    // lb/ft² × 4.882428 = kg/m²; lb × 0.45359237 / 1000 = tonnes; in × 25.4 = mm (NIST SP 811 App. B)
    expect(cells[2]).toBe((expected.steel_psf * 4.882428).toFixed(1));
    expect(cells[3]).toBe(((expected.scheme.steelWeight_lb * 0.45359237) / 1000).toFixed(2));
    expect(cells[7]).toBe((expected.maxDepth_in! * 25.4).toFixed(0));
    expect(within(results).getByTestId('study-timing')).toHaveTextContent(/now \d+\.\d\d tonnes/);
    expect(within(results).getByTestId('study-chart')).toHaveTextContent('Bay steel (kg/m²)');
    // No US figure left in the table or the timing line.
    expect(table.textContent).not.toMatch(/\d\s*(ft|psf|tons|in)\b/);
    expect(within(results).getByTestId('study-timing').textContent).not.toMatch(/\btons\b/);
  }, 30000);

  it('when the units switch from US to SI with 8 ft typed, then the fields read 2.44 m and the grade 345 MPa', async () => {
    storeUnitSystem('US');
    renderPanel();
    await userEvent.clear(screen.getByLabelText('From'));
    await userEvent.type(screen.getByLabelText('From'), '8');
    act(() => storeUnitSystem('SI'));
    // 8 ft × 0.3048 = 2.4384 m; 15 ft = 4.572 m; 1 ft = 0.3048 m (NIST SP 811 App. B)
    await waitFor(() => expect(screen.getByLabelText('From')).toHaveValue('2.44'));
    expect(screen.getByLabelText('To')).toHaveValue('4.57');
    expect(screen.getByLabelText('Step')).toHaveValue('0.30');
    expect(screen.getByLabelText('Steel grades')).toHaveValue('345');
    expect(screen.getByRole('checkbox', { name: 'Bay 2–3 / A–B (9.14 × 10.97 m)' })).toBeInTheDocument();
    act(() => storeUnitSystem('US'));
    await waitFor(() => expect(screen.getByLabelText('From')).toHaveValue('8'));
  });

  it('when composite and bare steel are both tried, then each spacing and direction is listed composite and bare steel', async () => {
    storeUnitSystem('US');
    renderPanel();
    await userEvent.clear(screen.getByLabelText('From'));
    await userEvent.type(screen.getByLabelText('From'), '10');
    await userEvent.clear(screen.getByLabelText('To'));
    await userEvent.type(screen.getByLabelText('To'), '10');
    await userEvent.selectOptions(screen.getByLabelText('Composite'), 'Try composite and bare steel');
    await userEvent.click(screen.getByRole('button', { name: 'Run study' }));
    const results = await screen.findByTestId('study-results', {}, { timeout: 20000 });
    const rows = within(results).getAllByRole('row').slice(1);
    expect(rows.map((r) => r.getAttribute('data-option-id'))).toEqual(['x-s10-dany-f50-c', 'x-s10-dany-f50-b', 'y-s10-dany-f50-c', 'y-s10-dany-f50-b']);
    expect(rows[2]).toHaveTextContent('N–S ≤ 10 ft, composite');
    expect(rows[3]).toHaveTextContent('N–S ≤ 10 ft, bare steel');
  }, 30000);
});
