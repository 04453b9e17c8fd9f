import { expect, test } from '@playwright/test';
import { SCREENSHOT_DIR, openDemoProject, signInAs } from './support/auth.helpers';
import { clickPlan, planCanvas, toPage } from './support/plan-canvas.helpers';

// Composite beams end to end (issue 11): the engineer changes f'c of a deck's slab on the demo
// scheme, the framing re-designs composite (studs and camber on the Plan labels and the Member
// sheet, both stages), the Schedule fills Studs and Camber, and the manager prices studs and
// camber and sees their cost on Tonnage. Demo coordinates: Scheme A, beams at y = 10 and 20 ft
// spanning x = 0 to 30 ft between girders on x = 0 and 30 ft.
test.describe.configure({ timeout: 240_000 });

test('when the engineer changes the slab and opens a beam, then studs, camber and both stages show; the Schedule and Tonnage carry them', async ({ page }) => {
  await signInAs(page, 'engineer@example.com');
  await openDemoProject(page);
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Plan' }).click();
  await page.getByRole('link', { name: /^Scheme A/ }).click();
  const canvas = await planCanvas(page, 90_000);
  await expect(page.getByTestId('design-status')).toContainText('sized', { timeout: 90_000 });
  // Zoom in on the first bay until member labels (size, studs, camber) are drawn.
  for (let i = 0; i < 12; i++) {
    const p = await toPage(canvas, 15, 15);
    await page.mouse.move(p.x, p.y);
    await page.mouse.wheel(0, -120);
    if (Number(await canvas.getAttribute('data-view-scale')) >= 12) break;
  }
  await expect(canvas).toHaveAttribute('data-labelled-members', /^[1-9]\d*$/, { timeout: 30_000 });

  // A deck between the beams: its slab build-up with the dead load arithmetic.
  await clickPlan(page, canvas, 15, 15);
  const slab = page.getByRole('group', { name: 'Slab build-up' });
  await expect(slab).toBeVisible({ timeout: 15_000 });
  await expect(page.getByTestId('slab-dead-load')).toContainText('47.6 psf'); // 114 × (3.25 + 3 × 6/12) / 12 + 2.5 (demo slab)

  // The firm's library: this build-up saved under a name of our own, renamed, then deleted; the deck keeps its slab.
  const profileName = `Quay slab ${Date.now()}`;
  await slab.getByLabel('Profile name').fill(profileName);
  await slab.getByRole('button', { name: 'Save to library' }).click();
  await expect(slab.getByRole('status')).toContainText(`Saved “${profileName}”`);
  const library = page.getByTestId('deck-profile-library');
  await library.getByText(/^Deck profile library/).click();
  const saved = library.getByRole('listitem', { name: `Deck profile ${profileName}` });
  await saved.getByRole('button', { name: 'Rename' }).click();
  await saved.getByLabel('New name').fill(`${profileName} (typical floor)`);
  await saved.getByRole('button', { name: 'Save name' }).click();
  const renamed = library.getByRole('listitem', { name: `Deck profile ${profileName} (typical floor)` });
  await expect(renamed).toBeVisible();
  await renamed.scrollIntoViewIfNeeded();
  await page.screenshot({ path: `${SCREENSHOT_DIR}/deck-profile-library.png` });
  await renamed.getByRole('button', { name: 'Delete' }).click();
  await renamed.getByRole('button', { name: `Delete “${profileName} (typical floor)”` }).click();
  await expect(library.getByRole('status')).toContainText(`Deleted “${profileName} (typical floor)” from the library.`);
  await expect(library.getByRole('listitem', { name: new RegExp(`^Deck profile ${profileName}`) })).toHaveCount(0);
  await expect(page.getByTestId('slab-dead-load')).toContainText('47.6 psf');
  const fc = slab.getByLabel("f'c, ksi");
  await fc.fill('4');
  await fc.press('Enter');
  await expect(page.getByTestId('save-status')).toHaveText(/^Saved · revision \d+/, { timeout: 30_000 });
  await page.keyboard.press('Escape');
  await page.mouse.move(0, 0);
  await page.screenshot({ path: `${SCREENSHOT_DIR}/composite-plan.png` });

  // A beam at y = 10 ft: the Member sheet shows the composite section, both stages, studs and camber.
  await clickPlan(page, canvas, 15, 10);
  await expect(page.getByTestId('member-sheet-shape')).toBeVisible({ timeout: 30_000 });
  const sheet = page.getByTestId('member-sheet-slot');
  await expect(sheet.getByText('Construction stage (bare steel)', { exact: true }).first()).toBeVisible({ timeout: 30_000 });
  await expect(sheet.getByText('Final stage', { exact: true }).first()).toBeVisible();
  await expect(sheet.getByText('Studs', { exact: true }).first()).toBeVisible();
  await expect(sheet.getByText('Camber', { exact: true }).first()).toBeVisible();
  await expect(sheet.getByRole('combobox', { name: 'Composite design' })).toHaveValue('basis');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/composite-member-sheet.png` });

  // The Schedule: Studs and Camber filled on composite members.
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Schedule' }).click();
  const byMark = page.getByRole('table', { name: 'Schedule by mark' });
  await expect(byMark).toBeVisible({ timeout: 90_000 });
  await expect(byMark.getByRole('columnheader', { name: 'Studs' })).toBeVisible();
  // Studs is the third cell from the end (…, Camber, Studs, Level, Kind); the reaction header spans four cells.
  const studs = await byMark.locator('tbody tr').evaluateAll((rows) => rows.map((r) => { const c = r.querySelectorAll('td'); return c[c.length - 3]?.textContent ?? ''; }));
  expect(studs.some((s) => /^\s*[1-9]\d*/.test(s))).toBe(true);
  await page.screenshot({ path: `${SCREENSHOT_DIR}/composite-schedule.png`, fullPage: true });

  // The manager prices studs and camber and sees their cost on Tonnage.
  await page.context().clearCookies();
  await signInAs(page, 'manager@example.com');
  await page.goto('/settings/unit-prices');
  await page.getByLabel(/^Shear stud \(US\$ each\)/).fill('4.50');
  await page.getByLabel(/^Camber \(US\$ per cambered piece\)/).fill('350');
  await page.getByRole('button', { name: 'Save prices' }).click();
  // The form remounts on the new prices row, so read the current prices rather than the status line.
  await expect(page.getByRole('region', { name: 'Current prices' }).getByText('$4.50 each')).toBeVisible({ timeout: 30_000 });
  await page.goto('/projects');
  await openDemoProject(page);
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Tonnage' }).click();
  const cardA = page.getByRole('article', { name: 'Scheme A — beams at about 10 ft' });
  await expect(cardA).toBeVisible({ timeout: 90_000 });
  await expect(cardA.getByText('Shear studs cost')).toBeVisible();
  await expect(cardA.getByText('Shear studs cost').locator('xpath=following-sibling::dd[1]')).toHaveText(/^\$[\d,]+$/);
  await expect(cardA.getByText('Camber cost').locator('xpath=following-sibling::dd[1]')).toHaveText(/^\$[\d,]+$/);
  await expect(page.getByTestId('price-basis')).toContainText('$4.50 per shear stud, $350 per cambered piece');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/composite-tonnage.png`, fullPage: true });
});
