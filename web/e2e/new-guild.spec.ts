import { expect, test } from '@playwright/test';
import { PHONE, acceptAsNewPerson, inviteNewEmail, newPerson, shootBothWidths, uniqueEmail } from './support';

test.use({ viewport: PHONE });

test('someone new to Selvage starts her own guild on her phone and lands in its member directory as its admin', async ({ browser }) => {
  // A brand-new account (invited to Wrenfield), so no demo person's guilds change.
  const email = uniqueEmail('founder');
  const link = await inviteNewEmail(browser, email);
  const { context, page } = await newPerson(browser);
  await page.setViewportSize(PHONE);
  await acceptAsNewPerson(page, link, 'Mirabel Thornquist', 'a-long-founder-password');

  await page.getByRole('link', { name: 'Start a new guild' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Start a new guild' })).toBeVisible();
  await page.getByRole('button', { name: 'Next' }).click();
  await expect(page.getByText("Write the guild's name.")).toBeVisible();
  await page.getByLabel('Name of the guild').fill('Fernhollow Quilters');
  await page.getByLabel('Town where you meet').fill('Fernhollow');
  await shootBothWidths(page, 'guild-new-step-1');
  await page.getByRole('button', { name: 'Next' }).click();
  await page.getByLabel('Time zone').selectOption('Europe/London');
  await page.getByLabel('Currency for dues and fees').selectOption('GBP');
  await page.getByLabel('Centimetres').check();
  await shootBothWidths(page, 'guild-new-step-2');
  await page.getByRole('button', { name: 'Next' }).click();
  await page.getByLabel('The membership year starts in').selectOption('9');
  await expect(page.getByTestId('wizard-summary')).toContainText('GBP, centimetres');
  await page.getByRole('button', { name: 'Start the guild' }).click();

  await expect(page.getByRole('heading', { level: 1, name: 'Fernhollow Quilters members' })).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: 'Fernhollow Quilters is ready.' })).toBeVisible();
  await expect(page.getByRole('form', { name: /^Invite a member/ })).toBeVisible();
  await context.close();
});
