// Request schemas and response types of the partner's review: verdicts, comments and the audit trail.
import { z } from 'zod';

export const reviewRequest = z
  .object({
    verdict: z.enum(['approved', 'questioned'], { error: 'Choose approved or questioned.' }),
    comment: z.string().trim().max(2000, 'A comment is at most 2000 characters.').default(''),
    version: z.number({ error: 'Send the version you last saw.' }).int().min(1),
  })
  .strict()
  .refine((value) => value.verdict !== 'questioned' || value.comment.length > 0, { path: ['comment'], message: 'Say what the question is.' });
export type ReviewRequest = z.input<typeof reviewRequest>;

export const commentRequest = z.object({ body: z.string({ error: 'Write a comment.' }).trim().min(1, 'Write a comment.').max(2000, 'A comment is at most 2000 characters.') }).strict();
export type CommentRequest = z.input<typeof commentRequest>;

export interface CommentDto {
  id: string;
  author: string;
  body: string;
  createdAt: string;
}

export interface AuditEventDto {
  id: string;
  who: string;
  at: string;
  entity: string;
  action: string;
  before: Record<string, unknown> | null;
  after: Record<string, unknown> | null;
  /** Names of the parts and systems the snapshots refer to by id, as they are called now. */
  names: Record<string, string>;
}

/** Marks a likely duplicate as a separate purchase; the reason goes into both receipts' audit trails. */
export const notDuplicateRequest = z
  .object({
    otherReceiptId: z.uuid({ error: 'Choose the other receipt of the pair.' }),
    reason: z.string({ error: 'Say why these are two purchases.' }).trim().min(1, 'Say why these are two purchases.').max(500, 'A reason is at most 500 characters.'),
  })
  .strict();
export type NotDuplicateRequest = z.input<typeof notDuplicateRequest>;
