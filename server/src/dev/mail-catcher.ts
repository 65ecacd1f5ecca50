/**
 * The local SMTP catcher: an SMTP server on loopback (smtp-server) that keeps
 * every message in memory and shows them in the browser, parsed with
 * mailparser. Development, demo and tests only: refuses NODE_ENV=production.
 */
import express from 'express';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type ParsedMail } from 'mailparser';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';

export interface CaughtMessage {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  attachments: { filename: string; contentType: string; size: number }[];
}

export interface RunningMailCatcher {
  smtpPort: number;
  webPort: number;
  webUrl: string;
  messages: CaughtMessage[];
  close(): Promise<void>;
}

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export async function startMailCatcher(opts: { smtpPort: number; webPort: number; host?: string; keep?: number }): Promise<RunningMailCatcher> {
  if (process.env.NODE_ENV === 'production') {
    throw new Error('The local SMTP catcher is a development stand-in and refuses to run with NODE_ENV=production. Set SMTP_URL to your mail relay.');
  }
  const host = opts.host ?? '127.0.0.1';
  const keep = opts.keep ?? 500;
  const messages: CaughtMessage[] = [];
  let nextId = 1;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail: ParsedMail) => {
          const addr = (a: ParsedMail['from']) => (a ? (Array.isArray(a) ? a.map((x) => x.text).join(', ') : a.text) : '');
          messages.unshift({
            id: nextId++,
            receivedAt: new Date().toISOString(),
            from: addr(mail.from),
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: mail.subject ?? '(no subject)',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
            attachments: mail.attachments.map((a) => ({ filename: a.filename ?? 'attachment', contentType: a.contentType, size: a.size })),
          });
          messages.splice(keep);
          callback();
        })
        .catch((err) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(opts.smtpPort, host, () => resolve());
  });
  const smtpPort = (smtp.server.address() as AddressInfo).port;

  const web = express();
  web.get('/api/messages', (_req, res) => res.json({ messages }));
  web.get('/messages/:id', (req, res) => {
    const m = messages.find((x) => x.id === Number(req.params.id));
    if (!m) return res.status(404).send('No such message');
    // The message body is shown in a sandboxed frame so that its HTML cannot run scripts here.
    res.type('html').send(`<!doctype html><meta charset="utf-8"><title>${esc(m.subject)}</title>
<body style="font:15px system-ui,sans-serif;margin:1.5rem;color:#1d2433"><p><a href="/">← all messages</a></p>
<h1 style="font-size:1.2rem">${esc(m.subject)}</h1><p>From ${esc(m.from)} to ${esc(m.to.join(', '))}, ${esc(m.receivedAt)}</p>
${m.attachments.length ? `<p>Attachments: ${m.attachments.map((a) => `${esc(a.filename)} (${esc(a.contentType)}, ${a.size} bytes)`).join('; ')}</p>` : ''}
${m.html ? `<iframe sandbox style="width:100%;height:70vh;border:1px solid #ccc" srcdoc="${esc(m.html)}"></iframe>` : `<pre style="white-space:pre-wrap">${esc(m.text)}</pre>`}</body>`);
  });
  web.get('/', (_req, res) => {
    res.type('html').send(`<!doctype html><meta charset="utf-8"><title>Caught mail</title>
<body style="font:15px system-ui,sans-serif;margin:1.5rem;color:#1d2433"><h1 style="font-size:1.2rem">Mail caught by the local SMTP stand-in (${messages.length})</h1>
<p>Nothing here leaves this machine.</p>
<table style="border-collapse:collapse"><thead><tr><th align="left">Received</th><th align="left">To</th><th align="left">Subject</th></tr></thead><tbody>
${messages.map((m) => `<tr><td style="padding:.2rem .8rem .2rem 0">${esc(m.receivedAt)}</td><td style="padding-right:.8rem">${esc(m.to.join(', '))}</td><td><a href="/messages/${m.id}">${esc(m.subject)}</a></td></tr>`).join('')}
</tbody></table></body>`);
  });
  const webServer: Server = await new Promise((resolve) => {
    const s = web.listen(opts.webPort, host, () => resolve(s));
  });
  const webPort = (webServer.address() as AddressInfo).port;
  return {
    smtpPort,
    webPort,
    webUrl: `http://${host}:${webPort}`,
    messages,
    async close() {
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
      await new Promise<void>((resolve) => webServer.close(() => resolve()));
    },
  };
}
