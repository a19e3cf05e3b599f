import { expect, test } from '@playwright/test';
import { HAZEL, DEMO_PASSWORD, tabTo, uniqueEmail } from './support';

test('sign in and send an invitation with the keyboard alone', async ({ page }) => {
  const email = uniqueEmail('keyboard');
  await page.goto('/sign-in');
  await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeVisible();

  // The first Tab lands on the skip link.
  await page.keyboard.press('Tab');
  await expect(page.getByRole('link', { name: 'Skip to main content' })).toBeFocused();

  await tabTo(page, page.getByLabel('E-mail address'));
  await page.keyboard.type(HAZEL.email);
  await page.keyboard.press('Tab');
  await expect(page.getByLabel('Password', { exact: true })).toBeFocused();
  await page.keyboard.type(DEMO_PASSWORD);
  await page.keyboard.press('Tab');
  await expect(page.getByLabel('Keep me signed in on this device')).toBeFocused();
  await page.keyboard.press('Space');
  await expect(page.getByLabel('Keep me signed in on this device')).toBeChecked();
  await page.keyboard.press('Shift+Tab');
  await expect(page.getByLabel('Password', { exact: true })).toBeFocused();
  await page.keyboard.press('Enter');

  await expect(page).toHaveURL(/\/$/);
  await expect(page.getByRole('heading', { level: 1, name: /^Hello, Hazel/ })).toBeVisible();

  const directoryLink = page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Members' });
  await tabTo(page, directoryLink);
  await page.keyboard.press('Enter');
  await expect(page.getByRole('heading', { level: 1, name: /members$/ })).toBeVisible();

  const form = page.getByRole('form', { name: /^Invite a member/ });
  await tabTo(page, form.getByLabel('E-mail address'));
  await page.keyboard.type(email);
  await tabTo(page, form.getByLabel('Treasurer'));
  await page.keyboard.press('Space');
  await expect(form.getByLabel('Treasurer')).toBeChecked();
  await tabTo(page, form.getByRole('button', { name: 'Send invitation' }));
  await page.keyboard.press('Enter');

  await expect(page.getByRole('status').filter({ hasText: `Invitation sent to ${email}` })).toBeVisible();
  const pending = page.getByRole('list', { name: 'Pending invitations' });
  await expect(pending).toContainText(email);
  await expect(pending).toContainText('Treasurer');
});
