import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Browser, type BrowserContext, type Locator, type Page } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export const DEMO_PASSWORD = 'quilting-bee-42';
export const HAZEL = { email: 'hazel@wrenfield.example', name: 'Hazel Ormsby' };
export const WRENFIELD = 'Wrenfield Quilt Guild';

let counter = 0;
export function uniqueEmail(prefix: string): string {
  counter += 1;
  return `${prefix}-${Date.now()}-${counter}@newcomers.example`;
}

/** A separate browser context (its own cookies) with the project's baseURL. */
export async function newPerson(browser: Browser): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL });
  return { context, page: await context.newPage() };
}

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/$/);
  await expect(page.getByRole('heading', { level: 1, name: /^Hello/ })).toBeVisible();
}

export async function openDirectory(page: Page, guildName = WRENFIELD): Promise<void> {
  await page.goto('/');
  await page.getByRole('link', { name: `Member directory for ${guildName}` }).click();
  await expect(page.getByRole('heading', { level: 1, name: `${guildName} members` })).toBeVisible();
}

export async function sendInvitation(page: Page, email: string): Promise<void> {
  const form = page.getByRole('form', { name: /^Invite a member/ });
  await form.getByLabel('E-mail address').fill(email);
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByRole('status').filter({ hasText: `Invitation sent to ${email}` })).toBeVisible();
}

/**
 * Opens /dev/inbox, waits for a message to `to` containing a link whose path starts with
 * `pathPrefix`, and returns that link as a path on this site (so cookies stay on baseURL).
 */
export async function findEmailLink(page: Page, to: string, pathPrefix: string): Promise<string> {
  await page.goto('/dev/inbox');
  await expect(page.getByRole('heading', { level: 1, name: 'Development inbox' })).toBeVisible();
  await page.getByLabel('Only messages to').fill(to);
  await page.getByRole('button', { name: 'Filter' }).click();
  let found: string | null = null;
  await expect(async () => {
    const items = page.getByTestId('inbox-item').filter({ hasText: `To: ${to}` });
    const count = await items.count();
    expect(count, `a message to ${to}`).toBeGreaterThan(0);
    for (let i = 0; i < count && !found; i += 1) {
      await items.nth(i).getByRole('link').click();
      const links = page.getByRole('region', { name: 'Links in this message' }).getByRole('link');
      await expect(links.first()).toBeVisible();
      for (const href of await links.evaluateAll((els) => els.map((el) => (el as HTMLAnchorElement).href))) {
        const url = new URL(href);
        if (url.pathname.startsWith(pathPrefix)) {
          found = `${url.pathname}${url.search}`;
          break;
        }
      }
    }
    expect(found, `a link to ${pathPrefix} in the mail to ${to}`).not.toBeNull();
  }).toPass({ timeout: 30_000, intervals: [1_000, 2_000, 3_000] });
  return found!;
}

export async function acceptAsNewPerson(page: Page, invitationPath: string, name: string, password: string) {
  await page.goto(invitationPath);
  await expect(page.getByRole('heading', { level: 1 })).toHaveText(`${HAZEL.name} invited you to join ${WRENFIELD}`);
  await page.getByLabel('Your name').fill(name);
  await page.getByLabel('Choose a password').fill(password);
  await page.getByLabel('Password again').fill(password);
  await page.getByRole('button', { name: 'Create account and join' }).click();
  await expect(page).toHaveURL(/\/$/);
  await expect(page.getByRole('heading', { level: 1, name: `Hello, ${name.split(' ')[0]}` })).toBeVisible();
}

/** Invites a brand-new e-mail as Hazel and returns the invitation link path. */
export async function inviteNewEmail(browser: Browser, email: string): Promise<string> {
  const admin = await newPerson(browser);
  try {
    await signIn(admin.page, HAZEL.email);
    await openDirectory(admin.page);
    await sendInvitation(admin.page, email);
  } finally {
    await admin.context.close();
  }
  const reader = await newPerson(browser);
  try {
    return await findEmailLink(reader.page, email, '/invitations/');
  } finally {
    await reader.context.close();
  }
}

/** Moves keyboard focus with Tab until `target` has it. */
export async function tabTo(page: Page, target: Locator, maxPresses = 250): Promise<void> {
  for (let i = 0; i < maxPresses; i += 1) {
    await page.keyboard.press('Tab');
    if (await target.evaluate((el) => el === document.activeElement).catch(() => false)) return;
  }
  throw new Error(`Could not reach ${target} with the Tab key`);
}

export const SCREENSHOTS = fileURLToPath(new URL('./screenshots/', import.meta.url));
export const AXE_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
export const PHONE = { width: 390, height: 844 };
export const DESKTOP = { width: 1280, height: 800 };

export async function expectNoAxeViolations(page: Page, label: string) {
  const results = await new AxeBuilder({ page }).withTags(AXE_TAGS).analyze();
  const summary = results.violations.map(
    (v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).join(' | ')}`,
  );
  expect(summary, `axe violations on ${label}`).toEqual([]);
}

/** A full-page picture at phone and desktop width, each checked with axe and for sideways scrolling. */
export async function shootBothWidths(page: Page, name: string) {
  mkdirSync(SCREENSHOTS, { recursive: true });
  for (const viewport of [PHONE, DESKTOP]) {
    await page.setViewportSize(viewport);
    // The pointer stays where the last click was; after the layout moves, whatever lies under it
    // would be measured in its hover colours, half-way through a transition.
    await page.mouse.move(0, 0);
    await page.evaluate(() => document.fonts.ready);
    await page.waitForLoadState('networkidle').catch(() => undefined);
    await page.screenshot({ path: `${SCREENSHOTS}${name}-${viewport.width}.png`, fullPage: true });
    await expectNoAxeViolations(page, `${name} at ${viewport.width}px`);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow, `horizontal scroll on ${name} at ${viewport.width}px`).toBeLessThanOrEqual(0);
  }
  await page.setViewportSize(PHONE);
}
