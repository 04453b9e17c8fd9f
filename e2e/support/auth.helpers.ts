import { expect, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'baywright-demo';
export const SCREENSHOT_DIR = 'artifacts/screenshots';

export async function signInAs(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/signin');
  await page.getByLabel('Email').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/projects$/);
}

export function mainNav(page: Page) {
  return page.getByRole('navigation', { name: 'Main' });
}

/** The seeded demo project's name (server/db/seed-demo.ts); other specs add projects of their own. */
export const DEMO_PROJECT = 'Harrow Quay Clinic';

/** From the Projects list, open the demo project by its name, not by its place in the list. */
export async function openDemoProject(page: Page): Promise<void> {
  await page.getByRole('table').getByRole('link', { name: DEMO_PROJECT }).first().click();
}
