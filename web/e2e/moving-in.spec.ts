import { expect, test, type Page } from '@playwright/test';
import { acceptAsNewPerson, findEmailLink, HAZEL, newPerson, openDirectory, PHONE, shootBothWidths, signIn, uniqueEmail } from './support';

test.describe.configure({ mode: 'serial' });

const memberCard = (page: Page, name: string) => page.getByTestId('member-card').filter({ has: page.getByRole('heading', { name, exact: true }) });

test('an admin moves the old roster in on her phone: preview with problems, import, invitations, and one imported member signs in', async ({ page, browser }) => {
  const primrose = uniqueEmail('primrose');
  const tabitha = uniqueEmail('tabitha');
  // Semicolons, a byte-order mark, a quoted comma, three ways of writing a date, and one bad address.
  const roster = [
    '\uFEFFName;E-mail;Phone;Town;Member since;Paid through;Roles',
    `Primrose Adeyemi;${primrose};555 0101;Wrenfield;12/03/2019;31 December 2026;`,
    `"Dunmore, Tabitha";${tabitha};;"Hollins Cross, East";2021-05-01;2026-12-31;`,
    'Odile Frampton;;555 0199;Wrenfield;March 3, 2020;;',
    'Wendell Typo;not-an-address;;;;;',
  ].join('\n');
  await page.setViewportSize(PHONE);
  await signIn(page, HAZEL.email);
  await openDirectory(page);
  await page.getByRole('link', { name: 'Import a roster from a spreadsheet' }).click();
  await page.getByLabel('Or paste the rows here').fill(roster);
  await page.getByRole('button', { name: 'Show me what will be imported' }).click();
  await expect(page.getByTestId('roster-counts')).toHaveText('3 new, 0 to update, 0 unchanged, 1 with problems (will be skipped)');
  await expect(page.getByRole('list', { name: 'Problems on row 5' })).toContainText('e-mail');
  await shootBothWidths(page, 'roster-import-preview');
  await page.getByRole('button', { name: 'Import 3 members' }).click();
  await expect(page.getByRole('heading', { name: 'The import is done' })).toBeVisible();
  await page.getByRole('button', { name: 'Send 2 invitations' }).click();
  await expect(page.getByRole('status').filter({ hasText: '2 invitations were sent.' })).toBeVisible();
  await shootBothWidths(page, 'roster-import-done');

  // The same file again changes nothing.
  await page.goto(page.url());
  await page.getByLabel('Or paste the rows here').fill(roster);
  await page.getByRole('button', { name: 'Show me what will be imported' }).click();
  await expect(page.getByTestId('roster-counts')).toHaveText('0 new, 0 to update, 3 unchanged, 1 with problems (will be skipped)');
  await expect(page.getByText('There is nothing new to import.')).toBeVisible();

  // Primrose follows her invitation, keeps her imported record, and later leaves asking to be erased.
  const { context, page: hers } = await newPerson(browser);
  await hers.setViewportSize(PHONE);
  const link = await findEmailLink(hers, primrose, '/invitations/');
  await acceptAsNewPerson(hers, link, 'Primrose Adeyemi', 'a-long-enough-password');
  await hers.goto('/profile');
  await hers.getByRole('button', { name: 'Leave Wrenfield Quilt Guild' }).click();
  const dialog = hers.getByRole('dialog', { name: 'Leave Wrenfield Quilt Guild?' });
  await dialog.getByRole('checkbox', { name: /ask the admins to erase/ }).check();
  await shootBothWidths(hers, 'leave-guild');
  await dialog.getByRole('button', { name: 'Leave Wrenfield Quilt Guild' }).click();
  await expect(hers.getByRole('status').filter({ hasText: 'You have left Wrenfield Quilt Guild' })).toBeVisible();
  await context.close();

  await openDirectory(page);
  const card = memberCard(page, 'Primrose Adeyemi');
  await expect(card.getByTestId('departure-note')).toContainText('She asked for her details to be erased.');
  await expect(memberCard(page, 'Odile Frampton').getByTestId('paper-badge')).toHaveText('Kept on paper');
});

test('an officer keeps a member on paper and records that she left; the admin erases a departed member who asked', async ({ page }) => {
  await page.setViewportSize(PHONE);
  await signIn(page, HAZEL.email);
  await openDirectory(page);
  const form = page.getByRole('form', { name: 'Add a member who has no e-mail' });
  await form.getByLabel('Her name').fill('Clover Ashdown');
  await form.getByRole('textbox', { name: /^Phone number/ }).fill('555 0142');
  await form.getByRole('button', { name: 'Add her to the roster' }).click();
  const clover = memberCard(page, 'Clover Ashdown');
  await expect(clover.getByTestId('paper-badge')).toHaveText('Kept on paper');
  await clover.getByRole('button', { name: /^Record that she left/ }).click();
  await page.getByRole('dialog').getByRole('button', { name: 'Yes, she has left' }).click();
  await expect(clover.getByTestId('departure-note')).toContainText('Left on');

  const henrietta = memberCard(page, 'Henrietta Quill');
  await henrietta.getByRole('button', { name: /^Erase her personal data/ }).click();
  const dialog = page.getByRole('dialog', { name: "Erase Henrietta Quill's personal data" });
  await expect(dialog).toContainText('She asked for this when she left.');
  await expect(dialog).toContainText('every invoice, payment, refund and receipt number');
  await expect(dialog.getByRole('button', { name: 'Erase her details' })).toBeDisabled();
  await shootBothWidths(page, 'erase-member');
  await dialog.getByRole('checkbox', { name: 'I understand this cannot be undone' }).check();
  await dialog.getByRole('button', { name: 'Erase her details' }).click();
  await expect(dialog.getByRole('status')).toContainText(/Her records now read “Former member \d+”/);
  await dialog.getByRole('button', { name: 'Close' }).last().click();
  await expect(page.getByTestId('member-card').filter({ hasText: 'Left; her personal data was erased.' })).toHaveCount(1);
  await expect(page.getByRole('heading', { name: 'Henrietta Quill' })).toHaveCount(0);
});

test('members read who holds each office and the handover history; the admin has the handover form', async ({ page }) => {
  await signIn(page, HAZEL.email);
  await openDirectory(page);
  await page.getByRole('link', { name: 'Officers and their terms' }).click();
  await expect(page.getByTestId('office-card').filter({ hasText: 'Treasurer' })).toContainText(/Doreen Achterberg, since 1 January \d{4}/);
  await expect(page.getByTestId('history-row').filter({ hasText: 'Clementine Marchbanks' })).toContainText(/access ended on 1 January \d{4}/);
  await expect(page.getByRole('heading', { name: 'Hand over an office' })).toBeVisible();
  await shootBothWidths(page, 'officers');
});
