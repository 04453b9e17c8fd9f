import { expect, test } from '@playwright/test';
import { SCREENSHOT_DIR, signInAs } from './support/auth.helpers';

// The manager compares the demo project's two schemes on Tonnage, reads which is lighter and
// cheaper, chooses the one in review, and finds it still chosen after a reload.
test('when the manager compares the demo schemes and chooses one, then it stays chosen after reload', async ({ page }) => {
  await signInAs(page, 'manager@example.com');
  await page.getByRole('table').getByRole('link', { name: 'Harrow Quay Clinic' }).click();
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Tonnage' }).click();
  await expect(page.getByRole('heading', { name: 'Tonnage', level: 2 })).toBeVisible();

  const cardA = page.getByRole('article', { name: 'Scheme A — beams at about 10 ft' });
  const cardB = page.getByRole('article', { name: 'Scheme B — beams at about 7.5 ft' });
  await expect(cardA).toBeVisible({ timeout: 30_000 });
  await expect(cardB).toBeVisible();
  await expect(cardA.getByText(/\d+\.\d tons/).first()).toBeVisible();
  await expect(cardB.getByText('Estimated cost')).toBeVisible();
  // The firm's unit prices (the demo's, or those another spec saved) are named beside the costs.
  await expect(page.getByTestId('price-basis')).toContainText(/Costs at \$[\d,]+ per ton fabricated and erected and \$[\d,]+ per connection/);

  // One sentence says which is lighter or heavier and cheaper or more expensive.
  const sentence = page.getByTestId('difference-sentences').getByRole('listitem').first();
  await expect(sentence).toHaveText(/^Scheme B — beams at about 7\.5 ft (is [\d.]+ tons \(\d+(\.\d)? %\) (lighter|heavier)|weighs about the same).*than Scheme A|^Scheme B .* Scheme A/);
  const lightest = page.getByRole('article').filter({ hasText: 'lightest' });
  const cheapest = page.getByRole('article').filter({ hasText: 'cheapest' });
  await expect(lightest).toHaveCount(1);
  await expect(cheapest).toHaveCount(1);
  // The caution once per screen, in the page footer; the note keeps the cost estimate's own words.
  await expect(page.getByRole('contentinfo')).toContainText('licensed engineer, who must check them');
  await expect(page.getByRole('note')).toContainText('Costs are estimates from unit prices');
  await expect(page.getByText('licensed engineer, who must check them')).toHaveCount(1);
  await expect(page.locator('.recharts-bar-rectangle').first()).toBeVisible();

  await expect(cardB.getByTestId('scheme-status')).toHaveText('In review');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/tonnage-compare.png`, fullPage: true });

  await cardB.getByRole('button', { name: /^Choose this scheme/ }).click();
  await expect(cardB.getByTestId('scheme-status')).toHaveText('✓ Chosen');

  await page.reload();
  const cardBAfter = page.getByRole('article', { name: 'Scheme B — beams at about 7.5 ft' });
  await expect(cardBAfter.getByTestId('scheme-status')).toHaveText('✓ Chosen', { timeout: 30_000 });
  await expect(page.getByRole('article', { name: 'Scheme A — beams at about 10 ft' }).getByTestId('scheme-status')).toHaveText('Draft');
  // The chosen scheme is now the baseline the other is measured against.
  await expect(page.getByRole('heading', { name: /^Against Scheme B — beams at about 7\.5 ft \(chosen\)/ })).toBeVisible();
  // The review panel shows the status change in the scheme's activity.
  await expect(page.getByRole('region', { name: 'Activity' })).toContainText('Status changed from in review to chosen');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/tonnage-chosen.png`, fullPage: true });

  await page.getByRole('link', { name: 'Unit prices' }).click();
  await expect(page.getByRole('heading', { name: 'Unit prices', level: 1 })).toBeVisible();
  // The current prices are shown (the demo's example prices, or those the composite spec saved).
  await expect(page.getByText(/per ton/).first()).toBeVisible();
  await page.screenshot({ path: `${SCREENSHOT_DIR}/unit-prices.png`, fullPage: true });
});
