// The hourly forgetting of expired account rows against the real PostgreSQL: a sign-up whose link expired unused
// goes with its password hash, a fresh one stays; account-mail counts older than the hour go, recent ones stay.
import { forgetExpired } from '../../backend/src/auth/forget-expired.job';
import { PendingSignUp } from '../../backend/src/auth/pending-sign-up.entity';
import { uniqueEmail } from '../support/api-client';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

it('forgets sign-ups whose link expired and account-mail counts past their hour, and keeps the rest', async () => {
  const em = t.orm.em.fork();
  const pending = (email: string, expiresAt: Date) =>
    em.create(PendingSignUp, { email, displayName: 'Waiting', passwordHash: 'not-a-real-hash', tokenHash: `${email}`.padEnd(64, 'x').slice(0, 64), expiresAt });
  const expired = pending(uniqueEmail('expired-sign-up'), new Date(Date.now() - 60_000));
  const fresh = pending(uniqueEmail('fresh-sign-up'), new Date(Date.now() + 60 * 60_000));
  await em.flush();
  const counted = uniqueEmail('counted');
  await em.execute(`insert into account_mail_sent (email, kind, sent_at) values (?, 'password-reset', now() - interval '61 minutes'), (?, 'password-reset', now() - interval '5 minutes')`, [counted, counted]);

  const forgotten = await forgetExpired(t.orm.em.fork());
  expect(forgotten.pendingSignUps).toBeGreaterThanOrEqual(1);
  expect(forgotten.accountMailCounts).toBeGreaterThanOrEqual(1);
  const left = t.orm.em.fork();
  expect(await left.count(PendingSignUp, { id: expired.id })).toBe(0);
  expect(await left.count(PendingSignUp, { id: fresh.id })).toBe(1);
  const [{ count }] = await left.execute(`select count(*)::int as count from account_mail_sent where email = ? and sent_at > now() - interval '1 hour'`, [counted]);
  const [{ all }] = await left.execute(`select count(*)::int as "all" from account_mail_sent where email = ?`, [counted]);
  expect([count, all]).toEqual([1, 1]);
});
