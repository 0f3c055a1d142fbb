// The job queue, kept in PostgreSQL by pg-boss: no other server to run. Names and payloads of every job live here.
import PgBoss from 'pg-boss';
import type { AppConfig } from '../config';

export const READ_RECEIPT = 'read-receipt';
/** Mail alerts: due events found and mailed once each (backend/src/alerts). */
export const SEND_ALERTS = 'send-alerts';
/** Every 15 minutes, in UTC: often enough for a 7-day warning, rare enough to cost nothing. */
export const SEND_ALERTS_CRON = '*/15 * * * *';
/** Expired account rows forgotten (backend/src/auth/forget-expired.job.ts). */
export const FORGET_EXPIRED = 'forget-expired';
/** Hourly, in UTC, off the quarter hours the alerts take. */
export const FORGET_EXPIRED_CRON = '7 * * * *';

export interface ReadReceiptJob {
  receiptId: string;
}

export interface JobQueue {
  boss: PgBoss;
  readReceipt(receiptId: string): Promise<void>;
  /**
   * Puts the alerts job and the forgetting of expired account rows on pg-boss's cron; the clock runs in the process
   * started with `schedule: true`.
   */
  scheduleCrons(): Promise<void>;
  stop(): Promise<void>;
}

/**
 * Creates a queue unless it exists. The server and the worker start together on a fresh database, and pg-boss's
 * create_queue from two processes at once can deadlock (seen on a first `npm start`): PostgreSQL aborts one, which
 * then finds the queue made by the other, or tries again.
 */
async function ensureQueue(boss: PgBoss, name: string, options: Omit<PgBoss.Queue, 'name'>): Promise<void> {
  for (let attempt = 1; ; attempt += 1) {
    if (await boss.getQueue(name)) return;
    try {
      await boss.createQueue(name, { name, ...options });
      return;
    } catch (error) {
      const deadlock = (error as { code?: string }).code === '40P01';
      if (!deadlock || attempt >= 5) throw error;
      await new Promise((resolve) => setTimeout(resolve, 50 + Math.random() * 200));
    }
  }
}

export async function startJobQueue(db: AppConfig['db'], options: { supervise?: boolean; schedule?: boolean } = {}): Promise<JobQueue> {
  const boss = new PgBoss({
    host: db.host,
    port: db.port,
    user: db.user,
    password: db.password,
    database: db.dbName,
    schema: 'pgboss',
    max: 4,
    supervise: options.supervise ?? false,
    // Only the worker runs the cron clock; pg-boss keeps one clock across processes anyway.
    schedule: options.schedule ?? false,
  });
  boss.on('error', (error) => console.error('[jobs]', error.message));
  await boss.start();
  // A reading that crashes or is killed is retried; the handler makes a retry replace, never add, lines.
  await ensureQueue(boss, READ_RECEIPT, { retryLimit: 3, retryDelay: 10, retryBackoff: true, expireInSeconds: 15 * 60 });
  // One alerts run at a time: a second one would find nothing new to send, so it is not worth queueing.
  await ensureQueue(boss, SEND_ALERTS, { policy: 'singleton', retryLimit: 2, retryDelay: 60, expireInSeconds: 10 * 60 });
  await ensureQueue(boss, FORGET_EXPIRED, { policy: 'singleton', retryLimit: 2, retryDelay: 60, expireInSeconds: 10 * 60 });
  return {
    boss,
    async readReceipt(receiptId) {
      await boss.send(READ_RECEIPT, { receiptId } satisfies ReadReceiptJob);
    },
    async scheduleCrons() {
      await boss.schedule(SEND_ALERTS, SEND_ALERTS_CRON, {}, { tz: 'UTC' });
      await boss.schedule(FORGET_EXPIRED, FORGET_EXPIRED_CRON, {}, { tz: 'UTC' });
    },
    async stop() {
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
  };
}
