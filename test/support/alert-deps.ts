// What sendDueAlerts needs in a test: the test app's database, a mailer to its fake SMTP server and its own address.
import type { AlertDeps } from '../../backend/src/alerts/alerts.service';
import { loadConfig } from '../../backend/src/config';
import { createMailer } from '../../backend/src/mail/mailer';
import type { TestApp } from './test-app';

export function alertDepsFor(t: TestApp): { deps: AlertDeps; close: () => void } {
  const mailer = createMailer({ ...loadConfig().smtp, port: t.mail.smtpPort });
  const base = loadConfig({ ...process.env, PGDATABASE: process.env.PGDATABASE ?? 'tallyhood_test' });
  return { deps: { orm: t.orm, mailer, config: { ...base, appUrl: t.url } }, close: () => mailer.close() };
}
