import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { PlanEditor } from '../../src/features/editor/components/plan-editor.component';
import type { SavePlanOutcome } from '../../src/features/editor/api/save-plan.api';
import { renderWithProviders, testSession } from '../../src/testing/test-utils';
import { parsePlanFile, type Plan } from '../../shared/schemas/plan.schema';

/** The two-bay fixture with a second level (Level 3) framed as Level 2 (an invented scheme of our own). */
function twoLevels(): Plan {
  const raw = JSON.parse(readFileSync(resolve(__dirname, '../fixtures/plans/two-bay.plan.json'), 'utf8'));
  const plan = parsePlanFile(raw).plan!;
  return {
    ...plan,
    levels: [...plan.levels, { id: 'L3', name: 'Level 3', elevation_ft: 28 }],
    columns: plan.columns.map((c) => ({ ...c, levels: [...c.levels, 'L3'] })),
    members: [...plan.members, ...plan.members.map((m) => ({ ...m, id: `${m.id}-3`, level: 'L3', mark: null }))],
  };
}

function renderEditor() {
  const save = vi.fn(async (): Promise<SavePlanOutcome> => ({ kind: 'saved', revision: 2, repairs: [] }));
  renderWithProviders(<PlanEditor schemeId="s1" schemeName="Scheme A" plan={twoLevels()} revision={1} canEdit save={save} />, { session: testSession('engineer') });
}

/** Moves the pointer along a few rows of the canvas until a member's tooltip shows (the beams run north–south). */
function hoverAMember(): HTMLElement {
  const canvas = screen.getByTestId('plan-canvas');
  for (const sy of [420, 100, 300]) {
    for (let sx = 0; sx <= 800; sx += 1) {
      // jsdom has no PointerEvent: a MouseEvent of type pointermove carries the coordinates.
      fireEvent(canvas, new MouseEvent('pointermove', { clientX: sx, clientY: sy, buttons: 0, bubbles: true }));
      const tip = screen.queryByRole('tooltip');
      if (tip) return tip;
    }
  }
  throw new Error('no member under the pointer anywhere on the middle rows');
}

describe('Plan canvas tooltip', () => {
  beforeEach(() => localStorage.clear());

  it('when the plan is edited under a still pointer (a member deleted), then the tooltip goes', async () => {
    renderEditor();
    const tip = hoverAMember();
    expect(tip.textContent).toMatch(/ · /);
    fireEvent.click(screen.getAllByRole('button', { name: /^Select / })[0]);
    fireEvent.keyDown(screen.getByTestId('plan-canvas'), { key: 'Delete' });
    await waitFor(() => expect(within(screen.getByRole('table')).getAllByRole('row')).toHaveLength(11));
    expect(screen.queryByRole('tooltip')).toBeNull();
    // Moving again shows it again, for what is under the pointer now.
    expect(hoverAMember().textContent).toMatch(/ · /);
  });

  it('when another level is shown, then the tooltip of the level before goes', () => {
    renderEditor();
    hoverAMember();
    fireEvent.change(screen.getByLabelText('Level'), { target: { value: 'L2' } });
    fireEvent.change(screen.getByLabelText('Level'), { target: { value: 'L3' } });
    expect(screen.queryByRole('tooltip')).toBeNull();
  });
});
