import { expect, test, type Browser } from '@playwright/test';
import { mkdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { PHONE, SCREENSHOTS, newPerson, shootBothWidths, signIn } from './support';

const ORGANISER = 'agnes@wrenfield.example';
const BEE_NAME = 'Lantern Street Bee';
const GUILD_NAME = 'Wrenfield Quilt Guild';

type Person = { membershipId: number; name: string };
type Fixture = { guilds: { name: string; members: { name: string; email: string }[] }[] };

/** Demo e-mail addresses by name, from the same fixture the demo database is seeded from. */
function demoEmails(): Map<string, string> {
  const fixture = JSON.parse(readFileSync(fileURLToPath(new URL('../../fixtures/demo-guild.json', import.meta.url)), 'utf8')) as Fixture;
  const guild = fixture.guilds.find((g) => g.name === GUILD_NAME)!;
  return new Map(guild.members.map((m) => [m.name, m.email]));
}

function addMonths(month: string, count: number): string {
  const [y, m] = month.split('-').map(Number);
  const index = y * 12 + m - 1 + count;
  return `${Math.floor(index / 12)}-${String((index % 12) + 1).padStart(2, '0')}`;
}

function monthInZone(timeZone: string): string {
  const parts = new Intl.DateTimeFormat('en-CA', { year: 'numeric', month: '2-digit', timeZone }).formatToParts(new Date());
  return `${parts.find((p) => p.type === 'year')!.value}-${parts.find((p) => p.type === 'month')!.value}`;
}

type Scenario = {
  guildId: number;
  beeId: number;
  month: string;
  queen: Person & { email: string };
  maker: Person & { email: string };
  roundPath: string;
  beesPath: string;
  beePath: string;
};

/** Asks the api, as the bee's organiser, who is queen of Lantern Street Bee this month. */
async function findScenario(browser: Browser): Promise<Scenario> {
  const { context, page } = await newPerson(browser);
  try {
    await signIn(page, ORGANISER);
    const dashboard = await (await page.request.get('/api/dashboard')).json();
    const guildId: number = dashboard.guilds.find((g: { name: string }) => g.name === GUILD_NAME).id;
    const guild = await (await page.request.get(`/api/guilds/${guildId}`)).json();
    const bees = await (await page.request.get(`/api/guilds/${guildId}/bees`)).json();
    const beeId: number = bees.find((b: { name: string }) => b.name === BEE_NAME).id;
    const bee = await (await page.request.get(`/api/guilds/${guildId}/bees/${beeId}`)).json();
    const month: string = bee.currentMonth ?? monthInZone(guild.timeZone);
    const slot = bee.rotation.find((r: { month: string }) => r.month === month);
    expect(slot, `${BEE_NAME} has a month ${month}`).toBeTruthy();
    expect(slot.queen, `${BEE_NAME} has a queen for ${month}`).toBeTruthy();
    const emails = demoEmails();
    const queen: Person = slot.queen;
    const maker: Person = bee.members.find(
      (m: Person & { status: string }) =>
        m.status === 'active' && m.membershipId !== queen.membershipId && m.membershipId !== bee.organiser.membershipId,
    );
    return {
      guildId,
      beeId,
      month,
      queen: { ...queen, email: emails.get(queen.name)! },
      maker: { ...maker, email: emails.get(maker.name)! },
      roundPath: `/guilds/${guildId}/bees/${beeId}/rounds/${month}`,
      beesPath: `/guilds/${guildId}/bees`,
      beePath: `/guilds/${guildId}/bees/${beeId}`,
    };
  } finally {
    await context.close();
  }
}

let scenario: Scenario;

test.describe.configure({ mode: 'serial' });

test.beforeAll(async ({ browser }) => {
  mkdirSync(SCREENSHOTS, { recursive: true });
  scenario = await findScenario(browser);
});

test.use({ viewport: PHONE });

test("this month's queen sets her block on a phone and sees the makers", async ({ page }) => {
  const { queen, month, roundPath } = scenario;
  await signIn(page, queen.email);
  await page.goto(roundPath);
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await expect(page.getByText(`Queen: ${queen.name}`)).toBeVisible();

  const form = page.getByRole('form', { name: 'Set the block for this month' });
  const title = `Lantern star ${Date.now().toString(36)}`;
  await form.getByLabel('Title', { exact: true }).fill(title);
  await form.getByRole('button', { name: '12 inch' }).click();
  await expect(form.getByRole('button', { name: '12 inch' })).toHaveAttribute('aria-pressed', 'true');
  await expect(form.getByLabel('Finished width (inches)')).toHaveValue('12');

  // Exactly two colours, whatever the round asked for before.
  while ((await form.getByLabel(/^Name of colour \d+$/).count()) > 0) {
    await form.getByRole('button', { name: 'Remove colour 1' }).click();
  }
  await form.getByRole('button', { name: 'Add a colour' }).click();
  await form.getByLabel('Name of colour 1').fill('Sky blue');
  await form.getByLabel('Colour 1', { exact: true }).fill('#87ceeb');
  await form.getByRole('button', { name: 'Add a colour' }).click();
  await form.getByLabel('Name of colour 2').fill('Lemon');
  await form.getByLabel('Colour 2', { exact: true }).fill('#fff44f');

  await form.getByLabel('Due date').fill(`${addMonths(month, 1)}-15`);
  // The 1st just after midnight has always passed, so publishing sends at once.
  await form.getByLabel('E-mail the makers on').fill(`${month}-01`);
  await form.getByLabel('Time of the e-mail').fill('00:05');
  const address = form.getByLabel('Address to mail blocks to');
  if ((await address.count()) > 0 && !(await address.inputValue()).trim()) {
    await address.fill(`${queen.name}\n1 Lantern Street\nWrenfield`);
  }
  await form.getByRole('button', { name: 'Save the round' }).click();
  await expect(form.getByRole('status').filter({ hasText: 'The round is saved.' })).toBeVisible();

  // The saved round, as makers see it: both sizes, each saying which it is.
  const block = page.getByRole('region', { name: 'The block', exact: true });
  await expect(block.locator('.size-figure').filter({ hasText: 'Unfinished (cut) size' })).toContainText('12 1/2 x 12 1/2 in');
  await expect(block.locator('.size-figure').filter({ hasText: 'Finished size' }).first()).toContainText('12 x 12 in');
  await expect(block.getByRole('list', { name: 'Colours to use' })).toContainText('Sky blue');
  await expect(block.getByRole('list', { name: 'Colours to use' })).toContainText('Lemon');
  await expect(page.getByRole('heading', { level: 1 })).toContainText(title);

  const publish = page.getByRole('button', { name: 'Publish the round' });
  if (await publish.isVisible()) {
    await publish.click();
    await expect(page.getByText(/^Published/)).toBeVisible();
  }

  const makers = page.getByRole('region', { name: "Makers' blocks" });
  await expect(makers.getByRole('list', { name: 'Makers and their blocks' })).toBeVisible();
  await expect(makers.getByTestId('maker-card').first()).toBeVisible();
  await expect(makers.getByTestId('maker-card').filter({ hasText: scenario.maker.name })).toBeVisible();
  await expect(makers.getByRole('button', { name: 'Nudge late makers' })).toBeVisible();

  // Stacked cards on a phone: each maker card is as wide as the list, nothing scrolls sideways.
  const [first, second] = await makers.getByTestId('maker-card').evaluateAll((els) => els.slice(0, 2).map((el) => el.getBoundingClientRect().left));
  if (second !== undefined) expect(second).toBe(first);

  await page.evaluate(() => window.scrollTo(0, 0));
  await shootBothWidths(page, 'round-queen');
});

test('a maker sees her own block and says where it is', async ({ page }) => {
  const { maker, roundPath } = scenario;
  await signIn(page, maker.email);
  await page.goto(roundPath);
  const mine = page.getByRole('region', { name: 'My block', exact: true });
  await expect(mine).toBeVisible();
  await expect(page.getByRole('region', { name: "Makers' blocks" })).toHaveCount(0);
  await expect(page.getByRole('region', { name: 'The block', exact: true }).locator('.size-figure').filter({ hasText: 'Unfinished (cut) size' })).toContainText(
    '12 1/2 x 12 1/2 in',
  );
  await mine.getByLabel('Made', { exact: true }).check();
  await mine.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(mine.getByRole('status').filter({ hasText: 'Saved: made.' })).toBeVisible();
  await shootBothWidths(page, 'round-maker');
});

test('the bees list, the bee page and the layout planner at 390 and 1280', async ({ page }) => {
  await signIn(page, ORGANISER);

  await page.goto(scenario.beesPath);
  await expect(page.getByRole('heading', { level: 1, name: `${GUILD_NAME} bees` })).toBeVisible();
  await expect(page.getByRole('article', { name: BEE_NAME })).toContainText('You organise this bee');
  await shootBothWidths(page, 'bees-list');

  await page.goto(scenario.beePath);
  await expect(page.getByRole('heading', { level: 1, name: BEE_NAME })).toBeVisible();
  await expect(page.getByRole('table')).toContainText(scenario.queen.name);
  await expect(page.getByRole('button', { name: /^Shuffle/ })).toBeVisible();
  await shootBothWidths(page, 'bee-organiser');

  await page.goto('/layout-planner');
  await expect(page.getByRole('heading', { level: 1, name: 'Layout planner' })).toBeVisible();
  await page.getByLabel('Sashing width, finished (inches)').fill('2');
  await page.getByLabel('Cornerstones where the strips cross').check();
  await page.getByRole('button', { name: 'Add a border' }).click();
  await page.getByLabel('Border 1 width, finished (inches)').fill('4');
  await page.getByRole('button', { name: 'Plan the quilt' }).click();
  await expect(page.getByRole('status').filter({ hasText: /^Planned:/ })).toBeVisible();
  await expect(page.getByRole('figure')).toBeVisible();
  await expect(page.getByRole('region', { name: 'Quilt top' })).toContainText('Finished size');
  await shootBothWidths(page, 'layout-planner');
});
