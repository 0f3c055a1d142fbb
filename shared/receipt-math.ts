// Receipt arithmetic shared by the check screen (live) and the server (filing): reconciliation against the
// printed total, and allocation of the receipt's tax, shipping and discount to its lines.
import type { ReceiptLineKind } from './enums';
import { Decimal, allocate, minorUnits, subtract, sum } from './money';

export interface MathLine {
  kind: ReceiptLineKind;
  amount: Decimal;
  taxable: boolean;
}

export interface ReceiptCharges {
  tax: Decimal | null;
  shipping: Decimal | null;
  /** A receipt-level discount printed as a positive amount taken off. */
  discount: Decimal | null;
}

export interface Reconciliation {
  linesTotal: Decimal;
  /** Lines + tax + shipping − discount. */
  computedTotal: Decimal;
  printedTotal: Decimal | null;
  /** Printed minus computed; null when no total was printed. */
  difference: Decimal | null;
  reconciles: boolean;
}

const zero = new Decimal(0);

export function reconcile(lines: readonly MathLine[], charges: ReceiptCharges & { total: Decimal | null }): Reconciliation {
  const linesTotal = sum(lines.map((line) => line.amount));
  const computedTotal = subtract(sum([linesTotal, charges.tax ?? zero, charges.shipping ?? zero]), charges.discount ?? zero);
  const difference = charges.total === null ? null : subtract(charges.total, computedTotal);
  return { linesTotal, computedTotal, printedTotal: charges.total, difference, reconciles: difference !== null && difference.isZero() };
}

export interface LineAllocation {
  tax: Decimal;
  shipping: Decimal;
  discount: Decimal;
}

/**
 * Splits one receipt-level charge over the lines that carry it, in proportion to their amounts, by the
 * largest-remainder method. A positive charge is carried by lines of money out; a negative one (tax given
 * back on a return slip) by lines of money back.
 */
function spread(charge: Decimal | null, lines: readonly MathLine[], eligible: (line: MathLine) => boolean, currency: string): Decimal[] {
  if (charge === null || charge.isZero()) return lines.map(() => zero);
  const weights = lines.map((line) => {
    if (!eligible(line)) return zero;
    const signed = charge.isNegative() ? line.amount.negated() : line.amount;
    return signed.isNegative() ? zero : signed;
  });
  if (weights.every((weight) => weight.isZero())) throw new AllocationError(`There is no line to carry ${charge.toString()}: add a line it belongs to.`);
  return allocate(charge, weights, currency);
}

export class AllocationError extends Error {
  override readonly name = 'AllocationError';
}

/**
 * Tax goes to taxable lines only; shipping to purchases, fees and returns; the printed discount to purchases and fees. Each column adds up to the printed figure exactly, to the currency's minor unit.
 */
export function allocateCharges(lines: readonly MathLine[], charges: ReceiptCharges, currency: string): LineAllocation[] {
  minorUnits(currency);
  const tax = spread(charges.tax, lines, (line) => line.taxable && line.kind !== 'discount', currency);
  // Shipping follows the goods: purchases, fees and returns carry it, deposits (refundable) do not.
  const shipping = spread(charges.shipping, lines, (line) => line.kind === 'part' || line.kind === 'fee' || line.kind === 'return', currency);
  const discount = spread(charges.discount, lines, (line) => line.kind === 'part' || line.kind === 'fee', currency);
  return lines.map((_, index) => ({ tax: tax[index], shipping: shipping[index], discount: discount[index] }));
}

/** What a filed line cost: its amount with its share of tax and shipping, less its share of the discount (SQL: LINE_TOTAL). */
export function linePaid(line: { amount: Decimal; allocatedTax: Decimal; allocatedShipping: Decimal; allocatedDiscount: Decimal }): Decimal {
  return subtract(sum([line.amount, line.allocatedTax, line.allocatedShipping]), line.allocatedDiscount);
}
