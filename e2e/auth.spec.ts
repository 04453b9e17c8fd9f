import { expect, test } from '@playwright/test';
import { mainNav, SCREENSHOT_DIR, signInAs } from './support/auth.helpers';

test.describe('signing in and out', () => {
  test('when an anonymous visitor opens projects, then they land on sign-in and come back after', async ({ page }) => {
    await page.goto('/projects');
    await expect(page).toHaveURL(/\/signin\?next=%2Fprojects$/);
    await expect(page.getByRole('heading', { name: 'Sign in to your firm' })).toBeVisible();
    await expect(page.getByRole('contentinfo')).toContainText('licensed engineer, who must check them');
    await page.screenshot({ path: `${SCREENSHOT_DIR}/signin.png`, fullPage: true });

    await page.getByLabel('Email').fill('engineer@example.com');
    await page.getByLabel('Password').fill('baywright-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page).toHaveURL(/\/projects$/);
  });

  test('when a new firm signs up, then its person lands on projects as owner', async ({ page }) => {
    const email = `owner-${Date.now()}@example.com`;
    await page.goto('/signin');
    await page.getByRole('link', { name: 'Set up your firm' }).click();
    await expect(page).toHaveURL(/\/signup$/);

    await page.getByLabel('Firm name').fill('Kestrel Row Engineers');
    await page.getByLabel('Your name').fill('Imogen Vale');
    await page.getByLabel('Email').fill(email);
    await page.getByLabel('Password').fill('a-long-enough-password');
    await page.getByRole('button', { name: 'Create firm and sign in' }).click();

    await expect(page).toHaveURL(/\/projects$/);
    await expect(page.getByRole('heading', { name: 'Projects', level: 1 })).toBeVisible();
    await expect(page.getByRole('heading', { name: 'No projects yet' })).toBeVisible();
    await expect(page.getByRole('banner')).toContainText('Imogen Vale');
    await expect(page.getByRole('banner')).toContainText('Owner');
    await expect(mainNav(page).getByRole('link', { name: 'Team' })).toBeVisible();

    await page.getByRole('link', { name: 'Settings' }).click();
    await expect(page.getByRole('region', { name: 'Firm' })).toContainText('Kestrel Row Engineers');
  });

  test('when the email is already used, then sign-up shows it on the Email field', async ({ page }) => {
    await page.goto('/signup');
    await page.getByLabel('Firm name').fill('Duplicate Firm');
    await page.getByLabel('Your name').fill('Someone Else');
    await page.getByLabel('Email').fill('owner@example.com');
    await page.getByLabel('Password').fill('a-long-enough-password');
    await page.getByRole('button', { name: 'Create firm and sign in' }).click();

    await expect(page.getByLabel('Email')).toHaveAttribute('aria-invalid', 'true');
    await expect(page).toHaveURL(/\/signup$/);
  });

  const roles = [
    { email: 'owner@example.com', role: 'Owner', links: ['Projects', 'New project', 'Team', 'Settings'] },
    { email: 'engineer@example.com', role: 'Engineer', links: ['Projects', 'New project', 'Settings'] },
    { email: 'drafter@example.com', role: 'Drafter', links: ['Projects', 'Settings'] },
    { email: 'manager@example.com', role: 'Manager', links: ['Projects', 'Settings'] },
  ];

  for (const { email, role, links } of roles) {
    test(`when ${email} signs in, then the navigation fits the ${role.toLowerCase()} role`, async ({ page }) => {
      await signInAs(page, email);
      await expect(page.getByRole('banner')).toContainText(role);
      await expect(mainNav(page).getByRole('link')).toHaveText(links);
    });
  }

  test('when a drafter opens the new-project address, then the page says the role cannot start projects', async ({ page }) => {
    await signInAs(page, 'drafter@example.com');
    await page.goto('/projects/new');
    await expect(page.getByRole('alert')).toContainText('cannot start projects');
    await expect(page.getByRole('button', { name: 'Create project' })).toHaveCount(0);
  });

  test('when a signed-in person opens sign-in, then they are sent to projects', async ({ page }) => {
    await signInAs(page, 'manager@example.com');
    await page.goto('/signin');
    await expect(page).toHaveURL(/\/projects$/);
  });

  test('when signing out, then sign-in is shown and projects are closed again', async ({ page }) => {
    await signInAs(page, 'engineer@example.com');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await expect(page).toHaveURL(/\/signin$/);
    await expect(page.getByRole('heading', { name: 'Sign in to your firm' })).toBeVisible();

    await page.goto('/projects');
    await expect(page).toHaveURL(/\/signin\?next=/);
  });

  test('when the password is wrong, then the form says so and stays on sign-in', async ({ page }) => {
    await page.goto('/signin');
    await page.getByLabel('Email').fill('engineer@example.com');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();

    await expect(page.getByRole('alert')).toBeVisible();
    await expect(page.getByRole('alert')).not.toBeEmpty();
    await expect(page).toHaveURL(/\/signin$/);
  });

  test('when an unknown address is opened, then the 404 page offers the way back', async ({ page }) => {
    await signInAs(page, 'engineer@example.com');
    await page.goto('/no-such-page');
    await expect(page.getByRole('heading', { name: 'This page does not exist' })).toBeVisible();
    await page.getByRole('link', { name: 'Go to projects' }).click();
    await expect(page).toHaveURL(/\/projects$/);
  });
});
