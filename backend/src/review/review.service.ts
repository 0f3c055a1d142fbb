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
import { commentMail } from '../mail/templates';
import type { Receipt } from '../receipts/receipt.entity';
import { Comment } from './comment.entity';
import { Part } from '../parts/part.entity';
import { VehicleSystem } from '../systems/vehicle-system.entity';

function commentDto(comment: Comment): CommentDto {
  return { id: comment.id, author: comment.author.displayName, body: comment.body, createdAt: comment.createdAt.toISOString() };
}

async function addComment(em: EntityManager, mailer: Mailer, config: AppConfig, receipt: Receipt, author: User, body: string): Promise<Comment> {
  const comment = em.create(Comment, { build: receipt.build, receipt, author, body });
  await em.flush();
  await em.populate(receipt, ['uploadedBy', 'vendor']);
  // A person who has left the build (or was removed) hears nothing more of it.
  const uploaderStillMember = (await em.count(Membership, { build: receipt.build, user: receipt.uploadedBy })) > 0;
  if (receipt.uploadedBy.id !== author.id && uploaderStillMember) {
    await afterCommit(em, () =>
      mailer.send(
        commentMail({
          to: receipt.uploadedBy.email,
          author: author.displayName,
          receiptLabel: `${receipt.vendor?.name ?? 'a receipt'}${receipt.purchaseDate ? ` of ${receipt.purchaseDate}` : ''}`,
          body,
          link: `${config.appUrl}/builds/${receipt.build.id}/receipts/${receipt.id}`,
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
  if (input.comment) await addComment(em, deps.mailer, deps.config, receipt, reviewer, input.comment);
}

export async function comment(em: EntityManager, deps: { mailer: Mailer; config: AppConfig }, receipt: Receipt, author: User, body: string): Promise<CommentDto> {
  return commentDto(await addComment(em, deps.mailer, deps.config, receipt, author, body));
}

export async function listComments(em: EntityManager, receipt: Receipt): Promise<CommentDto[]> {
  const comments = await em.find(Comment, { receipt }, { populate: ['author'], orderBy: { createdAt: 'asc' } });
  return comments.map(commentDto);
}

/** Ids of parts and systems in a snapshot, including the lines of a split or merge. */
function referencedIds(snapshot: Record<string, unknown> | null, into: { parts: Set<string>; systems: Set<string> }): void {
  if (!snapshot) return;
  if (typeof snapshot['partId'] === 'string') into.parts.add(snapshot['partId']);
  if (typeof snapshot['systemId'] === 'string') into.systems.add(snapshot['systemId']);
  for (const nested of [snapshot['shares'], snapshot['lines']]) {
    if (Array.isArray(nested)) for (const item of nested) if (item && typeof item === 'object') referencedIds(item as Record<string, unknown>, into);
  }
}

export async function auditTrail(em: EntityManager, receipt: Receipt): Promise<AuditEventDto[]> {
  const events = await em.find(AuditEvent, { receiptId: receipt.id }, { populate: ['user'], orderBy: { createdAt: 'asc' } });
  // The trail names the part and system a line went to, as they are called today (a deleted part says so).
  const ids = { parts: new Set<string>(), systems: new Set<string>() };
  for (const event of events) {
    referencedIds(event.before, ids);
    referencedIds(event.after, ids);
  }
  const names = new Map<string, string>();
  for (const part of await em.find(Part, { id: [...ids.parts], build: receipt.build })) names.set(part.id, part.description);
  for (const system of await em.find(VehicleSystem, { id: [...ids.systems], build: receipt.build })) names.set(system.id, system.name);
  for (const id of ids.parts) if (!names.has(id)) names.set(id, 'a part since deleted');
  return events.map((event) => {
    const own = { parts: new Set<string>(), systems: new Set<string>() };
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
      names: Object.fromEntries([...own.parts, ...own.systems].filter((id) => names.has(id)).map((id) => [id, names.get(id)!])),
    };
  });
}
