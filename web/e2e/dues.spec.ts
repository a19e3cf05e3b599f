import { expect, test, type Page } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { PHONE, expectNoAxeViolations, shootBothWidths, signIn } from './support';

const GUILD_NAME = 'Wrenfield Quilt Guild';
const MEMBER = { email: 'june@wrenfield.example', name: 'June Pettigrew' };
const TREASURER = { email: 'doreen@wrenfield.example', name: 'Doreen Achterberg' };
const TEST_CARD = '4242 4242 4242 4242';

let guildId = 0;
let receiptNumber = '';

async function wrenfieldId(page: Page): Promise<number> {
  const dashboard = await (await page.request.get('/api/dashboard')).json();
  return dashboard.guilds.find((g: { name: string }) => g.name === GUILD_NAME).id;
}

/** The one button that leaves for the payment page, whatever the amount on it. */
const payButton = (page: Page) => page.getByRole('button', { name: /^(Pay .+ by card|Go to the card payment page)$/ });

test.describe.configure({ mode: 'serial' });
test.use({ viewport: PHONE });

test('a member changes her mind on the payment page and nothing is charged', async ({ page }) => {
  await signIn(page, MEMBER.email);
  guildId = await wrenfieldId(page);
  await page.goto(`/guilds/${guildId}/dues`);
  await expect(page.getByRole('heading', { level: 1, name: 'Dues' })).toBeVisible();
  await payButton(page).click();

  await expect(page.getByLabel('Card number')).toBeVisible();
  await page.getByRole('link', { name: 'Cancel and go back' }).click();

  await expect(page).toHaveURL(new RegExp(`/guilds/${guildId}/dues\\?cancelled=1$`));
  await expect(page.getByRole('status').filter({ hasText: 'Payment cancelled. Nothing was charged.' })).toBeVisible();
  await expectNoAxeViolations(page, 'dues page after a cancelled payment');
});

test('a member pays her dues by card on her phone and gets a receipt', async ({ page }) => {
  await signIn(page, MEMBER.email);
  guildId ||= await wrenfieldId(page);

  // The dashboard says where she stands and takes her to the dues page.
  const card = page.getByRole('article', { name: `Dues: ${GUILD_NAME}` });
  await expect(card.getByTestId('dues-status')).toBeVisible();
  await card.getByRole('link', { name: new RegExp(`for ${GUILD_NAME}$`) }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Dues' })).toBeVisible();
  await expect(page.getByTestId('dues-status')).toBeVisible();
  // The demo seed must leave her owing on any day of the year (renewal open, in grace or lapsed).
  await expect(payButton(page), `${MEMBER.name} has dues to pay in the demo data today`).toBeEnabled();
  await shootBothWidths(page, 'dues');

  const total = (await page.getByTestId('quote-total').textContent())?.trim();
  await payButton(page).click();

  // The payment service's own page, in test mode.
  await expect(page.getByLabel('Card number')).toBeVisible();
  if (total) await expect(page.locator('#total')).toHaveText(total);
  await page.getByLabel('Card number').fill(TEST_CARD);
  await page.getByRole('button', { name: /^Pay / }).click();

  // Back in Selvage: it may take a moment to hear about the payment.
  await expect(page).toHaveURL(new RegExp(`/guilds/${guildId}/dues/return\\?invoice=\\d+`));
  await expect(page.getByRole('heading', { level: 1, name: 'Thank you: your dues are paid' })).toBeVisible({ timeout: 30_000 });
  receiptNumber = (await page.getByTestId('receipt-number').textContent())?.trim() ?? '';
  expect(receiptNumber).not.toBe('');
  if (total) await expect(page.getByText(`We received ${total}`)).toBeVisible();

  const download = page.getByRole('link', { name: /Download the receipt \(PDF\)/ });
  const receipt = await page.request.get((await download.getAttribute('href'))!);
  expect(receipt.status()).toBe(200);
  expect(receipt.headers()['content-type']).toContain('application/pdf');
  expect((await receipt.body()).subarray(0, 5).toString()).toBe('%PDF-');
  await shootBothWidths(page, 'dues-paid');

  // Her dues page now says she is paid up and lists the receipt.
  await page.getByRole('link', { name: 'Back to my dues' }).click();
  await expect(page.getByTestId('dues-status')).toHaveText('Paid up');
  const row = page.getByTestId('history-row').filter({ hasText: receiptNumber });
  await expect(row).toBeVisible();
  await expect(row).toContainText('Card');
  await expect(payButton(page)).toHaveCount(0);
  await shootBothWidths(page, 'dues-receipts');
});

test('the treasurer finds the payment in the ledger and downloads it', async ({ page }) => {
  expect(receiptNumber, 'the member paid in the test before').not.toBe('');
  await signIn(page, TREASURER.email);
  guildId ||= await wrenfieldId(page);

  await page.getByRole('button', { name: 'Menu' }).click();
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: /^(Wrenfield Quilt Guild )?[Tt]reasurer$/ }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Treasurer' })).toBeVisible();
  await expect(page.getByRole('link', { name: 'Ledger' })).toHaveAttribute('aria-current', 'page');

  const row = page.getByTestId('ledger-row').filter({ hasText: receiptNumber });
  await expect(row).toBeVisible();
  await expect(row).toContainText(MEMBER.name);
  await expect(row).toContainText('Card');
  await expect(row.getByRole('button', { name: /^Refund/ })).toBeVisible();

  // Only card payments: the filter goes into the address and the download.
  await page.getByLabel('Paid by').selectOption('card');
  await page.getByRole('button', { name: 'Show payments' }).click();
  await expect(page).toHaveURL(/\/treasurer(\/ledger)?\?method=card$/);
  await expect(page.getByTestId('ledger-row').filter({ hasText: receiptNumber })).toBeVisible();
  await shootBothWidths(page, 'treasurer-ledger');

  const [csv] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download these payments (CSV)' }).click()]);
  expect(csv.suggestedFilename()).toMatch(/\.csv$/);
  const text = readFileSync((await csv.path())!, 'utf8');
  expect(text).toContain(receiptNumber);
  expect(text).toContain(MEMBER.name);
});

test("the treasurer's other pages at both widths", async ({ page }) => {
  await signIn(page, TREASURER.email);
  guildId ||= await wrenfieldId(page);
  const base = `/guilds/${guildId}/treasurer`;

  await page.goto(`${base}/roster`);
  await expect(page.getByRole('heading', { level: 2, name: 'Roster' })).toBeVisible();
  await expect(page.getByTestId('roster-row').filter({ hasText: MEMBER.name })).toContainText('Paid up');
  await page.getByRole('button', { name: /Only .due now. or .overdue./ }).click();
  await expect(page.getByRole('button', { name: /Only .due now. or .overdue./ })).toHaveAttribute('aria-pressed', 'true');
  await expect(page.getByTestId('roster-row').filter({ hasText: MEMBER.name })).toHaveCount(0);
  await shootBothWidths(page, 'treasurer-roster');

  await page.goto(`${base}/record`);
  await expect(page.getByRole('heading', { level: 2, name: 'Record a payment' })).toBeVisible();
  await page.getByRole('button', { name: 'Record the payment' }).click();
  await expect(page.getByText('Choose the member who paid.')).toBeVisible();
  await expect(page.getByLabel('Member')).toBeFocused();
  await shootBothWidths(page, 'treasurer-record');

  await page.goto(`${base}/settings`);
  await expect(page.getByRole('heading', { level: 2, name: 'Plans' })).toBeVisible();
  await expect(page.getByLabel('The membership year starts in')).toBeVisible();
  await shootBothWidths(page, 'treasurer-settings');

  await page.goto(`${base}/audit`);
  await expect(page.getByRole('heading', { level: 2, name: 'Audit log' })).toBeVisible();
  await expect(page.getByTestId('audit-row').first()).toBeVisible();
  await shootBothWidths(page, 'treasurer-audit');
});

test("the treasurer's report: a chart with its figures in a table", async ({ page }) => {
  await signIn(page, TREASURER.email);
  guildId ||= await wrenfieldId(page);
  await page.goto(`/guilds/${guildId}/treasurer/report`);
  await expect(page.getByRole('heading', { level: 2, name: /^Report/ })).toBeVisible();
  await expect(page.getByTestId('dues-report')).toBeVisible();
  await expect(page.getByRole('img', { name: /^Bar chart/ })).toBeVisible();
  await expect(page.getByRole('table', { name: /^Money in each month/ })).toBeVisible();
  await shootBothWidths(page, 'treasurer-report');
});

test('a member cannot open the treasurer pages', async ({ page }) => {
  await signIn(page, MEMBER.email);
  guildId ||= await wrenfieldId(page);
  await page.goto(`/guilds/${guildId}/treasurer`);
  await expect(page.getByText('These pages are for the guild’s treasurer and admins.')).toBeVisible();
  await expect(page.getByRole('navigation', { name: 'Treasurer pages' })).toHaveCount(0);
});
