// How much account mail one address gets: sign-up links, "someone tried to sign up with this address" notices and
// reset links together, at most ACCOUNT_MAILS_PER_HOUR in any hour, whoever asks and from wherever. The request
// limits count per client address, so a caller spreading requests over many addresses could otherwise fill one
// mailbox. Past the cap the answer stays the same (it never says whether mail went) and no mail is sent.
import type { EntityManager } from '@mikro-orm/postgresql';

/** Enough for a person who asks again a few times because the first mail is slow (common practice, from memory). */
export const ACCOUNT_MAILS_PER_HOUR = 5;

export type AccountMailKind = 'sign-up-link' | 'sign-up-known-address' | 'password-reset';

/**
 * Whether one more account mail may go to `email` now; when it may, it is counted. Askers for one address run one
 * after the other (a transaction-scoped advisory lock on the address), so two at once cannot both take the last one.
 */
export async function mayMailAccount(em: EntityManager, email: string, kind: AccountMailKind): Promise<boolean> {
  const address = email.toLowerCase();
  return em.transactional(async (tx) => {
    await tx.execute(`select pg_advisory_xact_lock(hashtext('account-mail:' || ?))`, [address]);
    // Counts older than the hour are left for the hourly forget-expired job (auth/forget-expired.job.ts).
    const [{ count }] = await tx.execute<{ count: number }[]>(
      `select count(*)::int as count from account_mail_sent where email = ? and sent_at > now() - interval '1 hour'`,
      [address],
    );
    if (count >= ACCOUNT_MAILS_PER_HOUR) {
      console.warn(`[mail] ${kind} mail held back: the address had ${count} account mails in the last hour`);
      return false;
    }
    await tx.execute(`insert into account_mail_sent (email, kind) values (?, ?)`, [address, kind]);
    return true;
  });
}
