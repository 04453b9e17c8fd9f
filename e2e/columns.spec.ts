import { expect, test, type Page } from '@playwright/test';
import { SCREENSHOT_DIR, openDemoProject, signInAs } from './support/auth.helpers';
import { clickPlan, planCanvas } from './support/plan-canvas.helpers';

// The Column stack: every demo column sized by tier, one column's sheet with its working, a
// splice moved by the engineer (the tiers follow), and the same screen read-only for a drafter.

test.setTimeout(240_000);

async function openColumnStack(page: Page) {
  await openDemoProject(page);
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.getByRole('link', { name: 'Column stack' }).click();
  const table = page.getByTestId('column-stack');
  // The server designs a stale scheme first: allow a loaded machine.
  await expect(table).toBeVisible({ timeout: 90_000 });
  return table;
}

test('an engineer sees every column sized by tier, opens a column sheet and moves a splice; a drafter sees it read only', async ({ page, browser }) => {
  await signInAs(page, 'engineer@example.com');
  const table = await openColumnStack(page);

  // Every column: a size in every cell it reaches and at least one tier in the foot row.
  const headers = table.locator('thead th button');
  const count = await headers.count();
  expect(count).toBeGreaterThan(3);
  const sizes = await table.locator('tbody td[data-column]').evaluateAll((cells) => cells.map((c) => c.querySelector('span')?.textContent ?? ''));
  expect(sizes.length).toBeGreaterThan(count);
  for (const s of sizes) expect(s).toMatch(/^W\d+X\d+/);
  const tierRows = await table.locator('tfoot td').evaluateAll((cells) => cells.map((c) => c.querySelectorAll('span.block').length));
  expect(tierRows).toHaveLength(count);
  for (const n of tierRows) expect(n).toBeGreaterThan(0);

  // A four-level demo column has two tiers by default (two storeys each, common practice): the length below Level 4 is in tier 2.
  const l4 = table.locator('td[data-level="L4"][data-tier="2"]').first();
  await expect(l4).toBeVisible();
  const columnId = (await l4.getAttribute('data-column'))!;
  const column = table.locator(`td[data-column="${columnId}"]`);
  expect(await column.evaluateAll((cells) => cells.map((c) => c.getAttribute('data-tier')))).toEqual(['2', '2', '1', '1']);

  // Its sheet: per tier the working, with the E3 branch and the lighter shapes tried.
  await table.locator(`td[data-column="${columnId}"][data-level="L4"]`).scrollIntoViewIfNeeded();
  const markOf = await page.evaluate((id) => {
    const td = document.querySelector(`[data-testid="column-stack"] td[data-column="${id}"]`) as HTMLTableCellElement;
    const th = td.closest('table')!.querySelectorAll('thead th')[td.cellIndex] as HTMLElement;
    return th.querySelector('button')!.textContent!;
  }, columnId);
  await table.getByRole('button', { name: markOf, exact: true }).click();
  const sheet = page.getByTestId('column-sheet');
  await expect(sheet).toBeVisible();
  await expect(sheet.getByRole('heading', { name: new RegExp(`^Column ${markOf}`) })).toBeVisible();
  await expect(sheet.getByTestId('column-sheet-tier-2')).toBeVisible();
  await expect(sheet.getByTestId('column-sheet-tier-1')).toBeVisible();
  await expect(sheet.getByText(/^Eq\. E3-[23]: /).first()).toBeVisible();
  await expect(sheet.getByText('governs').first()).toBeVisible();
  // Inside the signed-in shell the caution is said once, in the page footer.
  await expect(page.getByRole('contentinfo')).toContainText('licensed engineer');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/column-stack-sheet.png`, fullPage: true });

  // Move this column's splice from Level 3 up to Level 4: the length below Level 4 joins tier 1.
  await sheet.getByLabel('follow the splices for all columns').uncheck();
  await sheet.getByLabel(`Splice ${markOf} at Level 3`).uncheck();
  await sheet.getByLabel(`Splice ${markOf} at Level 4`).check();
  await sheet.getByRole('button', { name: `Save splices of ${markOf}` }).click();
  await expect(page.getByRole('status').filter({ hasText: /Saved \(revision \d+\); the columns were designed again\./ })).toBeVisible({ timeout: 90_000 });
  await expect.poll(() => column.evaluateAll((cells) => cells.map((c) => c.getAttribute('data-tier'))), { timeout: 60_000 }).toEqual(['2', '1', '1', '1']);
  await expect(table.locator(`td[data-column="${columnId}"][data-level="R"]`).getByText('▾ splice')).toBeVisible();
  await page.screenshot({ path: `${SCREENSHOT_DIR}/column-stack-splice-moved.png`, fullPage: true });

  // A drafter: the same schedule (with the moved splice), the sheet, and no controls.
  const context = await browser.newContext();
  const drafter = await context.newPage();
  await signInAs(drafter, 'drafter@example.com');
  const dTable = await openColumnStack(drafter);
  await expect(drafter.getByTestId('column-settings-readonly')).toContainText('Read only');
  await expect.poll(() => dTable.locator(`td[data-column="${columnId}"]`).evaluateAll((cells) => cells.map((c) => c.getAttribute('data-tier')))).toEqual(['2', '1', '1', '1']);
  await dTable.getByRole('button', { name: markOf, exact: true }).click();
  await expect(drafter.getByTestId('column-sheet')).toBeVisible();
  await expect(drafter.getByTestId('column-editor')).toHaveCount(0);
  await expect(drafter.getByRole('checkbox')).toHaveCount(0);
  await expect(drafter.getByRole('button', { name: /^Save splices/ })).toHaveCount(0);
  await drafter.screenshot({ path: `${SCREENSHOT_DIR}/column-stack-drafter.png`, fullPage: true });
  // The server refuses a drafter's plan save whatever the screen shows ('plan:write').
  const schemeId = new URL(drafter.url()).searchParams.get('scheme') ?? '';
  if (schemeId) {
    const origin = new URL(drafter.url()).origin;
    const res = await drafter.request.put(`/api/schemes/${schemeId}/plan`, { data: { revision: 1, plan: {} }, headers: { Origin: origin } });
    expect(res.status()).toBe(403);
  }

  // On the Plan, a click on the column opens the same sheet beside the canvas.
  const projectId = new URL(drafter.url()).pathname.split('/')[2];
  const scheme = (await (await drafter.request.get(`/api/schemes/${schemeId}`)).json()) as { scheme: { plan: { columns: { id: string; x_ft: number; y_ft: number }[] } } };
  const at = scheme.scheme.plan.columns.find((c) => c.id === columnId)!;
  await drafter.goto(`/projects/${projectId}/plan?scheme=${schemeId}&level=L2`);
  const canvas = await planCanvas(drafter, 90_000);
  await expect(drafter.getByTestId('design-status')).toContainText('members sized', { timeout: 90_000 });
  await clickPlan(drafter, canvas, at.x_ft, at.y_ft);
  const slot = drafter.getByTestId('column-sheet-slot');
  await expect(slot).toBeVisible({ timeout: 30_000 });
  await expect(slot.getByRole('heading', { name: new RegExp(`^Column ${markOf}`) })).toBeVisible();
  await expect(slot.getByTestId('column-sheet-tier-1')).toBeVisible();
  await drafter.screenshot({ path: `${SCREENSHOT_DIR}/column-sheet-on-plan.png` });
  await context.close();
});
