import { expect, test, type Page } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PHONE, expectNoAxeViolations, newPerson, shootBothWidths, signIn } from './support';

const GUILD_NAME = 'Wrenfield Quilt Guild';
const SHOW = 'Wrenfield Spring Quilt Show';
const CHAIR = 'priya@wrenfield.example';
const MEMBER = 'june@wrenfield.example';
const JUNES_QUILT = 'Blue Hour over Wrenfield Mill';

test.describe.configure({ mode: 'serial' });
test.use({ viewport: PHONE });

let showPath = '';
let visitorCode = '';

async function openShow(page: Page) {
  const dashboard = await (await page.request.get('/api/dashboard')).json();
  const guildId = dashboard.guilds.find((g: { name: string }) => g.name === GUILD_NAME).id;
  await page.goto(`/guilds/${guildId}/shows`);
  await expect(page.getByRole('heading', { level: 1, name: 'Quilt shows' })).toBeVisible();
  await page.getByRole('link', { name: SHOW }).first().click();
  await expect(page.getByRole('heading', { level: 1, name: SHOW })).toBeVisible();
  showPath = new URL(page.url()).pathname;
}

/** The printed codes of a PDF of ballot cards, read back with pdftotext. */
function codesIn(pdf: Buffer): string[] {
  const dir = mkdtempSync(join(tmpdir(), 'selvage-cards-'));
  try {
    writeFileSync(join(dir, 'cards.pdf'), pdf);
    const text = execFileSync('pdftotext', [join(dir, 'cards.pdf'), '-'], { encoding: 'utf8' });
    return [...text.matchAll(/\b[0-9A-Z]{4}-[0-9A-Z]{4}-[0-9A-Z]{4}\b/g)].map((m) => m[0]);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

test('a member sees the show, its sleeve rule and her entry waiting for the show chair', async ({ page }) => {
  await signIn(page, MEMBER);
  await openShow(page);
  await expect(page.getByTestId('sleeve-note')).toContainText('4 in hanging sleeve');
  await expect(page.getByTestId('my-entry').filter({ hasText: JUNES_QUILT })).toContainText('waiting for the show chair');
  await expect(page.getByTestId('entry-fees')).toContainText('Still to pay: $5.00');
  await shootBothWidths(page, 'show-member');
  await page.getByRole('link', { name: 'Enter a quilt' }).click();
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await shootBothWidths(page, 'show-enter');
});

test('a member enters a quilt on her phone: a size outside the category is refused before sending and says by how much', async ({ page }) => {
  await signIn(page, MEMBER);
  await page.goto(showPath);
  // Every entry sent to the server, so the refusal can be shown to happen before sending.
  const sent: string[] = [];
  page.on('request', (request) => {
    if (request.method() === 'POST' && /\/guilds\/\d+\/shows\/\d+\/entries$/.test(new URL(request.url()).pathname)) sent.push(request.url());
  });
  await page.getByRole('link', { name: 'Enter a quilt' }).click();
  const form = page.getByRole('form', { name: 'Enter a quilt' });
  await form.getByLabel('Category').selectOption({ label: 'Medium' });
  await form.getByLabel('Title of the quilt').fill('Kitchen Window Stars');
  await form.getByLabel('Width (inches)').fill('60');
  await form.getByLabel('Height (inches)').fill('66');
  await form.getByLabel('Quilted by (optional)', { exact: true }).fill('June Pettigrew');
  await form.getByRole('button', { name: 'Enter this quilt' }).click();
  // Refused before sending, in the server's words, once: under the width field (the field the server
  // names); the size box above says only that it does not fit and what to do.
  const refusal = 'This category takes quilts at most 240 in around (perimeter); yours is 252 in around, 12 in over.';
  await expect(form.getByText(refusal, { exact: true })).toBeVisible();
  await expect(form.getByText(/yours is 252 in around/)).toHaveCount(1);
  await expect(form.getByLabel('Width (inches)')).toHaveAttribute('aria-invalid', 'true');
  await expect(form.getByLabel('Width (inches)')).toHaveAccessibleDescription(/yours is 252 in around, 12 in over\./);
  await expect(form.getByTestId('size-warning')).toHaveText(/^It does not fit Medium\.\s*Choose another category, or check the width and height\.$/);
  await expect(form.getByTestId('size-warning')).not.toContainText('You can still send it');
  await expect(form.getByRole('alert')).toHaveCount(0);
  await expect(page).toHaveURL(/\/enter$/);
  expect(sent).toEqual([]);
  await shootBothWidths(page, 'show-enter-refused');
  await form.getByLabel('Height (inches)').fill('59 1/2');
  await expect(form.getByTestId('size-warning')).toHaveCount(0);
  await form.getByRole('button', { name: 'Enter this quilt' }).click();
  const entry = page.getByTestId('my-entry').filter({ hasText: 'Kitchen Window Stars' });
  await expect(entry).toContainText('waiting for the show chair');
  // 60 in wide: a 4 in sleeve from an 8 1/2 x 59 strip.
  await expect(entry.getByTestId('sleeve-strip')).toContainText('8 1/2 in x 59 in');
  await expect(page.getByTestId('entry-fees')).toContainText('Still to pay: $10.00');
  expect(sent).toHaveLength(1);
});

test('the show chair accepts an entry, opens voting and prints visitor ballot cards', async ({ page }) => {
  await signIn(page, CHAIR);
  await openShow(page);
  await page.getByRole('link', { name: 'Entries' }).click();
  const row = page.getByTestId('review-row').filter({ hasText: JUNES_QUILT });
  await row.getByRole('button', { name: 'Accept' }).click();
  await expect(row).toContainText('Accepted');
  await shootBothWidths(page, 'show-entries-review');

  await page.getByRole('link', { name: 'Ballot desk' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Ballot desk' })).toBeVisible();
  await page.getByRole('button', { name: 'Open voting now' }).click();
  await page.getByRole('button', { name: 'Yes, open voting' }).click();
  await expect(page.getByRole('button', { name: 'Close voting' })).toBeVisible();

  const cards = page.getByRole('form', { name: 'Make visitor ballot codes' });
  await cards.getByLabel('How many cards').fill('10');
  await cards.getByRole('button', { name: 'Make the codes' }).click();
  const batch = page.getByTestId('code-batch').first();
  await expect(batch).toContainText('10 cards');
  const href = await batch.getByRole('link', { name: /^Print batch/ }).getAttribute('href');
  const pdf = await page.request.get(href!);
  expect(pdf.headers()['content-type']).toBe('application/pdf');
  const codes = codesIn(await pdf.body());
  expect(codes).toHaveLength(10);
  // The same codes as paper ballots to write on, for visitors without a phone.
  const paperHref = await batch.getByRole('link', { name: 'The same codes as paper ballots (PDF)' }).getAttribute('href');
  const paper = await page.request.get(paperHref!);
  expect(paper.headers()['content-type']).toBe('application/pdf');
  expect(codesIn(await paper.body())).toEqual(codes);
  visitorCode = codes[0];
  await expect(page.getByTestId('turnout')).toBeVisible();
  await shootBothWidths(page, 'show-ballot-desk-open');
});

test('a visitor opens her card\'s link on her phone and votes without an account', async ({ browser }) => {
  const { context, page } = await newPerson(browser);
  await page.setViewportSize(PHONE);
  await page.goto(`/vote/${visitorCode.replace(/-/g, '')}`);
  await expect(page.getByRole('heading', { level: 1, name: SHOW })).toBeVisible();
  await expect(page.getByText(`Ballot card ${visitorCode}`)).toBeVisible();
  await page.getByRole('radio', { name: new RegExp(JUNES_QUILT) }).check();
  await page.getByRole('radio', { name: /Hedgerow Scraps/ }).check();
  await shootBothWidths(page, 'vote-visitor-ballot');
  await page.getByRole('button', { name: 'Check my ballot' }).click();
  await expect(page.getByTestId('ballot-review')).toContainText(JUNES_QUILT);
  await page.getByRole('button', { name: 'Cast my ballot' }).click();
  await expect(page.getByRole('heading', { level: 1, name: `Your vote is in. Thank you for visiting ${SHOW}.` })).toBeVisible();
  await expectNoAxeViolations(page, 'visitor thank-you page');

  // The same card again: refused, plainly.
  await page.goto(`/vote/${visitorCode.toLowerCase()}`);
  await expect(page.getByText('This ballot card has already been used to vote.')).toBeVisible();
  // Typing a code by hand.
  await page.goto('/vote');
  await shootBothWidths(page, 'vote-type-code');
  await context.close();
});

test('a member votes from the show page, once', async ({ page }) => {
  await signIn(page, MEMBER);
  await page.goto(showPath);
  await page.getByRole('link', { name: 'Vote for viewer’s choice' }).click();
  await page.getByRole('radio', { name: new RegExp(JUNES_QUILT) }).check();
  await page.getByRole('button', { name: 'Check my ballot' }).click();
  await page.getByRole('button', { name: 'Cast my ballot' }).click();
  await page.goto(showPath);
  await expect(page.getByTestId('has-voted')).toHaveText('You have voted — thank you.');
});

test('the show chair sees turnout but no standings, closes voting and publishes the results', async ({ page }) => {
  await signIn(page, CHAIR);
  await page.goto(`${showPath}/voting`);
  const turnout = page.getByTestId('turnout');
  await expect(turnout).toContainText('2');
  await expect(page.getByTestId('standing')).toHaveCount(0);
  await page.getByRole('button', { name: 'Close voting' }).click();
  await page.getByRole('button', { name: 'Yes, close voting' }).click();
  await page.getByRole('button', { name: 'Publish the results' }).click();
  await page.getByRole('button', { name: 'Yes, publish them' }).click();
  await expect(page.getByTestId('published')).toBeVisible();
  await page.getByRole('link', { name: 'See the results' }).first().click();
  const medium = page.getByTestId('result-category').filter({ hasText: 'Medium' });
  await expect(medium.getByTestId('standing').first()).toContainText(JUNES_QUILT);
  await expect(medium.getByTestId('standing').first().getByTestId('ribbon')).toContainText('1st');
  await expect(page.getByTestId('audit-text')).toContainText('Member ballots: 1. Ballots cast: 2.');
  await shootBothWidths(page, 'show-results');
  await page.goto(`${showPath}/voting`);
  await expect(page.getByTestId('published')).toBeVisible();
  await shootBothWidths(page, 'show-ballot-desk-closed');
  await page.goto(`${showPath}/settings`);
  await expect(page.getByRole('heading', { level: 1, name: 'Show settings' })).toBeVisible();
  await shootBothWidths(page, 'show-settings');
});

test('a member reads last autumn\'s published results and their ribbons', async ({ page }) => {
  await signIn(page, MEMBER);
  await openShow(page);
  await page.goto(showPath.replace(/\/shows\/\d+$/, '/shows'));
  await page.getByRole('link', { name: 'Autumn Harvest Show' }).first().click();
  await page.getByRole('link', { name: 'See the results' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Viewer’s choice results' })).toBeVisible();
  // A tie for 1st in Medium: both share the ribbon.
  const medium = page.getByTestId('result-category').filter({ hasText: 'Medium' });
  await expect(medium.getByTestId('ribbon').filter({ hasText: '1st' })).toHaveCount(2);
  await shootBothWidths(page, 'show-results-member');
});
