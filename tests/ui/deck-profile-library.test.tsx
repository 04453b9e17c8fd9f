import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { DeckProfileLibrary } from '../../src/features/editor/components/deck-profile-library.component';
import { ApiError } from '../../src/lib/api-client';
import { BUILT_IN_DECK_PROFILES, type DeckProfile } from '../../shared/schemas/deck-profile.schema';

// The firm's deck profile library on the Plan (issue 11): rename and delete the firm's own
// profiles; built-ins are fixed; drafters and managers read it. Invented firm profile.
const FIRM: DeckProfile = { id: 'firm-1', name: 'Harbour lightweight', builtIn: false, slab: { ...BUILT_IN_DECK_PROFILES[0].slab, toppingThickness_in: 3.5 } };
const PROFILES = [...BUILT_IN_DECK_PROFILES, FIRM];

const open = async () => {
  const user = userEvent.setup();
  await user.click(screen.getByText(`Deck profile library (${PROFILES.length})`));
  return user;
};

describe('DeckProfileLibrary', () => {
  it('when an engineer renames the firm profile, then onRename gets its id and the new name and the list says so', async () => {
    const onRename = vi.fn().mockResolvedValue({});
    render(<DeckProfileLibrary profiles={PROFILES} canEdit onRename={onRename} onDelete={vi.fn()} />);
    const user = await open();
    const item = screen.getByRole('listitem', { name: 'Deck profile Harbour lightweight' });
    await user.click(within(item).getByRole('button', { name: 'Rename' }));
    const field = within(item).getByLabelText('New name');
    await user.clear(field);
    await user.type(field, 'Harbour LW 6¾ in');
    await user.click(within(item).getByRole('button', { name: 'Save name' }));
    expect(onRename).toHaveBeenCalledWith('firm-1', 'Harbour LW 6¾ in');
    expect(await screen.findByRole('status')).toHaveTextContent('Renamed “Harbour lightweight” to “Harbour LW 6¾ in”.');
  });

  it('when the server refuses a name, then its message for the name is shown beside the field and the form stays open', async () => {
    const onRename = vi.fn().mockRejectedValue(new ApiError(409, 'conflict', 'A deck profile with that name exists', { name: 'A deck profile named “NW 3 in” already exists' }));
    render(<DeckProfileLibrary profiles={PROFILES} canEdit onRename={onRename} onDelete={vi.fn()} />);
    const user = await open();
    const item = screen.getByRole('listitem', { name: 'Deck profile Harbour lightweight' });
    await user.click(within(item).getByRole('button', { name: 'Rename' }));
    await user.clear(within(item).getByLabelText('New name'));
    await user.type(within(item).getByLabelText('New name'), 'NW 3 in');
    await user.click(within(item).getByRole('button', { name: 'Save name' }));
    expect(await within(item).findByRole('alert')).toHaveTextContent('A deck profile named “NW 3 in” already exists');
    expect(within(item).getByLabelText('New name')).toHaveAttribute('aria-invalid', 'true');
  });

  it('when an engineer deletes the firm profile, then a confirmation names it and says decks keep their build-up, and only confirming deletes', async () => {
    const onDelete = vi.fn().mockResolvedValue(undefined);
    render(<DeckProfileLibrary profiles={PROFILES} canEdit onRename={vi.fn()} onDelete={onDelete} />);
    const user = await open();
    const item = screen.getByRole('listitem', { name: 'Deck profile Harbour lightweight' });
    await user.click(within(item).getByRole('button', { name: 'Delete' }));
    const confirm = within(item).getByRole('group', { name: 'Delete Harbour lightweight?' });
    expect(confirm).toHaveTextContent('Delete “Harbour lightweight” from the firm’s deck profiles? Decks that use it keep their build-up.');
    await user.click(within(confirm).getByRole('button', { name: 'Keep it' }));
    expect(onDelete).not.toHaveBeenCalled();
    await user.click(within(item).getByRole('button', { name: 'Delete' }));
    await user.click(within(item).getByRole('button', { name: 'Delete “Harbour lightweight”' }));
    expect(onDelete).toHaveBeenCalledWith('firm-1');
    expect(await screen.findByRole('status')).toHaveTextContent('Deleted “Harbour lightweight” from the library.');
  });

  it('when a profile is built in, then it offers no rename or delete and says why', async () => {
    render(<DeckProfileLibrary profiles={PROFILES} canEdit onRename={vi.fn()} onDelete={vi.fn()} />);
    await open();
    const item = screen.getByRole('listitem', { name: `Deck profile ${BUILT_IN_DECK_PROFILES[0].name}` });
    expect(within(item).queryByRole('button')).toBeNull();
    expect(item).toHaveTextContent('built in: cannot be renamed or deleted');
  });

  it('when a drafter or manager opens the library, then it is read only', async () => {
    render(<DeckProfileLibrary profiles={PROFILES} canEdit={false} onRename={vi.fn()} onDelete={vi.fn()} />);
    await open();
    expect(screen.getByText('Read only: owners and engineers keep the firm’s library.')).toBeInTheDocument();
    expect(within(screen.getByTestId('deck-profile-library')).queryAllByRole('button')).toHaveLength(0);
    expect(screen.getByRole('listitem', { name: 'Deck profile Harbour lightweight' })).toHaveTextContent("3.5 in topping");
  });
});
