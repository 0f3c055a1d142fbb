// The receipt reading worker, its own process (npm start runs it): takes reading jobs from the PostgreSQL queue,
// and runs the cron clock of the mail alerts job and of the forgetting of expired account rows, and works those
// queues too.
import { MikroORM } from '@mikro-orm/postgresql';
import { loadConfig } from '../config';
import { ormConfig } from '../db/mikro-orm.config';
import { Receipt } from '../receipts/receipt.entity';
import { closeReaders } from '../receipts/reading/read-document';
import { readWithPageImages } from '../receipts/read-with-pages';
import { createObjectStore } from '../storage/object-store';
import { startAlertsWorker } from '../alerts/alerts.job';
import { startForgettingWorker } from '../auth/forget-expired.job';
import { createMailer } from '../mail/mailer';
import { READ_RECEIPT, startJobQueue, type JobQueue, type ReadReceiptJob } from './queue';
import { readQueuedReceipt, type ReadReceiptDeps } from './read-receipt.job';

/** Starts taking reading jobs; returns a function that stops. Also used by tests, in-process. */
export async function startReadingWorker(queue: JobQueue, deps: ReadReceiptDeps): Promise<() => Promise<void>> {
  const workId = await queue.boss.work<ReadReceiptJob>(READ_RECEIPT, { batchSize: 1, pollingIntervalSeconds: 0.5, includeMetadata: true }, async ([job]) => {
    const outcome = await readQueuedReceipt(deps, job.data.receiptId, job.retryCount >= job.retryLimit);
    console.log(`[worker] receipt ${job.data.receiptId}: ${outcome}`);
  });
  return () => queue.boss.offWork({ id: workId });
}

/** Receipts left queued by a crash between saving and queueing are queued again. */
async function requeueStranded(orm: MikroORM, queue: JobQueue): Promise<void> {
  const stranded = await orm.em.fork().find(Receipt, { state: { $in: ['queued', 'reading'] }, updatedAt: { $lt: new Date(Date.now() - 60_000) } });
  for (const receipt of stranded) await queue.readReceipt(receipt.id);
  if (stranded.length) console.log(`[worker] queued ${stranded.length} stranded receipt(s) again`);
}

if (require.main === module) {
  (async () => {
    const config = loadConfig();
    const orm = await MikroORM.init(ormConfig(config.db));
    const store = createObjectStore(config.storage);
    await store.ensureBucket();
    const queue = await startJobQueue(config.db, { supervise: true, schedule: true });
    await requeueStranded(orm, queue);
    const stop = await startReadingWorker(queue, { orm, store, read: readWithPageImages });
    const mailer = createMailer(config.smtp);
    await queue.scheduleCrons();
    const stopAlerts = await startAlertsWorker(queue, { orm, mailer, config });
    const stopForgetting = await startForgettingWorker(queue, orm);
    console.log('[worker] reading receipts from the queue; mail alerts every 15 minutes; expired sign-ups forgotten hourly');
    const shutdown = async () => {
      await stop();
      await stopAlerts();
      await stopForgetting();
      mailer.close();
      await queue.stop();
      await closeReaders();
      store.close();
      await orm.close();
      process.exit(0);
    };
    process.on('SIGINT', shutdown);
    process.on('SIGTERM', shutdown);
  })().catch((error) => {
    console.error('The reading worker failed to start:', error);
    process.exit(1);
  });
}
