import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES, type Role } from '../../server/auth/policy';
import { listRoutes } from './helpers/list-routes';
import { makeRouteFixture } from './helpers/route-fixture';
import { ROUTE_TABLE, type RouteCase, type RouteFixture } from './helpers/route-table';
import { createTestApp, type Agent, type TestApp } from './helpers/test-app';

let t: TestApp;
let fx: RouteFixture;

beforeAll(async () => {
  t = await createTestApp();
  fx = await makeRouteFixture(t);
});

afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

async function call(agent: Agent, row: RouteCase, path: string) {
  const body = row.body?.(fx);
  const req = agent[row.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](path);
  if (row.multipart) {
    const m = row.multipart(fx);
    for (const [name, value] of Object.entries(m.fields)) req.field(name, value);
    return req.attach(m.file.field, m.file.content, m.file.filename);
  }
  return body === undefined ? req : req.send(body as object);
}

const label = (row: RouteCase) => `${row.method} ${row.route}`;

describe('route table coverage', () => {
  it('when the app is built, then every registered route has a row in the table and vice versa', () => {
    const registered = listRoutes(t.app).filter((r) => r.includes(' /api')).sort();
    const tabled = ROUTE_TABLE.map(label).sort();
    expect(registered).toEqual(tabled);
  });
});

describe.each(ROUTE_TABLE)('$method $route', (row) => {
  const allowedRoles: readonly Role[] =
    row.allowed === 'public' || row.allowed === 'signed-in' ? ROLES : row.allowed;

  it.each(ROLES)('when called as %s, then the role rule holds', async (role) => {
    const agent = await t.freshAgent(role);
    const res = await call(agent, row, await (row.path?.(fx) ?? row.route));
    const expected = allowedRoles.includes(role) ? row.okStatus : 403;
    expect(res.status, JSON.stringify(res.body)).toBe(expected);
    if (expected === 403) expect(res.body.error.code).toBe('forbidden');
  });

  it('when called anonymously, then it answers 401 unless public', async () => {
    const res = await call(t.anonymous(), row, await (row.path?.(fx) ?? row.route));
    const expected =
      row.allowed === 'public' ? row.okStatus : (row.anonymousStatus ?? 401);
    expect(res.status, JSON.stringify(res.body)).toBe(expected);
    if (expected === 401) expect(res.body.error.code).toBe('unauthenticated');
  });

  if (row.foreignPath) {
    it("when an allowed role targets another firm's resource, then it answers 404", async () => {
      const agent = await t.freshAgent(allowedRoles[0]);
      const res = await call(agent, row, await row.foreignPath!(fx));
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('not_found');
    });
  }
});
