// Answers a write on a receipt with the receipt as saved, read afresh (the unit of work is cleared first, so what
// the answer shows is what the database holds).
import type { Response } from 'express';
import { em, membershipOf } from '../http/build-access';
import { receiptDto } from './receipt-dto';
import { findReceipt } from './receipts.service';

export async function sendReceipt(res: Response, receiptId: string, status = 200): Promise<void> {
  const membership = membershipOf(res);
  em().clear();
  const receipt = await findReceipt(em(), membership.build, receiptId);
  res.status(status).json(await receiptDto(em(), receipt, membership.role));
}
