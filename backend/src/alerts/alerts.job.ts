// The scheduled alerts job: pg-boss runs it on its cron (every 15 minutes); it only calls sendDueAlerts.
import type { JobQueue } from '../jobs/queue';
import { SEND_ALERTS } from '../jobs/queue';
import { sendDueAlerts, type AlertDeps } from './alerts.service';

export { sendDueAlerts };

/** Takes alert jobs from the queue; returns a function that stops. */
export async function startAlertsWorker(queue: JobQueue, deps: AlertDeps): Promise<() => Promise<void>> {
  const workId = await queue.boss.work(SEND_ALERTS, { batchSize: 1, pollingIntervalSeconds: 5 }, async () => {
    const sent = await sendDueAlerts(deps, new Date());
    const total = Object.values(sent).reduce((count, n) => count + n, 0);
    if (total) console.log(`[alerts] sent ${total} mail(s): ${JSON.stringify(sent)}`);
  });
  return () => queue.boss.offWork({ id: workId });
}
