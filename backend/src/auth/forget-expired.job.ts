// The hourly forgetting of expired account rows: sign-ups whose link expired unused (each holds a password hash) and
// the account-mail counts past their hour. The mail cap only reads the counts; sign-up clears expired sign-ups too.
import type { QueryResult } from '@mikro-orm/core';
import type { EntityManager, MikroORM } from '@mikro-orm/postgresql';
import { FORGET_EXPIRED, type JobQueue } from '../jobs/queue';

export interface Forgotten {
  pendingSignUps: number;
  accountMailCounts: number;
}

/** Deletes what has expired; counts what went. */
export async function forgetExpired(em: EntityManager): Promise<Forgotten> {
  const pendingSignUps = await em.execute<QueryResult>(`delete from pending_sign_up where expires_at <= now()`, [], 'run');
  const accountMailCounts = await em.execute<QueryResult>(`delete from account_mail_sent where sent_at <= now() - interval '1 hour'`, [], 'run');
  return { pendingSignUps: pendingSignUps.affectedRows, accountMailCounts: accountMailCounts.affectedRows };
}

/** Takes the forgetting jobs from the queue; returns a function that stops. */
export async function startForgettingWorker(queue: JobQueue, orm: MikroORM): Promise<() => Promise<void>> {
  const workId = await queue.boss.work(FORGET_EXPIRED, { batchSize: 1, pollingIntervalSeconds: 5 }, async () => {
    const forgotten = await forgetExpired(orm.em.fork());
    if (forgotten.pendingSignUps + forgotten.accountMailCounts) console.log(`[jobs] forgot expired account rows: ${JSON.stringify(forgotten)}`);
  });
  return () => queue.boss.offWork({ id: workId });
}
