/**
 * Renders Selvage's e-mails from the Handlebars files in the repository's `email-templates/` folder.
 *
 * Each message has three files: `<name>.subject.hbs`, `<name>.html.hbs` and `<name>.txt.hbs`.
 * Every HTML part is wrapped in `layout.html.hbs` (registered as the partial `layout`).
 * HTML parts escape values (double-stash only, never triple-stash for data from people);
 * subject and text parts are plain text and are not HTML-escaped.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import Handlebars from 'handlebars';

/** The context keys each message needs; rendering without one of them throws. */
export const EMAIL_TEMPLATE_REQUIRED_KEYS = {
  invitation: ['inviteeEmail', 'guildName', 'invitedByName', 'acceptUrl', 'expiresOn'],
  'password-reset': ['name', 'resetUrl', 'validForText'],
  welcome: ['name', 'guildName', 'dashboardUrl'],
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
export interface EmailContexts {
  invitation: InvitationEmailContext;
  'password-reset': PasswordResetEmailContext;
  welcome: WelcomeEmailContext;
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

function environment(): { dir: string; hbs: typeof Handlebars } {
  if (!templatesDir || !hbs) {
    const dir = findEmailTemplatesDir();
    const env = Handlebars.create();
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

function isMissing(value: unknown): boolean {
  return value === undefined || value === null || (typeof value === 'string' && value.trim() === '');
}

function checkContext(name: EmailTemplateName, context: Record<string, unknown>): void {
  const required: readonly string[] = EMAIL_TEMPLATE_REQUIRED_KEYS[name];
  const missing = required.filter((key) => isMissing(context[key]));
  if (missing.length > 0) {
    throw new Error(`E-mail "${name}" needs a value for: ${missing.join(', ')}`);
  }
  // Links go into href attributes: only web addresses belong there.
  for (const key of required) {
    if (!key.endsWith('Url')) continue;
    const value = String(context[key]);
    if (!/^https?:\/\//i.test(value)) {
      throw new Error(`E-mail "${name}": ${key} must be an http(s) address, got "${value}"`);
    }
  }
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
export function renderEmail(name: EmailTemplateName, context: Record<string, unknown>): RenderedEmail {
  if (typeof name !== 'string' || !isTemplateName(name)) {
    throw new Error(`Unknown e-mail template "${String(name)}"; known ones: ${EMAIL_TEMPLATE_NAMES.join(', ')}`);
  }
  checkContext(name, context ?? {});
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
