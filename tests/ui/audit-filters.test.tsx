import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import type { AuditEvent } from '../../src/features/audit/api/get-audit.api';
import { AuditFiltersForm } from '../../src/features/audit/components/audit-filters.component';
import { AuditTable } from '../../src/features/audit/components/audit-table.component';

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

describe('audit log table', () => {
  const event = (id: string, action: string, detail: Record<string, unknown> | null): AuditEvent => ({
    id,
    userId: 'u-3',
    action,
    actor: 'Dominic Hale <manager@example.com>',
    target: 'Harrow Quay Clinic / Scheme B',
    detail,
    createdAt: '2026-12-02T04:16:57.000Z',
  });

  it('when a scheme status changes, a comment is posted or unit prices change, then each reads in words and the status change reads from → to', () => {
    render(
      <AuditTable
        events={[
          event('1', 'scheme.status_changed', { schemeId: 's-1', from: 'in_review', to: 'chosen' }),
          event('2', 'scheme.commented', null),
          event('3', 'prices.changed', null),
        ]}
      />,
    );
    expect(screen.getByText('Scheme status changed')).toBeInTheDocument();
    expect(screen.getByText('Comment on a scheme')).toBeInTheDocument();
    expect(screen.getByText('Unit prices changed')).toBeInTheDocument();
    expect(screen.getByText('in review → chosen')).toBeInTheDocument();
  });

  it('when the "What" list is opened, then unit prices are offered as an area', () => {
    render(<AuditFiltersForm people={[]} onApply={() => {}} />);
    const options = within(screen.getByLabelText('What')).getAllByRole('option').map((o) => [(o as HTMLOptionElement).value, o.textContent]);
    expect(options).toEqual(expect.arrayContaining([['prices', 'Unit prices'], ['scheme.status_changed', '— Scheme status changed']]));
  });
});
