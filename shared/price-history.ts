// What a build has paid for the same item before: the item's key, a line's unit price, and how far above the lowest
// price a new one is. Used by the price history route and by the check screen's hint, so both compare alike.
import { Decimal, roundHalfUp, roundToMinor, subtract, toDecimal } from './money';
import { partNumberKey } from './part-number-key';

/** A price more than this many percent above the lowest one paid earns a hint (strictly more: 10.00 % does not). */
export const PRICE_HINT_PERCENT = 10;

/**
 * The item a line is for: its part number compared as part numbers are (case, spaces and marks ignored) when it has
 * one, else its description in lower case with runs of spaces made one. The prefixes keep the two kinds apart.
 */
export function itemKey(partNumber: string, description: string): string {
  const number = partNumberKey(partNumber);
  if (number !== '') return `number:${number}`;
  return `description:${description.trim().toLowerCase().replace(/\s+/g, ' ')}`;
}

export interface PricedLine {
  unitPrice: Decimal | string | null;
  amount: Decimal | string;
  quantity: Decimal | string;
}

/**
 * The price of one of the line's items in the currency's minor units (half up): its unit price, else its amount over
 * its quantity; null when neither gives one (no unit price and a quantity of zero).
 */
export function lineUnitPrice(line: PricedLine, currencyCode: string): Decimal | null {
  if (line.unitPrice !== null && line.unitPrice !== '') return roundToMinor(toDecimal(line.unitPrice), currencyCode);
  const quantity = toDecimal(line.quantity);
  if (quantity.isZero()) return null;
  return roundToMinor(toDecimal(line.amount).dividedBy(quantity), currencyCode);
}

function exactPercentAbove(price: Decimal, lowest: Decimal): Decimal {
  return subtract(price, lowest).times(100).dividedBy(lowest);
}

/** How many whole percent `price` is above `lowest` (half up); null when the lowest was free. */
export function percentAbove(price: Decimal, lowest: Decimal): number | null {
  if (lowest.isZero()) return null;
  return roundHalfUp(exactPercentAbove(price, lowest), 0).toNumber();
}

/** Whether `price` is more than PRICE_HINT_PERCENT above `lowest`, on the exact figures (not the rounded percent). */
export function isAboveLowest(price: Decimal, lowest: Decimal): boolean {
  if (lowest.isZero() || !lowest.isPositive()) return false;
  return exactPercentAbove(price, lowest).greaterThan(PRICE_HINT_PERCENT);
}


/** The lowest of some prices paid (the earliest of equal ones, the list being in date order); undefined for none. */
export function lowestOf<Paid extends { unitPrice: string }>(prices: readonly Paid[]): Paid | undefined {
  let lowest: Paid | undefined;
  for (const price of prices) {
    if (!lowest || toDecimal(price.unitPrice).lessThan(toDecimal(lowest.unitPrice))) lowest = price;
  }
  return lowest;
}
