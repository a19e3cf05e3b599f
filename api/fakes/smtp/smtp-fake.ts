/**
 * A local stand-in for an outgoing mail service.
 *
 * It accepts mail over plain SMTP (no TLS, no login needed), keeps each message as one JSON file
 * in `dataDir`, and serves what it received over a tiny HTTP API so tests, the dev inbox and
 * people can read it back:
 *
 *   GET    /health         200 { status: "ok" }
 *   GET    /messages       summaries, newest first; `?to=ADDRESS` keeps messages for that recipient
 *   GET    /messages/:id   the whole stored message, or 404
 *   DELETE /messages       removes every stored message, 204
 */
import { randomBytes } from 'node:crypto';
import { promises as fs } from 'node:fs';
import * as http from 'node:http';
import type { AddressInfo } from 'node:net';
import * as path from 'node:path';
import { simpleParser, type AddressObject, type HeaderValue, type ParsedMail } from 'mailparser';
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';

export interface SmtpFakeOptions {
  /** Interface to bind both servers to. Defaults to 127.0.0.1. */
  host?: string;
  /** SMTP port; 0 picks any free port. */
  smtpPort: number;
  /** HTTP API port; 0 picks any free port. */
  httpPort: number;
  /** Folder for the stored messages; created when missing, kept across restarts. */
  dataDir: string;
  /** Largest message accepted, in bytes. Defaults to 25 MB. */
  maxMessageBytes?: number;
}

export interface SmtpFakeHandle {
  smtpPort: number;
  httpPort: number;
  close(): Promise<void>;
}

export interface StoredAttachment {
  filename: string | null;
  contentType: string;
  size: number;
  contentBase64: string;
}

export interface StoredMessage {
  id: string;
  receivedAt: string;
  envelopeFrom: string | null;
  envelopeTo: string[];
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string;
  headers: Record<string, string>;
  attachments: StoredAttachment[];
}

export type MessageSummary = Pick<StoredMessage, 'id' | 'receivedAt' | 'from' | 'to' | 'subject'>;

export const DEFAULT_MAX_MESSAGE_BYTES = 25 * 1024 * 1024;

/** Ids look like `0mimx3k2a-0001-9f2c4b1e`: time in base 36, a per-process counter, random hex. */
const ID_PATTERN = /^[0-9a-z]{10}-[0-9a-z]{4}-[0-9a-f]{8}$/;

let lastIdTime = 0;
let idSequence = 0;

/** A unique id whose plain string order is the order the messages arrived in. */
export function newMessageId(now = Date.now()): string {
  if (now <= lastIdTime) {
    now = lastIdTime;
    idSequence += 1;
  } else {
    lastIdTime = now;
    idSequence = 0;
  }
  return [
    now.toString(36).padStart(10, '0'),
    (idSequence % 36 ** 4).toString(36).padStart(4, '0'),
    randomBytes(4).toString('hex'),
  ].join('-');
}

function addressText(value: AddressObject | AddressObject[] | undefined): string {
  if (!value) return '';
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(', ');
}

function addressList(value: AddressObject | AddressObject[] | undefined): string[] {
  if (!value) return [];
  const out: string[] = [];
  const walk = (entries: AddressObject['value']): void => {
    for (const entry of entries) {
      if (entry.address) out.push(entry.address);
      if (entry.group) walk(entry.group);
    }
  };
  for (const obj of Array.isArray(value) ? value : [value]) walk(obj.value);
  return out;
}

function isAddressObject(value: unknown): value is AddressObject {
  return typeof value === 'object' && value !== null && 'text' in value && 'value' in value;
}

/** The raw text after "Name:" in a header line, unfolded. */
function rawHeaderValue(parsed: ParsedMail, key: string): string | undefined {
  const lines = parsed.headerLines.filter((h) => h.key === key);
  if (lines.length === 0) return undefined;
  return lines
    .map((h) => h.line.replace(/\r?\n[ \t]+/g, ' ').replace(/^[^:]*:\s*/, ''))
    .join('\n');
}

function headerToString(parsed: ParsedMail, key: string, value: HeaderValue): string {
  if (typeof value === 'string') return value;
  if (Array.isArray(value)) {
    // Repeated headers (Received, …): keep every occurrence, one per line.
    if (value.every((v) => typeof v === 'string')) return (value as string[]).join('\n');
    return rawHeaderValue(parsed, key) ?? JSON.stringify(value);
  }
  if (isAddressObject(value)) return value.text;
  // Dates and structured values (Content-Type with params, …): the text as it was sent.
  const raw = rawHeaderValue(parsed, key);
  if (raw !== undefined) return raw;
  if (value instanceof Date) return value.toISOString();
  return JSON.stringify(value);
}

function plainHeaders(parsed: ParsedMail): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of parsed.headers) {
    out[key.toLowerCase()] = headerToString(parsed, key.toLowerCase(), value);
  }
  return out;
}

function toStoredMessage(parsed: ParsedMail, session: SMTPServerSession): StoredMessage {
  const receivedAt = new Date();
  const envelope = session.envelope;
  return {
    id: newMessageId(receivedAt.getTime()),
    receivedAt: receivedAt.toISOString(),
    envelopeFrom: envelope.mailFrom ? envelope.mailFrom.address : null,
    envelopeTo: envelope.rcptTo.map((r) => r.address),
    from: addressText(parsed.from),
    to: addressText(parsed.to),
    subject: parsed.subject ?? '',
    text: parsed.text ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : '',
    headers: plainHeaders(parsed),
    attachments: parsed.attachments.map((a) => ({
      filename: a.filename ?? null,
      contentType: a.contentType,
      size: a.content.length,
      contentBase64: a.content.toString('base64'),
    })),
  };
}

/** Every address a message was meant for: envelope recipients (covers Bcc) plus To and Cc. */
function recipientsOf(message: StoredMessage, cc: string[]): string[] {
  return [...message.envelopeTo, ...cc];
}

class MessageStore {
  constructor(private readonly dir: string) {}

  async init(): Promise<void> {
    await fs.mkdir(this.dir, { recursive: true });
  }

  private file(id: string): string {
    return path.join(this.dir, `${id}.json`);
  }

  async save(message: StoredMessage & { recipients: string[] }): Promise<void> {
    const target = this.file(message.id);
    const temp = `${target}.${process.pid}.tmp`;
    await fs.writeFile(temp, JSON.stringify(message, null, 2));
    await fs.rename(temp, target);
  }

  private async ids(): Promise<string[]> {
    const names = await fs.readdir(this.dir).catch((err: NodeJS.ErrnoException) => {
      if (err.code === 'ENOENT') return [] as string[];
      throw err;
    });
    return names
      .filter((n) => n.endsWith('.json'))
      .map((n) => n.slice(0, -'.json'.length))
      .filter((id) => ID_PATTERN.test(id));
  }

  async get(id: string): Promise<(StoredMessage & { recipients?: string[] }) | null> {
    if (!ID_PATTERN.test(id)) return null;
    try {
      return JSON.parse(await fs.readFile(this.file(id), 'utf8'));
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw err;
    }
  }

  async list(to?: string): Promise<MessageSummary[]> {
    const ids = (await this.ids()).sort().reverse();
    const wanted = to?.trim().toLowerCase();
    const out: MessageSummary[] = [];
    for (const id of ids) {
      const m = await this.get(id);
      if (!m) continue;
      if (wanted) {
        const recipients = m.recipients ?? m.envelopeTo;
        if (!recipients.some((r) => r.toLowerCase() === wanted)) continue;
      }
      out.push({ id: m.id, receivedAt: m.receivedAt, from: m.from, to: m.to, subject: m.subject });
    }
    return out;
  }

  async clear(): Promise<void> {
    for (const id of await this.ids()) {
      await fs.rm(this.file(id), { force: true });
    }
  }
}

type SmtpError = Error & { responseCode?: number };

function smtpError(message: string, responseCode: number): SmtpError {
  const err: SmtpError = new Error(message);
  err.responseCode = responseCode;
  return err;
}

function sendJson(res: http.ServerResponse, status: number, body: unknown, extra: http.OutgoingHttpHeaders = {}): void {
  const payload = JSON.stringify(body);
  res.writeHead(status, {
    'content-type': 'application/json; charset=utf-8',
    'content-length': Buffer.byteLength(payload),
    'cache-control': 'no-store',
    ...extra,
  });
  res.end(payload);
}

function sendError(res: http.ServerResponse, status: number, message: string, extra?: http.OutgoingHttpHeaders): void {
  sendJson(res, status, { statusCode: status, message }, extra);
}

function createHttpHandler(store: MessageStore): http.RequestListener {
  return (req, res) => {
    const handle = async (): Promise<void> => {
      const url = new URL(req.url ?? '/', 'http://fake.invalid');
      const method = req.method ?? 'GET';
      const pathname = url.pathname.replace(/\/+$/, '') || '/';

      if (pathname === '/health') {
        if (method !== 'GET' && method !== 'HEAD') return sendError(res, 405, 'Method not allowed', { allow: 'GET' });
        return sendJson(res, 200, { status: 'ok' });
      }

      if (pathname === '/messages') {
        if (method === 'GET' || method === 'HEAD') {
          return sendJson(res, 200, await store.list(url.searchParams.get('to') ?? undefined));
        }
        if (method === 'DELETE') {
          await store.clear();
          res.writeHead(204);
          return void res.end();
        }
        return sendError(res, 405, 'Method not allowed', { allow: 'GET, DELETE' });
      }

      const match = /^\/messages\/([^/]+)$/.exec(pathname);
      if (match) {
        if (method !== 'GET' && method !== 'HEAD') return sendError(res, 405, 'Method not allowed', { allow: 'GET' });
        const message = await store.get(decodeURIComponent(match[1]));
        if (!message) return sendError(res, 404, 'No message with that id');
        const { recipients: _recipients, ...stored } = message;
        return sendJson(res, 200, stored);
      }

      return sendError(res, 404, 'Not found');
    };
    handle().catch((err: unknown) => {
      if (!res.headersSent) sendError(res, 500, err instanceof Error ? err.message : 'Internal error');
      else res.destroy();
    });
  };
}

function listen(server: http.Server | import('node:net').Server, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (err: Error): void => reject(err);
    server.once('error', onError);
    server.listen(port, host, () => {
      server.off('error', onError);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

export async function startSmtpFake(opts: SmtpFakeOptions): Promise<SmtpFakeHandle> {
  const host = opts.host ?? '127.0.0.1';
  const maxBytes = opts.maxMessageBytes ?? DEFAULT_MAX_MESSAGE_BYTES;
  const store = new MessageStore(opts.dataDir);
  await store.init();

  const smtp = new SMTPServer({
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    size: maxBytes,
    logger: false,
    banner: 'Selvage local mail fake',
    closeTimeout: 2000,
    onData(stream: SMTPServerDataStream, session: SMTPServerSession, callback: (err?: Error | null) => void) {
      const chunks: Buffer[] = [];
      let bytes = 0;
      stream.on('data', (chunk: Buffer) => {
        bytes += chunk.length;
        // Past the limit, keep draining the stream but stop holding the data.
        if (bytes <= maxBytes) chunks.push(chunk);
      });
      stream.on('error', (err) => callback(err));
      stream.on('end', () => {
        if (stream.sizeExceeded || bytes > maxBytes) {
          callback(smtpError(`Message too large: the limit is ${maxBytes} bytes`, 552));
          return;
        }
        simpleParser(Buffer.concat(chunks))
          .then(async (parsed) => {
            const message = toStoredMessage(parsed, session);
            const cc = addressList(parsed.cc);
            const recipients = [...new Set([...recipientsOf(message, cc), ...addressList(parsed.to)])];
            await store.save({ ...message, recipients });
            callback(null);
          })
          .catch((err: unknown) => {
            callback(smtpError(`Could not store the message: ${err instanceof Error ? err.message : String(err)}`, 451));
          });
      });
    },
  });
  // Connection-level problems (a client hanging up mid-command) must not bring the fake down.
  smtp.on('error', () => undefined);

  const web = http.createServer(createHttpHandler(store));

  const smtpPort = await listen(smtp.server, opts.smtpPort, host);
  let httpPort: number;
  try {
    httpPort = await listen(web, opts.httpPort, host);
  } catch (err) {
    await new Promise<void>((resolve) => smtp.close(() => resolve()));
    throw err;
  }

  let closing: Promise<void> | undefined;
  return {
    smtpPort,
    httpPort,
    close() {
      closing ??= Promise.all([
        new Promise<void>((resolve) => smtp.close(() => resolve())),
        new Promise<void>((resolve) => {
          web.close(() => resolve());
          web.closeAllConnections();
        }),
      ]).then(() => undefined);
      return closing;
    },
  };
}
