import type { Role } from '../../../server/auth/policy';
import { DEMO_PASSWORD } from '../../../server/db/seed-demo';
import type { TestApp } from './test-app';

// Every API route and who may call it. role-matrix.test.ts drives one check per row and
// role, and fails when the app registers a route that is missing here.
// To add a route: add a row with the Express pattern exactly as registered.

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface RouteFixture {
  t: TestApp;
  /** A new project of the demo firm (so destructive rows get their own). */
  ownProjectId(): Promise<string>;
  /** A new project of the other firm. */
  foreignProjectId(): Promise<string>;
  uniqueEmail(): string;
}

export interface RouteCase {
  method: Method;
  /** The pattern as registered on Express, e.g. '/api/projects/:id'. */
  route: string;
  /** 'public': anyone, signed in or not; 'signed-in': any role; else the roles allowed. */
  allowed: 'public' | 'signed-in' | readonly Role[];
  /** Status an allowed caller gets. */
  okStatus: number;
  /** Status an anonymous caller gets on a non-public route (default 401). */
  anonymousStatus?: number;
  /** Concrete path for the caller's own firm (default: route itself). */
  path?: (fx: RouteFixture) => Promise<string> | string;
  body?: (fx: RouteFixture) => unknown;
  /** The same route aimed at another firm's resource: an allowed role must get 404. */
  foreignPath?: (fx: RouteFixture) => Promise<string>;
}

export const ROUTE_TABLE: RouteCase[] = [
  { method: 'GET', route: '/api/health', allowed: 'public', okStatus: 200 },
  {
    method: 'POST',
    route: '/api/session',
    allowed: 'public',
    okStatus: 200,
    body: () => ({ email: 'manager@example.com', password: DEMO_PASSWORD }),
  },
  { method: 'GET', route: '/api/session', allowed: 'signed-in', okStatus: 200 },
  // Signing out without a session is harmless, so anonymous also gets 204.
  { method: 'DELETE', route: '/api/session', allowed: 'signed-in', okStatus: 204, anonymousStatus: 204 },
  {
    method: 'POST',
    route: '/api/firms',
    allowed: 'public',
    okStatus: 201,
    body: (fx) => ({
      firmName: 'Matrix Test Firm',
      name: 'Matrix Tester',
      email: fx.uniqueEmail(),
      password: 'long-enough-password',
    }),
  },
  {
    method: 'GET',
    route: '/api/projects',
    allowed: ['owner', 'engineer', 'drafter', 'manager'],
    okStatus: 200,
  },
  {
    method: 'POST',
    route: '/api/projects',
    allowed: ['owner', 'engineer'],
    okStatus: 201,
    body: () => ({ name: 'Matrix project' }),
  },
  {
    method: 'GET',
    route: '/api/projects/:id',
    allowed: ['owner', 'engineer', 'drafter', 'manager'],
    okStatus: 200,
    path: async (fx) => `/api/projects/${await fx.ownProjectId()}`,
    foreignPath: async (fx) => `/api/projects/${await fx.foreignProjectId()}`,
  },
  {
    method: 'PATCH',
    route: '/api/projects/:id',
    allowed: ['owner', 'engineer'],
    okStatus: 200,
    path: async (fx) => `/api/projects/${await fx.ownProjectId()}`,
    body: () => ({ client: 'Renamed client' }),
    foreignPath: async (fx) => `/api/projects/${await fx.foreignProjectId()}`,
  },
  {
    method: 'DELETE',
    route: '/api/projects/:id',
    allowed: ['owner', 'engineer'],
    okStatus: 204,
    path: async (fx) => `/api/projects/${await fx.ownProjectId()}`,
    foreignPath: async (fx) => `/api/projects/${await fx.foreignProjectId()}`,
  },
];
