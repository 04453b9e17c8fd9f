import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import ProjectSchemesRoute from '../../src/routes/project-schemes.route';
import { jsonResponse, renderWithProviders, testSession } from '../../src/testing/test-utils';

const PROJECT = 'p-1';

const scheme = (over: Record<string, unknown> = {}) => ({
  id: 's-1',
  projectId: PROJECT,
  name: 'Scheme A — beams at about 10 ft',
  status: 'draft',
  archived: false,
  revision: 3,
  createdBy: { id: 'u-1', name: 'Tobias Renfrew' },
  updatedBy: { id: 'u-1', name: 'Tobias Renfrew' },
  createdAt: '2026-11-02T10:00:00.000Z',
  updatedAt: '2026-11-03T10:00:00.000Z',
  design: {
    revision: 2,
    designedAt: '2026-11-02T11:00:00.000Z',
    stale: true,
    steelWeight_lb: 274326,
    pieces: 220,
    floorArea_ft2: 42870,
    steel_psf: 6.399,
    failingMembers: 0,
    problemCount: 0,
  },
  designStale: true,
  ...over,
});

function mockFetch(schemes: unknown[]) {
  const calls: { url: string; method: string; body: unknown }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      calls.push({ url, method: init?.method ?? 'GET', body: init?.body ? JSON.parse(String(init.body)) : undefined });
      if ((init?.method ?? 'GET') === 'GET') return jsonResponse(200, { schemes });
      return jsonResponse(201, { scheme: scheme({ id: 's-2', name: 'Scheme C', revision: 1, design: null }) });
    }),
  );
  return calls;
}

afterEach(() => vi.unstubAllGlobals());

const renderAs = (role: 'engineer' | 'drafter') =>
  renderWithProviders(<ProjectSchemesRoute />, {
    path: `/projects/${PROJECT}`,
    session: testSession(role),
    routes: [{ path: '/projects/:projectId', element: <ProjectSchemesRoute /> }],
  });

describe('project schemes page', () => {
  it('when a scheme has a stale design, then its weight, psf, pieces and the stale badge show with the plan link', async () => {
    mockFetch([scheme()]);
    renderAs('drafter');
    const row = (await screen.findByRole('link', { name: 'Scheme A — beams at about 10 ft' })).closest('tr')!;
    // 274,326 lb / 2,000 lb per short ton = 137.2 tons ("t" would read as tonnes, NIST SP 811)
    expect(within(row).getByText('137.2 tons')).toBeInTheDocument();
    expect(within(row).getByText('6.40 psf')).toBeInTheDocument();
    expect(within(row).getByText('220 pcs')).toBeInTheDocument();
    expect(within(row).getByText('Stale · rev 2')).toBeInTheDocument();
    expect(within(row).getByRole('link', { name: 'Open plan' })).toHaveAttribute('href', `/projects/${PROJECT}/plan?scheme=s-1`);
    expect(within(row).getByRole('link', { name: 'Building (3D)' })).toHaveAttribute('href', `/projects/${PROJECT}/plan?scheme=s-1&view=building`);
    expect(within(row).getByRole('link', { name: 'Export' })).toHaveAttribute('href', '/api/schemes/s-1/export');
  });

  it('when a scheme weighs a whole number of tons, then it still shows one decimal, as on Tonnage', async () => {
    mockFetch([scheme({ design: { ...scheme().design, steelWeight_lb: 300000 } })]);
    renderAs('drafter');
    const row = (await screen.findByRole('link', { name: 'Scheme A — beams at about 10 ft' })).closest('tr')!;
    // 300,000 lb / 2,000 lb per short ton = 150.0 tons
    expect(within(row).getByText('150.0 tons')).toBeInTheDocument();
  });

  it('when a drafter opens the page, then no create, clone, archive or delete controls are shown', async () => {
    mockFetch([scheme()]);
    renderAs('drafter');
    await screen.findByRole('link', { name: 'Scheme A — beams at about 10 ft' });
    for (const name of ['New scheme', 'Import plan file', 'Clone', 'Archive', 'Delete']) {
      expect(screen.queryByRole('button', { name })).toBeNull();
    }
  });

  it('when an engineer names a new scheme, then it is posted to the project and the list is read again', async () => {
    const calls = mockFetch([]);
    renderAs('engineer');
    expect(await screen.findByRole('heading', { name: 'No schemes yet' })).toBeInTheDocument();
    await userEvent.type(screen.getByLabelText('New scheme'), 'Scheme C');
    await userEvent.click(screen.getByRole('button', { name: 'New scheme' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'POST')).toHaveLength(1));
    expect(calls.find((c) => c.method === 'POST')).toEqual({ url: `/api/projects/${PROJECT}/schemes`, method: 'POST', body: { name: 'Scheme C' } });
    await waitFor(() => expect(calls.filter((c) => c.method === 'GET')).toHaveLength(2));
  });

  it('when an engineer clones a scheme, then the new name is asked (default "… copy") and posted; a blank one is refused with a message', async () => {
    const calls = mockFetch([scheme()]);
    renderAs('engineer');
    const row = (await screen.findByRole('link', { name: 'Scheme A — beams at about 10 ft' })).closest('tr')!;
    await userEvent.click(within(row).getByRole('button', { name: 'Clone' }));
    const field = within(row).getByLabelText('Name of the copy');
    expect(field).toHaveValue('Scheme A — beams at about 10 ft copy');
    await userEvent.clear(field);
    await userEvent.click(within(row).getByRole('button', { name: 'Make the copy' }));
    expect(within(row).getByRole('alert')).toHaveTextContent('A scheme needs a name');
    expect(calls.filter((c) => c.method === 'POST')).toEqual([]);
    await userEvent.type(field, 'Scheme C');
    await userEvent.click(within(row).getByRole('button', { name: 'Make the copy' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'POST')).toEqual([{ url: '/api/schemes/s-1/clone', method: 'POST', body: { name: 'Scheme C' } }]));
  });

  it('when a scheme is renamed to a blank name, then the name is said to be required and nothing is sent', async () => {
    const calls = mockFetch([scheme()]);
    renderAs('engineer');
    const row = (await screen.findByRole('link', { name: 'Scheme A — beams at about 10 ft' })).closest('tr')!;
    await userEvent.click(within(row).getByRole('button', { name: 'Rename' }));
    const field = screen.getByLabelText('Scheme name');
    await userEvent.clear(field);
    await userEvent.type(field, '   ');
    await userEvent.click(screen.getByRole('button', { name: 'Save name' }));
    expect(screen.getByRole('alert')).toHaveTextContent('A scheme needs a name');
    expect(field).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByLabelText('Scheme name')).toBeInTheDocument();
    expect(calls.filter((c) => c.method !== 'GET')).toEqual([]);
  });

  it('when the revisions are opened, then each shows the summary of what it changed', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string) => {
        if (url.endsWith('/revisions')) {
          return jsonResponse(200, {
            revisions: [
              { revision: 2, userId: 'u-1', userName: 'Tobias Renfrew', createdAt: '2026-11-03T10:00:00.000Z', note: null, summary: '2 beams added, 1 size locked (2B1)', current: true },
              { revision: 1, userId: 'u-1', userName: 'Tobias Renfrew', createdAt: '2026-11-02T10:00:00.000Z', note: 'Imported from a plan file', summary: 'First revision: 11 members, 6 columns, 1 level', current: false },
            ],
          });
        }
        return jsonResponse(200, { schemes: [scheme()] });
      }),
    );
    renderAs('drafter');
    const row = (await screen.findByRole('link', { name: 'Scheme A — beams at about 10 ft' })).closest('tr')!;
    await userEvent.click(within(row).getByRole('button', { name: 'Revisions' }));
    const list = await screen.findByRole('list', { name: 'Revisions of Scheme A — beams at about 10 ft' });
    expect(within(list).getAllByTestId('revision-summary').map((e) => e.textContent)).toEqual(['2 beams added, 1 size locked (2B1)', 'First revision: 11 members, 6 columns, 1 level']);
  });
});
