import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { findEmailLink, HAZEL, inviteNewEmail, signIn, uniqueEmail } from './support';

const SCREENSHOTS = fileURLToPath(new URL('./screenshots/', import.meta.url));
const AXE_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
const VIEWPORTS = [
  { width: 390, height: 844 },
  { width: 1280, height: 800 },
];

type PageVisit = { name: string; path: () => string; heading: RegExp | string; signedIn: boolean };

let invitationPath = '';
let inboxPath = '';
let beesPath = '';
let beePath = '';
let roundPath = '';

const visits: PageVisit[] = [
  { name: 'sign-in', path: () => '/sign-in', heading: 'Sign in', signedIn: false },
  { name: 'forgot-password', path: () => '/forgot-password', heading: 'Forgot your password?', signedIn: false },
  { name: 'reset-password', path: () => '/reset-password?token=screenshot-token', heading: 'Choose a new password', signedIn: false },
  { name: 'invitation', path: () => invitationPath, heading: /invited you to join/, signedIn: false },
  { name: 'invitation-expired', path: () => '/invitations/no-such-token', heading: 'This invitation cannot be used', signedIn: false },
  { name: 'inbox', path: () => inboxPath, heading: 'Development inbox', signedIn: false },
  { name: 'dashboard', path: () => '/', heading: /^Hello/, signedIn: true },
  { name: 'directory', path: () => '', heading: /members$/, signedIn: true },
  { name: 'profile', path: () => '/profile', heading: 'Profile', signedIn: true },
  { name: 'bees', path: () => beesPath, heading: /bees$/, signedIn: true },
  { name: 'bee', path: () => beePath, heading: 'Lantern Street Bee', signedIn: true },
  { name: 'round', path: () => roundPath, heading: /^[A-Z][a-z]+ \d{4}/, signedIn: true },
  { name: 'layout-planner', path: () => '/layout-planner', heading: 'Layout planner', signedIn: true },
  { name: 'not-found', path: () => '/no/such/page', heading: 'Page not found', signedIn: true },
];

async function expectNoAxeViolations(page: Page, label: string) {
  // The e-mail preview iframe is sandboxed without scripts, so axe cannot run inside it; its HTML
  // is the e-mail template's, checked where the templates are.
  const results = await new AxeBuilder({ page }).withTags(AXE_TAGS).exclude('iframe.inbox-frame').analyze();
  const summary = results.violations.map(
    (v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).join(' | ')}`,
  );
  expect(summary, `axe violations on ${label}`).toEqual([]);
}

async function expectNoHorizontalScroll(page: Page, label: string) {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow, `horizontal scroll on ${label}`).toBeLessThanOrEqual(0);
}

let directoryPath = '';

test.beforeAll(async ({ browser }) => {
  mkdirSync(SCREENSHOTS, { recursive: true });
  const email = uniqueEmail('screenshot');
  invitationPath = await inviteNewEmail(browser, email);
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL });
  const page = await context.newPage();
  await findEmailLink(page, email, '/invitations/');
  inboxPath = new URL(page.url()).pathname + new URL(page.url()).search;
  await signIn(page, HAZEL.email);
  await page.getByRole('link', { name: 'Member directory for Wrenfield Quilt Guild' }).click();
  await expect(page.getByRole('heading', { level: 1, name: /members$/ })).toBeVisible();
  directoryPath = new URL(page.url()).pathname;
  // The bee pages, seen by an admin who is not in the bee.
  const guildId = directoryPath.split('/')[2];
  beesPath = `/guilds/${guildId}/bees`;
  const bees = (await (await page.request.get(`/api${beesPath}`)).json()) as { id: number; name: string }[];
  const beeId = bees.find((b) => b.name === 'Lantern Street Bee')!.id;
  beePath = `${beesPath}/${beeId}`;
  const bee = (await (await page.request.get(`/api${beePath}`)).json()) as { currentMonth?: string; startMonth: string };
  roundPath = `${beePath}/rounds/${bee.currentMonth ?? bee.startMonth}`;
  await context.close();
});

for (const viewport of VIEWPORTS) {
  test(`every page at ${viewport.width}px: screenshot and accessibility`, async ({ page }) => {
    await page.setViewportSize(viewport);
    let signedIn = false;
    for (const visit of visits) {
      if (visit.signedIn && !signedIn) {
        await signIn(page, HAZEL.email);
        signedIn = true;
      }
      const path = visit.name === 'directory' ? directoryPath : visit.path();
      await page.goto(path);
      await expect(page.getByRole('heading', { level: 1, name: visit.heading })).toBeVisible();
      if (visit.name === 'inbox') {
        await expect(page.frameLocator('iframe.inbox-frame').locator('body')).toContainText('invited you');
      }
      // Let the web font and late data settle before the picture.
      await page.evaluate(() => document.fonts.ready);
      await page.waitForLoadState('networkidle').catch(() => undefined);
      await page.screenshot({ path: `${SCREENSHOTS}${visit.name}-${viewport.width}.png`, fullPage: true });
      await expectNoAxeViolations(page, `${visit.name} at ${viewport.width}px`);
      await expectNoHorizontalScroll(page, `${visit.name} at ${viewport.width}px`);
    }
  });
}

test('every page reflows at 320px without horizontal scrolling', async ({ page }) => {
  await page.setViewportSize({ width: 320, height: 640 });
  let signedIn = false;
  for (const visit of visits) {
    if (visit.signedIn && !signedIn) {
      await signIn(page, HAZEL.email);
      signedIn = true;
    }
    await page.goto(visit.name === 'directory' ? directoryPath : visit.path());
    await expect(page.getByRole('heading', { level: 1, name: visit.heading })).toBeVisible();
    await expectNoHorizontalScroll(page, `${visit.name} at 320px`);
  }
});
