// Capturing mail server: accepts every message on loopback, keeps it, and shows it over HTTP.
import { appendFile, mkdir, readFile, writeFile } from 'node:fs/promises';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import express from 'express';
import { simpleParser } from 'mailparser';
import type { AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export type CapturedMessage = {
  id: number;
  messageId: string | null;
  from: string | null;
  /** Envelope recipients (RCPT TO), so Bcc'd addresses are captured too; lower-cased. */
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  date: string;
  receivedAt: string;
  headers: Record<string, string>;
  size: number;
};
export type SmtpFakeOptions = { smtpPort?: number; httpPort?: number; host?: string; directory?: string };
export type SmtpFake = {
  smtpPort: number;
  httpPort: number;
  httpUrl: string;
  stop(): Promise<void>;
  /** Newest first, the same order as GET /api/messages. */
  messages(): CapturedMessage[];
  clear(): void;
};

// Headers worth seeing when checking a mail; the rest stay in the (not kept) raw message.
const KEPT_HEADERS = [
  'from',
  'to',
  'cc',
  'reply-to',
  'date',
  'message-id',
  'in-reply-to',
  'references',
  'list-unsubscribe',
  'list-unsubscribe-post',
  'list-id',
  'auto-submitted',
  'content-type',
];
const MAX_SIZE = 25 * 1024 * 1024;

/** Starts the SMTP listener and its HTTP inbox; both on loopback, ports 0 allowed. */
export async function startSmtpFake(opts: SmtpFakeOptions = {}): Promise<SmtpFake> {
  const host = opts.host ?? '127.0.0.1';
  const file = opts.directory ? path.join(opts.directory, 'messages.jsonl') : null;
  if (opts.directory) await mkdir(opts.directory, { recursive: true });
  let store: CapturedMessage[] = file ? await loadMessages(file) : [];
  let nextId = store.reduce((max, m) => Math.max(max, m.id), 0) + 1;
  // One chain for all file writes so appends and truncation never interleave.
  let writes: Promise<void> = Promise.resolve();
  const persist = (job: () => Promise<void>): Promise<void> => (writes = writes.then(job, job));

  const clear = (): void => {
    store = [];
    if (file) void persist(() => writeFile(file, ''));
  };

  const smtp = new SMTPServer({
    authOptional: true,
    // With STARTTLS offered, nodemailer upgrades and fails on smtp-server's built-in certificate.
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: MAX_SIZE,
    closeTimeout: 500,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        if (stream.sizeExceeded) return callback(Object.assign(new Error('Message too large'), { responseCode: 552 }));
        const raw = Buffer.concat(chunks);
        const recipients = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
        simpleParser(raw)
          .then(async (mail) => {
            const message: CapturedMessage = {
              id: nextId++,
              messageId: mail.messageId ?? null,
              from: firstAddress(mail.from) ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : null),
              to: recipients,
              subject: mail.subject ?? '',
              text: mail.text ?? '',
              html: typeof mail.html === 'string' ? mail.html : null,
              date: (mail.date ?? new Date()).toISOString(),
              receivedAt: new Date().toISOString(),
              headers: keptHeaders(mail.headerLines),
              size: raw.length,
            };
            store.push(message);
            // Acknowledge only once it is on disk, so a 250 means "kept".
            if (file) await persist(() => appendFile(file, JSON.stringify(message) + '\n'));
            callback();
          })
          .catch((err: unknown) => callback(err instanceof Error ? err : new Error(String(err))));
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.server.once('error', reject);
    smtp.listen(opts.smtpPort ?? 0, host, () => resolve());
  });
  const smtpPort = (smtp.server.address() as AddressInfo).port;

  const newestFirst = (): CapturedMessage[] => [...store].sort((a, b) => b.id - a.id);
  const app = express();
  app.disable('x-powered-by');
  app.use((_req, res, next) => {
    // Mail bodies are untrusted: the inbox never loads scripts or remote images.
    res.set('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'");
    next();
  });
  app.get('/api/messages', (req, res) => {
    const to = typeof req.query.to === 'string' ? req.query.to.toLowerCase() : null;
    res.json(newestFirst().filter((m) => !to || m.to.includes(to)));
  });
  app.get('/api/messages/:id', (req, res) => {
    const found = store.find((m) => String(m.id) === req.params.id);
    if (!found) return void res.status(404).json({ error: { code: 'not_found', message: 'No such message' } });
    res.json(found);
  });
  app.delete('/api/messages', (_req, res) => {
    clear();
    res.status(204).end();
  });
  app.get('/', (_req, res) => void res.type('html').send(renderInbox(newestFirst())));
  app.get('/messages/:id', (req, res) => {
    const found = store.find((m) => String(m.id) === req.params.id);
    if (!found) return void res.status(404).type('text').send('No such message');
    res.type('html').send(renderMessage(found));
  });
  const http = await listen(app, opts.httpPort ?? 0, host);
  const httpPort = (http.address() as AddressInfo).port;

  let stopped = false;
  return {
    smtpPort,
    httpPort,
    httpUrl: `http://${host.includes(':') ? `[${host}]` : host}:${httpPort}`,
    messages: newestFirst,
    clear,
    async stop() {
      if (stopped) return;
      stopped = true;
      http.closeAllConnections();
      await Promise.all([
        new Promise<void>((resolve) => http.close(() => resolve())),
        new Promise<void>((resolve) => smtp.close(() => resolve())),
      ]);
      await writes;
    },
  };
}

/** Options for running the fake from the environment (shared with fakes/all.ts). */
export function smtpFakeOptionsFromEnv(env: NodeJS.ProcessEnv = process.env): SmtpFakeOptions {
  return {
    smtpPort: portFromEnv(env.SMTP_FAKE_PORT, 2525, 'SMTP_FAKE_PORT'),
    httpPort: portFromEnv(env.SMTP_FAKE_HTTP_PORT, 8025, 'SMTP_FAKE_HTTP_PORT'),
    directory: path.resolve(env.SMTP_FAKE_DIR ?? '.data/smtp'),
  };
}

// A torn last line (crash mid-append) is skipped rather than losing the whole inbox.
async function loadMessages(file: string): Promise<CapturedMessage[]> {
  const content = await readFile(file, 'utf8').catch((err: NodeJS.ErrnoException) => {
    if (err.code === 'ENOENT') return '';
    throw err;
  });
  const messages: CapturedMessage[] = [];
  for (const line of content.split('\n')) {
    if (!line.trim()) continue;
    try {
      messages.push(JSON.parse(line) as CapturedMessage);
    } catch {
      // skip the unreadable line
    }
  }
  return messages;
}

function firstAddress(from: AddressObject | undefined): string | null {
  return from?.value[0]?.address?.toLowerCase() ?? null;
}

function keptHeaders(lines: ReadonlyArray<{ key: string; line: string }>): Record<string, string> {
  const kept: Record<string, string> = {};
  for (const { key, line } of lines) {
    if (!KEPT_HEADERS.includes(key)) continue;
    const value = line
      .slice(line.indexOf(':') + 1)
      .replace(/\r?\n[ \t]+/g, ' ')
      .trim();
    kept[key] = kept[key] ? `${kept[key]}, ${value}` : value;
  }
  return kept;
}

function listen(app: express.Express, port: number, host: string): Promise<Server> {
  return new Promise((resolve, reject) => {
    const server = app.listen(port, host, (err?: Error) => (err ? reject(err) : resolve(server)));
  });
}

// The inbox pages: plain server-rendered HTML, every mail-derived value escaped.
const PAGE_STYLE = `body{font:15px/1.5 system-ui,sans-serif;margin:0;background:#f4f1ea;color:#1d1d1b}
main{max-width:60rem;margin:0 auto;padding:1.5rem}h1{font-size:1.4rem}table{width:100%;border-collapse:collapse;background:#fff}
th,td{text-align:left;padding:.5rem .75rem;border-bottom:1px solid #ddd6c8;vertical-align:top}th{background:#e9e3d6}
a{color:#7a2e0e}pre{white-space:pre-wrap;background:#fff;padding:1rem;border:1px solid #ddd6c8}dt{font-weight:600}dd{margin:0 0 .5rem}`;

function page(title: string, body: string): string {
  return (
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title>` +
    `<meta name="viewport" content="width=device-width,initial-scale=1"><style>${PAGE_STYLE}</style></head><body><main>${body}</main></body></html>`
  );
}

function renderInbox(messages: CapturedMessage[]): string {
  const rows = messages.map(
    (m) =>
      `<tr><td><a href="/messages/${m.id}">${escapeHtml(m.subject || '(no subject)')}</a></td>` +
      `<td>${escapeHtml(m.to.join(', '))}</td><td><time datetime="${escapeHtml(m.date)}">${escapeHtml(m.date.replace('T', ' ').slice(0, 19))}</time></td></tr>`,
  );
  const table = rows.length
    ? `<table><thead><tr><th scope="col">Subject</th><th scope="col">To</th><th scope="col">Date (UTC)</th></tr></thead><tbody>${rows.join('')}</tbody></table>`
    : '<p>No messages yet. Mail sent to this fake shows up here.</p>';
  return page('Captured mail', `<h1>Captured mail (${messages.length})</h1>${table}`);
}

function renderMessage(m: CapturedMessage): string {
  const meta = [
    ['From', m.from ?? ''],
    ['To', m.to.join(', ')],
    ['Date', m.date],
    ['Message-ID', m.messageId ?? ''],
  ]
    .map(([k, v]) => `<dt>${escapeHtml(k ?? '')}</dt><dd>${escapeHtml(v ?? '')}</dd>`)
    .join('');
  // The HTML part is shown as source, never rendered: it could load remote content.
  const html = m.html ? `<details><summary>HTML part (source)</summary><pre>${escapeHtml(m.html)}</pre></details>` : '';
  return page(
    m.subject || 'Message',
    `<p><a href="/">&larr; Inbox</a></p><h1>${escapeHtml(m.subject || '(no subject)')}</h1>` +
      `<dl>${meta}</dl><pre>${escapeHtml(m.text || '(no text part)')}</pre>${html}`,
  );
}

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function portFromEnv(value: string | undefined, fallback: number, name: string): number {
  if (value === undefined || value === '') return fallback;
  const port = Number(value);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`${name} must be a port number, got "${value}"`);
  return port;
}

const isMain = process.argv[1] !== undefined && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href;
if (isMain) {
  const options = smtpFakeOptionsFromEnv();
  const fake = await startSmtpFake(options);
  console.log(`smtp fake: smtp://127.0.0.1:${fake.smtpPort}, inbox ${fake.httpUrl} (data in ${options.directory})`);
  const shutdown = () => void fake.stop().then(() => process.exit(0));
  process.once('SIGINT', shutdown);
  process.once('SIGTERM', shutdown);
}
