// Suggestions for a receipt's lines: every member reads them; owner and crew accept them (crew until filed).
import { Router, type Response } from 'express';
import { acceptSuggestionsRequest } from '../../../shared/api/suggestions';
import { ANY_MEMBER, buildRole, em, isUuid, membershipOf } from '../http/build-access';
import { NotFound } from '../http/errors';
import { validBody } from '../http/validate';
import { findReceipt } from '../receipts/receipts.service';
import { sendReceipt } from '../receipts/send-receipt';
import { acceptSuggestions } from './accept-suggestions';
import { receiptSuggestions } from './suggestions.service';

const EDITORS = ['owner', 'crew'] as const;

async function receiptOf(res: Response, receiptId: unknown) {
  if (!isUuid(receiptId)) throw new NotFound('That receipt');
  return findReceipt(em(), membershipOf(res).build, receiptId);
}

/** Mounted under /api/builds/:buildId. */
export function suggestionsRoutes(): Router {
  const router = Router({ mergeParams: true });

  router.get('/receipts/:receiptId/suggestions', buildRole(...ANY_MEMBER), async (req, res) => {
    res.json(await receiptSuggestions(em(), await receiptOf(res, req.params.receiptId)));
  });

  router.post('/receipts/:receiptId/suggestions/accept', buildRole(...EDITORS), validBody(acceptSuggestionsRequest), async (req, res) => {
    const receipt = await receiptOf(res, req.params.receiptId);
    await acceptSuggestions(em(), receipt, req.user!, membershipOf(res).role, req.body.lineIds);
    await sendReceipt(res, receipt.id);
  });

  return router;
}
