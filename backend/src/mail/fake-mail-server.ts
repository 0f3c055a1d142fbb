// A local fake SMTP server that catches every mail, with a small page listing them; for development and tests.
import { createServer, type Server } from 'node:http';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

export interface CaughtMail {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  receivedAt: string;
}

export interface FakeMailServer {
  smtpPort: number;
  httpPort: number | null;
  messages: CaughtMail[];
  /** Resolves with the first mail (already caught or arriving) that matches. */
  waitFor(match: (mail: CaughtMail) => boolean, timeoutMs?: number): Promise<CaughtMail>;
  close(): Promise<void>;
}

function addresses(value: unknown): string[] {
  const list = Array.isArray(value) ? value : value ? [value] : [];
  return list.flatMap((entry: { value?: { address?: string }[] }) => (entry.value ?? []).map((a) => (a.address ?? '').toLowerCase()));
}

export async function startFakeMailServer(options: { smtpPort?: number; httpPort?: number | null; quiet?: boolean } = {}): Promise<FakeMailServer> {
  const messages: CaughtMail[] = [];
  const waiters: { match: (mail: CaughtMail) => boolean; resolve: (mail: CaughtMail) => void }[] = [];

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
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
    .then((server) => console.log(`Fake SMTP on 127.0.0.1:${server.smtpPort}; caught mail at http://127.0.0.1:${server.httpPort}/`))
    .catch((error) => {
      console.error(`The fake mail server could not start: ${error.message}`);
      process.exit(1);
    });
}
