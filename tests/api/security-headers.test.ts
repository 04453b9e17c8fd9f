import { afterEach, describe, expect, it } from 'vitest';
import { HSTS_MAX_AGE_S } from '../../server/middleware/security.middleware';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp | undefined;
afterEach(async () => {
  expect(t?.serverErrors).toEqual([]);
  await t?.close();
  t = undefined;
});

describe('security headers', () => {
  it('when a page or API answer is sent, then the CSP allows scripts from our origin only (no inline, no eval)', async () => {
    t = await createTestApp();
    const res = await t.anonymous().get('/api/health');
    const directives = Object.fromEntries(
      String(res.headers['content-security-policy'])
        .split(';')
        .map((d) => d.trim().split(/\s+/))
        .map(([name, ...values]) => [name, values]),
    );
    expect(directives['script-src']).toEqual(["'self'"]);
    expect(directives['default-src']).toEqual(["'self'"]);
    expect(directives['object-src']).toEqual(["'none'"]);
    expect(directives['base-uri']).toEqual(["'self'"]);
    expect(directives['connect-src']).toEqual(["'self'"]);
  });

  it('when served over plain http, then no Strict-Transport-Security is sent', async () => {
    t = await createTestApp();
    const res = await t.anonymous().get('/api/health');
    expect(res.headers['strict-transport-security']).toBeUndefined();
  });

  it('when a trusted proxy says the request came over HTTPS, then HSTS is sent for a year with subdomains', async () => {
    t = await createTestApp({ trustProxy: 'loopback' });
    const res = await t.anonymous().get('/api/health').set('X-Forwarded-Proto', 'https');
    expect(res.headers['strict-transport-security']).toBe(`max-age=${HSTS_MAX_AGE_S}; includeSubDomains`);
    expect(HSTS_MAX_AGE_S).toBe(31_536_000);
    // Errors carry it too (the header is set before any route runs).
    const missing = await t.anonymous().get('/api/projects').set('X-Forwarded-Proto', 'https');
    expect(missing.status).toBe(401);
    expect(missing.headers['strict-transport-security']).toBe(`max-age=${HSTS_MAX_AGE_S}; includeSubDomains`);
  });

  it('when an untrusted client claims HTTPS in X-Forwarded-Proto, then no HSTS is sent', async () => {
    t = await createTestApp({ trustProxy: false });
    const res = await t.anonymous().get('/api/health').set('X-Forwarded-Proto', 'https');
    expect(res.headers['strict-transport-security']).toBeUndefined();
  });
});
