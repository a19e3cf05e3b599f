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
  'bee-invitation': {
    name: 'June Pettigrew',
    beeName: 'Scrappy Stars Bee',
    guildName: 'Wrenfield Quilt Guild',
    organiserName: 'Hazel Ormsby',
    beeUrl: 'https://selvage.example/guilds/1/bees/7',
  },
  'round-assignment': {
    makerName: 'June Pettigrew',
    queenName: 'Hazel Ormsby',
    beeName: 'Scrappy Stars Bee',
    guildName: 'Wrenfield Quilt Guild',
    monthLabel: 'March 2027',
    title: 'Wonky Star',
    instructionsHtml: '<p>Make one <strong>wonky star</strong>.</p>\n<ul>\n<li>Points may wander</li>\n</ul>',
    instructionsText: 'Make one wonky star.\n\n- Points may wander',
    finishedText: '12 x 12 inches',
    unfinishedText: '12 1/2 x 12 1/2 inches',
    seamText: '1/4 inch',
    toleranceText: '1/8 inch',
    trimToSize: true,
    swatches: [
      { name: 'Navy', hex: '#1F2A44' },
      { name: 'Mustard', hex: '#D4A017' },
      { name: 'Sage green', hex: '#9CAF88' },
    ],
    background: { name: 'Low-volume cream', hex: '#F6F0E1' },
    queenSendsFabric: false,
    dueDateText: 'Monday 15 March 2027',
    deliveryByMail: true,
    deliveryAddress: 'Hazel Ormsby\n4 Bobbin Lane\nWrenfield WR1 2AB',
    meetingDetails: '',
    patternLink: 'https://patterns.example/wonky-star?size=12&ref=selvage',
    files: [
      { filename: 'wonky-star-diagram.pdf', url: 'https://selvage.example/api/guilds/1/bees/7/rounds/2027-03/files/3' },
      { filename: 'colour-photo.jpg', url: 'https://selvage.example/api/guilds/1/bees/7/rounds/2027-03/files/4' },
    ],
    roundUrl: 'https://selvage.example/guilds/1/bees/7/rounds/2027-03',
  },
  'round-reminder': {
    name: 'Hazel Ormsby',
    queenName: 'Hazel Ormsby',
    beeName: 'Scrappy Stars Bee',
    monthLabel: 'March 2027',
    sendDateText: 'Monday 1 March 2027',
    daysLeft: 3,
    roundUrl: 'https://selvage.example/guilds/1/bees/7/rounds/2027-03',
    isQueen: true,
  },
  'due-reminder': {
    makerName: 'June Pettigrew',
    queenName: 'Hazel Ormsby',
    beeName: 'Scrappy Stars Bee',
    title: 'Wonky Star',
    dueDateText: 'Monday 15 March 2027',
    unfinishedText: '12 1/2 x 12 1/2 inches',
    finishedText: '12 x 12 inches',
    roundUrl: 'https://selvage.example/guilds/1/bees/7/rounds/2027-03',
    deliveryByMail: true,
  },
  'round-changed': {
    makerName: 'June Pettigrew',
    queenName: 'Hazel Ormsby',
    beeName: 'Scrappy Stars Bee',
    title: 'Wonky Star',
    monthLabel: 'March 2027',
    roundUrl: 'https://selvage.example/guilds/1/bees/7/rounds/2027-03',
    changes: ['the due date', 'the colours'],
  },
  'block-nudge': {
    makerName: 'June Pettigrew',
    queenName: 'Hazel Ormsby',
    beeName: 'Scrappy Stars Bee',
    title: 'Wonky Star',
    dueDateText: 'Monday 15 March 2027',
    roundUrl: 'https://selvage.example/guilds/1/bees/7/rounds/2027-03',
  },
  'dues-receipt': {
    name: 'June Pettigrew',
    guildName: 'Wrenfield Quilt Guild',
    receiptNumber: '2026-0007',
    totalText: '$30.00',
    periodText: '1 January 2027 to 31 December 2027',
    paidOnText: '2 December 2026',
    methodText: 'Visa card ending 4242',
    duesUrl: 'https://selvage.example/guilds/1/dues',
  },
  'dues-renewal-soon': {
    name: 'June Pettigrew',
    guildName: 'Wrenfield Quilt Guild',
    yearLabel: '2028',
    totalText: '$30.00',
    renewByText: '1 January 2028',
    paidThroughText: '31 December 2027',
    duesUrl: 'https://selvage.example/guilds/1/dues',
    lines: [{ label: '2028 dues — Regular', amountText: '$30.00' }],
    graceEndsOnText: '1 February 2028',
    lateFeeText: '$5.00',
    treasurerName: 'Doreen Achterberg',
  },
  'dues-lapsed': {
    name: 'Agnes Hollowell',
    guildName: 'Wrenfield Quilt Guild',
    yearLabel: '2028',
    totalText: '$35.00',
    lapsedOnText: '2 February 2028',
    paidThroughText: '31 December 2027',
    duesUrl: 'https://selvage.example/guilds/1/dues',
    lines: [
      { label: '2028 dues — Regular', amountText: '$30.00' },
      { label: 'Late fee (renewed after 1 February 2028)', amountText: '$5.00' },
    ],
    treasurerName: 'Doreen Achterberg',
  },
};

/** Messages that may reach someone who has nothing to do with Selvage yet. */
const FIRST_CONTACT: EmailTemplateName[] = ['invitation', 'password-reset', 'welcome', 'bee-invitation'];

const linkOf = (name: EmailTemplateName): string => {
  const ctx = samples[name] as unknown as Record<string, string>;
  return ctx[Object.keys(ctx).find((k) => k.endsWith('Url'))!];
};

/** What a URL looks like inside an HTML attribute or text after Handlebars escaping. */
const htmlEscaped = (s: string): string =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/=/g, '&#x3D;');

describe('renderEmail', () => {
  it('knows exactly these messages', () => {
    expect([...EMAIL_TEMPLATE_NAMES].sort()).toEqual([
      'bee-invitation',
      'block-nudge',
      'due-reminder',
      'dues-lapsed',
      'dues-receipt',
      'dues-renewal-soon',
      'invitation',
      'password-reset',
      'round-assignment',
      'round-changed',
      'round-reminder',
      'welcome',
    ]);
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
      // First contact says what to do if it was not expected; bee mail says why it came.
      const why = FIRST_CONTACT.includes(name)
        ? /ignore this e-mail|used your e-mail address by mistake/
        : /You get this e-mail because/;
      expect(rendered.text).toMatch(why);
      expect(rendered.html).toMatch(why);
    });

    it('leaves no template syntax or "undefined" in the output', () => {
      for (const part of [rendered.subject, rendered.html, rendered.text]) {
        expect(part).not.toMatch(/\{\{|\}\}|undefined|\[object Object\]/);
      }
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
      'Unknown e-mail template "newsletter"; known ones: invitation, password-reset, welcome, bee-invitation, round-assignment, round-reminder, due-reminder, round-changed, block-nudge, dues-receipt, dues-renewal-soon, dues-lapsed',
    );
    expect(() => renderEmail('__proto__' as EmailTemplateName, {})).toThrow(/Unknown e-mail template/);
  });
});

describe('renderEmail: required values', () => {
  it('counts false and 0 as present, and refuses NaN', () => {
    const reminder = renderEmail('round-reminder', { ...samples['round-reminder'], isQueen: false, daysLeft: 0 });
    expect(reminder.text).toContain('(today)');
    expect(reminder.subject).toBe("Hazel Ormsby's March 2027 block for Scrappy Stars Bee is not published yet");
    const assignment = renderEmail('round-assignment', {
      ...samples['round-assignment'],
      trimToSize: false,
      queenSendsFabric: false,
      deliveryByMail: false,
    });
    expect(assignment.text).toContain('Please leave your block untrimmed.');
    expect(() => renderEmail('round-reminder', { ...samples['round-reminder'], daysLeft: Number.NaN })).toThrow(
      /needs a value for: daysLeft/,
    );
  });

  it('refuses text where a true/false or a number belongs, so "false" cannot read as yes', () => {
    expect(() => renderEmail('round-assignment', { ...samples['round-assignment'], trimToSize: 'false' })).toThrow(
      /trimToSize must be true or false/,
    );
    expect(() => renderEmail('round-reminder', { ...samples['round-reminder'], daysLeft: '3' })).toThrow(
      /daysLeft must be a number/,
    );
  });

  it('lets optional values be empty or left out', () => {
    const ctx: Record<string, unknown> = { ...samples['round-assignment'], swatches: [], files: [], background: null };
    delete ctx.deliveryAddress;
    delete ctx.meetingDetails;
    delete ctx.patternLink;
    const { html, text } = renderEmail('round-assignment', ctx);
    expect(html).not.toContain('Background:');
    expect(html).not.toContain('would like these colours');
    expect(html).not.toContain('Pattern:');
    expect(html).not.toContain('Files from');
    expect(html).toContain('address is on the round’s page');
    expect(text).toContain("address is on the round's page");
    const changed = renderEmail('round-changed', { ...samples['round-changed'], changes: [] });
    expect(changed.text).not.toContain('What changed');
  });

  it('refuses optional links that are not web addresses and colours that are not #RRGGBB', () => {
    const base = samples['round-assignment'];
    expect(() => renderEmail('round-assignment', { ...base, patternLink: 'javascript:alert(1)' })).toThrow(
      /patternLink must be an http\(s\) address/,
    );
    expect(() =>
      renderEmail('round-assignment', { ...base, files: [{ filename: 'x.pdf', url: 'data:text/html,hi' }] }),
    ).toThrow(/files\[0\]\.url must be an http\(s\) address/);
    expect(() =>
      renderEmail('round-assignment', { ...base, swatches: [{ name: 'Red', hex: 'red;background:url(x)' }] }),
    ).toThrow(/swatches\[0\]\.hex must be a colour/);
    expect(() => renderEmail('round-assignment', { ...base, background: { name: 'Cream', hex: '#FFF' } })).toThrow(
      /background\.hex must be a colour/,
    );
  });
});

describe('round-assignment', () => {
  const ctx = samples['round-assignment'];
  const { subject, html, text } = renderEmail('round-assignment', ctx);

  it('has a subject naming the month, the queen and the block', () => {
    expect(subject).toBe('Your March 2027 block for Hazel Ormsby: Wonky Star');
  });

  it('labels both sizes as finished and unfinished, in HTML and text', () => {
    expect(html).toMatch(/Finished size<\/p>\s*<p[^>]*>12 x 12 inches<\/p>/);
    expect(html).toMatch(/Unfinished size \(cut size\)<\/p>\s*<p[^>]*>12 1\/2 x 12 1\/2 inches<\/p>/);
    expect(text).toContain('Finished size: 12 x 12 inches');
    expect(text).toContain('Unfinished size (cut size): 12 1/2 x 12 1/2 inches');
    for (const part of [html, text]) {
      expect(part).toContain('1/4 inch seam allowance');
      expect(part).toContain('to the unfinished size, 12 1/2 x 12 1/2 inches. Within 1/8 inch');
    }
  });

  it('asks for an untrimmed block when the queen trims', () => {
    const r = renderEmail('round-assignment', { ...ctx, trimToSize: false });
    for (const part of [r.html, r.text]) {
      expect(part).toContain('leave your block untrimmed');
      expect(part).toContain('Hazel Ormsby will trim it');
      expect(part).not.toContain('Please trim your block');
    }
  });

  it('shows each swatch as a coloured square with its name and hex, and the background', () => {
    for (const { name, hex } of ctx.swatches) {
      expect(html).toContain(`bgcolor="${hex}"`);
      expect(html).toContain(`background-color:${hex};border:1px solid #1E2430`);
      expect(html).toContain(`${name} <span`);
      expect(html).toContain(`(${hex})`);
      expect(text).toContain(`- ${name} (${hex})`);
    }
    expect(html).toContain('bgcolor="#F6F0E1"');
    expect(html).toContain('<strong>Background:</strong> Low-volume cream');
    expect(text).toContain('Background: Low-volume cream (#F6F0E1)');
  });

  it('inserts the instructions as HTML, and their text version in the text part', () => {
    expect(html).toContain(ctx.instructionsHtml);
    expect(text).toContain(ctx.instructionsText);
    expect(text).not.toContain('<strong>');
  });

  it('escapes a script in a swatch name, the title, the address and the background', () => {
    const script = '<script>alert(1)</script>';
    const r = renderEmail('round-assignment', {
      ...ctx,
      title: script,
      swatches: [{ name: script, hex: '#112233' }],
      background: { name: script, hex: '#FFFFFF' },
      deliveryAddress: `${script}\nLine two`,
    });
    expect(r.html).not.toContain('<script');
    expect(r.html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(r.html).toContain('&lt;/script&gt;<br>Line two');
    expect(r.text).toContain(`- ${script} (#112233)`);
  });

  it('links the pattern and the files, and prints the address with its line breaks', () => {
    expect(html).toContain(`href="${htmlEscaped(ctx.patternLink!)}"`);
    for (const f of ctx.files) {
      expect(html).toContain(`href="${htmlEscaped(f.url)}"`);
      expect(html).toContain(`>${f.filename}</a>`);
      expect(text).toContain(`- ${f.filename}: ${f.url}`);
    }
    expect(text).toContain(`Pattern: ${ctx.patternLink}`);
    expect(html).toContain('Hazel Ormsby<br>4 Bobbin Lane<br>Wrenfield WR1 2AB');
    expect(text).toContain(ctx.deliveryAddress);
    for (const part of [html, text]) {
      expect(part).toContain('post your block to Hazel Ormsby in good time to arrive by Monday 15 March 2027');
      expect(part).toContain('Please use fabric from your own stash.');
    }
  });

  it('describes a meeting hand-over and fabric from the queen', () => {
    const r = renderEmail('round-assignment', {
      ...ctx,
      deliveryByMail: false,
      deliveryAddress: '',
      meetingDetails: 'April meeting, 7 pm\nWrenfield village hall',
      queenSendsFabric: true,
    });
    expect(r.html).toContain('April meeting, 7 pm<br>Wrenfield village hall');
    expect(r.text).toContain('April meeting, 7 pm\nWrenfield village hall');
    for (const part of [r.html, r.text]) {
      expect(part).toContain('hand it to Hazel Ormsby by Monday 15 March 2027');
      expect(part).not.toContain('post your block');
      expect(part).toContain('Hazel Ormsby will send you the fabric');
    }
  });

  it('mentions the calendar file, the due date and the safety line in both parts', () => {
    for (const part of [html, text]) {
      expect(part).toContain('A calendar file with the due date is attached');
      expect(part).toContain('Monday 15 March 2027');
      expect(part).toContain('close your rotary cutter after every cut, and unplug the iron when you finish');
    }
  });
});

describe('bee mail', () => {
  it('bee-invitation says who invited her to which bee', () => {
    const r = renderEmail('bee-invitation', samples['bee-invitation']);
    expect(r.subject).toBe('Hazel Ormsby invited you to join Scrappy Stars Bee');
    expect(r.text).toContain('press Join on that page');
  });

  it('round-reminder asks the queen to publish, and tells the organiser who has not', () => {
    const queen = renderEmail('round-reminder', samples['round-reminder']);
    expect(queen.subject).toBe('Please publish your March 2027 block for Scrappy Stars Bee');
    expect(queen.text).toContain('Your makers get your block assignment on Monday 1 March 2027 (in 3 days)');
    expect(queen.html).toContain('press <strong>Publish</strong>');
    const organiser = renderEmail('round-reminder', {
      ...samples['round-reminder'],
      name: 'Lottie Faraday',
      isQueen: false,
      daysLeft: 1,
    });
    expect(organiser.text).toContain('Hazel Ormsby has not published the March 2027 block for Scrappy Stars Bee yet');
    expect(organiser.text).toContain('(tomorrow)');
    expect(organiser.html).toContain('you organise Scrappy Stars Bee');
  });

  it('due-reminder gives both sizes, labelled, and the hand-over', () => {
    const mail = renderEmail('due-reminder', samples['due-reminder']);
    for (const part of [mail.html, mail.text]) {
      expect(part).toMatch(/Finished size:(<\/strong> <span[^>]*>| )12 x 12 inches/);
      expect(part).toMatch(/Unfinished size \(cut size\):(<\/strong> <span[^>]*>| )12 1\/2 x 12 1\/2 inches/);
      expect(part).toContain('Please post it soon');
    }
    const meeting = renderEmail('due-reminder', { ...samples['due-reminder'], deliveryByMail: false });
    expect(meeting.text).toContain('hand it to Hazel Ormsby by Monday 15 March 2027');
    expect(meeting.text).toContain('Already handed it over?');
  });

  it('round-changed lists what changed', () => {
    const r = renderEmail('round-changed', samples['round-changed']);
    expect(r.subject).toBe('Hazel Ormsby changed the March 2027 block: Wonky Star');
    expect(r.html).toContain('What changed: <strong>the due date and the colours</strong>.');
    expect(r.text).toContain('What changed: the due date and the colours.');
    const three = renderEmail('round-changed', { ...samples['round-changed'], changes: ['a', 'b', 'c'] });
    expect(three.text).toContain('What changed: a, b and c.');
    const script = renderEmail('round-changed', { ...samples['round-changed'], changes: ['<b>x</b>'] });
    expect(script.html).toContain('&lt;b&gt;x&lt;/b&gt;');
  });

  it('block-nudge is gentle', () => {
    const r = renderEmail('block-nudge', samples['block-nudge']);
    expect(r.subject).toBe('A friendly note from Hazel Ormsby about your Wonky Star block');
    for (const part of [r.html, r.text]) {
      expect(part).toContain('looking forward to your');
      expect(part).not.toMatch(/\b(late|overdue|failed|must)\b/i);
    }
  });
});

describe('dues reminders', () => {
  it('dues-renewal-soon says what she owes, by when, and how to pay, without scolding', () => {
    const r = renderEmail('dues-renewal-soon', samples['dues-renewal-soon']);
    expect(r.subject).toBe('Your Wrenfield Quilt Guild dues for 2028: $30.00 by 1 January 2028');
    for (const part of [r.html, r.text]) {
      expect(part).toContain('paid through 31 December 2027');
      expect(part).toContain('2028 dues — Regular');
      expect(part).toContain('Doreen Achterberg, the guild');
      expect(part).toContain('grace period until 1 February 2028; after that, renewing adds a $5.00 late fee');
      expect(part).not.toMatch(/\b(overdue|failed|must|unfortunately)\b/i);
    }
    const plain = renderEmail('dues-renewal-soon', { ...samples['dues-renewal-soon'], graceEndsOnText: '', lateFeeText: '', treasurerName: '', lines: [] });
    expect(plain.text).not.toContain('grace period');
    expect(plain.text).toContain("Or give cash or a cheque to the guild's treasurer.");
    const household = renderEmail('dues-renewal-soon', { ...samples['dues-renewal-soon'], householdName: 'Mill Row' });
    expect(household.text).toContain('everyone in the Mill Row household, so one payment is enough');
  });

  it('dues-lapsed lists what renewing costs now and is kind about it', () => {
    const r = renderEmail('dues-lapsed', samples['dues-lapsed']);
    expect(r.subject).toBe('Your Wrenfield Quilt Guild membership has lapsed: here is how to renew');
    for (const part of [r.html, r.text]) {
      expect(part).toContain('lapsed on');
      expect(part).toContain('2 February 2028');
      expect(part).toContain('$35.00');
      expect(part).toContain('Late fee (renewed after 1 February 2028)');
      expect(part).toContain('welcome back any time');
      expect(part).not.toMatch(/\b(overdue|failed|must|unfortunately)\b/i);
    }
    expect(r.text).toContain('Late fee (renewed after 1 February 2028): $5.00');
  });
});
