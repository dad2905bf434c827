import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';

/** A message caught by the fake SMTP server. */
export interface CaughtMail {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
}

export interface FakeSmtp {
  smtpPort: number;
  httpPort: number;
  messages: CaughtMail[];
  close(): Promise<void>;
}

const header = (raw: string, name: string) => {
  const m = raw.match(new RegExp(`^${name}:\\s*(.*(?:\\r?\\n[ \\t].*)*)`, 'im'));
  return m ? m[1].replace(/\r?\n[ \t]/g, ' ').trim() : '';
};

/** Decodes a quoted-printable body (nodemailer's default for text with long lines). */
const decodeQp = (s: string) =>
  Buffer.from(
    s.replace(/=\r?\n/g, '').replace(/=([0-9A-F]{2})/gi, (_m, h) => String.fromCharCode(parseInt(h, 16))),
    'latin1',
  ).toString('utf8');

function plainText(raw: string): string {
  const boundary = raw.match(/boundary="?([^";\r\n]+)"?/i)?.[1];
  let part = raw;
  if (boundary) {
    const parts = raw.split(`--${boundary}`);
    part = parts.find((p) => /content-type:\s*text\/plain/i.test(p)) ?? parts[1] ?? raw;
  }
  const split = part.search(/\r?\n\r?\n/);
  const head = part.slice(0, split);
  let body = part.slice(split).replace(/^\s+/, '');
  if (/content-transfer-encoding:\s*quoted-printable/i.test(head)) body = decodeQp(body);
  else if (/content-transfer-encoding:\s*base64/i.test(head)) body = Buffer.from(body, 'base64').toString('utf8');
  return body.trim();
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/**
 * A local SMTP server that keeps every message in memory, and an HTTP side that lists them:
 * `GET /` (a page for people), `GET /messages` (JSON), `DELETE /messages`.
 */
export async function startFakeSmtp(opts: { smtpPort?: number; httpPort?: number } = {}): Promise<FakeSmtp> {
  const messages: CaughtMail[] = [];
  let next = 1;
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    logger: false,
    onData(stream, session, done) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        messages.push({
          id: next++,
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: header(raw, 'Subject'),
          text: plainText(raw),
          receivedAt: new Date().toISOString(),
        });
        done();
      });
    },
  });
  await new Promise<void>((resolve) => smtp.listen(opts.smtpPort ?? 0, '127.0.0.1', resolve));
  const page = http.createServer((req, res) => {
    if (req.url?.startsWith('/messages')) {
      if (req.method === 'DELETE') {
        messages.length = 0;
        res.writeHead(204).end();
        return;
      }
      res.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify(messages));
      return;
    }
    const rows = [...messages]
      .reverse()
      .map(
        (m) =>
          `<article><h2>${escapeHtml(m.subject)}</h2><p><b>To:</b> ${escapeHtml(m.to.join(', '))} · ${m.receivedAt}</p><pre>${escapeHtml(m.text)}</pre></article>`,
      )
      .join('');
    res
      .writeHead(200, { 'content-type': 'text/html; charset=utf-8' })
      .end(
        `<!doctype html><meta charset="utf-8"><title>Warpmeter outbox (local)</title><style>body{font:14px system-ui;margin:2rem;max-width:60rem}pre{white-space:pre-wrap;background:#f4f1ea;padding:1rem}</style><h1>Mail caught on this machine</h1><p>${messages.length} message(s). Nothing here left the machine.</p>${rows}`,
      );
  });
  await new Promise<void>((resolve) => page.listen(opts.httpPort ?? 0, '127.0.0.1', resolve));
  return {
    smtpPort: ((smtp as unknown as { server: http.Server }).server.address() as AddressInfo).port,
    httpPort: (page.address() as AddressInfo).port,
    messages,
    close: async () => {
      await new Promise<void>((r) => smtp.close(() => r()));
      await new Promise<void>((r) => page.close(() => r()));
    },
  };
}
