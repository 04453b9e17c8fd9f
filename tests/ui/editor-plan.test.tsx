import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { act, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { PlanEditor } from '../../src/features/editor/components/plan-editor.component';
import type { SavePlanOutcome } from '../../src/features/editor/api/save-plan.api';
import { renderWithProviders, testSession } from '../../src/testing/test-utils';
import { parsePlanFile, type Plan } from '../../shared/schemas/plan.schema';

function twoBay(): Plan {
  const raw = JSON.parse(readFileSync(resolve(__dirname, '../fixtures/plans/two-bay.plan.json'), 'utf8'));
  return parsePlanFile(raw).plan!;
}

function renderEditor(canEdit: boolean, save = vi.fn(async (): Promise<SavePlanOutcome> => ({ kind: 'saved', revision: 2, repairs: [] }))) {
  const plan = twoBay();
  const utils = renderWithProviders(<PlanEditor schemeId="s1" schemeName="Scheme A" plan={plan} revision={1} canEdit={canEdit} save={save} />, {
    session: testSession(canEdit ? 'engineer' : 'drafter'),
  });
  return { ...utils, plan, save };
}

describe('Plan editor', () => {
  // Unsaved drafts are kept in localStorage; each test starts without one.
  beforeEach(() => localStorage.clear());

  it('when an engineer opens a plan, then every tool is offered with its shortcut and the members are sized in the table', async () => {
    renderEditor(true);
    const tools = screen.getByRole('toolbar', { name: 'Plan tools' });
    expect(within(tools).getAllByRole('button').map((b) => b.textContent)).toEqual([
      'SelectV', 'GridG', 'ColumnC', 'GirderR', 'BeamB', 'InfillI', 'DeckD', 'ZoneZ', 'Point loadP', 'Line loadL', 'OpeningO', 'MeasureM', 'DeleteE',
    ]);
    const table = screen.getByRole('table');
    // Two-bay fixture: 4 girders and 7 beams, designed in the browser.
    await waitFor(() => expect(screen.getByTestId('design-status')).toHaveTextContent('11 members sized'), { timeout: 20_000 });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(11);
    for (const row of rows) {
      const cells = within(row).getAllByRole('cell');
      expect(cells[2].textContent).toMatch(/^W\d+X[\d.]+$/);
      expect(cells[3].textContent).toMatch(/^\d\.\d\d$/);
      expect(cells[4].textContent).toMatch(/^(Passes|Over|Not designed) — /);
    }
  });

  it('when a tool key is pressed, then the same tool as its toolbar button becomes active', () => {
    renderEditor(true);
    const tools = screen.getByRole('toolbar', { name: 'Plan tools' });
    fireEvent.keyDown(screen.getByTestId('plan-canvas'), { key: 'r' });
    expect(within(tools).getByRole('button', { name: /Girder/ })).toHaveAttribute('aria-pressed', 'true');
    fireEvent.click(within(tools).getByRole('button', { name: /Infill/ }));
    expect(within(tools).getByRole('button', { name: /Infill/ })).toHaveAttribute('aria-pressed', 'true');
    expect(screen.getByLabelText('Max spacing, ft')).toHaveValue('10');
  });

  it('when "Delete selected" is chosen from the Plan menu, then it does what the Delete key does', async () => {
    renderEditor(true);
    fireEvent.click(screen.getAllByRole('button', { name: /^Select / })[0]);
    fireEvent.click(screen.getByRole('button', { name: 'Plan menu ▾' }));
    const menu = screen.getByRole('menu', { name: 'Plan menu' });
    expect(within(menu).getByRole('menuitem', { name: /Delete selected/ })).toHaveTextContent('Del');
    fireEvent.click(within(menu).getByRole('menuitem', { name: /Delete selected/ }));
    expect(within(screen.getByRole('table')).getAllByRole('row')).toHaveLength(11);
    fireEvent.keyDown(screen.getByTestId('plan-canvas'), { key: 'z', ctrlKey: true });
    expect(within(screen.getByRole('table')).getAllByRole('row')).toHaveLength(12);
  });

  it('when a row of the member list is chosen, then that member is the selection', async () => {
    renderEditor(true);
    await waitFor(() => expect(screen.getByTestId('design-status')).toHaveTextContent('11 members sized'), { timeout: 20_000 });
    const first = screen.getAllByRole('button', { name: /^Select / })[0];
    fireEvent.click(first);
    expect(first).toHaveAttribute('aria-pressed', 'true');
    expect(screen.getAllByRole('button', { name: /^Select / }).filter((b) => b.getAttribute('aria-pressed') === 'true')).toHaveLength(1);
  });

  it('when an unsaved draft was kept on this device, then the editor offers to restore it', async () => {
    const plan = twoBay();
    const kept = { ...plan, members: plan.members.slice(2) };
    localStorage.setItem('baywright.plan-draft.s1', JSON.stringify({ baseRevision: 1, plan: kept, keptAt: '2026-12-01T10:00:00Z' }));
    renderEditor(true);
    const alert = screen.getByRole('alert');
    expect(alert).toHaveTextContent('were kept on this device but not saved');
    fireEvent.click(within(alert).getByRole('button', { name: 'Restore them' }));
    expect(within(screen.getByRole('table')).getAllByRole('row')).toHaveLength(10);
  });

  it('when a drafter opens a plan, then no tools, undo or tool options are shown', () => {
    renderEditor(false);
    expect(screen.queryByRole('toolbar', { name: 'Plan tools' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Undo' })).toBeNull();
    expect(screen.queryByRole('group', { name: 'Tool options' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Fit to view' })).toBeInTheDocument();
    expect(screen.getByTestId('plan-editor')).toHaveAttribute('data-read-only', 'true');
    // Delete is refused even from the keyboard.
    fireEvent.click(screen.getAllByRole('button', { name: /^Select / })[0]);
    fireEvent.keyDown(screen.getByTestId('plan-canvas'), { key: 'Delete' });
    expect(within(screen.getByRole('table')).getAllByRole('row')).toHaveLength(12);
  });

  it('when a save meets a newer revision, then the banner says what changed and "Take theirs" shows their plan', async () => {
    const theirs = twoBay();
    theirs.members = theirs.members.filter((m) => m.id !== 'b7');
    const save = vi.fn(async (): Promise<SavePlanOutcome> => ({ kind: 'conflict', current: { revision: 5, plan: theirs, updatedBy: 'Imogen Ashdown', updatedAt: null } }));
    renderEditor(true, save);
    fireEvent.click(screen.getByRole('button', { name: /Infill/ }));
    // Grid from spacings is an edit: it is saved, and meets the conflict.
    fireEvent.click(within(screen.getByRole('toolbar', { name: 'Plan tools' })).getByRole('button', { name: /Grid/ }));
    fireEvent.change(screen.getByLabelText('Bays 1, 2, 3 … (east–west), ft'), { target: { value: '2@25' } });
    fireEvent.click(screen.getByRole('button', { name: 'Grid from spacings' }));
    const alert = await screen.findByRole('alert', {}, { timeout: 5000 });
    expect(alert).toHaveTextContent('Imogen Ashdown saved this scheme (revision 5)');
    expect(alert).toHaveTextContent('Changed there: 1 member removed.');
    expect(alert).toHaveTextContent('Yours differs from theirs by: 2 grid lines changed, 1 member added.');
    await act(async () => fireEvent.click(screen.getByRole('button', { name: 'Take theirs' })));
    expect(screen.queryByRole('alert')).toBeNull();
    expect(screen.getByTestId('save-status')).toHaveTextContent('Saved · revision 5');
  });

  it('when the grid spacings cannot be read, then the field says why and nothing changes', () => {
    renderEditor(true);
    fireEvent.click(within(screen.getByRole('toolbar', { name: 'Plan tools' })).getByRole('button', { name: /Grid/ }));
    fireEvent.change(screen.getByLabelText('Bays 1, 2, 3 … (east–west), ft'), { target: { value: '3@thirty' } });
    fireEvent.click(screen.getByRole('button', { name: 'Grid from spacings' }));
    expect(screen.getByLabelText('Bays 1, 2, 3 … (east–west), ft')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByText(/“3@thirty” is not a spacing/)).toBeInTheDocument();
  });
});
