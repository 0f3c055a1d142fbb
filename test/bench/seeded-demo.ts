// A throw-away database of a bench section's own with the demo build seeded into it, and a document store beside it.
import { MikroORM } from '@mikro-orm/postgresql';
import type http from 'node:http';
import type { AddressInfo } from 'node:net';
import { createApp } from '../../backend/src/app';
import type { JobQueue } from '../../backend/src/jobs/queue';
import { startFakeMailServer, type FakeMailServer } from '../../backend/src/mail/fake-mail-server';
import { createMailer } from '../../backend/src/mail/mailer';
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { Build } from '../../backend/src/builds/build.entity';
import { loadConfig, type AppConfig } from '../../backend/src/config';
import { ormConfig } from '../../backend/src/db/mikro-orm.config';
import { DEMO_BUILD } from '../../backend/src/seed/demo-scenario';
import { seedDemo } from '../../backend/src/seed/seed-demo';
import { startFakeS3 } from '../../backend/src/storage/fake-s3-server';
import { createObjectStore, type ObjectStore } from '../../backend/src/storage/object-store';
import { recreateDatabase } from './bench-db';

export interface SeededDemo {
  orm: MikroORM;
  store: ObjectStore;
  config: AppConfig;
  build: Build;
}

/** Runs `work` on a fresh database named `dbName` holding the demo build; everything is closed afterwards. */
export async function withSeededDemo<T>(dbName: string, work: (demo: SeededDemo) => Promise<T>): Promise<T> {
  const base = loadConfig({ ...process.env, NODE_ENV: 'development' });
  await recreateDatabase(base.db, dbName);
  const db = { ...base.db, dbName };
  const orm = await MikroORM.init(ormConfig(db));
  const s3Folder = await mkdtemp(path.join(os.tmpdir(), `${dbName}-s3-`));
  const s3 = await startFakeS3({ directory: s3Folder });
  const store = createObjectStore({ ...base.storage, endpoint: s3.endpoint });
  try {
    await orm.getMigrator().up();
    await store.ensureBucket();
    const config = { ...base, db, clientDist: '/nonexistent' };
    await seedDemo({ orm, store, config });
    const build = await orm.em.fork().findOneOrFail(Build, { name: DEMO_BUILD.name });
    return await work({ orm, store, config, build });
  } finally {
    store.close();
    await s3.close();
    await rm(s3Folder, { recursive: true, force: true });
    await orm.close(true);
  }
}

/**
 * Runs `work` with the app listening on a loopback port in this process, on a fresh database holding the demo build,
 * with a fake mail server to take what it sends. No job runs: the seed reads its receipts itself.
 */
export async function withDemoApp<T>(dbName: string, work: (app: { port: number; build: Build; mail: FakeMailServer; orm: MikroORM }) => Promise<T>): Promise<T> {
  return withSeededDemo(dbName, async ({ orm, store, config, build }) => {
    const mail = await startFakeMailServer({ quiet: true });
    const mailer = createMailer({ ...config.smtp, port: mail.smtpPort });
    const queue = { readReceipt: async () => undefined, scheduleCrons: async () => undefined, stop: async () => undefined } as unknown as JobQueue;
    const running = createApp({ orm, config, mailer, store, queue });
    let server: http.Server | undefined;
    try {
      server = await new Promise<http.Server>((resolve) => {
        const listening = running.app.listen(0, '127.0.0.1', () => resolve(listening));
      });
      return await work({ port: (server.address() as AddressInfo).port, build, mail, orm });
    } finally {
      if (server) await new Promise((resolve) => server!.close(resolve));
      await running.close();
      mailer.close();
      await mail.close();
    }
  });
}
