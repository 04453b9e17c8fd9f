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

function renderEditor(canEdit: boolean, save: (schemeId: string, revision: number, plan: Plan) => Promise<SavePlanOutcome> = vi.fn(async (): Promise<SavePlanOutcome> => ({ kind: 'saved', revision: 2, repairs: [] }))) {
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

  it('when a save meets a newer revision that changed the same grid line, then only that line is asked about and the choice is saved with their other change', async () => {
    // Theirs: grid line 2 moved to 32 ft, and beam b7 deleted.
    const theirs = twoBay();
    theirs.members = theirs.members.filter((m) => m.id !== 'b7');
    theirs.grids = theirs.grids!.map((g) => (g.id === 'g2' ? { ...g, offset_ft: 32 } : g));
    const save = vi
      .fn<(schemeId: string, revision: number, plan: Plan) => Promise<SavePlanOutcome>>()
      .mockResolvedValueOnce({ kind: 'conflict', current: { revision: 5, plan: theirs, updatedBy: 'Imogen Ashdown', updatedAt: null } })
      .mockResolvedValueOnce({ kind: 'saved', revision: 6, repairs: [] });
    renderEditor(true, save);
    // Grid from spacings moves lines 2 and 3 here (to 25 and 50 ft): it is saved, and meets the conflict.
    fireEvent.click(within(screen.getByRole('toolbar', { name: 'Plan tools' })).getByRole('button', { name: /Grid/ }));
    fireEvent.change(screen.getByLabelText('Bays 1, 2, 3 … (east–west), ft'), { target: { value: '2@25' } });
    fireEvent.click(screen.getByRole('button', { name: 'Grid from spacings' }));
    const alert = await screen.findByRole('alert', {}, { timeout: 20_000 });
    expect(alert).toHaveTextContent('Imogen Ashdown saved this scheme (revision 5)');
    expect(alert).toHaveTextContent('You both changed one element');
    const items = within(within(alert).getByRole('list', { name: 'Elements you both changed' })).getAllByRole('listitem');
    expect(items.map((li) => li.textContent)).toEqual(['grid line 2: yours moved; theirs movedKeep mineTake theirs']);
    // The choice is needed before saving.
    expect(within(alert).getByRole('button', { name: 'Save my choices' })).toBeDisabled();
    fireEvent.click(within(items[0]).getByRole('radio', { name: 'Take theirs' }));
    await act(async () => fireEvent.click(within(alert).getByRole('button', { name: 'Save my choices' })));
    expect(screen.queryByRole('alert')).toBeNull();
    expect(save).toHaveBeenCalledTimes(2);
    expect(save.mock.calls[1][1]).toBe(5);
    const sent = save.mock.calls[1][2];
    // Theirs for line 2, mine for line 3 (only I moved it), their deleted beam stays deleted.
    expect(sent.grids!.filter((g) => g.axis === 'x').map((g) => [g.label, g.offset_ft])).toEqual([['1', 0], ['2', 32], ['3', 50]]);
    expect(sent.members.some((m) => m.id === 'b7')).toBe(false);
    await waitFor(() => expect(screen.getByTestId('save-status')).toHaveTextContent('Saved · revision 6'));
  }, 40_000);

  it('when the server merged the save with another, then a notice names who and what came in, and the plan shows it', async () => {
    const save = vi.fn(async (_schemeId: string, _revision: number, plan: Plan): Promise<SavePlanOutcome> => ({
      kind: 'saved',
      revision: 6,
      repairs: [],
      merged: { basedOn: 1, mergedWith: 5, by: ['Imogen Ashdown'], changes: ['beam at A–B / 3 removed'], plan: { ...plan, members: plan.members.filter((m) => m.id !== 'b7') } },
    }));
    renderEditor(true, save);
    fireEvent.click(within(screen.getByRole('toolbar', { name: 'Plan tools' })).getByRole('button', { name: /Grid/ }));
    fireEvent.change(screen.getByLabelText('Bays 1, 2, 3 … (east–west), ft'), { target: { value: '2@25' } });
    fireEvent.click(screen.getByRole('button', { name: 'Grid from spacings' }));
    const notice = await screen.findByTestId('merged-notice', {}, { timeout: 20_000 });
    expect(notice).toHaveTextContent('Merged with Imogen Ashdown’s save (revision 5); your changes are kept and saved with theirs. Taken in from theirs:');
    expect(within(notice).getAllByRole('listitem').map((li) => li.textContent)).toEqual(['beam at A–B / 3 removed']);
    expect(screen.getByTestId('save-status')).toHaveTextContent('Saved · revision 6');
    expect(within(screen.getByRole('table')).getAllByRole('row')).toHaveLength(11);
    fireEvent.click(within(notice).getByRole('button', { name: 'Dismiss' }));
    expect(screen.queryByTestId('merged-notice')).toBeNull();
  }, 40_000);

  it('when the grid spacings cannot be read, then the field says why and nothing changes', () => {
    renderEditor(true);
    fireEvent.click(within(screen.getByRole('toolbar', { name: 'Plan tools' })).getByRole('button', { name: /Grid/ }));
    fireEvent.change(screen.getByLabelText('Bays 1, 2, 3 … (east–west), ft'), { target: { value: '3@thirty' } });
    fireEvent.click(screen.getByRole('button', { name: 'Grid from spacings' }));
    expect(screen.getByLabelText('Bays 1, 2, 3 … (east–west), ft')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByText(/“3@thirty” is not a spacing/)).toBeInTheDocument();
  });
});
