import { expect, test, type Page } from '@playwright/test';
import { SCREENSHOT_DIR, signInAs, openDemoProject } from './support/auth.helpers';
import { clickPlan, generatedPlan, planCanvas, schemeWithPlan } from './support/plan-canvas.helpers';

async function openDemoProjectPlan(page: Page) {
  await openDemoProject(page);
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Plan' }).click();
}

test.describe('plan', () => {
  test('when an engineer lays out a 3 × 2 bay floor, then every member is sized on the canvas and in the list', async ({ page, browser }) => {
    test.setTimeout(360_000);
    await page.setViewportSize({ width: 1440, height: 900 });
    await signInAs(page, 'engineer@example.com');
    await openDemoProjectPlan(page);

    const schemeName = `Scheme E2E ${Date.now().toString(36).slice(-4).toUpperCase()}`;
    await page.getByLabel('New scheme name').fill(schemeName);
    await page.getByRole('button', { name: 'Start scheme' }).click();
    await expect(page).toHaveURL(/plan\?scheme=/);
    const canvas = await planCanvas(page);
    const editor = page.getByTestId('plan-editor');

    // Grid from spacings: 3 bays of 30 ft east–west, 2 of 36 ft north–south.
    await page.getByRole('toolbar', { name: 'Plan tools' }).getByRole('button', { name: /^Grid/ }).click();
    await page.getByLabel('Bays 1, 2, 3 … (east–west), ft').fill('3@30');
    await page.getByLabel('Bays A, B, C … (north–south), ft').fill('2@36');
    await page.getByRole('button', { name: 'Grid from spacings' }).click();
    await page.getByRole('button', { name: 'Fit to view' }).click();

    // Columns on every intersection: 4 × 3.
    await canvas.focus();
    await page.keyboard.press('c');
    await page.getByRole('button', { name: 'Columns at all intersections' }).click();

    // Girders along A, B and C, drawn as chains (R is the Girder shortcut).
    await page.keyboard.press('r');
    for (const y of [0, 36, 72]) {
      for (const x of [0, 30, 60, 90]) await clickPlan(page, canvas, x, y);
      await page.keyboard.press('Escape');
    }
    // Edge beams on the numbered lines.
    await page.keyboard.press('b');
    for (const x of [0, 30, 60, 90]) {
      for (const y of [0, 36, 72]) await clickPlan(page, canvas, x, y);
      await page.keyboard.press('Escape');
    }
    // Infill every bay with beams at 10 ft.
    await page.keyboard.press('i');
    await page.getByLabel('Max spacing, ft').fill('10');
    for (const x of [15, 45, 75]) for (const y of [18, 54]) await clickPlan(page, canvas, x, y);
    await expect(page.getByTestId('plan-notice')).toHaveText('2 beams at 10 ft, running north–south.');

    // A load zone, deck on every bay, then a corridor zone painted on one deck.
    await page.keyboard.press('z');
    await page.getByRole('button', { name: 'Use this zone' }).click();
    await page.keyboard.press('d');
    for (const x of [15, 45, 75]) for (const y of [18, 54]) await clickPlan(page, canvas, x + 3, y + 3);
    await page.keyboard.press('z');
    await page.getByLabel('Occupancy').selectOption({ label: 'Corridors above first floor' });
    await page.getByRole('button', { name: 'Use this zone' }).click();
    await clickPlan(page, canvas, 48, 57);

    // 9 girders + 8 edge beams + 12 infill beams, every one sized.
    const rows = page.getByRole('table').locator('tbody tr');
    await expect(rows).toHaveCount(29);
    await expect(page.getByTestId('design-status')).toContainText('29 members sized', { timeout: 30_000 });
    for (const row of await rows.all()) {
      await expect(row.locator('td').nth(2)).toHaveText(/^W\d+X\d+/);
      await expect(row.locator('td').nth(3)).toHaveText(/^\d\.\d\d$/);
      await expect(row.locator('td').nth(4)).toHaveText(/^(Passes|Over) — /);
    }
    await expect(canvas).toHaveAttribute('data-labelled-members', '29');
    await expect(page.getByTestId('save-status')).toHaveText(/^Saved · revision \d+/, { timeout: 15_000 });
    await page.keyboard.press('v');
    await page.mouse.move(0, 0);
    await editor.screenshot({ path: `${SCREENSHOT_DIR}/plan-engineer.png` });

    // A heavy point load at midspan of the beam on x = 10 ft makes it deeper or heavier.
    await clickPlan(page, canvas, 10, 18);
    // The Member sheet opens beside the canvas: plan and sheet in view together.
    const sheetShape = page.getByTestId('member-sheet-shape');
    await expect(sheetShape).toBeVisible();
    const [canvasBox, sheetBox] = [await canvas.boundingBox(), await page.getByTestId('member-sheet-slot').boundingBox()];
    expect(sheetBox!.x).toBeGreaterThanOrEqual(canvasBox!.x + canvasBox!.width - 1);
    expect(canvasBox!.y + canvasBox!.height).toBeLessThanOrEqual(page.viewportSize()!.height);
    await expect(page.getByTestId('save-status')).toBeInViewport();
    const sizeBefore = (await sheetShape.textContent())!;
    await page.keyboard.press('Escape');
    await page.keyboard.press('p');
    await page.getByLabel('Dead, kip').fill('20');
    await page.getByLabel('Live, kip').fill('20');
    await clickPlan(page, canvas, 10, 18);
    await page.keyboard.press('v');
    await clickPlan(page, canvas, 10, 9);
    await expect(sheetShape).not.toHaveText(sizeBefore, { timeout: 30_000 });
    const sizeAfter = (await sheetShape.textContent())!;
    expect(weight(sizeAfter)).toBeGreaterThanOrEqual(weight(sizeBefore));

    // Undo takes the point load away (the size returns); redo puts it back.
    await page.getByRole('button', { name: 'Undo' }).click();
    await expect(sheetShape).toHaveText(sizeBefore, { timeout: 30_000 });
    await page.getByRole('button', { name: 'Redo' }).click();
    await expect(sheetShape).toHaveText(sizeAfter, { timeout: 30_000 });
    await expect(page.getByTestId('save-status')).toHaveText(/^Saved · revision \d+/, { timeout: 15_000 });
    await page.screenshot({ path: `${SCREENSHOT_DIR}/plan-member-sheet.png` });
    // The Design basis opens as a panel beside the canvas too; the canvas does not move down.
    const canvasTop = (await canvas.boundingBox())!.y;
    const basisToggle = page.locator('button[aria-expanded]', { hasText: 'Design basis' });
    await basisToggle.click();
    await expect(page.getByRole('complementary', { name: 'Design basis panel' })).toBeVisible();
    expect((await canvas.boundingBox())!.y).toBe(canvasTop);
    await page.screenshot({ path: `${SCREENSHOT_DIR}/plan-design-basis.png` });
    await basisToggle.click();

    // A drafter opens the same plan: read only, no tools.
    const url = page.url();
    const drafterContext = await browser.newContext({ viewport: { width: 1600, height: 1000 } });
    const drafter = await drafterContext.newPage();
    await signInAs(drafter, 'drafter@example.com');
    await drafter.goto(url);
    await expect(drafter.getByTestId('plan-editor')).toHaveAttribute('data-read-only', 'true', { timeout: 60_000 });
    await expect(drafter.getByRole('table').locator('tbody tr')).toHaveCount(29);
    await expect(drafter.getByRole('toolbar', { name: 'Plan tools' })).toHaveCount(0);
    await expect(drafter.getByRole('button', { name: 'Undo' })).toHaveCount(0);
    await expect(drafter.getByLabel('Bays 1, 2, 3 … (east–west), ft')).toHaveCount(0);
    await expect(drafter.getByTestId('plan-notice')).toHaveText('Read only: your role can view this plan but not change it.');
    await drafter.getByTestId('plan-editor').screenshot({ path: `${SCREENSHOT_DIR}/plan-drafter.png` });
    await drafterContext.close();
  });
  // Two people saving one scheme: e2e/merge.spec.ts.
});

/** Weight per foot from a designation: W16X31 → 31. */
function weight(shape: string): number {
  const m = /^W\d+X([\d.]+)/.exec(shape.trim());
  return m ? Number(m[1]) : 0;
}
