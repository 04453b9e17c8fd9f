import { render, screen, within } from '@testing-library/react';
import { QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider, createMemoryRouter } from 'react-router-dom';
import { describe, expect, it, vi } from 'vitest';
import { AppHeader, navItemsFor } from '../../src/app/app-header.component';
import { AppShellLayout } from '../../src/app/app-shell.layout';
import { EngineerCaution } from '../../src/components/ui/engineer-caution.ui';
import type { Role } from '../../src/lib/permissions';
import { jsonResponse, renderWithProviders, testQueryClient, testSession } from '../../src/testing/test-utils';

function mainNavLinks(role: Role): string[] {
  renderWithProviders(<AppHeader session={testSession(role)} />, { path: '/projects' });
  const nav = screen.getByRole('navigation', { name: 'Main' });
  return within(nav)
    .getAllByRole('link')
    .map((link) => link.textContent ?? '');
}

describe('role-aware navigation', () => {
  it('when a drafter is signed in, then "New project" and "Team" are not offered', () => {
    expect(mainNavLinks('drafter')).toEqual(['Projects', 'Settings']);
  });

  it('when a manager is signed in, then "New project" is not offered', () => {
    expect(mainNavLinks('manager')).toEqual(['Projects', 'Settings']);
  });

  it('when an engineer is signed in, then "New project" is offered but not "Team"', () => {
    expect(mainNavLinks('engineer')).toEqual(['Projects', 'New project', 'Settings']);
  });

  it('when the owner is signed in, then "New project" and "Team" are offered', () => {
    expect(mainNavLinks('owner')).toEqual(['Projects', 'New project', 'Team', 'Settings']);
    expect(navItemsFor('owner').find((i) => i.label === 'Team')?.to).toBe('/settings/team');
  });

  it('when signed in, then the header names the person and role and offers sign-out', () => {
    renderWithProviders(<AppHeader session={testSession('manager')} />);
    expect(screen.getByText('Test manager')).toBeInTheDocument();
    expect(screen.getByText('Manager')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Sign out' })).toBeInTheDocument();
  });

  it('when nobody is signed in, then the shell sends the visitor to sign-in, keeping where they were going', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => jsonResponse(401, { error: { code: 'unauthenticated', message: 'Sign in.' } })));
    const { router } = renderWithProviders(<AppShellLayout />, {
      path: '/projects/42',
      routes: [{ path: '/signin', element: <p>Sign-in page</p> }],
    });
    expect(await screen.findByText('Sign-in page')).toBeInTheDocument();
    expect(router.state.location.search).toBe('?next=%2Fprojects%2F42');
  });

  it('when signed in, then every page carries the engineer-of-record caution', () => {
    renderWithProviders(<AppShellLayout />, { path: '/projects', session: testSession('engineer') });
    expect(screen.getByRole('contentinfo')).toHaveTextContent(/licensed engineer, who must check them/);
    expect(screen.getByRole('contentinfo')).toHaveTextContent(/local building code and the engineer of record govern/);
  });

  it('when a screen inside the shell has its own caution (results, sheets, panels), then the caution shows once, in the footer', () => {
    const screenWithItsOwn = (
      <section aria-label="Results">
        <EngineerCaution />
        <EngineerCaution />
      </section>
    );
    const router = createMemoryRouter([{ path: '/', element: <AppShellLayout />, children: [{ path: 'projects', element: screenWithItsOwn }] }], { initialEntries: ['/projects'] });
    render(
      <QueryClientProvider client={testQueryClient(testSession('engineer'))}>
        <RouterProvider router={router} />
      </QueryClientProvider>,
    );
    expect(screen.getByRole('region', { name: 'Results' })).toBeInTheDocument();
    expect(screen.getAllByText(/licensed engineer, who must check them/)).toHaveLength(1);
    expect(within(screen.getByRole('contentinfo')).getByText(/licensed engineer, who must check them/)).toBeInTheDocument();
  });

  it('when a screen is shown on its own (no frame footer), then it keeps its own caution', () => {
    renderWithProviders(<EngineerCaution />);
    expect(screen.getAllByText(/licensed engineer, who must check them/)).toHaveLength(1);
  });
});

describe('active navigation link', () => {
  it('when on the new-project page, then only "New project" is marked current', () => {
    renderWithProviders(<AppHeader session={testSession('engineer')} />, { path: '/projects/new' });
    const nav = screen.getByRole('navigation', { name: 'Main' });
    expect(within(nav).getByRole('link', { current: 'page' })).toHaveTextContent('New project');
  });

  it('when on a project page, then "Projects" is marked current', () => {
    renderWithProviders(<AppHeader session={testSession('engineer')} />, { path: '/projects/7/plan' });
    const nav = screen.getByRole('navigation', { name: 'Main' });
    expect(within(nav).getByRole('link', { current: 'page' })).toHaveTextContent('Projects');
  });
});
