// The job queue on a database pg-boss has never seen, started by several processes at once as `npm start` does
// (the server and the worker): every one must come up with every queue, none may fail on a deadlock.
import pg from 'pg';
import { loadConfig } from '../../backend/src/config';
import { FORGET_EXPIRED, FORGET_EXPIRED_CRON, READ_RECEIPT, SEND_ALERTS, SEND_ALERTS_CRON, startJobQueue, type JobQueue } from '../../backend/src/jobs/queue';

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

it('starts four queues at once on a fresh database, each with every queue made once, and puts both crons on the clock', async () => {
  const queues: JobQueue[] = await Promise.all([1, 2, 3, 4].map(() => startJobQueue(fresh)));
  try {
    for (const queue of queues) {
      expect((await queue.boss.getQueue(READ_RECEIPT))?.retryLimit).toBe(3);
      expect((await queue.boss.getQueue(SEND_ALERTS))?.policy).toBe('singleton');
      expect((await queue.boss.getQueue(FORGET_EXPIRED))?.policy).toBe('singleton');
    }
    expect((await queues[0].boss.getQueues()).map((queue) => queue.name).sort()).toEqual([READ_RECEIPT, SEND_ALERTS, FORGET_EXPIRED].sort());
    await queues[0].scheduleCrons();
    const schedules = await queues[0].boss.getSchedules();
    expect(schedules.map((schedule) => [schedule.name, schedule.cron, schedule.options?.tz]).sort()).toEqual(
      [
        [FORGET_EXPIRED, FORGET_EXPIRED_CRON, 'UTC'],
        [SEND_ALERTS, SEND_ALERTS_CRON, 'UTC'],
      ].sort(),
    );
  } finally {
    await Promise.all(queues.map((queue) => queue.stop()));
  }
});
