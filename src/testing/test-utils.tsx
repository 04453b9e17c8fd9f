import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import type { ReactElement } from 'react';
import { createMemoryRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { sessionQueryKey } from '../features/auth/api/get-session.api';
import type { Session } from '../features/auth/api/session.schema';
import type { Role } from '../lib/permissions';

export function testSession(role: Role, overrides: Partial<Session> = {}): Session {
  return {
    user: { id: 'u-1', email: `${role}@example.com`, name: `Test ${role}` },
    firm: { id: 'f-1', name: 'Harrow Lane Structures' },
    role,
    ...overrides,
  };
}

export function testQueryClient(session?: Session | null): QueryClient {
  const client = new QueryClient({
    defaultOptions: { queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } },
  });
  if (session !== undefined) client.setQueryData(sessionQueryKey, session);
  return client;
}

type RenderOptions = { path?: string; session?: Session | null; routes?: RouteObject[] };

/** Renders an element inside a memory router and a fresh QueryClient. */
export function renderWithProviders(element: ReactElement, { path = '/', session, routes = [] }: RenderOptions = {}) {
  const queryClient = testQueryClient(session);
  const router = createMemoryRouter([{ path: '*', element }, ...routes], { initialEntries: [path] });
  const result = render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { ...result, queryClient, router };
}

/** A fetch stand-in answering one JSON response, and recording what was asked. */
export function jsonResponse(status: number, body: unknown): Response {
  return new Response(status === 204 ? null : JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  });
}
