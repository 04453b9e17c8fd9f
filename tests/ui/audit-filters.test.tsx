import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { AuditFiltersForm } from '../../src/features/audit/components/audit-filters.component';

describe('audit log filter', () => {
  it('when the "What" list is opened, then schemes, plan revisions and design runs are offered as areas and as single actions', () => {
    render(<AuditFiltersForm people={[]} onApply={() => {}} />);
    const what = screen.getByLabelText('What');
    const options = within(what).getAllByRole('option').map((o) => [(o as HTMLOptionElement).value, o.textContent]);
    expect(options).toEqual(
      expect.arrayContaining([
        ['scheme', 'Schemes'],
        ['plan', 'Plan revisions'],
        ['design', 'Design runs'],
        ['plan.revised', '— Plan saved'],
        ['plan.restored', '— Plan revision restored'],
        ['design.run', '— Design run'],
        ['scheme.cloned', '— Scheme cloned'],
        ['scheme.deleted', '— Scheme deleted'],
        ['scheme.imported', '— Scheme imported from a plan file'],
      ]),
    );
  });

  it('when "Plan saved" is chosen and applied, then the filter asks for action plan.revised', async () => {
    const onApply = vi.fn();
    render(<AuditFiltersForm people={[]} onApply={onApply} />);
    await userEvent.selectOptions(screen.getByLabelText('What'), 'plan.revised');
    await userEvent.click(screen.getByRole('button', { name: 'Apply' }));
    expect(onApply).toHaveBeenCalledWith({ action: 'plan.revised', userId: undefined, from: undefined, to: undefined });
  });
});
