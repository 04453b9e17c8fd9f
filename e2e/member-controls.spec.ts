import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { SCREENSHOT_DIR, signInAs } from './support/auth.helpers';
import { clickPlan, planCanvas, schemeWithPlan } from './support/plan-canvas.helpers';
import { PDFParse } from 'pdf-parse';

// Issue 16 item 14: from the Member sheet an engineer braces a beam and holds it to live
// span/600; the design re-runs and the sheet shows the new Lb and limit with their source;
// reactions are toggled on the Plan; the one-member calc sheet downloads and reads back.

const twoBay = () => JSON.parse(readFileSync(new URL('../tests/fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8')) as unknown;

test('an engineer sets a brace point and an L/600 limit on a beam, sees the design change, shows reactions and downloads its calc sheet', async ({ page }) => {
  test.setTimeout(300_000);
  await page.setViewportSize({ width: 1440, height: 900 });
  await signInAs(page, 'engineer@example.com');
  const url = await schemeWithPlan(page, twoBay(), `Member controls ${Date.now().toString(36).slice(-4).toUpperCase()}`);
  await page.goto(url);
  const canvas = await planCanvas(page, 60_000);
  await expect(page.getByTestId('design-status')).toContainText('11 members sized', { timeout: 60_000 });

  // Beam b2 of the fixture runs north–south on x = 10 ft, 36 ft long.
  await clickPlan(page, canvas, 10, 9);
  const sheet = page.getByTestId('member-sheet-slot');
  await expect(sheet).toBeVisible({ timeout: 15_000 });
  await expect(page.getByTestId('member-lb-source')).toHaveText('from the design basis');
  await expect(page.getByTestId('member-live-limit-used')).toHaveText('span/360 (from the design basis)');
  const shapeBefore = (await page.getByTestId('member-sheet-shape').textContent())!;
  const ratioBefore = (await page.getByTestId('member-sheet-ratio').textContent())!;

  // One brace point at midspan and live span/600 (e.g. under cladding).
  const form = sheet.getByRole('form', { name: 'Bracing and deflection limits' });
  await form.getByLabel('Compression flange braced').selectOption('points');
  await form.getByLabel(/Brace points from the start support/).fill('18');
  await form.getByLabel(/Live limit span\/n/).fill('600');
  await form.getByRole('button', { name: 'Apply bracing and limits' }).click();

  await expect(page.getByTestId('member-live-limit-used')).toHaveText('span/600 (set on this member)', { timeout: 30_000 });
  await expect(page.getByTestId('member-lb-used')).toHaveText(/^18\.00 ft/, { timeout: 30_000 }); // 36 ft span, braced at 18 ft
  await expect(page.getByTestId('member-lb-source')).toHaveText('set on this member');
  await expect
    .poll(async () => `${await page.getByTestId('member-sheet-shape').textContent()} ${await page.getByTestId('member-sheet-ratio').textContent()}`, { timeout: 30_000 })
    .not.toBe(`${shapeBefore} ${ratioBefore}`);
  await expect(page.getByTestId('save-status')).toHaveText(/^Saved · revision \d+/, { timeout: 30_000 });

  // Reactions on the Plan: drawn at member ends, with the legend naming the basis and unit.
  const toggle = page.getByRole('button', { name: 'Reactions' });
  await toggle.click();
  await expect(toggle).toHaveAttribute('aria-pressed', 'true');
  await expect(page.getByTestId('reactions-legend')).toContainText('LRFD factored');
  await expect(canvas).not.toHaveAttribute('data-reactions-drawn', '0', { timeout: 15_000 });
  await page.screenshot({ path: `${SCREENSHOT_DIR}/plan-reactions-member-controls.png` });

  // The one-member calc sheet of the saved revision.
  const [download] = await Promise.all([page.waitForEvent('download', { timeout: 120_000 }), page.getByTestId('member-calc-sheet-link').click()]);
  expect(download.suggestedFilename()).toMatch(/-calc-sheet-.+-r\d+\.pdf$/);
  const parser = new PDFParse({ data: new Uint8Array(readFileSync((await download.path())!)) });
  const text = (await parser.getText()).text.replace(/\s+/g, ' ');
  await parser.destroy();
  expect(text).toContain('Member calc sheet');
  expect(text).toContain('span/600; set on this member');
  expect(text).toContain('at 18.00 ft; set on this member');
  expect(text).toContain('AISC 360-16 F2');
  expect(text).toContain('licensed engineer');
});
