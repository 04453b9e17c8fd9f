import { readFileSync } from 'node:fs';
import { expect, test, type Page } from '@playwright/test';
import { signInAs } from './support/auth.helpers';

// The app really runs under its Content-Security-Policy: every screen of the production build
// is opened and any CSP violation (Chromium's "Refused to …" console message or a
// securitypolicyviolation event) fails the test. A deliberate inline script proves the policy
// is enforced and that the listener would notice.

test.setTimeout(180_000);

declare global {
  interface Window {
    __cspViolations?: string[];
  }
}

function watchCsp(page: Page): string[] {
  const refused: string[] = [];
  page.on('console', (msg) => {
    // Older Chromium says "Refused to …"; this one "… violates the following Content Security Policy directive …".
    if (/Refused to|Content Security Policy/i.test(msg.text())) refused.push(`${page.url()}: ${msg.text()}`);
  });
  return refused;
}

async function violations(page: Page): Promise<string[]> {
  return page.evaluate(() => window.__cspViolations ?? []);
}

test('when every screen of the production build is opened, then no Content-Security-Policy violation is reported', async ({ page }) => {
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      (window.__cspViolations ??= []).push(`${e.violatedDirective} ${e.blockedURI}`);
    });
  });
  const refused = watchCsp(page);

  // The built page has no inline script: every <script> loads a file from our origin.
  const html = readFileSync('dist/index.html', 'utf8');
  const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)];
  expect(scripts.length).toBeGreaterThan(0);
  for (const [, attrs, body] of scripts) {
    expect(attrs).toMatch(/\bsrc="\/assets\/[^"]+\.js"/);
    expect(body.trim()).toBe('');
  }

  const first = await page.goto('/signin');
  const csp = first!.headers()['content-security-policy'];
  expect(csp).toContain("script-src 'self'");
  expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
  for (const path of ['/signup', '/password-forgot']) {
    await page.goto(path);
    await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  }

  await signInAs(page, 'owner@example.com');
  // The demo project (other specs may have added projects of their own, some without schemes).
  const projects = (await (await page.request.get('/api/projects')).json()) as { projects: { id: string; name: string }[] };
  const id = (projects.projects.find((p) => p.name === 'Harrow Quay Clinic') ?? projects.projects[0]).id;
  const schemes = (await (await page.request.get(`/api/projects/${id}/schemes`)).json()) as { schemes: { id: string }[] };

  await page.goto(`/projects/${id}/plan?scheme=${schemes.schemes[0].id}`);
  const canvas = page.getByTestId('plan-canvas');
  await expect(canvas).toHaveAttribute('data-view-scale', /\d/, { timeout: 30_000 });

  for (const path of [
    '/projects',
    `/projects/${id}`,
    `/projects/${id}/schedule`,
    `/projects/${id}/tonnage`,
    `/projects/${id}/details`,
    '/settings',
    '/settings/team',
    '/settings/unit-prices',
    '/settings/team/audit',
    '/settings/team/outbox',
  ]) {
    await page.goto(path);
    await expect(page.getByRole('heading', { level: 1 }).first()).toBeVisible({ timeout: 30_000 });
    await page.waitForLoadState('networkidle');
    expect(await violations(page), path).toEqual([]);
  }
  expect(refused).toEqual([]);

  // Control: an inline script is refused, and both detectors see it.
  await page.evaluate(() => {
    const s = document.createElement('script');
    s.textContent = 'window.__inlineRan = true;';
    document.body.appendChild(s);
  });
  await expect.poll(() => violations(page)).toEqual([expect.stringMatching(/^script-src(-elem)? inline$/)]);
  expect(await page.evaluate(() => (window as unknown as { __inlineRan?: boolean }).__inlineRan ?? false)).toBe(false);
  await expect.poll(() => refused.length).toBe(1);
  expect(refused[0]).toMatch(/Refused to execute inline script|inline script violates the following Content Security Policy directive 'script-src 'self''/);
});
