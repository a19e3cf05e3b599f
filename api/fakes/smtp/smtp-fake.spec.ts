import { promises as fs } from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import * as nodemailer from 'nodemailer';
import { newMessageId, startSmtpFake, type MessageSummary, type SmtpFakeHandle, type StoredMessage } from './smtp-fake';

const ATTACHMENT = Buffer.from([0x00, 0x01, 0xfe, 0xff, 0x51, 0x75, 0x69, 0x6c, 0x74, 0x0a]);
const SUBJECT = 'Bienvenue à la guilde — crème brûlée & 🧵';

function transport(port: number) {
  return nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });
}

async function getJson<T>(fake: SmtpFakeHandle, route: string): Promise<{ status: number; body: T }> {
  const res = await fetch(`http://127.0.0.1:${fake.httpPort}${route}`);
  return { status: res.status, body: (await res.json()) as T };
}

describe('SMTP fake', () => {
  let dir: string;
  let fake: SmtpFakeHandle | undefined;

  beforeAll(async () => {
    dir = await fs.mkdtemp(path.join(os.tmpdir(), 'selvage-smtp-fake-'));
  });

  afterAll(async () => {
    await fake?.close();
    await fs.rm(dir, { recursive: true, force: true });
  });

  it('starts on free ports when given 0 and answers /health', async () => {
    fake = await startSmtpFake({ smtpPort: 0, httpPort: 0, dataDir: path.join(dir, 'mail') });
    expect(fake.smtpPort).toBeGreaterThan(0);
    expect(fake.httpPort).toBeGreaterThan(0);
    expect(fake.smtpPort).not.toBe(fake.httpPort);
    const health = await fetch(`http://127.0.0.1:${fake.httpPort}/health`);
    expect(health.status).toBe(200);
  });

  it('stores messages and serves them back newest first', async () => {
    const smtp = transport(fake!.smtpPort);
    await smtp.sendMail({
      from: 'Selvage <no-reply@selvage.example>',
      to: 'hazel@wrenfield.example',
      subject: 'First message',
      text: 'Plain text only.',
    });
    await smtp.sendMail({
      from: 'Selvage <no-reply@selvage.example>',
      to: 'June Pettigrew <june@wrenfield.example>',
      cc: 'lottie@wrenfield.example',
      bcc: 'hidden@wrenfield.example',
      subject: SUBJECT,
      text: 'Hello June.\nSee you at the sit-and-sew.',
      html: '<p>Hello <strong>June</strong>.</p>',
      attachments: [{ filename: 'pattern.bin', content: ATTACHMENT, contentType: 'application/octet-stream' }],
    });
    smtp.close();

    const { status, body: list } = await getJson<MessageSummary[]>(fake!, '/messages');
    expect(status).toBe(200);
    expect(list).toHaveLength(2);
    expect(list.map((m) => m.subject)).toEqual([SUBJECT, 'First message']);
    expect(Object.keys(list[0]).sort()).toEqual(['from', 'id', 'receivedAt', 'subject', 'to']);
    expect(list[0].to).toContain('june@wrenfield.example');
    expect(list[0].from).toContain('no-reply@selvage.example');
    expect(list[0].id > list[1].id).toBe(true);

    const { status: oneStatus, body: full } = await getJson<StoredMessage>(fake!, `/messages/${list[0].id}`);
    expect(oneStatus).toBe(200);
    expect(full.id).toBe(list[0].id);
    expect(new Date(full.receivedAt).toString()).not.toBe('Invalid Date');
    expect(full.subject).toBe(SUBJECT);
    expect(full.envelopeFrom).toBe('no-reply@selvage.example');
    expect(full.envelopeTo.sort()).toEqual(
      ['hidden@wrenfield.example', 'june@wrenfield.example', 'lottie@wrenfield.example'].sort(),
    );
    expect(full.to).toMatch(/^"?June Pettigrew"? <june@wrenfield\.example>$/);
    expect(full.text.trim()).toBe('Hello June.\nSee you at the sit-and-sew.');
    expect(full.html).toContain('<p>Hello <strong>June</strong>.</p>');
    expect(full.headers.subject).toBe(SUBJECT);
    expect(full.headers['content-type']).toMatch(/^multipart\/mixed/);
    expect(full.headers.from).toContain('no-reply@selvage.example');
    expect(Object.values(full.headers).every((v) => typeof v === 'string')).toBe(true);
    expect(full.attachments).toHaveLength(1);
    expect(full.attachments[0]).toMatchObject({
      filename: 'pattern.bin',
      contentType: 'application/octet-stream',
      size: ATTACHMENT.length,
    });
    expect(Buffer.from(full.attachments[0].contentBase64, 'base64').equals(ATTACHMENT)).toBe(true);
    expect(full).not.toHaveProperty('recipients');
  });

  it('filters by recipient, case-insensitively, across To, Cc and Bcc', async () => {
    const june = await getJson<MessageSummary[]>(fake!, '/messages?to=JUNE@Wrenfield.example');
    expect(june.body.map((m) => m.subject)).toEqual([SUBJECT]);
    const hazel = await getJson<MessageSummary[]>(fake!, `/messages?to=${encodeURIComponent('hazel@wrenfield.example')}`);
    expect(hazel.body.map((m) => m.subject)).toEqual(['First message']);
    const lottie = await getJson<MessageSummary[]>(fake!, '/messages?to=lottie@wrenfield.example');
    expect(lottie.body).toHaveLength(1);
    const hidden = await getJson<MessageSummary[]>(fake!, '/messages?to=hidden@wrenfield.example');
    expect(hidden.body).toHaveLength(1);
    const nobody = await getJson<MessageSummary[]>(fake!, '/messages?to=nobody@wrenfield.example');
    expect(nobody.body).toEqual([]);
  });

  it('answers unknown ids, paths and methods with JSON errors', async () => {
    const missing = await getJson<{ statusCode: number }>(fake!, `/messages/${newMessageId()}`);
    expect(missing.status).toBe(404);
    expect(missing.body.statusCode).toBe(404);
    const traversal = await getJson<{ statusCode: number }>(fake!, '/messages/..%2F..%2Fetc%2Fpasswd');
    expect(traversal.status).toBe(404);
    const elsewhere = await getJson<{ statusCode: number }>(fake!, '/inbox');
    expect(elsewhere.status).toBe(404);
    const put = await fetch(`http://127.0.0.1:${fake!.httpPort}/messages`, { method: 'PUT' });
    expect(put.status).toBe(405);
    expect(put.headers.get('content-type')).toMatch(/application\/json/);
    const post = await fetch(`http://127.0.0.1:${fake!.httpPort}/health`, { method: 'POST' });
    expect(post.status).toBe(405);
  });

  it('keeps messages across a restart on the same folder', async () => {
    await fake!.close();
    fake = await startSmtpFake({ smtpPort: 0, httpPort: 0, dataDir: path.join(dir, 'mail') });
    const { body } = await getJson<MessageSummary[]>(fake, '/messages');
    expect(body.map((m) => m.subject)).toEqual([SUBJECT, 'First message']);

    // New mail after the restart still sorts as newest.
    const smtp = transport(fake.smtpPort);
    await smtp.sendMail({ from: 'a@selvage.example', to: 'b@wrenfield.example', subject: 'Third', text: 'x' });
    smtp.close();
    const after = await getJson<MessageSummary[]>(fake, '/messages');
    expect(after.body.map((m) => m.subject)).toEqual(['Third', SUBJECT, 'First message']);
  });

  it('DELETE /messages clears the inbox', async () => {
    const res = await fetch(`http://127.0.0.1:${fake!.httpPort}/messages`, { method: 'DELETE' });
    expect(res.status).toBe(204);
    const { body } = await getJson<MessageSummary[]>(fake!, '/messages');
    expect(body).toEqual([]);
  });

  it('refuses a message over the size limit with an SMTP 552', async () => {
    const small = await startSmtpFake({
      smtpPort: 0,
      httpPort: 0,
      dataDir: path.join(dir, 'small'),
      maxMessageBytes: 2048,
    });
    try {
      const smtp = transport(small.smtpPort);
      await expect(
        smtp.sendMail({ from: 'a@selvage.example', to: 'b@wrenfield.example', subject: 'Big', text: 'q'.repeat(10_000) }),
      ).rejects.toMatchObject({ responseCode: 552 });
      smtp.close();
      const { body } = await getJson<MessageSummary[]>(small, '/messages');
      expect(body).toEqual([]);
    } finally {
      await small.close();
    }
  });
});
