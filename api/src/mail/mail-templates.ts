/**
 * Renders Selvage's e-mails from the Handlebars files in the repository's `email-templates/` folder.
 *
 * Each message has three files: `<name>.subject.hbs`, `<name>.html.hbs` and `<name>.txt.hbs`.
 * Every HTML part is wrapped in `layout.html.hbs` (registered as the partial `layout`).
 * HTML parts escape values (double-stash only, never triple-stash for data from people; the one
 * exception is round-assignment's `instructionsHtml`, which our Markdown renderer has already made
 * safe); subject and text parts are plain text and are not HTML-escaped.
 *
 * Required keys must be present and not blank; `false` and `0` count as present. Optional lists
 * and texts (swatches, files, changes, deliveryAddress, …) may be empty or left out.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import Handlebars from 'handlebars';

/** The context keys each message needs; rendering without one of them throws. */
export const EMAIL_TEMPLATE_REQUIRED_KEYS = {
  invitation: ['inviteeEmail', 'guildName', 'invitedByName', 'acceptUrl', 'expiresOn'],
  'password-reset': ['name', 'resetUrl', 'validForText'],
  welcome: ['name', 'guildName', 'dashboardUrl'],
  'bee-invitation': ['name', 'beeName', 'guildName', 'organiserName', 'beeUrl'],
  // Not required, because they may be empty: swatches, background, deliveryAddress, meetingDetails,
  // patternLink, files.
  'round-assignment': [
    'makerName',
    'queenName',
    'beeName',
    'guildName',
    'monthLabel',
    'title',
    'instructionsHtml',
    'instructionsText',
    'finishedText',
    'unfinishedText',
    'seamText',
    'toleranceText',
    'trimToSize',
    'queenSendsFabric',
    'dueDateText',
    'deliveryByMail',
    'roundUrl',
  ],
  'round-reminder': ['name', 'queenName', 'beeName', 'monthLabel', 'sendDateText', 'daysLeft', 'roundUrl', 'isQueen'],
  'due-reminder': [
    'makerName',
    'queenName',
    'beeName',
    'title',
    'dueDateText',
    'unfinishedText',
    'finishedText',
    'roundUrl',
    'deliveryByMail',
  ],
  // `changes` may be empty.
  'round-changed': ['makerName', 'queenName', 'beeName', 'title', 'monthLabel', 'roundUrl'],
  'block-nudge': ['makerName', 'queenName', 'beeName', 'title', 'dueDateText', 'roundUrl'],
  'dues-receipt': ['name', 'guildName', 'receiptNumber', 'totalText', 'periodText', 'paidOnText', 'methodText', 'duesUrl'],
  // Optional: lines, graceEndsOnText, lateFeeText, householdName, treasurerName.
  'dues-renewal-soon': ['name', 'guildName', 'yearLabel', 'totalText', 'renewByText', 'paidThroughText', 'duesUrl'],
  // Optional: lines, householdName, treasurerName.
  'dues-lapsed': ['name', 'guildName', 'yearLabel', 'totalText', 'lapsedOnText', 'paidThroughText', 'duesUrl'],
} as const satisfies Record<string, readonly string[]>;

export type EmailTemplateName = keyof typeof EMAIL_TEMPLATE_REQUIRED_KEYS;

export const EMAIL_TEMPLATE_NAMES = Object.keys(EMAIL_TEMPLATE_REQUIRED_KEYS) as EmailTemplateName[];

/** Context shapes, for callers that want the compiler to check them. */
export interface InvitationEmailContext {
  inviteeEmail: string;
  guildName: string;
  invitedByName: string;
  acceptUrl: string;
  /** A date people can read, e.g. "Tuesday 15 December 2026". */
  expiresOn: string;
}
export interface PasswordResetEmailContext {
  name: string;
  resetUrl: string;
  /** How long the link works, in words, e.g. "1 hour". */
  validForText: string;
}
export interface WelcomeEmailContext {
  name: string;
  guildName: string;
  dashboardUrl: string;
}
/** A colour the queen picked: a name people use and "#RRGGBB". */
export interface EmailColour {
  name: string;
  hex: string;
}
/** An invitation from a bee's organiser to a guild member; she accepts in the app. */
export interface BeeInvitationEmailContext {
  name: string;
  beeName: string;
  guildName: string;
  organiserName: string;
  beeUrl: string;
}
/** A maker's block assignment for one month, sent at the round's send time. */
export interface RoundAssignmentEmailContext {
  makerName: string;
  queenName: string;
  beeName: string;
  guildName: string;
  /** e.g. "March 2027". */
  monthLabel: string;
  title: string;
  /** Safe HTML from our Markdown renderer; the only value the templates output unescaped. */
  instructionsHtml: string;
  instructionsText: string;
  /** e.g. "12 x 12 inches". */
  finishedText: string;
  /** e.g. "12 1/2 x 12 1/2 inches". */
  unfinishedText: string;
  /** e.g. "1/4 inch". */
  seamText: string;
  /** e.g. "1/8 inch". */
  toleranceText: string;
  /** true: trim to the unfinished size; false: leave it untrimmed, the queen trims. */
  trimToSize: boolean;
  swatches: EmailColour[];
  background: EmailColour | null;
  queenSendsFabric: boolean;
  /** e.g. "Friday 15 March 2027". */
  dueDateText: string;
  deliveryByMail: boolean;
  /** Only for mail bees; may be empty. Line breaks are kept. */
  deliveryAddress?: string;
  /** Only for meeting bees; may be empty. Line breaks are kept. */
  meetingDetails?: string;
  /** An http(s) address; may be empty. */
  patternLink?: string;
  /** Files the queen attached to the round; url is http(s). */
  files: { filename: string; url: string }[];
  roundUrl: string;
}
/** To the queen (isQueen) or the organiser, before the send date of a round that is not published. */
export interface RoundReminderEmailContext {
  name: string;
  queenName: string;
  beeName: string;
  monthLabel: string;
  sendDateText: string;
  /** Whole days until the send date: 0 = today, 1 = tomorrow. */
  daysLeft: number;
  roundUrl: string;
  isQueen: boolean;
}
/** To a maker who has not mailed or handed over her block, 7 days before the due date. */
export interface DueReminderEmailContext {
  makerName: string;
  queenName: string;
  beeName: string;
  title: string;
  dueDateText: string;
  unfinishedText: string;
  finishedText: string;
  roundUrl: string;
  deliveryByMail: boolean;
}
/** A short notice after the queen edits a published round. */
export interface RoundChangedEmailContext {
  makerName: string;
  queenName: string;
  beeName: string;
  title: string;
  monthLabel: string;
  roundUrl: string;
  /** Phrases such as "the due date", "the colours"; may be empty. */
  changes: string[];
}
/** The queen's one-click reminder to a maker whose block is late. */
export interface BlockNudgeEmailContext {
  makerName: string;
  queenName: string;
  beeName: string;
  title: string;
  dueDateText: string;
  roundUrl: string;
}
/** Sent once a dues payment is recorded (card, cash or cheque), with the PDF receipt attached. */
export interface DuesReceiptEmailContext {
  name: string;
  guildName: string;
  /** e.g. "2026-0007". */
  receiptNumber: string;
  /** e.g. "$30.00". */
  totalText: string;
  /** e.g. "1 January 2027 to 31 December 2027". */
  periodText: string;
  /** e.g. "2 December 2026". */
  paidOnText: string;
  /** e.g. "Visa card ending 4242", "Cash", "Cheque no. 311". */
  methodText: string;
  duesUrl: string;
}
/** One line of what a member owes, e.g. { label: "2028 dues — Regular", amountText: "$30.00" }. */
export interface DuesLineText {
  label: string;
  amountText: string;
}
/** About two weeks before a member's paid time runs out (the dues reminders job). */
export interface DuesRenewalSoonEmailContext {
  name: string;
  guildName: string;
  /** e.g. "2028" or "2027–28". */
  yearLabel: string;
  /** e.g. "$30.00". */
  totalText: string;
  /** Her last day in good standing, e.g. "1 January 2028". */
  renewByText: string;
  paidThroughText: string;
  duesUrl: string;
  lines?: DuesLineText[];
  /** The last day of grace after renewByText; empty when the guild has none. */
  graceEndsOnText?: string;
  /** e.g. "$5.00"; empty when there is no late fee. */
  lateFeeText?: string;
  householdName?: string;
  treasurerName?: string;
}
/** Once, when a member's membership lapses, with what renewing costs now. */
export interface DuesLapsedEmailContext {
  name: string;
  guildName: string;
  yearLabel: string;
  totalText: string;
  /** The first day she was lapsed, e.g. "2 February 2028". */
  lapsedOnText: string;
  paidThroughText: string;
  duesUrl: string;
  lines?: DuesLineText[];
  householdName?: string;
  treasurerName?: string;
}
export interface EmailContexts {
  invitation: InvitationEmailContext;
  'password-reset': PasswordResetEmailContext;
  welcome: WelcomeEmailContext;
  'bee-invitation': BeeInvitationEmailContext;
  'round-assignment': RoundAssignmentEmailContext;
  'round-reminder': RoundReminderEmailContext;
  'due-reminder': DueReminderEmailContext;
  'round-changed': RoundChangedEmailContext;
  'block-nudge': BlockNudgeEmailContext;
  'dues-receipt': DuesReceiptEmailContext;
  'dues-renewal-soon': DuesRenewalSoonEmailContext;
  'dues-lapsed': DuesLapsedEmailContext;
}

export interface RenderedEmail {
  subject: string;
  html: string;
  text: string;
}

const TEMPLATES_FOLDER = 'email-templates';

/** Walks up from `start` until it finds a folder that holds `email-templates/`. */
export function findEmailTemplatesDir(start: string = __dirname): string {
  let dir = path.resolve(start);
  for (;;) {
    const candidate = path.join(dir, TEMPLATES_FOLDER);
    if (fs.existsSync(candidate) && fs.statSync(candidate).isDirectory()) return candidate;
    const parent = path.dirname(dir);
    if (parent === dir) {
      throw new Error(`Could not find the "${TEMPLATES_FOLDER}" folder in any folder above ${start}`);
    }
    dir = parent;
  }
}

interface CompiledEmail {
  subject: HandlebarsTemplateDelegate;
  html: HandlebarsTemplateDelegate;
  text: HandlebarsTemplateDelegate;
}

let templatesDir: string | undefined;
let hbs: typeof Handlebars | undefined;
const compiled = new Map<EmailTemplateName, CompiledEmail>();

function readTemplate(dir: string, file: string): string {
  const full = path.join(dir, file);
  try {
    return fs.readFileSync(full, 'utf8');
  } catch (err) {
    throw new Error(`E-mail template file "${file}" could not be read from ${dir}: ${(err as Error).message}`);
  }
}

/** Words for a count of days from today: "today", "tomorrow", "in 3 days". */
function daysFromToday(days: number): string {
  if (days <= 0) return 'today';
  if (days === 1) return 'tomorrow';
  return `in ${days} days`;
}

/** "a", "a and b", "a, b and c". */
function joinWithAnd(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

function registerHelpers(env: typeof Handlebars): void {
  env.registerHelper('daysFromToday', (days: unknown) => daysFromToday(Number(days)));
  env.registerHelper('joinWithAnd', (items: unknown) =>
    joinWithAnd(Array.isArray(items) ? items.map((item) => String(item)) : []),
  );
  // HTML only: escapes the value, then keeps its line breaks (addresses, meeting details).
  env.registerHelper('withLineBreaks', (value: unknown) => {
    const escaped = env.escapeExpression(typeof value === 'string' ? value.trim() : '');
    return new env.SafeString(escaped.replace(/\r?\n/g, '<br>'));
  });
}

function environment(): { dir: string; hbs: typeof Handlebars } {
  if (!templatesDir || !hbs) {
    const dir = findEmailTemplatesDir();
    const env = Handlebars.create();
    registerHelpers(env);
    env.registerPartial('layout', env.compile(readTemplate(dir, 'layout.html.hbs'), { strict: false }));
    templatesDir = dir;
    hbs = env;
  }
  return { dir: templatesDir, hbs };
}

function compiledFor(name: EmailTemplateName): CompiledEmail {
  const cached = compiled.get(name);
  if (cached) return cached;
  const { dir, hbs: env } = environment();
  const entry: CompiledEmail = {
    subject: env.compile(readTemplate(dir, `${name}.subject.hbs`), { noEscape: true }),
    html: env.compile(readTemplate(dir, `${name}.html.hbs`)),
    text: env.compile(readTemplate(dir, `${name}.txt.hbs`), { noEscape: true }),
  };
  compiled.set(name, entry);
  return entry;
}

function isTemplateName(name: string): name is EmailTemplateName {
  return Object.prototype.hasOwnProperty.call(EMAIL_TEMPLATE_REQUIRED_KEYS, name);
}

/** false and 0 are values; only nothing, blank text and NaN are missing. */
function isMissing(value: unknown): boolean {
  return (
    value === undefined ||
    value === null ||
    (typeof value === 'string' && value.trim() === '') ||
    (typeof value === 'number' && Number.isNaN(value))
  );
}

/** Keys that must be a real true/false or number, so a "false" string cannot flip the wording. */
const BOOLEAN_KEYS = new Set(['trimToSize', 'queenSendsFabric', 'deliveryByMail', 'isQueen']);
const NUMBER_KEYS = new Set(['daysLeft']);

const WEB_ADDRESS = /^https?:\/\//i;
const HEX_COLOUR = /^#[0-9a-f]{6}$/i;

/**
 * Every link that ends up in an href and every colour that ends up in a style attribute, optional
 * ones included: top-level `…Url`/`…Link` strings, and `url`/`hex` of objects in the context
 * (directly or in lists, e.g. files and swatches).
 */
function checkLinksAndColours(name: EmailTemplateName, context: Record<string, unknown>): void {
  const checkObject = (where: string, value: unknown): void => {
    if (!value || typeof value !== 'object') return;
    const { url, hex } = value as { url?: unknown; hex?: unknown };
    if (url !== undefined && !WEB_ADDRESS.test(String(url))) {
      throw new Error(`E-mail "${name}": ${where}.url must be an http(s) address, got "${String(url)}"`);
    }
    if (hex !== undefined && !HEX_COLOUR.test(String(hex))) {
      throw new Error(`E-mail "${name}": ${where}.hex must be a colour like #1D5C63, got "${String(hex)}"`);
    }
  };
  for (const [key, value] of Object.entries(context)) {
    if (/(Url|Link)$/.test(key) && !isMissing(value) && !WEB_ADDRESS.test(String(value))) {
      throw new Error(`E-mail "${name}": ${key} must be an http(s) address, got "${String(value)}"`);
    }
    if (Array.isArray(value)) value.forEach((item, i) => checkObject(`${key}[${i}]`, item));
    else checkObject(key, value);
  }
}

function checkContext(name: EmailTemplateName, context: Record<string, unknown>): void {
  const required: readonly string[] = EMAIL_TEMPLATE_REQUIRED_KEYS[name];
  const missing = required.filter((key) => isMissing(context[key]));
  if (missing.length > 0) {
    throw new Error(`E-mail "${name}" needs a value for: ${missing.join(', ')}`);
  }
  for (const key of required) {
    const value = context[key];
    if (BOOLEAN_KEYS.has(key) && typeof value !== 'boolean') {
      throw new Error(`E-mail "${name}": ${key} must be true or false, got ${JSON.stringify(value)}`);
    }
    if (NUMBER_KEYS.has(key) && (typeof value !== 'number' || !Number.isFinite(value))) {
      throw new Error(`E-mail "${name}": ${key} must be a number, got ${JSON.stringify(value)}`);
    }
  }
  // Links go into href attributes and colours into style attributes: only web addresses and
  // #RRGGBB colours belong there.
  checkLinksAndColours(name, context);
}

/** One line, no surrounding or doubled whitespace (also keeps line breaks out of the header). */
function tidySubject(raw: string): string {
  return raw.replace(/\s+/g, ' ').trim();
}

/** Trailing spaces off, at most one blank line in a row, one newline at the end. */
function tidyText(raw: string): string {
  return (
    raw
      .replace(/\r\n/g, '\n')
      .replace(/[ \t]+$/gm, '')
      .replace(/\n{3,}/g, '\n\n')
      .trim() + '\n'
  );
}

/**
 * Renders one e-mail. Throws for an unknown template name or a missing required context value.
 * The subject is also available to the HTML layout as `@subject` (for the page title).
 */
export function renderEmail<N extends EmailTemplateName>(
  name: N,
  context: EmailContexts[N] | Record<string, unknown>,
): RenderedEmail {
  if (typeof name !== 'string' || !isTemplateName(name)) {
    throw new Error(`Unknown e-mail template "${String(name)}"; known ones: ${EMAIL_TEMPLATE_NAMES.join(', ')}`);
  }
  checkContext(name, (context ?? {}) as Record<string, unknown>);
  const t = compiledFor(name);
  const subject = tidySubject(t.subject(context));
  const html = t.html(context, { data: { subject } }).trim() + '\n';
  const text = tidyText(t.text(context));
  return { subject, html, text };
}

/** Drops compiled templates so the next render reads the files again (for tests and previews). */
export function clearEmailTemplateCache(): void {
  compiled.clear();
  templatesDir = undefined;
  hbs = undefined;
}
