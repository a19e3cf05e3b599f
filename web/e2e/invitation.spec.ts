import { expect, test } from '@playwright/test';
import { acceptAsNewPerson, findEmailLink, HAZEL, newPerson, openDirectory, sendInvitation, signIn, uniqueEmail, WRENFIELD } from './support';

test('an admin invites a new person, who joins from the e-mail and sees the guild', async ({ page, browser }) => {
  const email = uniqueEmail('mabel');
  // Unique per run so the test also passes against a database kept from earlier runs.
  const name = `Mabel Quince-${Date.now().toString(36)}`;

  await signIn(page, HAZEL.email);
  await openDirectory(page);
  await sendInvitation(page, email);
  await expect(page.getByRole('list', { name: 'Pending invitations' })).toContainText(email);

  const newcomer = await newPerson(browser);
  const invitationPath = await findEmailLink(newcomer.page, email, '/invitations/');
  await acceptAsNewPerson(newcomer.page, invitationPath, name, 'feather-stitch-2024');

  const card = newcomer.page.getByRole('article', { name: WRENFIELD });
  await expect(card).toBeVisible();
  await expect(card).toContainText('Wrenfield');
  await card.getByRole('link', { name: `Member directory for ${WRENFIELD}` }).click();
  await expect(newcomer.page.getByRole('heading', { level: 3, name })).toBeVisible();
  await newcomer.context.close();

  // The invitation is used: it leaves the pending list.
  await page.reload();
  await expect(page.getByRole('heading', { level: 2, name: 'Pending invitations' })).toBeVisible();
  await expect(page.getByRole('heading', { level: 3, name })).toBeVisible();
  await expect(page.getByRole('list', { name: 'Pending invitations' }).getByText(email)).toHaveCount(0);
});

test('an officer can revoke a pending invitation', async ({ page }) => {
  const email = uniqueEmail('withdrawn');
  await signIn(page, HAZEL.email);
  await openDirectory(page);
  await sendInvitation(page, email);
  const pending = page.getByRole('list', { name: 'Pending invitations' });
  await expect(pending).toContainText(email);
  await pending.getByRole('button', { name: `Revoke the invitation for ${email}` }).click();
  await expect(page.getByText(`Invitation for ${email} revoked.`)).toBeVisible();
  await expect(page.getByText(email, { exact: true })).toHaveCount(0);
});
