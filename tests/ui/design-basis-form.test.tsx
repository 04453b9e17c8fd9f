import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import type { PlanDesignBasis } from '../../shared/schemas/plan.schema';
import { DesignBasisForm } from '../../src/features/design-basis/components/design-basis-form.component';
import { DEFAULT_DESIGN_BASIS } from '../../src/features/design-basis/components/design-basis-form.schema';
import { ApiError } from '../../src/lib/api-client';

const BASIS: PlanDesignBasis = {
  method: 'LRFD',
  Fy_ksi: 50,
  liveLoadReduction: true,
  deflectionLimits: { live: 360, total: 240 },
};

async function replace(label: string | RegExp, text: string) {
  const input = screen.getByLabelText(label);
  await userEvent.clear(input);
  if (text) await userEvent.type(input, text);
}

describe('DesignBasisForm', () => {
  it('when opened, then it shows the plan basis: LRFD, 50 ksi, L/360 and L/240, reduction on', () => {
    render(<DesignBasisForm value={BASIS} onSubmit={vi.fn()} canEdit />);
    expect(screen.getByRole('radio', { name: /^LRFD/ })).toBeChecked();
    expect(screen.getByLabelText('Fy (ksi)')).toHaveValue('50');
    expect(screen.getByLabelText(/Live load, n/)).toHaveValue('360');
    expect(screen.getByLabelText(/Total load, n/)).toHaveValue('240');
    expect(screen.getByRole('checkbox', { name: /Reduce live loads/ })).toBeChecked();
    expect(screen.getByRole('radio', { name: 'All dead + live' })).toBeChecked();
  });

  it('when the engineer switches to ASD, 65 ksi, blank total limit, no reduction, then onSubmit gets the complete basis', async () => {
    const onSubmit = vi.fn();
    render(<DesignBasisForm value={BASIS} onSubmit={onSubmit} canEdit />);
    await userEvent.click(screen.getByRole('radio', { name: /^ASD/ }));
    await replace('Fy (ksi)', '65');
    await replace(/Total load, n/, '');
    await userEvent.click(screen.getByRole('checkbox', { name: /Reduce live loads/ }));
    await userEvent.click(screen.getByRole('radio', { name: /Superimposed dead \+ live/ }));
    await userEvent.click(screen.getByRole('button', { name: 'Save design basis' }));
    await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
    expect(onSubmit).toHaveBeenCalledWith({
      method: 'ASD',
      Fy_ksi: 65,
      liveLoadReduction: false,
      deflectionLimits: { live: 360, total: null },
      totalDeflectionIncludes: 'superimposedDeadAndLive',
    });
  });

  it('when Fy is outside 36–70 ksi or not a number, then the Fy field says so and nothing is submitted', async () => {
    const onSubmit = vi.fn();
    render(<DesignBasisForm value={BASIS} onSubmit={onSubmit} canEdit />);
    await replace('Fy (ksi)', '100');
    await userEvent.click(screen.getByRole('button', { name: 'Save design basis' }));
    const fy = screen.getByLabelText('Fy (ksi)');
    await waitFor(() => expect(fy).toHaveAccessibleDescription('Fy must be between 36 and 70 ksi'));
    expect(fy).toHaveAttribute('aria-invalid', 'true');
    await replace('Fy (ksi)', '-5');
    await userEvent.click(screen.getByRole('button', { name: 'Save design basis' }));
    await waitFor(() => expect(fy).toHaveAccessibleDescription('Fy must be between 36 and 70 ksi'));
    await replace('Fy (ksi)', 'fifty');
    await userEvent.click(screen.getByRole('button', { name: 'Save design basis' }));
    await waitFor(() => expect(fy).toHaveAccessibleDescription('Fy must be a number in ksi, such as 50'));
    await replace('Fy (ksi)', '');
    await userEvent.click(screen.getByRole('button', { name: 'Save design basis' }));
    await waitFor(() => expect(fy).toHaveAccessibleDescription('Enter Fy in ksi (50 for ASTM A992)'));
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('when a deflection limit is not a positive whole number, then that field says so beside it', async () => {
    const onSubmit = vi.fn();
    render(<DesignBasisForm value={BASIS} onSubmit={onSubmit} canEdit />);
    await replace(/Live load, n/, '360.5');
    await replace(/Total load, n/, '0');
    await userEvent.click(screen.getByRole('button', { name: 'Save design basis' }));
    await waitFor(() =>
      expect(screen.getByLabelText(/Live load, n/)).toHaveAccessibleDescription(
        'Live-load limit: a whole number n of span/n (for example 360), or blank to skip the check',
      ),
    );
    expect(screen.getByLabelText(/Total load, n/)).toHaveAccessibleDescription(
      'Total-load limit: a whole number n of span/n (for example 240), or blank to skip the check',
    );
    expect(screen.getByLabelText('Fy (ksi)')).not.toHaveAttribute('aria-invalid');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('when limits were cleared, then "Use IBC floor limits" puts back 360 and 240 (IBC Table 1604.3)', async () => {
    const onSubmit = vi.fn();
    render(<DesignBasisForm value={{ ...BASIS, deflectionLimits: { live: null, total: null } }} onSubmit={onSubmit} canEdit />);
    await userEvent.click(screen.getByRole('button', { name: /Use IBC floor limits/ }));
    await userEvent.click(screen.getByRole('button', { name: 'Save design basis' }));
    await waitFor(() => expect(onSubmit).toHaveBeenCalled());
    expect(onSubmit.mock.calls[0][0].deflectionLimits).toEqual({ live: 360, total: 240 });
  });

  it('when the server rejects a field, then its message sits beside that field', async () => {
    const onSubmit = vi.fn().mockRejectedValue(new ApiError(400, 'invalid_input', 'Invalid input.', { Fy_ksi: 'Fy is not allowed for this project' }));
    render(<DesignBasisForm value={BASIS} onSubmit={onSubmit} canEdit />);
    await replace('Fy (ksi)', '55');
    await userEvent.click(screen.getByRole('button', { name: 'Save design basis' }));
    await waitFor(() => expect(screen.getByLabelText('Fy (ksi)')).toHaveAccessibleDescription('Fy is not allowed for this project'));
  });

  it('when SI display is chosen, then Fy stays in ksi with its MPa equivalent beside it', () => {
    render(<DesignBasisForm value={BASIS} onSubmit={vi.fn()} canEdit units="SI" />);
    expect(screen.getByLabelText('Fy (ksi)')).toHaveAccessibleDescription(/= 344.7 MPa/); // 50 × 6.894 757 (NIST SP 811)
  });

  it('when the role cannot edit, then there is no Save button and the inputs are read-only or disabled', () => {
    render(<DesignBasisForm value={DEFAULT_DESIGN_BASIS} onSubmit={vi.fn()} canEdit={false} />);
    expect(screen.queryByRole('button', { name: 'Save design basis' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Use IBC/ })).not.toBeInTheDocument();
    expect(screen.getByLabelText('Fy (ksi)')).toHaveAttribute('readonly');
    expect(screen.getByRole('radio', { name: /^ASD/ })).toBeDisabled();
    expect(screen.getByRole('checkbox', { name: /Reduce live loads/ })).toBeDisabled();
    expect(screen.getByText(/can read the design basis but not change it/)).toBeInTheDocument();
  });
});

// Composite settings (issue 11). An invented project basis: composite on, 3/4 in studs,
// Fu 65 ksi, 25 % minimum, 10 lb per stud, 20 psf construction live, unshored, cambered
// (the defaults of calc-interface.md "Additions"; 10 lb per stud is common practice).
const COMPOSITE_BASIS: PlanDesignBasis = {
  ...BASIS,
  composite: { enabled: true, studDiameter_in: 0.75, studFu_ksi: 65, minPercentComposite: 0.25, constructionLive_psf: 20, shored: false, camber: true, studEquivalentWeight_lb: 10 },
  columns: { series: ['W14'], storeysPerTier: 2 },
};

describe('DesignBasisForm composite settings', () => {
  it('when opened on a composite basis, then it shows each setting, the minimum as a percent', () => {
    render(<DesignBasisForm value={COMPOSITE_BASIS} onSubmit={vi.fn()} canEdit />);
    expect(screen.getByRole('checkbox', { name: /Design beams and girders under a slab composite/ })).toBeChecked();
    expect(screen.getByLabelText('Stud diameter')).toHaveValue('0.75');
    expect(screen.getByLabelText('Stud Fu (ksi)')).toHaveValue('65');
    expect(screen.getByLabelText('Minimum composite (%)')).toHaveValue('25');
    expect(screen.getByLabelText('Steel-equivalent weight of a stud (lb)')).toHaveValue('10');
    expect(screen.getByLabelText('Construction live load (psf)')).toHaveValue('20');
    expect(screen.getByRole('checkbox', { name: /Shored construction/ })).not.toBeChecked();
    expect(screen.getByRole('checkbox', { name: /Camber unshored members/ })).toBeChecked();
  });

  it('when the engineer sets 40 % minimum, 12 lb per stud, 5/8 in studs and no camber, then onSubmit gets them (fraction 0.4) and keeps the column settings', async () => {
    const onSubmit = vi.fn();
    render(<DesignBasisForm value={COMPOSITE_BASIS} onSubmit={onSubmit} canEdit />);
    await replace('Minimum composite (%)', '40');
    await replace('Steel-equivalent weight of a stud (lb)', '12');
    await userEvent.selectOptions(screen.getByLabelText('Stud diameter'), '0.625');
    await userEvent.click(screen.getByRole('checkbox', { name: /Camber unshored members/ }));
    await userEvent.click(screen.getByRole('button', { name: 'Save design basis' }));
    await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
    const next = onSubmit.mock.calls[0][0] as PlanDesignBasis;
    expect(next.composite).toEqual({ enabled: true, studDiameter_in: 0.625, studFu_ksi: 65, minPercentComposite: 0.4, constructionLive_psf: 20, shored: false, camber: false, studEquivalentWeight_lb: 12 });
    expect(next.columns).toEqual({ series: ['W14'], storeysPerTier: 2 });
  });

  it('when a plan without composite settings switches composite on, then the defaults come with it', async () => {
    const onSubmit = vi.fn();
    render(<DesignBasisForm value={BASIS} onSubmit={onSubmit} canEdit />);
    expect(screen.getByRole('checkbox', { name: /Design beams and girders under a slab composite/ })).not.toBeChecked();
    await userEvent.click(screen.getByRole('checkbox', { name: /Design beams and girders under a slab composite/ }));
    await userEvent.click(screen.getByRole('button', { name: 'Save design basis' }));
    await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
    expect(onSubmit.mock.calls[0][0].composite).toEqual({ ...COMPOSITE_BASIS.composite });
  });

  it('when the minimum composite is under 25 % or a stud weight is text, then those fields say so and nothing is submitted', async () => {
    const onSubmit = vi.fn();
    render(<DesignBasisForm value={COMPOSITE_BASIS} onSubmit={onSubmit} canEdit />);
    await replace('Minimum composite (%)', '10');
    await replace('Steel-equivalent weight of a stud (lb)', 'ten');
    await replace('Stud Fu (ksi)', '400');
    await userEvent.click(screen.getByRole('button', { name: 'Save design basis' }));
    await waitFor(() => expect(screen.getByLabelText('Minimum composite (%)')).toHaveAccessibleDescription('Minimum composite must be between 25 and 100 %'));
    expect(screen.getByLabelText('Steel-equivalent weight of a stud (lb)')).toHaveAccessibleDescription('Steel-equivalent weight of a stud must be a number in lb');
    expect(screen.getByLabelText('Stud Fu (ksi)')).toHaveAccessibleDescription('Stud Fu must be between 50 and 100 ksi');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('when the role cannot edit, then the composite settings are shown but cannot be changed', () => {
    render(<DesignBasisForm value={COMPOSITE_BASIS} onSubmit={vi.fn()} canEdit={false} />);
    expect(screen.getByRole('checkbox', { name: /Design beams and girders under a slab composite/ })).toBeDisabled();
    expect(screen.getByLabelText('Stud diameter')).toBeDisabled();
    expect(screen.getByLabelText('Minimum composite (%)')).toHaveValue('25');
    expect(screen.getByRole('checkbox', { name: /Camber unshored members/ })).toBeDisabled();
  });
});
