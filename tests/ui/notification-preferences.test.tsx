import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import SettingsRoute from '../../src/routes/settings.route';
import { jsonResponse, renderWithProviders, testSession } from '../../src/testing/test-utils';
import type { Role } from '../../src/lib/permissions';

type Call = { url: string; method: string; body: unknown };

/** fetch stand-in: GET answers `stored`; PUT answers `put` (or echoes the body as saved). */
function mockFetch(stored: unknown, put?: { status: number; body: unknown }, get?: { status: number; body: unknown }) {
  const calls: Call[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      const method = init?.method ?? 'GET';
      const body = init?.body ? JSON.parse(String(init.body)) : undefined;
      calls.push({ url, method, body });
      if (method === 'GET') return get ? jsonResponse(get.status, get.body) : jsonResponse(200, { notifications: stored });
      return put ? jsonResponse(put.status, put.body) : jsonResponse(200, { notifications: body });
    }),
  );
  return calls;
}

const renderAs = (role: Role) => renderWithProviders(<SettingsRoute />, { path: '/settings', session: testSession(role) });

const section = () => screen.getByRole('region', { name: 'E-mail notifications' });

describe('notification preferences on Settings', () => {
  it.each(['owner', 'engineer', 'drafter', 'manager'] as const)(
    'when a %s opens Settings, then their own settings load into two checkboxes with a Save button',
    async (role) => {
      const calls = mockFetch({ schemeSubmitted: true, schemeChosen: false });
      renderAs(role);
      const submitted = await screen.findByRole('checkbox', { name: /submitted for review/ });
      expect(submitted).toBeChecked();
      expect(within(section()).getByRole('checkbox', { name: /is chosen/ })).not.toBeChecked();
      expect(within(section()).getByRole('button', { name: 'Save' })).toBeEnabled();
      expect(calls).toEqual([{ url: '/api/me/notifications', method: 'GET', body: undefined }]);
    },
  );

  it('when a box is changed and Save pressed, then both settings are PUT and a confirmation shows', async () => {
    const calls = mockFetch({ schemeSubmitted: true, schemeChosen: false });
    renderAs('manager');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('checkbox', { name: /is chosen/ }));
    await user.click(screen.getByRole('checkbox', { name: /submitted for review/ }));
    await user.click(within(section()).getByRole('button', { name: 'Save' }));

    expect(await within(section()).findByRole('status')).toHaveTextContent('Notification settings saved.');
    expect(calls.filter((c) => c.method === 'PUT')).toEqual([
      { url: '/api/me/notifications', method: 'PUT', body: { schemeSubmitted: false, schemeChosen: true } },
    ]);
    expect(screen.getByRole('checkbox', { name: /is chosen/ })).toBeChecked();
    expect(screen.getByRole('checkbox', { name: /submitted for review/ })).not.toBeChecked();

    // Changing a box again hides the confirmation until the next save.
    await user.click(screen.getByRole('checkbox', { name: /is chosen/ }));
    expect(within(section()).queryByText('Notification settings saved.')).toBeNull();
  });

  it('when the save is refused, then the server message shows and no confirmation', async () => {
    mockFetch(
      { schemeSubmitted: true, schemeChosen: true },
      { status: 400, body: { error: { code: 'validation_failed', message: 'schemeChosen must be true or false' } } },
    );
    renderAs('engineer');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('checkbox', { name: /is chosen/ }));
    await user.click(within(section()).getByRole('button', { name: 'Save' }));
    const alert = await within(section()).findByRole('alert');
    expect(alert).toHaveTextContent('Your notification settings were not saved. schemeChosen must be true or false');
    expect(within(section()).queryByText('Notification settings saved.')).toBeNull();
    // What the person chose stays on screen to try again.
    expect(screen.getByRole('checkbox', { name: /is chosen/ })).not.toBeChecked();
  });

  it('when the settings cannot be read, then the section says so and shows no form', async () => {
    mockFetch(undefined, undefined, { status: 500, body: { error: { code: 'internal', message: 'Something went wrong on our side.' } } });
    renderAs('drafter');
    await waitFor(() =>
      expect(within(section()).getByRole('alert')).toHaveTextContent(
        'Your notification settings could not be loaded. Something went wrong on our side.',
      ),
    );
    expect(within(section()).queryByRole('checkbox')).toBeNull();
    expect(within(section()).queryByRole('button', { name: 'Save' })).toBeNull();
  });
});
