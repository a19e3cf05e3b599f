import { expect, test } from '@playwright/test';
import { acceptAsNewPerson, findEmailLink, inviteNewEmail, newPerson, signIn, uniqueEmail } from './support';

// Uses a freshly invited account so the demo passwords never change.
test('a member resets a forgotten password from the e-mail link', async ({ browser, page }) => {
  const email = uniqueEmail('forgetful');
  const invitationPath = await inviteNewEmail(browser, email);
  const joiner = await newPerson(browser);
  await acceptAsNewPerson(joiner.page, invitationPath, 'Ada Forgetful', 'first-password-123');
  await joiner.context.close();

  await page.goto('/sign-in');
  await page.getByRole('link', { name: 'Forgot your password?' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Forgot your password?' })).toBeVisible();
  await page.getByLabel('E-mail address').fill(email);
  await page.getByRole('button', { name: 'Send me a reset link' }).click();
  await expect(page.getByRole('status')).toContainText('Check your e-mail');

  const resetPath = await findEmailLink(page, email, '/reset-password');
  await page.goto(resetPath);
  await page.getByLabel('New password', { exact: true }).fill('second-password-456');
  await page.getByLabel('New password again').fill('second-password-456');
  await page.getByRole('button', { name: 'Save new password' }).click();

  await expect(page).toHaveURL(/\/sign-in/);
  await expect(page.getByRole('status')).toContainText('Your password has been changed');

  // The old password no longer works; the new one does.
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill('first-password-123');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert')).toBeVisible();
  await signIn(page, email, 'second-password-456');
});
