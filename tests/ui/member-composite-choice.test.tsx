import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { MemberCompositeChoice } from '../../src/features/member-sheet/components/member-composite.component';

// The Member sheet's composite on/off for one member (plan file members[].composite, issue 11).
describe('MemberCompositeChoice', () => {
  it('when a member follows a composite design basis and the engineer picks bare steel, then onChange gets false; picking the basis again gives null', async () => {
    const onChange = vi.fn();
    const { rerender } = render(<MemberCompositeChoice value={null} basisComposite canEdit onChange={onChange} />);
    const select = screen.getByRole('combobox', { name: 'Composite design' });
    expect(select).toHaveValue('basis');
    expect(screen.getByRole('option', { name: 'Follow the design basis (design basis: composite)' })).toBeInTheDocument();
    await userEvent.selectOptions(select, 'off');
    expect(onChange).toHaveBeenLastCalledWith(false);
    rerender(<MemberCompositeChoice value={false} basisComposite canEdit onChange={onChange} />);
    expect(screen.getByRole('combobox', { name: 'Composite design' })).toHaveValue('off');
    await userEvent.selectOptions(screen.getByRole('combobox', { name: 'Composite design' }), 'basis');
    expect(onChange).toHaveBeenLastCalledWith(null);
    await userEvent.selectOptions(screen.getByRole('combobox', { name: 'Composite design' }), 'on');
    expect(onChange).toHaveBeenLastCalledWith(true);
  });

  it('when the role cannot edit, then the choice is read as text with no control', () => {
    render(<MemberCompositeChoice value={false} basisComposite canEdit={false} onChange={vi.fn()} />);
    expect(screen.queryByRole('combobox')).toBeNull();
    expect(screen.getByTestId('member-composite-choice')).toHaveTextContent('Composite design: bare steel (non-composite).');
  });
});
