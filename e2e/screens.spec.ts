import { expect, test, type Page } from '@playwright/test';
import { SCREENSHOT_DIR, signInAs, openDemoProject } from './support/auth.helpers';

// Walks the screens a person sees, checks each carries the caution, and keeps a picture of
// each in artifacts/screenshots for review.
async function expectCaution(page: Page) {
  await expect(page.getByRole('contentinfo')).toContainText(
    'an aid to a licensed engineer, who must check them. The local building code and the engineer of record govern.',
  );
}

test('when an owner walks through every screen, then each carries the caution', async ({ page }) => {
  await page.goto('/signup');
  await page.getByRole('button', { name: 'Create firm and sign in' }).click();
  await expect(page.getByLabel('Password')).toHaveAttribute('aria-invalid', 'true');
  await expectCaution(page);
  await page.screenshot({ path: `${SCREENSHOT_DIR}/signup-errors.png`, fullPage: true });

  await page.goto('/signin');
  await page.getByLabel('Email').fill('owner@example.com');
  await page.getByLabel('Password').fill('wrong-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert')).toBeVisible();
  await page.screenshot({ path: `${SCREENSHOT_DIR}/signin-error.png`, fullPage: true });

  await signInAs(page, 'owner@example.com');
  await expectCaution(page);

  await page.goto('/projects/new');
  await expect(page.getByRole('heading', { name: 'New project', level: 1 })).toBeVisible();
  await expectCaution(page);
  await page.screenshot({ path: `${SCREENSHOT_DIR}/project-new.png`, fullPage: true });

  await page.goto('/projects');
  await openDemoProject(page);
  await page.getByRole('link', { name: 'Project details' }).click();
  await expect(page.getByRole('heading', { name: 'Project details', level: 2 })).toBeVisible();
  await expectCaution(page);
  await page.screenshot({ path: `${SCREENSHOT_DIR}/project-details.png`, fullPage: true });

  await page.getByRole('link', { name: 'Plan' }).click();
  await expect(page.getByRole('heading', { name: 'Open a scheme on the Plan' })).toBeVisible();
  await expectCaution(page);
  await page.screenshot({ path: `${SCREENSHOT_DIR}/project-plan.png`, fullPage: true });

  await page.getByRole('link', { name: 'Settings' }).click();
  await expect(page.getByRole('heading', { name: 'Settings', level: 1 })).toBeVisible();
  await expectCaution(page);
  await page.screenshot({ path: `${SCREENSHOT_DIR}/settings.png`, fullPage: true });

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Team' }).click();
  await expect(page.getByRole('heading', { name: 'Team', level: 1 })).toBeVisible();
  await expect(
    page.getByRole('table', { name: 'What each role may do' }).getByRole('row', { name: /Owner/ }),
  ).toHaveAttribute('aria-current', 'true');
  await expectCaution(page);
  await page.screenshot({ path: `${SCREENSHOT_DIR}/team.png`, fullPage: true });
});
