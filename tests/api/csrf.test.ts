import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { DEMO_PASSWORD } from '../../server/db/seed-demo';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

const creds = { email: 'owner@example.com', password: DEMO_PASSWORD };

describe('CSRF: same-origin check on state-changing requests', () => {
  it('when a POST carries no Origin and no Referer, then 403 csrf', async () => {
    const res = await request(t.app).post('/api/session').send(creds);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
  });

  it('when a signed-in POST comes from a foreign Origin, then 403 csrf and nothing is stored', async () => {
    const before = await t.ctx.db.models.Project.count();
    const res = await t.agents.owner
      .post('/api/projects')
      .set('Origin', 'https://evil.example')
      .send({ name: 'Planted project' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
    expect(await t.ctx.db.models.Project.count()).toBe(before);
  });

  it('when Origin is the literal "null", then 403 csrf', async () => {
    const res = await t.anonymous().post('/api/session').set('Origin', 'null').send(creds);
    expect(res.status).toBe(403);
  });

  it('when Origin is missing but the Referer is one of our pages, then the request passes', async () => {
    const res = await request(t.app)
      .post('/api/session')
      .set('Host', 'baywright.test')
      .set('Referer', 'http://baywright.test/sign-in')
      .send(creds);
    expect(res.status).toBe(200);
  });

  it('when a DELETE has a foreign Referer and no Origin, then 403 csrf', async () => {
    const res = await request(t.app)
      .delete('/api/session')
      .set('Host', 'baywright.test')
      .set('Referer', 'http://elsewhere.test/page');
    expect(res.status).toBe(403);
  });

  it('when a GET has no Origin, then it is not checked', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
  });
});
