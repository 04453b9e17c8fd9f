import { fireEvent, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { DeckSlabEditor } from '../../src/features/editor/components/deck-slab-editor.component';
import { BUILT_IN_DECK_PROFILES } from '../../shared/schemas/deck-profile.schema';
import type { PlanSlab } from '../../shared/schemas/plan.schema';

// The slab build-up of a deck on the Plan (issue 11). Invented slab: lightweight concrete
// 114 pcf, 3¼ in over 3 in deck, 6 in ribs at 12 in, 2.5 psf deck.
const SLAB: PlanSlab = { ...BUILT_IN_DECK_PROFILES[0].slab, profile: BUILT_IN_DECK_PROFILES[0].name };

describe('DeckSlabEditor', () => {
  it('when a deck has a slab, then its dead load and the arithmetic are shown', () => {
    render(<DeckSlabEditor slab={SLAB} profiles={BUILT_IN_DECK_PROFILES} canEdit onChange={vi.fn()} />);
    // 114 × (3.25 + 3 × 6/12) / 12 = 45.1 psf + 2.5 psf deck = 47.6 psf (plain geometry, design-basis §1)
    expect(screen.getByTestId('slab-dead-load')).toHaveTextContent('Slab dead load 47.6 psf: slab 114 pcf × (3.25 + 3 × 6/12) in / 12 = 45.1 psf + deck 2.5 psf = 47.6 psf');
    expect(screen.getByLabelText('Slab')).toHaveValue(BUILT_IN_DECK_PROFILES[0].id);
  });

  it("when the engineer changes f'c to 4, then onChange gets the build-up with 4 ksi and no longer names the library profile", () => {
    const onChange = vi.fn();
    render(<DeckSlabEditor slab={SLAB} profiles={BUILT_IN_DECK_PROFILES} canEdit onChange={onChange} />);
    const fc = screen.getByLabelText("f'c, ksi");
    fireEvent.change(fc, { target: { value: '4' } });
    fireEvent.blur(fc);
    expect(onChange).toHaveBeenCalledWith({ ...BUILT_IN_DECK_PROFILES[0].slab, fc_ksi: 4 });
  });

  it('when a value is out of range or the ribs are wider than their spacing, then the field says so and nothing changes', () => {
    const onChange = vi.fn();
    render(<DeckSlabEditor slab={SLAB} profiles={BUILT_IN_DECK_PROFILES} canEdit onChange={onChange} />);
    const rib = screen.getByLabelText('Rib height, in');
    fireEvent.change(rib, { target: { value: '30' } });
    fireEvent.blur(rib);
    expect(rib).toHaveAccessibleDescription('Rib height must be between 0.5 and 8 in');
    const width = screen.getByLabelText('Average rib width, in');
    fireEvent.change(width, { target: { value: '14' } });
    fireEvent.blur(width);
    expect(width).toHaveAccessibleDescription('Average rib width must not exceed the rib spacing');
    expect(onChange).not.toHaveBeenCalled();
  });

  it('when the engineer picks the normal-weight 3 in profile, then the deck takes its build-up and name', async () => {
    const onChange = vi.fn();
    render(<DeckSlabEditor slab={null} profiles={BUILT_IN_DECK_PROFILES} canEdit onChange={onChange} />);
    await userEvent.selectOptions(screen.getByLabelText('Slab'), BUILT_IN_DECK_PROFILES[1].id);
    expect(onChange).toHaveBeenCalledWith({ ...BUILT_IN_DECK_PROFILES[1].slab, profile: BUILT_IN_DECK_PROFILES[1].name });
  });

  it('when the role cannot edit, then the build-up is read-only and there is no save to the library', () => {
    render(<DeckSlabEditor slab={SLAB} profiles={BUILT_IN_DECK_PROFILES} canEdit={false} onChange={vi.fn()} onSaveProfile={vi.fn()} />);
    expect(screen.getByLabelText('Slab')).toBeDisabled();
    expect(screen.getByLabelText('Topping above the ribs, in')).toHaveAttribute('readonly');
    expect(screen.queryByRole('button', { name: 'Save to library' })).toBeNull();
  });
  it('when the profile a deck was set from has been renamed or deleted in the library, then the picker says so and the build-up stays', () => {
    render(<DeckSlabEditor slab={{ ...SLAB, profile: 'Gone from the library' }} profiles={BUILT_IN_DECK_PROFILES} canEdit onChange={vi.fn()} />);
    expect(screen.getByLabelText('Slab')).toHaveValue('custom');
    expect(screen.getByRole('option', { name: 'Gone from the library (no longer in the library; the deck keeps its build-up)' })).toBeInTheDocument();
    expect(screen.getByTestId('slab-dead-load')).toHaveTextContent('Slab dead load 47.6 psf');
  });
});
