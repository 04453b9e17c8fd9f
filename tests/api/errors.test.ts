import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

describe('error envelope and security headers', () => {
  it('when an /api path does not exist, then 404 JSON not_found', async () => {
    const res = await t.agents.owner.get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(res.body).toEqual({
      error: { code: 'not_found', message: 'No API route GET /api/no-such-thing.' },
    });
  });

  it('when the JSON body is over 2 MB, then 413 payload_too_large', async () => {
    const big = JSON.stringify({ name: 'x'.repeat(2 * 1024 * 1024 + 10) });
    const res = await t.agents.owner
      .post('/api/projects')
      .set('Content-Type', 'application/json')
      .send(big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
  });

  it('when a POST body is a JSON array instead of an object, then 400 invalid_input', async () => {
    const res = await t.agents.owner.post('/api/projects').send([1, 2]);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
  });

  it('when a POST has no body, then 400 naming the required field', async () => {
    const res = await t.agents.owner.post('/api/projects');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ name: 'Project name is required' });
  });

  it('when any response is sent, then it carries the CSP and other helmet headers', async () => {
    const res = await t.anonymous().get('/api/health');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("img-src 'self' data: blob:");
    expect(csp).toContain("style-src 'self' 'unsafe-inline'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
