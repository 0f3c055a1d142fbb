// A local fake SMTP server that catches every mail, with a small page listing them; for development and tests. Mail
// for the receipts domain is also handed on (receiveFor): to receiveMail in tests, to the app's webhook under npm start.
import { createServer, type Server } from 'node:http';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import { loadConfig } from '../config';

export interface CaughtMail {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  receivedAt: string;
}

/** Takes a raw message for its envelope recipients in the receipts domain; a throw is answered as a failed delivery. */
export type InboundDelivery = (raw: Buffer, recipients: string[]) => Promise<void>;

export interface FakeMailServer {
  smtpPort: number;
  httpPort: number | null;
  messages: CaughtMail[];
  /** Resolves with the first mail (already caught or arriving) that matches. */
  waitFor(match: (mail: CaughtMail) => boolean, timeoutMs?: number): Promise<CaughtMail>;
  /** From now on, mail to addresses `@domain` is delivered through `deliver` before the sender gets its answer. */
  receiveFor(domain: string, deliver: InboundDelivery): void;
  close(): Promise<void>;
}

function addresses(value: unknown): string[] {
  const list = Array.isArray(value) ? value : value ? [value] : [];
  return list.flatMap((entry: { value?: { address?: string }[] }) => (entry.value ?? []).map((a) => (a.address ?? '').toLowerCase()));
}

export async function startFakeMailServer(options: { smtpPort?: number; httpPort?: number | null; quiet?: boolean } = {}): Promise<FakeMailServer> {
  const messages: CaughtMail[] = [];
  const waiters: { match: (mail: CaughtMail) => boolean; resolve: (mail: CaughtMail) => void }[] = [];
  let inbound: { domain: string; deliver: InboundDelivery } | null = null;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    // The upload's limit on ten files of 20 MB, with room for base64 (4/3).
    size: 300 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      new Promise<Buffer>((resolve, reject) => {
        stream.once('end', () => {
          const tooLarge = (stream as typeof stream & { sizeExceeded?: boolean }).sizeExceeded;
          if (tooLarge) reject(Object.assign(new Error('The message is too large.'), { responseCode: 552 }));
          else resolve(Buffer.concat(chunks));
        });
        stream.once('error', reject);
      })
        .then(async (raw) => {
          const target = inbound;
          const recipients = session.envelope.rcptTo.map((rcpt) => rcpt.address).filter((address) => target && address.toLowerCase().endsWith(`@${target.domain}`));
          if (target && recipients.length) await target.deliver(raw, recipients);
          return simpleParser(raw);
        })
        .then((parsed) => {
          const mail: CaughtMail = {
            id: messages.length + 1,
            from: addresses(parsed.from)[0] ?? '',
            to: addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
            receivedAt: new Date().toISOString(),
          };
          messages.push(mail);
          if (!options.quiet) console.log(`[mail] to ${mail.to.join(', ')}: ${mail.subject}\n${mail.text}`);
          for (const waiter of [...waiters]) {
            if (waiter.match(mail)) {
              waiters.splice(waiters.indexOf(waiter), 1);
              waiter.resolve(mail);
            }
          }
          callback();
        })
        .catch(callback);
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(options.smtpPort ?? 0, '127.0.0.1', () => resolve());
  });
  const smtpPort = (smtp.server.address() as { port: number }).port;

  let http: Server | null = null;
  if (options.httpPort !== null && options.httpPort !== undefined) {
    http = createServer((req, res) => {
      if (req.url?.startsWith('/messages.json')) {
        res.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify(messages));
        return;
      }
      const escape = (s: string) => s.replace(/[&<>]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;' })[c]!);
      const rows = [...messages]
        .reverse()
        .map((m) => `<article><h2>${escape(m.subject)}</h2><p>To ${escape(m.to.join(', '))} at ${m.receivedAt}</p><pre>${escape(m.text)}</pre></article>`)
        .join('<hr>');
      res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
      res.end(`<!doctype html><title>Caught mail</title><h1>Caught mail (${messages.length})</h1>${rows || '<p>No mail yet.</p>'}`);
    });
    await new Promise<void>((resolve, reject) => {
      http!.once('error', reject);
      http!.listen(options.httpPort ?? 0, '127.0.0.1', () => resolve());
    });
  }

  return {
    smtpPort,
    httpPort: http ? (http.address() as { port: number }).port : null,
    messages,
    waitFor(match, timeoutMs = 10_000) {
      const found = messages.find(match);
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const waiter = { match, resolve: (mail: CaughtMail) => (clearTimeout(timer), resolve(mail)) };
        const timer = setTimeout(() => {
          waiters.splice(waiters.indexOf(waiter), 1);
          reject(new Error(`No matching mail within ${timeoutMs} ms; caught: ${messages.map((m) => m.subject).join(' | ') || 'none'}`));
        }, timeoutMs);
        waiters.push(waiter);
      });
    },
    receiveFor(domain, deliver) {
      inbound = { domain: domain.toLowerCase(), deliver };
    },
    async close() {
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
      if (http) await new Promise<void>((resolve) => http!.close(() => resolve()));
    },
  };
}

if (require.main === module) {
  const smtpPort = Number.parseInt(process.env.SMTP_PORT ?? '2525', 10);
  const httpPort = Number.parseInt(process.env.MAIL_VIEW_PORT ?? '2580', 10);
  startFakeMailServer({ smtpPort, httpPort })
    .then((server) => {
      console.log(`Fake SMTP on 127.0.0.1:${server.smtpPort}; caught mail at http://127.0.0.1:${server.httpPort}/`);
      const { appUrl, inbox } = loadConfig();
      if (!inbox.webhookSecret) return;
      // As an inbound-mail service would: the message goes to the app's webhook, which hands it to receiveMail.
      server.receiveFor(inbox.domain, async (raw, recipients) => {
        const answer = await fetch(`${appUrl}/api/inbound-mail`, {
          method: 'POST',
          headers: { authorization: `Bearer ${inbox.webhookSecret}`, 'content-type': 'message/rfc822', 'x-envelope-to': recipients.join(', ') },
          body: raw,
        });
        if (!answer.ok) throw new Error(`The app did not take the message (${answer.status}).`);
      });
      console.log(`Mail to any address @${inbox.domain} goes to the builds' inboxes.`);
    })
    .catch((error) => {
      console.error(`The fake mail server could not start: ${error.message}`);
      process.exit(1);
    });
}
