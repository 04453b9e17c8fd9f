import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { PlanEditor } from '../../src/features/editor/components/plan-editor.component';
import type { SavePlanOutcome } from '../../src/features/editor/api/save-plan.api';
import { drawStatic } from '../../src/features/editor/canvas/draw-static';
import { buildStaticGeometry } from '../../src/features/editor/canvas/static-geometry';
import { readPlanTheme } from '../../src/features/editor/canvas/plan-theme';
import { UNITS_STORAGE_KEY } from '../../src/lib/units-context';
import { renderWithProviders, testSession } from '../../src/testing/test-utils';
import { parsePlanFile, type Plan } from '../../shared/schemas/plan.schema';

// The two-bay fixture: grid lines 1, 2, 3 at 0, 30, 60 ft and A, B at 0, 36 ft.
function twoBay(): Plan {
  const raw = JSON.parse(readFileSync(resolve(__dirname, '../fixtures/plans/two-bay.plan.json'), 'utf8'));
  return parsePlanFile(raw).plan!;
}

function renderEditor(save = vi.fn(async (): Promise<SavePlanOutcome> => ({ kind: 'saved', revision: 2, repairs: [] }))) {
  const plan = twoBay();
  const utils = renderWithProviders(<PlanEditor schemeId="s-units" schemeName="Scheme A" plan={plan} revision={1} canEdit save={save} />, {
    session: testSession('engineer'),
  });
  return { ...utils, plan, save };
}

const spanCells = () => within(screen.getByRole('table')).getAllByRole('row').slice(1).map((r) => within(r).getAllByRole('cell')[1].textContent);

describe('Plan editor in SI', () => {
  beforeEach(() => localStorage.clear());

  it('when SI is chosen and "3@9.144" is typed as grid spacings, then the saved plan has lines 30 ft apart', async () => {
    localStorage.setItem(UNITS_STORAGE_KEY, 'SI');
    const { save } = renderEditor();
    fireEvent.click(within(screen.getByRole('toolbar', { name: 'Plan tools' })).getByRole('button', { name: /Grid/ }));
    fireEvent.change(screen.getByLabelText('Bays 1, 2, 3 … (east–west), m'), { target: { value: '3@9.144' } });
    fireEvent.click(screen.getByRole('button', { name: 'Grid from spacings' }));
    await waitFor(() => expect(save).toHaveBeenCalled(), { timeout: 8000 });
    const sent = save.mock.calls.at(-1) as unknown as [string, number, Plan];
    // 9.144 m ÷ 0.3048 m/ft = 30 ft exactly (NIST SP 811: 1 ft = 0.3048 m); the plan stays in feet.
    const xs = sent[2].grids!.filter((g) => g.axis === 'x').map((g) => g.offset_ft).sort((a, b) => a - b);
    expect(xs).toEqual([0, 30, 60, 90]);
  });

  it('when the Plan units switch is set to SI, then member spans, the scale bar and the point-load field read metric', async () => {
    renderEditor();
    // US first: a 30 ft girder reads 30.0′.
    expect(spanCells()).toContain('girder 30.0′');
    fireEvent.click(screen.getByRole('radio', { name: 'SI' }));
    expect(localStorage.getItem(UNITS_STORAGE_KEY)).toBe('SI');
    // 30 ft × 0.3048 = 9.144 m → 9.14 m (NIST SP 811: 1 ft = 0.3048 m exactly).
    expect(spanCells()).toContain('girder 9.14 m');
    for (const text of spanCells()) expect(text).toMatch(/^(girder|beam) \d+\.\d\d m$/);
    expect(screen.getByTestId('scale-indicator')).toHaveTextContent(/^\d+(\.\d+)? m · [\d.]+ px\/m$/);
    fireEvent.click(within(screen.getByRole('toolbar', { name: 'Plan tools' })).getByRole('button', { name: /Point load/ }));
    // The default 5 kip shows as 22.2411 kN (5 × 4.4482216, NIST SP 811).
    expect(screen.getByLabelText('Dead, kN')).toHaveValue('22.2411');
  });

  it('when a point load of 44.482216152605 kN is typed in SI, then the tool keeps 10 kip; a pressure unit is refused', () => {
    localStorage.setItem(UNITS_STORAGE_KEY, 'SI');
    renderEditor();
    fireEvent.click(within(screen.getByRole('toolbar', { name: 'Plan tools' })).getByRole('button', { name: /Point load/ }));
    const dead = screen.getByLabelText('Dead, kN');
    fireEvent.change(dead, { target: { value: '12 psf' } });
    expect(dead).toHaveAttribute('aria-invalid', 'true');
    fireEvent.change(dead, { target: { value: '44.482216152605' } }); // 10 kip × 4.4482216152605 kN/kip (NIST SP 811, exact)
    expect(dead).not.toHaveAttribute('aria-invalid');
    // Back in US the field shows the stored tool value: 10 kip.
    fireEvent.click(screen.getByRole('radio', { name: 'US' }));
    expect(Number((screen.getByLabelText('Dead, kip') as HTMLInputElement).value)).toBeCloseTo(10, 9);
  });
});

describe('Plan canvas labels in SI', () => {
  it('when the plan is drawn in SI, then the grid dimensions read metres and not feet-and-inches', () => {
    const plan = twoBay();
    const canvas = document.createElement('canvas');
    canvas.width = 800;
    canvas.height = 600;
    const ctx = canvas.getContext('2d')!;
    const view = { scale: 8, x: 100, y: 500, width: 800, height: 600 };
    const geo = buildStaticGeometry(plan, plan.levels[0].id, { byId: new Map(), result: null, pending: true, error: null, lastEditToSizesMs: null, lastEngineMs: null });
    const texts = (system: 'US' | 'SI') => {
      (ctx as unknown as { __clearEvents(): void }).__clearEvents();
      drawStatic(ctx, plan, geo, view, readPlanTheme(), system);
      return (ctx as unknown as { __getEvents(): { type: string; props: { text?: string } }[] }).__getEvents().filter((e) => e.type === 'fillText').map((e) => e.props.text);
    };
    expect(texts('US')).toEqual(expect.arrayContaining([`30'-0"`, `36'-0"`]));
    const si = texts('SI');
    expect(si).toEqual(expect.arrayContaining(['9.144 m', '10.973 m'])); // 30 ft and 36 ft × 0.3048
    expect(si.some((t) => t?.includes(`'-`))).toBe(false);
  });
});
