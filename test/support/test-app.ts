// Starts the real app for a test file: the test database (made fresh by npm test), a fake SMTP server, a port.
import { MikroORM } from '@mikro-orm/postgresql';
import { createServer, type Server } from 'node:http';
import type { Express, Request, Response } from 'express';
import { createApp } from '../../backend/src/app';
import { receiveMail } from '../../backend/src/inbox/receive-mail';
import { loadConfig } from '../../backend/src/config';
import { ormConfig } from '../../backend/src/db/mikro-orm.config';
import { createMailer, type Mailer } from '../../backend/src/mail/mailer';
import { startFakeMailServer, type FakeMailServer } from '../../backend/src/mail/fake-mail-server';
import { startJobQueue, type JobQueue } from '../../backend/src/jobs/queue';
import { startFakeS3, type FakeS3 } from '../../backend/src/storage/fake-s3-server';
import { createObjectStore, type ObjectStore } from '../../backend/src/storage/object-store';
import { rememberMailOf } from './caught-mail';
import os from 'node:os';
import path from 'node:path';

/** A request that means to get a 5xx answer (a test of that answer) carries this header, so the file does not fail. */
export const DELIBERATE_5XX_HEADER = 'x-test-expects-server-error';
/** Enough of an answer's body to say what went wrong. */
const BODY_SHOWN = 600;

/**
 * The app as the tests reach it (through supertest or the listening port), noting every 5xx answer that was not
 * asked for: `close()` then fails the file, naming each request and what it answered.
 */
export function recordingServerErrors(app: Express, unexpected: string[]): Express {
  const recording = (req: Request, res: Response) => {
    if (req.headers[DELIBERATE_5XX_HEADER]) return app(req, res);
    const method = req.method;
    const url = req.url;
    let body = '';
    const end = res.end.bind(res) as (...args: unknown[]) => Response;
    res.end = ((...args: unknown[]) => {
      const [chunk] = args;
      if (res.statusCode >= 500 && (typeof chunk === 'string' || Buffer.isBuffer(chunk))) body = chunk.toString().slice(0, BODY_SHOWN);
      return end(...args);
    }) as Response['end'];
    res.on('finish', () => {
      if (res.statusCode >= 500) unexpected.push(`${method} ${url} answered ${res.statusCode}: ${body || '(no body)'}`);
    });
    return app(req, res);
  };
  return Object.assign(recording, app) as unknown as Express;
}

export interface TestApp {
  app: Express;
  url: string;
  orm: MikroORM;
  mail: FakeMailServer;
  /** The app's own mailer: a test may hold its sends back to see what waits for them. */
  mailer: Mailer;
  store: ObjectStore;
  queue: JobQueue;
  close(): Promise<void>;
}

/**
 * `reading: true` queues uploaded receipts for reading as the app does; otherwise the test app's queue takes no
 * reading jobs, so a test file's own workers never pick up (and move on) the receipts another file forces into a
 * state. Files that do not read start their receipts through `filedReceipt`.
 */
export async function startTestApp(options: { serveClient?: boolean; clientDist?: string; reading?: boolean } = {}): Promise<TestApp> {
  const mail = await startFakeMailServer({ quiet: true });
  const base = loadConfig({ ...process.env, PGDATABASE: process.env.PGDATABASE ?? 'tallyhood_test', PORT: '0' });
  const orm = await MikroORM.init(ormConfig(base.db));
  const mailer = createMailer({ ...base.smtp, port: mail.smtpPort });
  // One folder for every test file of a run: they share the database, so the queue's jobs may be taken by
  // another file's worker, which must then find the documents too.
  const s3Folder = path.join(os.tmpdir(), `tallyhood-test-s3-${base.db.dbName}`);
  const s3: FakeS3 = await startFakeS3({ directory: s3Folder });
  const store = createObjectStore({ ...base.storage, endpoint: s3.endpoint });
  await store.ensureBucket();
  const realQueue = await startJobQueue(base.db);
  const queue: JobQueue = options.reading ? realQueue : { ...realQueue, readReceipt: async () => undefined };
  // The URL (and so the links in mail) is only known once the server listens.
  const config = { ...base, smtp: { ...base.smtp, port: mail.smtpPort }, clientDist: options.clientDist ?? (options.serveClient ? base.clientDist : '/nonexistent') };
  const holder: { server?: Server } = {};
  const running = createApp({ orm, config, mailer, store, queue });
  const unexpectedServerErrors: string[] = [];
  const app = recordingServerErrors(running.app, unexpectedServerErrors);
  rememberMailOf(app, mail);
  await new Promise<void>((resolve) => {
    holder.server = createServer(app).listen(0, '127.0.0.1', () => resolve());
  });
  const port = (holder.server!.address() as { port: number }).port;
  config.appUrl = `http://127.0.0.1:${port}`;
  // Mail to the receipts domain reaches the builds' inboxes as it does under npm start, through the one seam.
  mail.receiveFor(config.inbox.domain, async (raw, recipients) => {
    await receiveMail({ orm, store, queue, mailer, config }, raw, { recipients });
  });
  return {
    app,
    url: config.appUrl,
    orm,
    mail,
    mailer,
    store,
    queue,
    async close() {
      await new Promise<void>((resolve) => holder.server!.close(() => resolve()));
      await running.close();
      mailer.close();
      await mail.close();
      await queue.stop();
      store.close();
      await s3.close();
      await orm.close(true);
      if (unexpectedServerErrors.length > 0) {
        throw new Error(`${unexpectedServerErrors.length} answer(s) of 5xx that no test asked for (mark a deliberate one with the ${DELIBERATE_5XX_HEADER} header):\n${unexpectedServerErrors.join('\n')}`);
      }
    },
  };
}
