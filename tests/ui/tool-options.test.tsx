import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { act, fireEvent, screen, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { PlanEditor } from '../../src/features/editor/components/plan-editor.component';
import type { SavePlanOutcome } from '../../src/features/editor/api/save-plan.api';
import { dispatch } from '../../src/features/editor/actions/action-registry';
import { createEditorStore } from '../../src/features/editor/store/editor.store';
import { ToolOptionsBar } from '../../src/features/editor/components/tool-options.component';
import { renderWithProviders, testSession } from '../../src/testing/test-utils';
import { parsePlanFile, type Plan } from '../../shared/schemas/plan.schema';

function twoBay(): Plan {
  const raw = JSON.parse(readFileSync(resolve(__dirname, '../fixtures/plans/two-bay.plan.json'), 'utf8'));
  return parsePlanFile(raw).plan!;
}

describe('Tool options: each tool shows and uses its own values', () => {
  beforeEach(() => localStorage.clear());

  it('when the Point load tool is set to Dead 7 / Live 3 and the Line load tool is chosen, then the line load fields show its own 0.4 / 0 klf', () => {
    const store = createEditorStore({ plan: twoBay() });
    renderWithProviders(<ToolOptionsBar store={store} />, { session: testSession('engineer') });
    act(() => dispatch(store, 'tool.pointLoad'));
    fireEvent.change(screen.getByLabelText('Dead, kip'), { target: { value: '7' } });
    fireEvent.change(screen.getByLabelText('Live, kip'), { target: { value: '3' } });
    expect(store.getState().options.pointLoad).toEqual({ D_kip: 7, L_kip: 3 });

    act(() => dispatch(store, 'tool.lineLoad'));
    expect(screen.getByLabelText('Dead, kip/ft')).toHaveValue('0.4');
    expect(screen.getByLabelText('Live, kip/ft')).toHaveValue('0');
    // The values shown are the ones the tool places.
    expect(store.getState().options.lineLoad).toEqual({ D_klf: 0.4, L_klf: 0 });

    fireEvent.change(screen.getByLabelText('Dead, kip/ft'), { target: { value: '1.2' } });
    expect(store.getState().options.lineLoad).toEqual({ D_klf: 1.2, L_klf: 0 });
    // Back on the Point load tool, its own 7 / 3 kip.
    act(() => dispatch(store, 'tool.pointLoad'));
    expect(screen.getByLabelText('Dead, kip')).toHaveValue('7');
    expect(screen.getByLabelText('Live, kip')).toHaveValue('3');
  });

  it('when the editor toolbar switches from Point load (Dead 7 kip) to Line load, then the line load field shows its own 0.4 kip/ft', () => {
    const save = vi.fn(async (): Promise<SavePlanOutcome> => ({ kind: 'saved', revision: 2, repairs: [] }));
    renderWithProviders(<PlanEditor schemeId="s-tools" schemeName="Scheme A" plan={twoBay()} revision={1} canEdit save={save} />, { session: testSession('engineer') });
    fireEvent.click(within(screen.getByRole('toolbar', { name: 'Plan tools' })).getByRole('button', { name: /Point load/ }));
    fireEvent.change(screen.getByLabelText('Dead, kip'), { target: { value: '7' } });
    fireEvent.click(within(screen.getByRole('toolbar', { name: 'Plan tools' })).getByRole('button', { name: /Line load/ }));
    expect(screen.getByLabelText('Dead, kip/ft')).toHaveValue('0.4');
  });
});
