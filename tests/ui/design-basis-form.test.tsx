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
