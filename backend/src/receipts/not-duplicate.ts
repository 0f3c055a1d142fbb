// "Not a duplicate": someone who vouches for the books (the owner or the reviewer) says two likely duplicates are two
// purchases. Crew, who upload and check receipts, cannot clear the warning on their own: a second pair of eyes decides.
import type { EntityManager } from '@mikro-orm/postgresql';
import { recordAudit } from '../audit/audit';
import type { User } from '../auth/user.entity';
import { ValidationFailed } from '../http/errors';
import { NotDuplicate } from './not-duplicate.entity';
import { findDuplicates } from './receipt-dto';
import type { Receipt } from './receipt.entity';

export const NOT_DUPLICATE_ROLES = ['owner', 'reviewer'] as const;

export async function markNotDuplicate(em: EntityManager, receipt: Receipt, other: Receipt, user: User, reason: string): Promise<void> {
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
}
