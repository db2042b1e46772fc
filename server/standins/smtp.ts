// The local SMTP stand-in: accepts mail on loopback (no TLS, no login needed), keeps every message as
// a JSON file under STANDIN_DATA_DIR/mail so it survives a restart, and serves a small inbox API over
// HTTP for tests and developers. `inboxClient()` is the typed way to read that API.
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import { randomUUID } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { SMTPServer } from 'smtp-server';
import PostalMime, { type Address, type Email } from 'postal-mime';
import type { StandIn } from './index';

export interface InboxSummary {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
}

export interface InboxMessage extends InboxSummary {
  text: string;
  html: string;
  /** Header names in lower case; repeated headers joined with ", ". */
  headers: Record<string, string>;
}

export interface SmtpStandInOptions {
  smtpPort: number;
  inboxPort: number;
  dataDir: string;
  host?: string;
}

export interface SmtpStandIn extends StandIn {
  smtpPort: number;
  inboxUrl: string;
}

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

function addressesOf(list: Address[] | undefined): string[] {
  return (list ?? []).flatMap((a) => (a.group ? a.group.map((m) => m.address) : [a.address ?? '']));
}

function formatAddress(a: Address | undefined): string {
  if (!a || a.group) return a?.name ?? '';
  return a.name ? `${a.name} <${a.address}>` : (a.address ?? '');
}

function summary(m: InboxMessage): InboxSummary {
  return { id: m.id, receivedAt: m.receivedAt, from: m.from, to: m.to, subject: m.subject };
}

/** Messages kept on disk, newest last; loaded once at start. */
class MailStore {
  private readonly messages: InboxMessage[] = [];
  constructor(private readonly dir: string) {
    mkdirSync(dir, { recursive: true });
    for (const f of readdirSync(dir).filter((n) => n.endsWith('.json'))) {
      try {
        this.messages.push(JSON.parse(readFileSync(join(dir, f), 'utf8')) as InboxMessage);
      } catch {
        /* a half-written file from a crash: skip it */
      }
    }
    this.messages.sort((a, b) => a.receivedAt.localeCompare(b.receivedAt) || a.id.localeCompare(b.id));
  }

  add(raw: Buffer, envelopeTo: string[], parsed: Email): InboxMessage {
    const headers: Record<string, string> = {};
    for (const h of parsed.headers) headers[h.key] = headers[h.key] ? `${headers[h.key]}, ${h.value}` : h.value;
    const to = addressesOf(parsed.to);
    const msg: InboxMessage = {
      // Sortable by arrival even within one millisecond.
      id: `${Date.now().toString(36)}-${randomUUID().slice(0, 8)}`,
      receivedAt: new Date().toISOString(),
      from: formatAddress(parsed.from),
      to: (to.length ? to : envelopeTo).map((a) => a.toLowerCase()),
      subject: parsed.subject ?? '',
      text: parsed.text ?? '',
      html: parsed.html ?? '',
      headers,
    };
    writeFileSync(join(this.dir, `${msg.id}.eml`), raw);
    writeFileSync(join(this.dir, `${msg.id}.json`), JSON.stringify(msg));
    this.messages.push(msg);
    return msg;
  }

  list(filter: { to?: string; subject?: string }): InboxMessage[] {
    const to = filter.to?.trim().toLowerCase();
    const subject = filter.subject?.toLowerCase();
    return this.messages.filter(
      (m) => (!to || m.to.includes(to)) && (!subject || m.subject.toLowerCase().includes(subject)),
    );
  }

  get(id: string): InboxMessage | undefined {
    return this.messages.find((m) => m.id === id);
  }

  remove(id?: string): number {
    const gone = id ? this.messages.filter((m) => m.id === id) : [...this.messages];
    for (const m of gone) {
      this.messages.splice(this.messages.indexOf(m), 1);
      for (const ext of ['json', 'eml']) rmSync(join(this.dir, `${m.id}.${ext}`), { force: true });
    }
    return gone.length;
  }
}

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function inboxPage(messages: InboxMessage[]): string {
  const rows = messages
    .slice()
    .reverse()
    .map(
      (m) =>
        `<tr><td>${escapeHtml(m.receivedAt.replace('T', ' ').slice(0, 19))}</td><td>${escapeHtml(m.to.join(', '))}</td>` +
        `<td><a href="/messages/${m.id}/html">${escapeHtml(m.subject || '(no subject)')}</a></td>` +
        `<td><a href="/messages/${m.id}">json</a> · <a href="/messages/${m.id}/text">text</a></td></tr>`,
    )
    .join('');
  return `<!doctype html><meta charset="utf-8"><title>Local inbox</title>
<style>body{font:15px/1.4 Barlow,Arial,sans-serif;margin:24px;color:#111b2e;background:#fcfaf6}
table{border-collapse:collapse}td,th{padding:4px 10px;border-bottom:1px solid #dad0bb;text-align:left}</style>
<h1>Local inbox (${messages.length})</h1><p>Everything the app sent through the local SMTP stand-in. Newest first.</p>
<table><tr><th>Received (UTC)</th><th>To</th><th>Subject</th><th></th></tr>${rows}</table>`;
}

function send(res: ServerResponse, status: number, body: unknown, type = 'application/json; charset=utf-8') {
  // No keep-alive: a client must not hold a socket to a stand-in that a test stops and starts again.
  res.writeHead(status, { 'Content-Type': type, 'Cache-Control': 'no-store', Connection: 'close' });
  res.end(typeof body === 'string' ? body : JSON.stringify(body));
}

function inboxHandler(store: MailStore) {
  return (req: IncomingMessage, res: ServerResponse) => {
    const url = new URL(req.url ?? '/', 'http://inbox');
    const parts = url.pathname.split('/').filter(Boolean);
    if (req.method === 'GET' && parts.length === 0) return send(res, 200, inboxPage(store.list({})), 'text/html');
    if (parts[0] !== 'messages') return send(res, 404, { error: 'not found' });
    const id = parts[1];
    if (req.method === 'DELETE') return send(res, 200, { removed: store.remove(id) });
    if (req.method !== 'GET') return send(res, 405, { error: 'method not allowed' });
    if (!id) {
      const items = store.list({
        to: url.searchParams.get('to') ?? undefined,
        subject: url.searchParams.get('subject') ?? undefined,
      });
      return send(res, 200, { items: items.map(summary), total: items.length });
    }
    const msg = store.get(id);
    if (!msg) return send(res, 404, { error: 'no such message' });
    // The HTML view carries no script and may show only what the message itself holds.
    if (parts[2] === 'html') return send(res, 200, msg.html, 'text/html; charset=utf-8');
    if (parts[2] === 'text') return send(res, 200, msg.text, 'text/plain; charset=utf-8');
    return send(res, 200, msg);
  };
}

interface Listenable {
  once(event: 'error', listener: (err: Error) => void): unknown;
  removeListener(event: 'error', listener: (err: Error) => void): unknown;
  listen(port: number, host: string, callback: () => void): unknown;
}

function listen(server: Listenable, port: number, host: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const onError = (err: Error) => reject(err);
    server.once('error', onError);
    server.listen(port, host, () => {
      server.removeListener('error', onError);
      resolve();
    });
  });
}

export async function startSmtpStandInAt(opts: SmtpStandInOptions): Promise<SmtpStandIn> {
  const host = opts.host ?? '127.0.0.1';
  const store = new MailStore(opts.dataDir);
  const smtp = new SMTPServer({
    secure: false,
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    size: MAX_MESSAGE_BYTES,
    banner: 'Rackturn local SMTP stand-in',
    logger: false,
    onAuth: (_auth, _session, cb) => cb(null, { user: 'local' }),
    onData(stream, session, cb) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        if (stream.sizeExceeded) return cb(Object.assign(new Error('Message too large'), { responseCode: 552 }));
        const raw = Buffer.concat(chunks);
        PostalMime.parse(raw)
          .then((parsed) => {
            store.add(
              raw,
              session.envelope.rcptTo.map((r) => r.address),
              parsed,
            );
            cb();
          })
          .catch((err: Error) => cb(err));
      });
    },
  });
  // Client-side failures (a dropped connection) are the client's business; the stand-in carries on.
  smtp.on('error', () => undefined);
  await listen(smtp, opts.smtpPort, host);
  const http = createServer(inboxHandler(store));
  try {
    await listen(http, opts.inboxPort, host);
  } catch (err) {
    await new Promise<void>((r) => smtp.close(() => r()));
    throw err;
  }
  return {
    name: `smtp (${host}:${opts.smtpPort}, inbox http://${host}:${opts.inboxPort})`,
    smtpPort: opts.smtpPort,
    inboxUrl: `http://${host}:${opts.inboxPort}`,
    async stop() {
      http.closeAllConnections();
      await Promise.all([
        new Promise<void>((r) => http.close(() => r())),
        new Promise<void>((r) => smtp.close(() => r())),
      ]);
    },
  };
}

/** The stand-in as `npm start` and `npm test` run it, on the ports their environment names. */
export async function startSmtpStandIn(env: NodeJS.ProcessEnv): Promise<StandIn> {
  const smtpPort = Number(env.SMTP_PORT ?? 4400);
  const inbox = new URL(env.MAIL_INBOX_URL ?? 'http://127.0.0.1:4401');
  const dataDir = join(env.STANDIN_DATA_DIR ?? join(process.cwd(), '.data', 'standins'), 'mail');
  return startSmtpStandInAt({ smtpPort, inboxPort: Number(inbox.port), dataDir, host: inbox.hostname });
}

/** Reads the stand-in's inbox API: what tests and scripts use to see the mail the app sent. */
export function inboxClient(baseUrl: string | undefined = process.env.MAIL_INBOX_URL) {
  if (!baseUrl) throw new Error('MAIL_INBOX_URL is not set: the local SMTP stand-in is not configured');
  const base = baseUrl.replace(/\/$/, '');
  const getJson = async <T>(path: string): Promise<T> => {
    const res = await fetch(`${base}${path}`);
    if (!res.ok) throw new Error(`inbox ${path}: ${res.status}`);
    return (await res.json()) as T;
  };
  const client = {
    async list(filter: { to?: string; subject?: string } = {}): Promise<InboxSummary[]> {
      const q = new URLSearchParams(Object.entries(filter).filter((e): e is [string, string] => Boolean(e[1])));
      return (await getJson<{ items: InboxSummary[] }>(`/messages?${q}`)).items;
    },
    get: (id: string) => getJson<InboxMessage>(`/messages/${encodeURIComponent(id)}`),
    /** Every full message to one address, oldest first. */
    async messagesTo(to: string, subject?: string): Promise<InboxMessage[]> {
      return Promise.all((await client.list({ to, subject })).map((m) => client.get(m.id)));
    },
    /** Waits until at least `count` messages to the address have arrived, and returns them. */
    async waitFor(to: string, opts: { count?: number; subject?: string; timeoutMs?: number } = {}) {
      const deadline = Date.now() + (opts.timeoutMs ?? 10_000);
      for (;;) {
        const found = await client.list({ to, subject: opts.subject });
        if (found.length >= (opts.count ?? 1)) return Promise.all(found.map((m) => client.get(m.id)));
        if (Date.now() > deadline)
          throw new Error(`no mail to ${to} within ${opts.timeoutMs ?? 10_000} ms (found ${found.length})`);
        await new Promise((r) => setTimeout(r, 100));
      }
    },
    async clear(): Promise<void> {
      await fetch(`${base}/messages`, { method: 'DELETE' });
    },
  };
  return client;
}

export type InboxClient = ReturnType<typeof inboxClient>;
