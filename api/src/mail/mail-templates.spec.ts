import * as path from 'node:path';
import {
  EMAIL_TEMPLATE_NAMES,
  EMAIL_TEMPLATE_REQUIRED_KEYS,
  findEmailTemplatesDir,
  renderEmail,
  type EmailContexts,
  type EmailTemplateName,
} from './mail-templates';

const samples: { [N in EmailTemplateName]: EmailContexts[N] } = {
  invitation: {
    inviteeEmail: 'june@wrenfield.example',
    guildName: 'Wrenfield Quilt Guild',
    invitedByName: 'Hazel Ormsby',
    acceptUrl: 'https://selvage.example/invitations/tok3n-abc?from=mail&x=1',
    expiresOn: 'Tuesday 15 December 2026',
  },
  'password-reset': {
    name: 'Doreen Achterberg',
    resetUrl: 'https://selvage.example/reset-password?token=0123abcd',
    validForText: '1 hour',
  },
  welcome: {
    name: 'June Pettigrew',
    guildName: 'Millbrook Modern Quilters',
    dashboardUrl: 'https://selvage.example/',
  },
};

const linkOf = (name: EmailTemplateName): string => {
  const ctx = samples[name] as unknown as Record<string, string>;
  return ctx[Object.keys(ctx).find((k) => k.endsWith('Url'))!];
};

/** What a URL looks like inside an HTML attribute or text after Handlebars escaping. */
const htmlEscaped = (s: string): string =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/=/g, '&#x3D;');

describe('renderEmail', () => {
  it('knows exactly the three messages', () => {
    expect([...EMAIL_TEMPLATE_NAMES].sort()).toEqual(['invitation', 'password-reset', 'welcome']);
  });

  it('finds the email-templates folder by walking up', () => {
    const dir = findEmailTemplatesDir();
    expect(path.basename(dir)).toBe('email-templates');
  });

  describe.each(EMAIL_TEMPLATE_NAMES)('%s', (name) => {
    const rendered = renderEmail(name, samples[name] as unknown as Record<string, unknown>);
    const link = linkOf(name);

    it('renders a one-line subject, an HTML part and a text part', () => {
      expect(rendered.subject.length).toBeGreaterThan(5);
      expect(rendered.subject).toBe(rendered.subject.trim());
      expect(rendered.subject).not.toMatch(/[\r\n]/);
      expect(rendered.html).toMatch(/^<!DOCTYPE html>/);
      expect(rendered.text.trim().length).toBeGreaterThan(50);
    });

    it('puts the link in the button, prints it below, and puts it in the text', () => {
      const escaped = htmlEscaped(link);
      // Once as the button, once as the printed link.
      expect(rendered.html.split(`href="${escaped}"`).length - 1).toBe(2);
      expect(rendered.html).toContain(`>${escaped}</a>`);
      expect(rendered.text).toContain(link);
    });

    it('uses the Selvage layout and says what to do if the mail was not expected', () => {
      expect(rendered.html).toContain('#1D5C63');
      expect(rendered.html).toContain('Atkinson Hyperlegible Next');
      expect(rendered.html).toContain(`<title>${htmlEscaped(rendered.subject)}</title>`);
      expect(rendered.html).not.toMatch(/<img|url\(|@import|<link/i);
      expect(rendered.text).toMatch(/ignore this e-mail|used your e-mail address by mistake/);
      expect(rendered.html).toMatch(/ignore this e-mail|used your e-mail address by mistake/);
    });

    it('has a footer naming the guild when there is one', () => {
      const guild = (samples[name] as { guildName?: string }).guildName;
      if (guild) {
        expect(rendered.html).toContain(`Sent by Selvage for ${guild}`);
        expect(rendered.text).toContain(`Sent by Selvage for ${guild}`);
      } else {
        expect(rendered.html).toContain('Sent by Selvage');
        expect(rendered.html).not.toContain('Sent by Selvage for');
      }
    });

    it('throws when a required value is missing or blank', () => {
      for (const key of EMAIL_TEMPLATE_REQUIRED_KEYS[name]) {
        const ctx: Record<string, unknown> = { ...samples[name] };
        delete ctx[key];
        expect(() => renderEmail(name, ctx)).toThrow(new RegExp(`"${name}" needs a value for: ${key}`));
        expect(() => renderEmail(name, { ...samples[name], [key]: '  ' })).toThrow(key);
      }
    });
  });

  it('escapes guild names in HTML and leaves them plain in text and subject', () => {
    const hostile = 'Stitch & <Bitch>';
    const script = '<script>alert("x")</script>';
    const invitation = renderEmail('invitation', {
      ...samples.invitation,
      guildName: hostile,
      invitedByName: script,
    });
    expect(invitation.html).toContain('Stitch &amp; &lt;Bitch&gt;');
    expect(invitation.html).not.toContain('<Bitch>');
    expect(invitation.html).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;');
    expect(invitation.html).not.toContain('<script');
    expect(invitation.text).toContain(`join ${hostile} on Selvage`);
    expect(invitation.text).toContain(script);
    expect(invitation.text).not.toContain('&amp;');
    expect(invitation.text).not.toContain('&lt;');
    expect(invitation.subject).toBe(`${script} invited you to join ${hostile} on Selvage`);

    const welcome = renderEmail('welcome', { ...samples.welcome, guildName: '<script>' });
    expect(welcome.html).toContain('Sent by Selvage for &lt;script&gt;');
    expect(welcome.html).not.toContain('<script>');
    expect(welcome.text).toContain('Sent by Selvage for <script>');
  });

  it('keeps line breaks in values out of the subject', () => {
    const { subject } = renderEmail('welcome', { ...samples.welcome, name: 'June\r\nBcc: someone@example.com' });
    expect(subject).toBe('Welcome to Millbrook Modern Quilters, June Bcc: someone@example.com');
  });

  it('refuses links that are not web addresses', () => {
    expect(() => renderEmail('password-reset', { ...samples['password-reset'], resetUrl: 'javascript:alert(1)' })).toThrow(
      /resetUrl must be an http\(s\) address/,
    );
  });

  it('throws a clear error for an unknown template', () => {
    expect(() => renderEmail('newsletter' as EmailTemplateName, {})).toThrow(
      'Unknown e-mail template "newsletter"; known ones: invitation, password-reset, welcome',
    );
    expect(() => renderEmail('__proto__' as EmailTemplateName, {})).toThrow(/Unknown e-mail template/);
  });
});
