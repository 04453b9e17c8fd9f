import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { StudyPanel } from '../../src/features/bay-study/components/study-panel.component';
import { StudyRunner } from '../../src/features/bay-study/study/study-runner';
import { renderWithProviders } from '../../src/testing/test-utils';
import { twoBayPlan } from '../unit/editor/plan-fixture';

function renderPanel(over: Partial<Parameters<typeof StudyPanel>[0]> = {}) {
  const setPreview = vi.fn();
  const plan = twoBayPlan();
  renderWithProviders(
    <StudyPanel
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
    />,
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
});
