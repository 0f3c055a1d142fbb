// The job queue on a database pg-boss has never seen, started by several processes at once as `npm start` does
// (the server and the worker): every one must come up with both queues, none may fail on a deadlock.
import pg from 'pg';
import { loadConfig } from '../../backend/src/config';
import { READ_RECEIPT, SEND_ALERTS, startJobQueue, type JobQueue } from '../../backend/src/jobs/queue';

jest.setTimeout(60_000);

const base = loadConfig({ ...process.env, PGDATABASE: process.env.PGDATABASE ?? 'tallyhood_test' }).db;
const fresh = { ...base, dbName: `${base.dbName}_queue_${process.pid}` };

async function admin(sql: string) {
  const client = new pg.Client({ host: base.host, port: base.port, user: base.user, password: base.password, database: 'postgres' });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

beforeAll(() => admin(`create database "${fresh.dbName}"`));
afterAll(() => admin(`drop database if exists "${fresh.dbName}" with (force)`));

it('starts four queues at once on a fresh database, each with both queues made once', async () => {
  const queues: JobQueue[] = await Promise.all([1, 2, 3, 4].map(() => startJobQueue(fresh)));
  try {
    for (const queue of queues) {
      expect((await queue.boss.getQueue(READ_RECEIPT))?.retryLimit).toBe(3);
      expect((await queue.boss.getQueue(SEND_ALERTS))?.policy).toBe('singleton');
    }
    expect((await queues[0].boss.getQueues()).map((queue) => queue.name).sort()).toEqual([READ_RECEIPT, SEND_ALERTS].sort());
  } finally {
    await Promise.all(queues.map((queue) => queue.stop()));
  }
});
