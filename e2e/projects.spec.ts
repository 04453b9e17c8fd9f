import { expect, test } from '@playwright/test';
import { SCREENSHOT_DIR, signInAs } from './support/auth.helpers';

test.describe('projects', () => {
  test('when an engineer creates a project, then its page opens with its sections and honest empty states', async ({ page }) => {
    const name = `Alder Quay Offices ${Date.now().toString(36).slice(-4).toUpperCase()}`;
    await signInAs(page, 'engineer@example.com');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'New project' }).click();
    await expect(page.getByRole('heading', { name: 'New project', level: 1 })).toBeVisible();

    // An empty name is refused beside the field before anything is sent.
    await page.getByRole('button', { name: 'Create project' }).click();
    await expect(page.getByLabel('Project name')).toHaveAttribute('aria-invalid', 'true');

    await page.getByLabel('Project name').fill(name);
    await page.getByLabel('Project number').fill('BW-2417');
    await page.getByLabel('Client').fill('Alder Quay Holdings');
    await page.getByLabel('Site address').fill('14 Ferrier Lane, Eastmoor');
    await page.getByRole('button', { name: 'Create project' }).click();

    await expect(page).toHaveURL(/\/projects\/[^/]+$/);
    await expect(page.getByRole('heading', { name, level: 1 })).toBeVisible();
    await expect(page.getByText('BW-2417')).toBeVisible();
    const sections = page.getByRole('navigation', { name: 'Project sections' });
    await expect(sections.getByRole('link')).toHaveText(['Schemes', 'Plan', 'Schedule', 'Column stack', 'Tonnage', 'Project details']);
    await expect(page.getByRole('heading', { name: 'No schemes yet' })).toBeVisible();
    await page.screenshot({ path: `${SCREENSHOT_DIR}/project.png`, fullPage: true });

    await sections.getByRole('link', { name: 'Tonnage' }).click();
    await expect(page.getByRole('heading', { name: 'Nothing to compare yet' })).toBeVisible();

    // The new project is listed, and a reload of its page keeps the session.
    await page.reload();
    await expect(page.getByRole('heading', { name, level: 1 })).toBeVisible();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Projects' }).click();
    await expect(page.getByRole('link', { name })).toBeVisible();
    await page.screenshot({ path: `${SCREENSHOT_DIR}/projects.png`, fullPage: true });
  });

  test('when an engineer edits a project and then deletes it, then the list follows', async ({ page }) => {
    const name = `Wren Street Clinic ${Date.now().toString(36).slice(-4).toUpperCase()}`;
    await signInAs(page, 'engineer@example.com');
    await page.goto('/projects/new');
    await page.getByLabel('Project name').fill(name);
    await page.getByRole('button', { name: 'Create project' }).click();
    await expect(page.getByRole('heading', { name, level: 1 })).toBeVisible();

    await page.getByRole('link', { name: 'Project details' }).click();
    await page.getByLabel('Client').fill('Wren Street Health Trust');
    await page.getByRole('button', { name: 'Save details' }).click();
    await expect(page.getByRole('status')).toContainText('Saved');
    await expect(page.locator('header dl')).toContainText('Wren Street Health Trust');

    await page.getByRole('button', { name: 'Delete project…' }).click();
    await page.getByRole('button', { name: `Delete “${name}” permanently` }).click();
    await expect(page).toHaveURL(/\/projects$/);
    await expect(page.getByRole('link', { name })).toHaveCount(0);
  });

  test('when a drafter opens a project, then its details are read-only and no create action is offered', async ({ page }) => {
    await signInAs(page, 'drafter@example.com');
    await expect(page.getByRole('link', { name: 'Start a project' })).toHaveCount(0);
    // The demo seed gives the firm one project.
    const first = page.getByRole('table').getByRole('link').first();
    await expect(first).toBeVisible();
    await first.click();
    await page.getByRole('link', { name: 'Project details' }).click();
    await expect(page.getByLabel('Project name')).toHaveAttribute('readonly', '');
    await expect(page.getByRole('button', { name: 'Save details' })).toHaveCount(0);
    await expect(page.getByRole('button', { name: 'Delete project…' })).toHaveCount(0);
  });
});
