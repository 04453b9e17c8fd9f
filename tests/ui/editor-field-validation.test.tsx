import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { PlanEditor } from '../../src/features/editor/components/plan-editor.component';
import { SelectionInspector } from '../../src/features/editor/components/selection-inspector.component';
import type { SavePlanOutcome } from '../../src/features/editor/api/save-plan.api';
import { createEditorStore } from '../../src/features/editor/store/editor.store';
import { UNITS_STORAGE_KEY } from '../../src/lib/units-context';
import { renderWithProviders, testSession } from '../../src/testing/test-utils';
import { parsePlanFile, type Plan } from '../../shared/schemas/plan.schema';

// The two-bay fixture has one point load, p1: D = 2 kip, L = 1 kip; grid line 2 at x = 30 ft.
function twoBay(): Plan {
  const raw = JSON.parse(readFileSync(resolve(__dirname, '../fixtures/plans/two-bay.plan.json'), 'utf8'));
  return parsePlanFile(raw).plan!;
}

function inspect(id: string) {
  const store = createEditorStore({ plan: twoBay() });
  store.setState({ selection: [id] });
  const before = store.getState().plan;
  render(<SelectionInspector store={store} canEdit />);
  return { store, before };
}

/** The message an input points at with aria-describedby. */
function describedText(input: HTMLElement): string | null {
  const id = input.getAttribute('aria-describedby');
  return id ? (document.getElementById(id)?.textContent ?? null) : null;
}

function typeAndBlur(input: HTMLElement, value: string) {
  fireEvent.change(input, { target: { value } });
  fireEvent.blur(input);
}

describe('Plan inspector fields refuse bad input with a message', () => {
  beforeEach(() => localStorage.clear());

  it('when "abc" is typed as a point load’s dead load, then the field says so and the plan is unchanged', () => {
    const { store, before } = inspect('p1');
    const dead = screen.getByLabelText('Dead, kip');
    typeAndBlur(dead, 'abc');
    expect(dead).toHaveAttribute('aria-invalid', 'true');
    expect(describedText(dead)).toBe('Dead load: enter a number of kip, 0 or more');
    expect(screen.getByText('Dead load: enter a number of kip, 0 or more')).toBeInTheDocument();
    expect(store.getState().plan).toBe(before);
    expect(store.getState().plan.pointLoads.find((p) => p.id === 'p1')!.D_kip).toBe(2);
  });

  it('when "-5" is typed as a point load’s live load, then the field says it must be 0 or more and the plan keeps 1 kip', () => {
    const { store, before } = inspect('p1');
    const live = screen.getByLabelText('Live, kip');
    typeAndBlur(live, '-5');
    expect(live).toHaveAttribute('aria-invalid', 'true');
    expect(describedText(live)).toBe('Live load: enter a number of kip, 0 or more');
    expect(store.getState().plan).toBe(before);
    expect(store.getState().plan.pointLoads.find((p) => p.id === 'p1')!.L_kip).toBe(1);
  });

  it('when a bad value is corrected to 7.5, then the message goes and the plan holds 7.5 kip', () => {
    const { store } = inspect('p1');
    typeAndBlur(screen.getByLabelText('Dead, kip'), '-5');
    expect(screen.getByText('Dead load: enter a number of kip, 0 or more')).toBeInTheDocument();
    typeAndBlur(screen.getByLabelText('Dead, kip'), '7.5');
    const dead = screen.getByLabelText('Dead, kip');
    expect(dead).not.toHaveAttribute('aria-invalid');
    expect(dead).not.toHaveAttribute('aria-describedby');
    expect(screen.queryByText(/Dead load:/)).toBeNull();
    const p1 = store.getState().plan.pointLoads.find((p) => p.id === 'p1')!;
    expect(p1.D_kip).toBe(7.5);
    expect(p1.L_kip).toBe(1);
  });

  it('when 0 is typed as a dead load, then it is accepted (0 or more)', () => {
    const { store } = inspect('p1');
    typeAndBlur(screen.getByLabelText('Dead, kip'), '0');
    expect(store.getState().plan.pointLoads.find((p) => p.id === 'p1')!.D_kip).toBe(0);
  });

  it('when SI is shown and "-1" kN is typed, then the message names kN and the plan is unchanged', () => {
    localStorage.setItem(UNITS_STORAGE_KEY, 'SI');
    const { store, before } = inspect('p1');
    const dead = screen.getByLabelText('Dead, kN');
    typeAndBlur(dead, '-1');
    expect(describedText(dead)).toBe('Dead load: enter a number of kN, 0 or more');
    expect(store.getState().plan).toBe(before);
  });

  it('when "abc" is typed as a grid line position, then the field names the grid line and the line stays at 30 ft', () => {
    const plan = twoBay();
    const line2 = plan.grids!.find((g) => g.axis === 'x' && g.offset_ft === 30)!;
    const { store, before } = inspect(line2.id);
    const x = screen.getByLabelText('x, ft');
    typeAndBlur(x, 'abc');
    expect(describedText(x)).toBe(`Grid line ${line2.label} position: enter a number of ft`);
    expect(store.getState().plan).toBe(before);
  });
});

describe('Plan tool option fields refuse bad input with a message', () => {
  beforeEach(() => localStorage.clear());

  function renderEditor() {
    const save = vi.fn(async (): Promise<SavePlanOutcome> => ({ kind: 'saved', revision: 2, repairs: [] }));
    renderWithProviders(<PlanEditor schemeId="s-fields" schemeName="Scheme A" plan={twoBay()} revision={1} canEdit save={save} />, { session: testSession('engineer') });
    return save;
  }
  const tool = (name: RegExp) => fireEvent.click(within(screen.getByRole('toolbar', { name: 'Plan tools' })).getByRole('button', { name }));

  it('when the point load tool’s dead load is "abc" or "-5", then the field says why and the tool keeps the last valid 5 kip', () => {
    renderEditor();
    tool(/Point load/);
    const dead = screen.getByLabelText('Dead, kip');
    fireEvent.change(dead, { target: { value: 'abc' } });
    expect(dead).toHaveAttribute('aria-invalid', 'true');
    expect(describedText(dead)).toBe('Dead load: enter a number of kip, 0 or more');
    fireEvent.change(dead, { target: { value: '-5' } });
    expect(describedText(dead)).toBe('Dead load: enter a number of kip, 0 or more');
    // Leaving and coming back shows the tool's stored value: the default 5 kip, not -5.
    tool(/Select/);
    tool(/Point load/);
    expect(screen.getByLabelText('Dead, kip')).toHaveValue('5');
    expect(screen.getByLabelText('Dead, kip')).not.toHaveAttribute('aria-invalid');
  });

  it('when the point load tool’s live load is set to 3, then it is used and no message shows', () => {
    renderEditor();
    tool(/Point load/);
    fireEvent.change(screen.getByLabelText('Live, kip'), { target: { value: '3' } });
    expect(screen.getByLabelText('Live, kip')).not.toHaveAttribute('aria-invalid');
    tool(/Select/);
    tool(/Point load/);
    expect(screen.getByLabelText('Live, kip')).toHaveValue('3');
  });

  it('when the infill spacing is 0 or the beam count is 1.5, then each field says why and keeps its last valid value', () => {
    renderEditor();
    tool(/Infill/);
    const spacing = screen.getByLabelText('Max spacing, ft');
    fireEvent.change(spacing, { target: { value: '0' } });
    expect(describedText(spacing)).toBe('Max spacing: enter a number of ft, more than 0');
    fireEvent.change(screen.getByLabelText('By'), { target: { value: 'count' } });
    const count = screen.getByLabelText('Beams per bay');
    fireEvent.change(count, { target: { value: '1.5' } });
    expect(count).toHaveAttribute('aria-invalid', 'true');
    expect(describedText(count)).toBe('Beams per bay: enter a whole number, 1 or more');
    fireEvent.change(screen.getByLabelText('By'), { target: { value: 'spacing' } });
    expect(screen.getByLabelText('Max spacing, ft')).toHaveValue('10');
  });

  it('when a zone pressure is negative, then the field says so and "Use this zone" cannot add it', () => {
    renderEditor();
    tool(/Zone/);
    const partitions = screen.getByLabelText('Partitions, psf');
    fireEvent.change(partitions, { target: { value: '-15' } });
    expect(describedText(partitions)).toBe('Partitions: enter a number of psf, 0 or more');
    expect(screen.getByRole('button', { name: 'Use this zone' })).toBeDisabled();
    fireEvent.change(partitions, { target: { value: '15' } });
    expect(screen.getByRole('button', { name: 'Use this zone' })).toBeEnabled();
  });
});
