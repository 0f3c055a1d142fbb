// A part's warranty: set, changed or removed on the part, its start taken from the receipt it rests on by default.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Warranty } from '../../../shared/warranty';
import type { Build } from '../builds/build.entity';
import { ValidationFailed } from '../http/errors';
import { ReceiptLine } from '../receipts/receipt-line.entity';
import { Receipt } from '../receipts/receipt.entity';
import type { Part } from './part.entity';

export interface WarrantyChanges {
  warranty?: Warranty;
  /** null: start on the receipt's date. */
  warrantyStart?: string | null;
  warrantyReceiptId?: string | null;
}

export function warrantyOf(part: Pick<Part, 'warrantyMonths' | 'warrantyLifetime'>): Warranty {
  return part.warrantyLifetime ? 'lifetime' : part.warrantyMonths;
}

/** The latest dated receipt with a purchase line on the part: what the counter asks for when the part fails. */
async function latestReceiptOf(em: EntityManager, part: Part): Promise<Receipt | null> {
  const line = await em.findOne(
    ReceiptLine,
    { part, kind: 'part', receipt: { purchaseDate: { $ne: null } } },
    { populate: ['receipt'], orderBy: { receipt: { purchaseDate: 'desc' }, createdAt: 'desc' } },
  );
  return line?.receipt ?? null;
}

async function receiptOfBuild(em: EntityManager, build: Build, receiptId: string): Promise<Receipt> {
  const receipt = await em.findOne(Receipt, { id: receiptId, build });
  if (!receipt) throw new ValidationFailed({ warrantyReceiptId: 'No such receipt on this build.' });
  return receipt;
}

/**
 * Applies the warranty fields of an edit. Without a receipt named, the warranty rests on the part's latest receipt;
 * without a start, it starts on that receipt's date (a length in months needs a start to have an end).
 */
export async function changeWarranty(em: EntityManager, build: Build, part: Part, changes: WarrantyChanges): Promise<void> {
  const { warrantyStart, warrantyReceiptId } = changes;
  if (changes.warranty === undefined && warrantyStart === undefined && warrantyReceiptId === undefined) return;
  const warranty = changes.warranty === undefined ? warrantyOf(part) : changes.warranty;
  if (warranty === null) {
    if (warrantyStart || warrantyReceiptId) {
      throw new ValidationFailed({ warranty: 'Choose the warranty\'s length (months or lifetime) before its start or receipt.' });
    }
    Object.assign(part, { warrantyMonths: null, warrantyLifetime: false, warrantyStart: null, warrantyReceipt: null });
    return;
  }
  let receipt = part.warrantyReceipt;
  if (warrantyReceiptId !== undefined) receipt = warrantyReceiptId === null ? null : await receiptOfBuild(em, build, warrantyReceiptId);
  else receipt ??= await latestReceiptOf(em, part);
  // A start the person typed stands (null: the receipt's date); a newly named receipt brings its own date; otherwise
  // the start saved before stays, also when the receipt is unlinked.
  let start: string | null;
  if (warrantyStart !== undefined) start = warrantyStart;
  else if (warrantyReceiptId) start = null;
  else start = part.warrantyStart;
  start ??= receipt?.purchaseDate ?? null;
  if (typeof warranty === 'number' && !start) {
    throw new ValidationFailed({ warrantyStart: 'Enter the day the warranty starts, or choose the receipt it rests on (one with a date).' });
  }
  Object.assign(part, {
    warrantyMonths: typeof warranty === 'number' ? warranty : null,
    warrantyLifetime: warranty === 'lifetime',
    warrantyStart: start,
    warrantyReceipt: receipt,
  });
}
