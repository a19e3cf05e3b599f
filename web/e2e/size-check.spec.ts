import { expect, test, type Browser } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { PHONE, SCREENSHOTS, newPerson, shootBothWidths, signIn } from './support';

const ORGANISER = 'agnes@wrenfield.example';
const BEE_NAME = 'Lantern Street Bee';
const GUILD_NAME = 'Wrenfield Quilt Guild';

type Person = { membershipId: number; name: string };
type Fixture = { guilds: { name: string; members: { name: string; email: string }[] }[] };
type Scenario = { roundPath: string; maker: Person & { email: string }; queen: Person & { email: string }; unfinishedIn: [number, number] };

/** Demo e-mail addresses by name, from the fixture the demo database is seeded from. */
function demoEmails(): Map<string, string> {
  const fixture = JSON.parse(readFileSync(fileURLToPath(new URL('../../fixtures/demo-guild.json', import.meta.url)), 'utf8')) as Fixture;
  return new Map(fixture.guilds.find((g) => g.name === GUILD_NAME)!.members.map((m) => [m.name, m.email]));
}

/** As the bee's organiser, finds a past month whose round has gone out and a maker with a block in it. */
async function findScenario(browser: Browser): Promise<Scenario> {
  const { context, page } = await newPerson(browser);
  try {
    await signIn(page, ORGANISER);
    const dashboard = await (await page.request.get('/api/dashboard')).json();
    const guildId: number = dashboard.guilds.find((g: { name: string }) => g.name === GUILD_NAME).id;
    const bees = await (await page.request.get(`/api/guilds/${guildId}/bees`)).json();
    const beeId: number = bees.find((b: { name: string }) => b.name === BEE_NAME).id;
    const bee = await (await page.request.get(`/api/guilds/${guildId}/bees/${beeId}`)).json();
    const slots = (bee.rotation as { month: string; past: boolean; queen: Person | null; round: { sent: boolean } | null }[])
      .filter((r) => r.past && r.round?.sent && r.queen)
      .reverse();
    expect(slots.length, `${BEE_NAME} has a past month whose round has gone out`).toBeGreaterThan(0);
    const emails = demoEmails();
    for (const slot of slots) {
      const roundPath = `/guilds/${guildId}/bees/${beeId}/rounds/${slot.month}`;
      const round = await (await page.request.get(`/api${roundPath}`)).json();
      const block = (round.blocks as (Person & { status: string })[]).find(
        (b) => b.membershipId !== slot.queen!.membershipId && b.membershipId !== bee.organiser.membershipId && emails.has(b.name),
      );
      if (!block || !round.round) continue;
      const unfinished = round.round.unfinished as { widthMm: number; heightMm: number };
      return {
        roundPath,
        maker: { membershipId: block.membershipId, name: block.name, email: emails.get(block.name)! },
        queen: { ...slot.queen!, email: emails.get(slot.queen!.name)! },
        unfinishedIn: [unfinished.widthMm / 25.4, unfinished.heightMm / 25.4],
      };
    }
    throw new Error(`No past month of ${BEE_NAME} has a maker with a block`);
  } finally {
    await context.close();
  }
}

/**
 * The api's fixture generator (api/scripts/generate-photo-fixtures.ts, `renderScene(spec, seed)`).
 * It lives in the api's CommonJS package and loads OpenCV, which Playwright's ES-module loader
 * cannot import on Node 20, so it runs under tsx (as the api's own scripts do) in a child process;
 * that also keeps the web's type check out of the api's code. The picture goes to JPEG with jimp.
 */
const REPO = fileURLToPath(new URL('../../', import.meta.url));
const GENERATOR = fileURLToPath(new URL('../../api/scripts/generate-photo-fixtures.ts', import.meta.url));
const TSX = fileURLToPath(new URL('../../node_modules/.bin/tsx', import.meta.url));
const RENDER = `
const { renderScene } = require(process.env.GENERATOR);
const { Jimp } = require('jimp');
const { writeFileSync } = require('node:fs');
(async () => {
  const scene = await renderScene(JSON.parse(process.env.SCENE_SPEC), process.env.SCENE_SEED);
  const data = Buffer.from(scene.rgba.buffer, scene.rgba.byteOffset, scene.rgba.byteLength);
  const image = new Jimp({ width: scene.width, height: scene.height, data });
  writeFileSync(process.env.OUT, await image.getBuffer('image/jpeg', { quality: 90 }));
})().catch((error) => {
  console.error(error);
  process.exit(1);
});
`;

/** A synthetic photo: the block at the round's unfinished size beside a card printed true to size. */
function blockPhoto([widthIn, heightIn]: [number, number]): Buffer {
  const spec = {
    background: 'mat',
    block: { widthIn, heightIn, print: 'pieced', outOfSquareMm: 0, rotationDeg: 4, threads: 1 },
    card: { printScale: 1, rotationDeg: -6, side: 'right', framing: 'full' },
    camera: {
      megapixels: 4,
      portrait: false,
      rollDeg: 3,
      tiltDeg: 5,
      tiltAxisDeg: 40,
      barrel: -0.003,
      blurPx: 0.6,
      noise: 2,
      light: 0.1,
      shadow: 0.05,
      exposure: 1,
      jpegQuality: 90,
      fill: 0.85,
    },
    expect: 'measure',
  };
  const out = join(mkdtempSync(join(tmpdir(), 'selvage-size-check-')), 'block.jpg');
  execFileSync(TSX, ['-e', RENDER], {
    cwd: REPO,
    env: { ...process.env, GENERATOR, SCENE_SPEC: JSON.stringify(spec), SCENE_SEED: 'web-e2e-size-check', OUT: out },
    stdio: ['ignore', 'inherit', 'inherit'],
    timeout: 120_000,
  });
  return readFileSync(out);
}

let scenario: Scenario;
let photo: Buffer;

test.describe.configure({ mode: 'serial' });
test.use({ viewport: PHONE });

test.beforeAll(async ({ browser }) => {
  test.setTimeout(120_000);
  mkdirSync(SCREENSHOTS, { recursive: true });
  scenario = await findScenario(browser);
  photo = blockPhoto(scenario.unfinishedIn);
});

test('a maker checks her block size from a photo on a phone', async ({ page }) => {
  test.setTimeout(120_000);
  await signIn(page, scenario.maker.email);
  await page.goto(scenario.roundPath);
  const panel = page.getByTestId('size-check-panel');
  await expect(panel.getByRole('heading', { name: 'Check the size before you send it' })).toBeVisible();
  await expect(panel.getByText(/inches unfinished/).first()).toBeVisible();
  await expect(panel.getByRole('link', { name: /Print the reference card \(US Letter\)/ })).toHaveAttribute('target', '_blank');
  await expect(panel.getByRole('link', { name: /Print the reference card \(A4\)/ })).toHaveAttribute('href', /paper=a4/);

  await panel.getByLabel('I measured the 6 inch bar (inches)').check();
  await panel.getByLabel(/What does your ruler read for the long bar\?/).fill('6');
  await panel.getByLabel('Take a photo').setInputFiles({ name: 'block.jpg', mimeType: 'image/jpeg', buffer: photo });
  await expect(panel.getByRole('img', { name: /The photo you chose/ })).toBeVisible();
  await panel.getByRole('button', { name: 'Measure the block' }).click();

  const result = panel.getByTestId('size-check-result');
  await expect(result).toBeVisible({ timeout: 60_000 });
  const picture = result.getByRole('img', { name: /^Photo of your block/ });
  await expect(picture).toBeVisible();
  await expect.poll(() => picture.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true);

  // The photo shows a block cut exactly to the round's unfinished size, on a plain mat, card at 100%.
  await expect(result.getByRole('heading', { name: 'Selvage could not measure this photo' })).toHaveCount(0);
  await expect(picture).toHaveAttribute('src', /\/images\/overlay$/);
  await expect(result.locator('.verdict-headline')).toHaveText(/In size|Big enough/);
  await expect(result).toContainText(/inches unfinished \(as it is now\)/);
  await expect(panel.getByRole('status').filter({ hasText: /In size|Too big|Too small|Big enough|could not measure/ })).toBeAttached();

  await shootBothWidths(page, 'size-check');
});

test("the queen sees the maker's latest size check in her grid", async ({ page }) => {
  await signIn(page, scenario.queen.email);
  await page.goto(scenario.roundPath);
  const card = page.getByTestId('maker-card').filter({ has: page.getByRole('heading', { name: scenario.maker.name }) });
  const summary = card.getByTestId('size-check-summary');
  await expect(summary).toBeVisible();
  await expect(summary).toContainText(/In size|Too big: trim it|Too small|Big enough|Could not measure/);
  await expect(summary.getByRole('link', { name: new RegExp(`Size check photo of ${scenario.maker.name}`) })).toHaveAttribute(
    'href',
    /\/images\/(overlay|display)$/,
  );
  await shootBothWidths(page, 'size-check-queen');
});
