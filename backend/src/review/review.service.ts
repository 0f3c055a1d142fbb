// The partner's review: approve or question a filed receipt, comment on it (its uploader is told by mail), and read
// its audit trail.
import { afterCommit } from '../http/request-transaction';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { AuditEventDto, CommentDto } from '../../../shared/api/review';
import { AuditEvent } from '../audit/audit-event.entity';
import { recordAudit } from '../audit/audit';
import type { User } from '../auth/user.entity';
import type { AppConfig } from '../config';
import { StaleVersion, ValidationFailed } from '../http/errors';
import { Membership } from '../builds/membership.entity';
import type { Mailer } from '../mail/mailer';
import { answerMail, approvedMail, commentMail } from '../mail/templates';
import type { BuildRole } from '../../../shared/enums';
import { Receipt } from '../receipts/receipt.entity';
import { Comment } from './comment.entity';
import { Part } from '../parts/part.entity';
import { VehicleSystem } from '../systems/vehicle-system.entity';

function commentDto(comment: Comment): CommentDto {
  return { id: comment.id, author: comment.author.displayName, body: comment.body, createdAt: comment.createdAt.toISOString() };
}

export const receiptLabel = (receipt: Receipt) => `${receipt.vendor?.name ?? 'a receipt'}${receipt.purchaseDate ? ` of ${receipt.purchaseDate}` : ''}`;

/** A person who has left the build (or was removed) hears nothing more of it. */
export async function stillMember(em: EntityManager, receipt: Receipt, user: User): Promise<boolean> {
  return (await em.count(Membership, { build: receipt.build, user })) > 0;
}

/**
 * A comment by the owner or crew on a questioned receipt answers the question: the receipt becomes "answered" and goes
 * back to the reviewer's queue, and the reviewer who asked is mailed the answer. The asker's own follow-up answers nothing.
 */
async function answerIfQuestioned(em: EntityManager, deps: { mailer: Mailer; config: AppConfig }, receipt: Receipt, author: User, role: BuildRole, body: string): Promise<User | null> {
  if (receipt.reviewState !== 'questioned' || role === 'reviewer' || receipt.reviewedBy?.id === author.id) return null;
  receipt.reviewState = 'answered';
  recordAudit(em, { build: receipt.build, user: author, entity: 'receipt', entityId: receipt.id, receiptId: receipt.id, action: 'answer', before: { reviewState: 'questioned' }, after: { reviewState: 'answered' } });
  await em.flush();
  const asker = receipt.reviewedBy;
  if (!asker) return null;
  await em.populate(receipt, ['reviewedBy', 'vendor']);
  if (!(await stillMember(em, receipt, asker))) return null;
  const mail = answerMail({
    to: asker.email,
    author: author.displayName,
    receiptLabel: receiptLabel(receipt),
    question: receipt.reviewComment,
    body,
    link: `${deps.config.appUrl}/builds/${receipt.build.id}/review`,
  });
  await afterCommit(em, () => deps.mailer.send(mail));
  return asker;
}

async function addComment(em: EntityManager, deps: { mailer: Mailer; config: AppConfig }, receipt: Receipt, author: User, role: BuildRole, body: string): Promise<Comment> {
  const comment = em.create(Comment, { build: receipt.build, receipt, author, body });
  await em.flush();
  await em.populate(receipt, ['uploadedBy', 'vendor']);
  const answered = await answerIfQuestioned(em, deps, receipt, author, role, body);
  // The uploader hears of every comment but their own; one who was just mailed the answer is not mailed it twice.
  if (receipt.uploadedBy.id !== author.id && receipt.uploadedBy.id !== answered?.id && (await stillMember(em, receipt, receipt.uploadedBy))) {
    await afterCommit(em, () =>
      deps.mailer.send(
        commentMail({
          to: receipt.uploadedBy.email,
          author: author.displayName,
          receiptLabel: receiptLabel(receipt),
          body,
          link: `${deps.config.appUrl}/builds/${receipt.build.id}/receipts/${receipt.id}`,
        }),
      ),
    );
  }
  return comment;
}

export async function review(
  em: EntityManager,
  deps: { mailer: Mailer; config: AppConfig },
  receipt: Receipt,
  reviewer: User,
  input: { verdict: 'approved' | 'questioned'; comment: string; version: number },
): Promise<void> {
  if (receipt.state !== 'filed') throw new ValidationFailed({ verdict: 'Only a filed receipt can be reviewed.' });
  if (receipt.version !== input.version) throw new StaleVersion('This receipt');
  const before = { reviewState: receipt.reviewState };
  receipt.reviewState = input.verdict;
  receipt.reviewComment = input.comment;
  receipt.reviewedBy = reviewer;
  receipt.reviewedAt = new Date();
  recordAudit(em, { build: receipt.build, user: reviewer, entity: 'receipt', entityId: receipt.id, receiptId: receipt.id, action: 'review', before, after: { reviewState: input.verdict } });
  await em.flush();
  if (input.comment) await addComment(em, deps, receipt, reviewer, 'reviewer', input.comment);
  else if (input.verdict === 'approved') await mailApproval(em, deps, receipt, reviewer);
}

/** An approval without words is still news to the uploader (an approval with words reaches them as a comment). */
async function mailApproval(em: EntityManager, deps: { mailer: Mailer; config: AppConfig }, receipt: Receipt, reviewer: User): Promise<void> {
  await em.populate(receipt, ['uploadedBy', 'vendor']);
  if (receipt.uploadedBy.id === reviewer.id || !(await stillMember(em, receipt, receipt.uploadedBy))) return;
  const mail = approvedMail({ to: receipt.uploadedBy.email, reviewer: reviewer.displayName, receiptLabel: receiptLabel(receipt), link: `${deps.config.appUrl}/builds/${receipt.build.id}/receipts/${receipt.id}` });
  await afterCommit(em, () => deps.mailer.send(mail));
}

export async function comment(em: EntityManager, deps: { mailer: Mailer; config: AppConfig }, receipt: Receipt, author: User, role: BuildRole, body: string): Promise<CommentDto> {
  return commentDto(await addComment(em, deps, receipt, author, role, body));
}

export async function listComments(em: EntityManager, receipt: Receipt): Promise<CommentDto[]> {
  const comments = await em.find(Comment, { receipt }, { populate: ['author'], orderBy: { createdAt: 'asc' } });
  return comments.map(commentDto);
}

/** Ids of parts and systems in a snapshot, including the lines of a split or merge. */
function referencedIds(snapshot: Record<string, unknown> | null, into: { parts: Set<string>; systems: Set<string>; receipts?: Set<string> }): void {
  if (!snapshot) return;
  if (typeof snapshot['otherReceiptId'] === 'string') into.receipts?.add(snapshot['otherReceiptId']);
  if (typeof snapshot['partId'] === 'string') into.parts.add(snapshot['partId']);
  if (typeof snapshot['systemId'] === 'string') into.systems.add(snapshot['systemId']);
  for (const nested of [snapshot['shares'], snapshot['lines']]) {
    if (Array.isArray(nested)) for (const item of nested) if (item && typeof item === 'object') referencedIds(item as Record<string, unknown>, into);
  }
}

export async function auditTrail(em: EntityManager, receipt: Receipt): Promise<AuditEventDto[]> {
  const events = await em.find(AuditEvent, { receiptId: receipt.id }, { populate: ['user'], orderBy: { createdAt: 'asc' } });
  // The trail names the part and system a line went to, as they are called today (a deleted part says so).
  const ids = { parts: new Set<string>(), systems: new Set<string>(), receipts: new Set<string>() };
  for (const event of events) {
    referencedIds(event.before, ids);
    referencedIds(event.after, ids);
  }
  const names = new Map<string, string>();
  for (const part of await em.find(Part, { id: [...ids.parts], build: receipt.build })) names.set(part.id, part.description);
  for (const system of await em.find(VehicleSystem, { id: [...ids.systems], build: receipt.build })) names.set(system.id, system.name);
  for (const id of ids.parts) if (!names.has(id)) names.set(id, 'a part since deleted');
  const others = await em.find(Receipt, { id: [...ids.receipts], build: receipt.build }, { populate: ['vendor'] });
  for (const other of others) names.set(other.id, receiptLabel(other));
  return events.map((event) => {
    const own = { parts: new Set<string>(), systems: new Set<string>(), receipts: new Set<string>() };
    referencedIds(event.before, own);
    referencedIds(event.after, own);
    return {
      id: event.id,
      who: event.user.displayName,
      at: event.createdAt.toISOString(),
      entity: event.entity,
      action: event.action,
      before: event.before,
      after: event.after,
      names: Object.fromEntries([...own.parts, ...own.systems, ...own.receipts].filter((id) => names.has(id)).map((id) => [id, names.get(id)!])),
    };
  });
}
