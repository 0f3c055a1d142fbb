// Review of a build's receipts: the queue, verdicts (reviewer or owner), comments (any member), "not a duplicate"
// (owner or reviewer), the audit trail.
import { Router, type Response } from 'express';
import { commentRequest, notDuplicateRequest, reviewRequest } from '../../../shared/api/review';
import type { AppConfig } from '../config';
import { ANY_MEMBER, buildRole, em, isUuid, membershipOf } from '../http/build-access';
import { NotFound } from '../http/errors';
import { validBody } from '../http/validate';
import type { Mailer } from '../mail/mailer';
import { markNotDuplicate, NOT_DUPLICATE_ROLES } from '../receipts/not-duplicate';
import { receiptDto } from '../receipts/receipt-dto';
import { findReceipt, listReceipts } from '../receipts/receipts.service';
import { auditTrail, comment, listComments, review } from './review.service';

/** Mounted under /api/builds/:buildId. */
export function reviewRoutes(deps: { mailer: Mailer; config: AppConfig }): Router {
  const router = Router({ mergeParams: true });
  const receiptOf = (res: Response, receiptId: unknown) => {
    if (!isUuid(receiptId)) throw new NotFound('That receipt');
    return findReceipt(em(), membershipOf(res).build, receiptId);
  };

  router.get('/review-queue', buildRole(...ANY_MEMBER), async (_req, res) => {
    // Not reviewed yet, or answered since it was questioned: both wait for the reviewer.
    const filed = await listReceipts(em(), membershipOf(res).build, { state: 'filed' });
    res.json({ receipts: filed.filter((r) => r.reviewState === 'none' || r.reviewState === 'answered') });
  });

  router.post('/receipts/:receiptId/review', buildRole('owner', 'reviewer'), validBody(reviewRequest), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    await review(em(), deps, receipt, req.user!, req.body);
    res.json({ reviewState: receipt.reviewState, reviewComment: receipt.reviewComment, version: receipt.version });
  });

  router.get('/receipts/:receiptId/comments', buildRole(...ANY_MEMBER), async (req, res) => {
    res.json({ comments: await listComments(em(), await receiptOf(res, req.params.receiptId)) });
  });

  router.post('/receipts/:receiptId/comments', buildRole(...ANY_MEMBER), validBody(commentRequest), async (req, res) => {
    res.status(201).json(await comment(em(), deps, await receiptOf(res, req.params.receiptId), req.user!, membershipOf(res).role, req.body.body));
  });

  router.post('/receipts/:receiptId/not-duplicate', buildRole(...NOT_DUPLICATE_ROLES), validBody(notDuplicateRequest), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    const other = await receiptOf(res, req.body.otherReceiptId);
    await markNotDuplicate(em(), deps, receipt, other, req.user!, req.body.reason);
    const membership = membershipOf(res);
    em().clear();
    res.json(await receiptDto(em(), await findReceipt(em(), membership.build, receipt.id), membership.role));
  });

  router.get('/receipts/:receiptId/audit', buildRole(...ANY_MEMBER), async (req, res) => {
    res.json({ events: await auditTrail(em(), await receiptOf(res, req.params.receiptId)) });
  });

  return router;
}
