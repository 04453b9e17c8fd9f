import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { SCREENSHOT_DIR, signInAs, openDemoProject } from './support/auth.helpers';

// The drafter's afternoon: open the demo project's Schedule, filter it, download the CSV and
// the plan sheet, review the sheet on screen. Marks are the only thing a drafter may change.

test.setTimeout(150_000);

test('a drafter filters the schedule, downloads the CSV and the plan sheet, and edits nothing but marks', async ({ page }) => {
  await signInAs(page, 'drafter@example.com');
  await openDemoProject(page);
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.getByRole('link', { name: 'Schedule' }).click();

  // By default one row per mark, with its quantity and the envelope of its reactions, and every
  // column (Camber, Studs, Level, Kind included) inside the window at 1440 px.
  const byMark = page.getByRole('table', { name: 'Schedule by mark' });
  await expect(byMark).toBeVisible({ timeout: 30_000 });
  await expect(byMark.getByRole('columnheader', { name: /Reaction, envelope of the ends/ })).toBeVisible();
  const quantities = await byMark.locator('tbody tr[data-mark]').evaluateAll((rows) => rows.map((r) => Number(r.getAttribute('data-quantity'))));
  expect(quantities.some((q) => q > 1)).toBe(true);
  const fit = await byMark.evaluate((t) => ({ table: t.scrollWidth, box: t.parentElement!.clientWidth, right: t.getBoundingClientRect().right }));
  expect(fit.table).toBeLessThanOrEqual(fit.box);
  expect(fit.right).toBeLessThanOrEqual(1440);
  for (const name of [/^Camber/, 'Studs', 'Level', 'Kind']) await expect(byMark.getByRole('columnheader', { name })).toBeInViewport();
  await page.screenshot({ path: `${SCREENSHOT_DIR}/schedule-by-mark.png`, fullPage: false });
  const [markCsv] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download CSV' }).click()]);
  const markLines = readFileSync((await markCsv.path())!, 'utf8').split('\r\n').filter(Boolean);
  expect(markLines[0]).toMatch(/^level,level_name,mark,kind,size,quantity,/);
  expect(markLines).toHaveLength(quantities.length + 1);

  await page.getByRole('combobox', { name: 'Rows' }).selectOption('member');
  const table = page.getByRole('table', { name: 'Member schedule' });
  await expect(table).toBeVisible();
  const memberFit = await table.evaluate((t) => ({ table: t.scrollWidth, box: t.parentElement!.clientWidth }));
  expect(memberFit.table).toBeLessThanOrEqual(memberFit.box);
  await expect(table).toBeVisible({ timeout: 30_000 });
  await expect(page.getByText('licensed engineer').first()).toBeVisible();
  // The demo is composite: studs are in the schedule, so no "columns stay empty" note.
  await expect(page.getByText(/these columns stay empty/)).toHaveCount(0);
  const count = page.getByText(/^\d+ of \d+ members$/);
  const total = Number((await count.textContent())!.split(' of ')[1].split(' ')[0]);
  expect(total).toBeGreaterThan(20);

  // Filter: girders on the first level only.
  const levelSelect = page.getByRole('combobox', { name: 'Level' });
  const firstLevel = await levelSelect.locator('option').nth(1).getAttribute('value');
  await levelSelect.selectOption(firstLevel!);
  await page.getByRole('combobox', { name: 'Kind' }).selectOption('girder');
  const shown = Number((await count.textContent())!.split(' of ')[0]);
  expect(shown).toBeGreaterThan(0);
  expect(shown).toBeLessThan(total);
  await expect(table.locator('tbody tr[data-member]')).toHaveCount(shown);
  await page.getByRole('combobox', { name: 'Group by' }).selectOption('kind');
  await expect(page.getByTestId('schedule-group')).toHaveCount(1);
  await page.screenshot({ path: `${SCREENSHOT_DIR}/schedule.png`, fullPage: true });

  // Marks are the drafter's only edit; nothing to change geometry, loads, sizes or schemes.
  await expect(page.getByRole('button', { name: /^Edit mark of member / }).first()).toBeVisible();
  await expect(page.getByRole('button', { name: 'Renumber marks' })).toBeVisible();
  await expect(page.getByRole('button', { name: /lock|design now|save plan|delete|new scheme/i })).toHaveCount(0);

  // CSV download.
  const [csv] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download CSV' }).click()]);
  expect(csv.suggestedFilename()).toMatch(/^[a-z0-9-]+-schedule-r\d+\.csv$/);
  const csvText = readFileSync((await csv.path())!, 'utf8');
  expect(csvText.split('\r\n')[0]).toMatch(/^level,level_name,mark,member_id,kind,size,count_same_mark,span_ft,/);
  expect(csvText.split('\r\n').filter(Boolean)).toHaveLength(total + 1);

  // Plan sheet PDF download.
  const [pdf] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download plan sheet (PDF)' }).click()]);
  expect(pdf.suggestedFilename()).toMatch(/^[a-z0-9-]+-plan-sheet-r\d+\.pdf$/);
  expect(readFileSync((await pdf.path())!).subarray(0, 5).toString('latin1')).toBe('%PDF-');

  // The same sheet on screen.
  await page.getByRole('button', { name: 'View plan sheet' }).click();
  const sheet = page.getByTestId('plan-sheet-svg');
  await expect(sheet).toBeVisible({ timeout: 30_000 });
  await expect(sheet.getByText('CAUTION')).toBeVisible();
  await sheet.screenshot({ path: `${SCREENSHOT_DIR}/plan-sheet-svg.png` });

  // The Schemes tab offers the drafter no scheme writes either.
  await page.getByRole('link', { name: 'Schemes' }).click();
  await expect(page.getByRole('button', { name: /new scheme|import/i })).toHaveCount(0);
});
