// Filing a checked receipt: it must reconcile (or the owner accepts the difference); charges are allocated to the
// lines to the cent, core deposits are opened, and parts move on to "on the shelf" or "sent back".
import type { EntityManager } from '@mikro-orm/postgresql';
import { Decimal, minorUnits, sum, toWire } from '../../../shared/money';
import { AllocationError, allocateCharges, reconcile, type MathLine } from '../../../shared/receipt-math';
import type { User } from '../auth/user.entity';
import { recordAudit } from '../audit/audit';
import { Forbidden, StaleVersion, ValidationFailed } from '../http/errors';
import { changeWarranty, warrantyOf } from '../parts/part-warranty';
import { Core } from './core.entity';
import { ReceiptLine } from './receipt-line.entity';
import type { Receipt } from './receipt.entity';
import { assertEditable, moneySnapshot } from './receipts.service';
import { suggestWarranty } from './warranty-suggestion';

/** Kinds that must land on a system; an unassigned fee or discount is spread over the other lines instead. */
export const NEEDS_SYSTEM: ReadonlySet<string> = new Set(['part', 'return', 'core_charge', 'core_refund']);

function addDays(isoDate: string, days: number): string {
  const date = new Date(`${isoDate}T00:00:00Z`);
  date.setUTCDate(date.getUTCDate() + days);
  return date.toISOString().slice(0, 10);
}

export async function fileReceipt(
  em: EntityManager,
  receipt: Receipt,
  user: User,
  role: string,
  input: { version: number; acceptDifference?: { reason: string }; coreDueDays: number },
): Promise<void> {
  assertEditable(receipt, role);
  if (receipt.version !== input.version) throw new StaleVersion('This receipt');
  const lines = await em.find(ReceiptLine, { receipt }, { populate: ['part', 'system', 'returnOf'], orderBy: { position: 'asc' } });
  if (lines.length === 0) throw new ValidationFailed({ lines: 'Add at least one line before filing.' });

  const fields: Record<string, string> = {};
  lines.forEach((line, index) => {
    if (NEEDS_SYSTEM.has(line.kind) && !line.system) fields[`lines.${index}.systemId`] = `Line ${index + 1} ("${line.description}") needs a part or a system.`;
  });
  if (!receipt.purchaseDate) fields.purchaseDate = 'Enter the date of the receipt.';
  if (Object.keys(fields).length) throw new ValidationFailed(fields, 'Some lines are not assigned yet.');

  const check = reconcile(lines, receipt);
  if (!check.reconciles) {
    const places = minorUnits(receipt.build.currency);
    const what =
      check.difference === null
        ? 'No total is entered'
        : `The lines and charges come to ${toWire(check.computedTotal, places)} but the receipt says ${toWire(check.printedTotal!, places)}`;
    if (!input.acceptDifference) {
      throw new ValidationFailed({ total: `${what}. Correct a line, add the missing fee, or let the owner accept the difference.` }, `${what}.`);
    }
    if (role !== 'owner') throw new Forbidden('Only the owner can accept a difference from the printed total.');
    receipt.differenceAccepted = true;
    receipt.differenceReason = input.acceptDifference.reason;
  } else {
    receipt.differenceAccepted = false;
    receipt.differenceReason = '';
  }

  // Unassigned fees and discounts are charges of the whole receipt, like shipping.
  const carried = lines.filter((line) => line.system);
  const loose = lines.filter((line) => !line.system);
  const shipping = sum([receipt.shipping ?? new Decimal(0), ...loose.filter((l) => l.kind === 'fee').map((l) => l.amount)]);
  const discount = sum([receipt.discount ?? new Decimal(0), ...loose.filter((l) => l.kind === 'discount').map((l) => l.amount.negated())]);
  let shares;
  try {
    shares = allocateCharges(carried as MathLine[], { tax: receipt.tax, shipping, discount }, receipt.build.currency);
  } catch (error) {
    if (error instanceof AllocationError) throw new ValidationFailed({ lines: error.message });
    throw error;
  }
  for (const line of loose) {
    line.allocatedTax = new Decimal(0);
    line.allocatedShipping = new Decimal(0);
    line.allocatedDiscount = new Decimal(0);
  }
  carried.forEach((line, index) => {
    line.allocatedTax = shares[index].tax;
    line.allocatedShipping = shares[index].shipping;
    line.allocatedDiscount = shares[index].discount;
  });

  // A core whose charge line was changed to another kind while the receipt was open is no longer owed.
  for (const core of await em.find(Core, { chargeLine: { receipt, kind: { $ne: 'core_charge' } } })) em.remove(core);
  for (const line of lines) {
    if (line.kind === 'core_charge' && !(await em.count(Core, { chargeLine: line }))) {
      em.create(Core, { build: receipt.build, chargeLine: line, dueDate: addDays(receipt.purchaseDate!, input.coreDueDays) });
    }
    if (line.kind === 'core_refund' && line.returnOf?.kind === 'core_charge') {
      const core = await em.findOne(Core, { chargeLine: line.returnOf });
      if (core) {
        core.state = 'refunded';
        core.refundLine = line;
      }
    }
    if (line.part && line.kind === 'part' && (line.part.status === 'planned' || line.part.status === 'ordered')) line.part.status = 'on_hand';
    // The warranty the line's words name goes to a part that has none yet, from the receipt's date: only a
    // suggestion, which the person can change or remove on the part. A warranty already on the part stands.
    const suggested = line.kind === 'part' ? suggestWarranty(line.description) : null;
    if (line.part && suggested && warrantyOf(line.part) === null) {
      await changeWarranty(em, receipt.build, line.part, { warranty: suggested, warrantyStart: receipt.purchaseDate, warrantyReceiptId: receipt.id });
    }
    if (line.part && line.kind === 'return') line.part.status = 'returned';
  }

  receipt.state = 'filed';
  receipt.filedAt = new Date();
  receipt.filedBy = user;
  receipt.reviewState = 'none';
  recordAudit(em, {
    build: receipt.build,
    user,
    entity: 'receipt',
    entityId: receipt.id,
    receiptId: receipt.id,
    action: 'file',
    after: { ...moneySnapshot(receipt), differenceAccepted: receipt.differenceAccepted, differenceReason: receipt.differenceReason },
  });
  await em.flush();
}

/**
 * The owner reopens a filed receipt to correct it; it must be filed again. What filing derived is undone: the receipt
 * leaves the ledger (it counts filed receipts only), its lines lose their shares of the charges, and cores its refund
 * lines refunded are back to dropped off until it is filed again. Cores charged on it stay, with whatever the people
 * did with them since; deleting the charge line removes its core.
 */
export async function reopenReceipt(em: EntityManager, receipt: Receipt, user: User): Promise<void> {
  if (receipt.state !== 'filed') throw new ValidationFailed({ state: 'Only a filed receipt can be reopened.' });
  const lines = await em.find(ReceiptLine, { receipt });
  for (const line of lines) {
    line.allocatedTax = new Decimal(0);
    line.allocatedShipping = new Decimal(0);
    line.allocatedDiscount = new Decimal(0);
  }
  for (const core of await em.find(Core, { refundLine: { receipt } })) {
    core.state = 'dropped_off';
    core.refundLine = null;
  }
  receipt.state = 'to_check';
  recordAudit(em, { build: receipt.build, user, entity: 'receipt', entityId: receipt.id, receiptId: receipt.id, action: 'reopen' });
  await em.flush();
}
