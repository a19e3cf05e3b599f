import { expect, test, type Page } from '@playwright/test';
import { HAZEL, openDirectory, signIn } from './support';

const JUNE = 'June Pettigrew';

function memberCard(page: Page, name: string) {
  return page.getByTestId('member-card').filter({ has: page.getByRole('heading', { level: 3, name, exact: true }) });
}

async function setShowChair(page: Page, on: boolean) {
  await memberCard(page, JUNE).getByRole('button', { name: `Change roles for ${JUNE}` }).click();
  const dialog = page.getByRole('dialog', { name: `Roles for ${JUNE}` });
  await expect(dialog).toBeVisible();
  await dialog.getByLabel('Show chair').setChecked(on);
  await dialog.getByRole('button', { name: 'Save roles' }).click();
  await expect(dialog).toBeHidden();
}

test('an admin gives a member a role and takes it away again', async ({ page }) => {
  await signIn(page, HAZEL.email);
  await openDirectory(page);
  const june = memberCard(page, JUNE);
  await expect(june).toBeVisible();

  // Start from a known state even if an earlier run stopped half way.
  if ((await june.getByText('Show chair', { exact: true }).count()) > 0) await setShowChair(page, false);

  await setShowChair(page, true);
  await expect(june.getByText('Show chair', { exact: true })).toBeVisible();
  await page.reload();
  await expect(memberCard(page, JUNE).getByText('Show chair', { exact: true })).toBeVisible();

  await setShowChair(page, false);
  await expect(june.getByText('Show chair', { exact: true })).toHaveCount(0);
  await page.reload();
  await expect(memberCard(page, JUNE)).toBeVisible();
  await expect(memberCard(page, JUNE).getByText('Show chair', { exact: true })).toHaveCount(0);
});

test('the last admin cannot remove their own admin role', async ({ page }) => {
  await signIn(page, HAZEL.email);
  await openDirectory(page);
  await memberCard(page, HAZEL.name).getByRole('button', { name: `Change roles for ${HAZEL.name}` }).click();
  const dialog = page.getByRole('dialog', { name: `Roles for ${HAZEL.name}` });
  await dialog.getByLabel('Admin').uncheck();
  await dialog.getByRole('button', { name: 'Save roles' }).click();
  await expect(dialog.getByRole('alert')).toContainText(/admin/i);
  await dialog.getByRole('button', { name: 'Cancel' }).click();
  await expect(dialog).toBeHidden();
  await page.reload();
  await expect(memberCard(page, HAZEL.name).getByText('Admin', { exact: true })).toBeVisible();
});
