// The check screen's reconciliation from what the person has typed so far, using the same arithmetic the server files with.
import type { ReceiptLineKind } from '../../../../../shared/enums';
import { Decimal, parseMoney } from '../../../../../shared/money';
import { Reconciliation, reconcile } from '../../../../../shared/receipt-math';

export interface TypedLine {
  kind: ReceiptLineKind;
  amount: string;
  taxable: boolean;
}

export interface TypedCharges {
  tax: string;
  shipping: string;
  discount: string;
  total: string;
}

export type LiveReconciliation = { ok: true; result: Reconciliation } | { ok: false; message: string };

/** A blank charge means none was printed; text that is not an amount stops the sum with a message. */
function optional(text: string): Decimal | null | undefined {
  if (text.trim() === '') return null;
  const parsed = parseMoney(text);
  return parsed.ok ? parsed.value : undefined;
}

export function liveReconciliation(lines: readonly TypedLine[], charges: TypedCharges): LiveReconciliation {
  const mathLines = [];
  for (const line of lines) {
    const parsed = parseMoney(line.amount);
    if (!parsed.ok) return { ok: false, message: 'Fix the line amounts marked in the table to see the total.' };
    mathLines.push({ kind: line.kind, amount: parsed.value, taxable: line.taxable });
  }
  const tax = optional(charges.tax);
  const shipping = optional(charges.shipping);
  const discount = optional(charges.discount);
  const total = optional(charges.total);
  if (tax === undefined || shipping === undefined || discount === undefined || total === undefined) {
    return { ok: false, message: 'Fix the tax, shipping, discount or total above to see the reconciliation.' };
  }
  return { ok: true, result: reconcile(mathLines, { tax, shipping, discount, total }) };
}
