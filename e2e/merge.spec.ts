import { expect, test, type Page } from '@playwright/test';
import { SCREENSHOT_DIR, signInAs } from './support/auth.helpers';
import { clickPlan, generatedPlan, planCanvas, schemeWithPlan } from './support/plan-canvas.helpers';

// Two engineers (the firm's owner and its engineer) with one scheme open in two browser
// sessions. Edits of different elements merge on their own, each told what came in from the
// other; only elements both changed are asked about, and nothing saved is lost.

type StoredPlan = { columns: unknown[]; pointLoads: unknown[]; grids: { axis: string; label: string; offset_ft: number }[] };

async function storedPlan(page: Page, schemeId: string): Promise<StoredPlan> {
  const res = await page.request.get(`/api/schemes/${schemeId}`);
  expect(res.status()).toBe(200);
  return ((await res.json()) as { scheme: { plan: StoredPlan } }).scheme.plan;
}

async function gridFromSpacings(page: Page, spacings: string) {
  await page.getByRole('toolbar', { name: 'Plan tools' }).getByRole('button', { name: /^Grid/ }).click();
  await page.getByLabel('Bays 1, 2, 3 … (east–west), ft').fill(spacings);
  await page.getByRole('button', { name: 'Grid from spacings' }).click();
}

const saved = /^Saved · revision \d+/;

test('when two engineers edit one scheme, then different elements merge with a notice and only the grid lines both moved are asked about', async ({ page, browser }) => {
  test.setTimeout(240_000);
  await page.setViewportSize({ width: 1600, height: 1000 });
  await signInAs(page, 'engineer@example.com');
  const url = await schemeWithPlan(page, generatedPlan(2, 1, 2), `Merge ${Date.now().toString(36).slice(-4)}`);
  const schemeId = new URL(url, 'http://x').searchParams.get('scheme')!;
  await page.goto(url);
  const canvas = await planCanvas(page, 60_000);
  await expect(page.getByTestId('save-status')).toHaveText(saved, { timeout: 30_000 });

  // The owner opens the same scheme in another session and adds a column, saved first.
  const ownerContext = await browser.newContext({ viewport: { width: 1600, height: 1000 } });
  const owner = await ownerContext.newPage();
  await signInAs(owner, 'owner@example.com');
  await owner.goto(url);
  const ownerCanvas = await planCanvas(owner, 60_000);
  await ownerCanvas.focus();
  await owner.keyboard.press('c');
  await clickPlan(owner, ownerCanvas, 15, 15);
  await expect(owner.getByTestId('save-status')).toHaveText(saved, { timeout: 30_000 });

  // The engineer, still on the old revision, adds a point load: merged with the owner's column, no question asked.
  await canvas.focus();
  await page.keyboard.press('p');
  await clickPlan(page, canvas, 45, 15);
  const notice = page.getByTestId('merged-notice');
  await expect(notice).toContainText('Merged with Imogen Ashdown’s save', { timeout: 30_000 });
  await expect(notice.getByRole('listitem')).toHaveText([/^column at .+ added$/]);
  await expect(page.getByRole('alert').filter({ hasText: 'while you were drawing' })).toHaveCount(0);
  await expect(page.getByTestId('save-status')).toHaveText(saved, { timeout: 30_000 });
  await page.getByTestId('plan-editor').screenshot({ path: `${SCREENSHOT_DIR}/plan-merged.png` });
  let stored = await storedPlan(page, schemeId);
  expect(stored.columns).toHaveLength(7); // 6 + the owner's
  expect(stored.pointLoads).toHaveLength(1); // the engineer's

  // Both now move the east–west grid lines, differently; the owner also adds a second column.
  await gridFromSpacings(owner, '2@25');
  await ownerCanvas.focus();
  await owner.keyboard.press('c');
  await clickPlan(owner, ownerCanvas, 50, 10);
  // The owner was on the revision before the engineer's merge: the owner's save merges too.
  await expect(owner.getByTestId('merged-notice')).toContainText('Merged with Tobias Renfrew’s save', { timeout: 30_000 });
  await expect(owner.getByTestId('save-status')).toHaveText(saved, { timeout: 30_000 });

  await gridFromSpacings(page, '2@32');
  const banner = page.getByRole('alert').filter({ hasText: 'while you were drawing' });
  await expect(banner).toContainText('You both changed 2 elements', { timeout: 30_000 });
  const asked = banner.getByRole('list', { name: 'Elements you both changed' }).getByRole('listitem');
  await expect(asked).toHaveCount(2);
  await expect(asked.nth(0)).toContainText('grid line 2: yours moved; theirs moved');
  await expect(asked.nth(1)).toContainText('grid line 3: yours moved; theirs moved');
  await expect(page.getByTestId('save-status')).toHaveText('Not saved: someone else saved first');
  await page.getByTestId('plan-editor').screenshot({ path: `${SCREENSHOT_DIR}/plan-conflict.png` });

  // Mine for line 2, theirs for line 3.
  await asked.nth(0).getByRole('radio', { name: 'Keep mine' }).check();
  await asked.nth(1).getByRole('radio', { name: 'Take theirs' }).check();
  await banner.getByRole('button', { name: 'Save my choices' }).click();
  await expect(banner).toHaveCount(0);
  await expect(page.getByTestId('save-status')).toHaveText(saved, { timeout: 30_000 });

  // Stored: every column of both, the point load, line 2 where I put it and line 3 where the owner did.
  stored = await storedPlan(page, schemeId);
  expect(stored.columns).toHaveLength(8);
  expect(stored.pointLoads).toHaveLength(1);
  expect(stored.grids.filter((g) => g.axis === 'x').map((g) => [g.label, g.offset_ft])).toEqual([['1', 0], ['2', 32], ['3', 50]]);
  await ownerContext.close();
});
