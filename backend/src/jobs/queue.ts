// The job queue, kept in PostgreSQL by pg-boss: no other server to run. Names and payloads of every job live here.
import PgBoss from 'pg-boss';
import type { AppConfig } from '../config';

export const READ_RECEIPT = 'read-receipt';

export interface ReadReceiptJob {
  receiptId: string;
}

export interface JobQueue {
  boss: PgBoss;
  readReceipt(receiptId: string): Promise<void>;
  stop(): Promise<void>;
}

export async function startJobQueue(db: AppConfig['db'], options: { supervise?: boolean } = {}): Promise<JobQueue> {
  const boss = new PgBoss({
    host: db.host,
    port: db.port,
    user: db.user,
    password: db.password,
    database: db.dbName,
    schema: 'pgboss',
    max: 4,
    supervise: options.supervise ?? false,
    schedule: false,
  });
  boss.on('error', (error) => console.error('[jobs]', error.message));
  await boss.start();
  // A reading that crashes or is killed is retried; the handler makes a retry replace, never add, lines.
  await boss.createQueue(READ_RECEIPT, { name: READ_RECEIPT, retryLimit: 3, retryDelay: 10, retryBackoff: true, expireInSeconds: 15 * 60 });
  return {
    boss,
    async readReceipt(receiptId) {
      await boss.send(READ_RECEIPT, { receiptId } satisfies ReadReceiptJob);
    },
    async stop() {
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
  };
}
