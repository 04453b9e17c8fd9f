import { expect, test } from '@playwright/test';
import { mainNav, SCREENSHOT_DIR, signInAs } from './support/auth.helpers';

test('when the owner invites an engineer, then the link from the Outbox signs the new person in as engineer and the audit log shows it', async ({
  page,
  browser,
}) => {
  const email = `fern.ashby.${Date.now().toString(36)}@larkspur.example`;

  // The owner invites from the Team screen.
  await signInAs(page, 'owner@example.com');
  await mainNav(page).getByRole('link', { name: 'Team' }).click();
  await expect(page.getByRole('heading', { name: 'Team', level: 1 })).toBeVisible();
  const form = page.getByRole('form', { name: 'Invite a person' });
  // A bad address is refused beside its field.
  await form.getByLabel('E-mail').fill('not-an-address');
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await expect(form.getByLabel('E-mail')).toHaveAttribute('aria-invalid', 'true');

  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Role').selectOption('engineer');
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Invitation sent to' })).toContainText(email);
  const waiting = page.getByRole('list', { name: 'Waiting invitations' });
  await expect(waiting).toContainText(email);
  await expect(waiting).toContainText('Engineer');
  await expect(page.getByRole('table', { name: 'People of your firm and their roles' })).toContainText('Imogen Ashdown');
  await page.screenshot({ path: `${SCREENSHOT_DIR}/team-manage.png`, fullPage: true });

  // The link is read from the Outbox screen.
  await page.getByRole('navigation', { name: 'Team sections' }).getByRole('link', { name: 'Outbox' }).click();
  await expect(page.getByRole('heading', { name: 'Outbox', level: 1 })).toBeVisible();
  const message = page.getByRole('article').filter({ hasText: email }).first();
  await expect(message).toContainText('invited you to Larkspur Structural Partners');
  const link = message.getByRole('link', { name: /\/invitations\// });
  await expect(link).toBeVisible();
  const href = await link.getAttribute('href');
  expect(href).toMatch(/\/invitations\/[a-z0-9]{52}$/);
  await page.screenshot({ path: `${SCREENSHOT_DIR}/outbox.png`, fullPage: true });

  // The new person opens it in their own browser.
  const theirs = await browser.newContext();
  const newcomer = await theirs.newPage();
  await newcomer.goto(href!);
  await expect(newcomer.getByRole('heading', { name: 'Join Larkspur Structural Partners' })).toBeVisible();
  await expect(newcomer.getByText('You are invited as engineer.')).toBeVisible();
  await newcomer.getByRole('button', { name: 'Join and sign in' }).click();
  await expect(newcomer.getByLabel('Your name')).toHaveAttribute('aria-invalid', 'true');
  await newcomer.getByLabel('Your name').fill('Fern Ashby');
  await newcomer.getByLabel('Password').fill('fern-long-password');
  await newcomer.getByRole('button', { name: 'Join and sign in' }).click();

  await expect(newcomer).toHaveURL(/\/projects$/);
  await expect(newcomer.getByRole('banner')).toContainText('Fern Ashby');
  await expect(newcomer.getByRole('banner')).toContainText('Engineer');
  await expect(mainNav(newcomer).getByRole('link')).toHaveText(['Projects', 'New project', 'Settings']);

  // The same link a second time says it has been used.
  await newcomer.goto(href!);
  await expect(newcomer.getByRole('heading', { name: 'This invitation cannot be used' })).toBeVisible();
  await expect(newcomer.getByRole('alert')).toContainText('already been used');
  await theirs.close();

  // The owner sees the new person and the audit log records the invitation.
  await page.getByRole('navigation', { name: 'Team sections' }).getByRole('link', { name: 'People' }).click();
  await expect(page.getByRole('table', { name: 'People of your firm and their roles' })).toContainText('Fern Ashby');
  await expect(page.getByLabel('Role of Fern Ashby')).toHaveValue('engineer');
  await page.getByRole('navigation', { name: 'Team sections' }).getByRole('link', { name: 'Audit log' }).click();
  await expect(page.getByRole('heading', { name: 'Audit log', level: 1 })).toBeVisible();
  const log = page.getByRole('table', { name: 'Audit log, newest first' });
  await expect(log.getByRole('row').filter({ hasText: 'Invitation sent' }).filter({ hasText: email })).toHaveCount(1);
  await expect(log.getByRole('row').filter({ hasText: 'Invitation accepted' }).filter({ hasText: email })).toHaveCount(1);

  // Filtering to invitations leaves sign-ins out.
  await page.getByLabel('What').selectOption('invitation');
  await page.getByRole('button', { name: 'Apply' }).click();
  await expect(log.getByRole('row').filter({ hasText: 'Signed in' })).toHaveCount(0);
  await expect(log.getByRole('row').filter({ hasText: email })).toHaveCount(2);
  await page.screenshot({ path: `${SCREENSHOT_DIR}/audit.png`, fullPage: true });
});

test('when someone forgot their password, then the page answers the same whatever the address', async ({ page }) => {
  await page.goto('/signin');
  await page.getByRole('link', { name: 'Forgot your password?' }).click();
  await expect(page.getByRole('heading', { name: 'Forgot your password?' })).toBeVisible();
  await page.getByLabel('Email').fill('nobody-here@example.com');
  await page.getByRole('button', { name: 'Send me a link' }).click();
  await expect(page.getByRole('status')).toContainText('If an account uses this address');
});
