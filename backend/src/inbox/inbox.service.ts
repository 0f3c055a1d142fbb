// A build's inbox address, its rotation (the old token is kept as retired, so mail to it is shown, not lost) and
// the mail it did not accept.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { InboxDto, MailRefusalDto } from '../../../shared/api/inbox';
import type { Build } from '../builds/build.entity';
import { inboxAddress, newInboxToken } from './inbox-token';
import { MailRefusal } from './mail-refusal.entity';
import { RetiredInboxToken } from './retired-inbox-token.entity';

/** The refused list shows the latest this many: enough to spot a pattern, never a page that grows without end. */
export const REFUSALS_SHOWN = 100;

export function inboxDto(build: Build, domain: string): InboxDto {
  return { address: inboxAddress(build.inboxToken, domain) };
}

export async function rotateInbox(em: EntityManager, build: Build): Promise<void> {
  em.create(RetiredInboxToken, { token: build.inboxToken, build });
  build.inboxToken = newInboxToken();
  await em.flush();
}

export async function listRefusals(em: EntityManager, build: Build): Promise<MailRefusalDto[]> {
  const refusals = await em.find(MailRefusal, { build }, { orderBy: { receivedAt: 'desc', id: 'asc' }, limit: REFUSALS_SHOWN });
  return refusals.map((refusal) => ({
    id: refusal.id,
    receivedAt: refusal.receivedAt.toISOString(),
    from: refusal.fromAddress,
    subject: refusal.subject,
    reason: refusal.reason,
    detail: refusal.detail,
  }));
}
