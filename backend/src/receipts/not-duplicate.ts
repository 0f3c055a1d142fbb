// "Not a duplicate": someone who vouches for the books (the owner or the reviewer) says two likely duplicates are two
// purchases. Crew, who upload and check receipts, cannot clear the warning on their own: a second pair of eyes decides.
import type { EntityManager } from '@mikro-orm/postgresql';
import { recordAudit } from '../audit/audit';
import type { AppConfig } from '../config';
import { afterCommit } from '../http/request-transaction';
import type { Mailer } from '../mail/mailer';
import { notDuplicateMail } from '../mail/templates';
import { receiptLabel, stillMember } from '../review/review.service';
import type { User } from '../auth/user.entity';
import { ValidationFailed } from '../http/errors';
import { NotDuplicate } from './not-duplicate.entity';
import { findDuplicates } from './receipt-dto';
import type { Receipt } from './receipt.entity';

export const NOT_DUPLICATE_ROLES = ['owner', 'reviewer'] as const;

export async function markNotDuplicate(em: EntityManager, deps: { mailer: Mailer; config: AppConfig }, receipt: Receipt, other: Receipt, user: User, reason: string): Promise<void> {
  const duplicates = await findDuplicates(em, receipt.build.id, [receipt.id]);
  if (!duplicates.get(receipt.id)!.includes(other.id)) {
    throw new ValidationFailed({ otherReceiptId: 'That receipt is not a likely duplicate of this one.' });
  }
  const [first, second] = receipt.id < other.id ? [receipt, other] : [other, receipt];
  em.create(NotDuplicate, { build: receipt.build, first, second, markedBy: user, reason });
  // Each receipt's own trail says which other receipt it was told apart from, and why.
  for (const [self, partner] of [[receipt, other], [other, receipt]] as const) {
    recordAudit(em, { build: receipt.build, user, entity: 'receipt', entityId: self.id, receiptId: self.id, action: 'not_duplicate', after: { otherReceiptId: partner.id, reason } });
  }
  await em.flush();
  // Whoever uploaded either receipt (once, and not the one who marked it) learns the warning is gone, and why.
  await em.populate([receipt, other], ['uploadedBy', 'vendor']);
  const told = new Set<string>([user.id]);
  for (const self of [receipt, other]) {
    const uploader = self.uploadedBy;
    if (told.has(uploader.id) || !(await stillMember(em, self, uploader))) continue;
    told.add(uploader.id);
    const mail = notDuplicateMail({ to: uploader.email, author: user.displayName, receiptLabel: receiptLabel(self), reason, link: `${deps.config.appUrl}/builds/${self.build.id}/receipts/${self.id}` });
    await afterCommit(em, () => deps.mailer.send(mail));
  }
}
