// Budget arithmetic for the screens: estimate against budget in words, and sums of amounts from the API.
import { Decimal, parseMoney, subtract, sum, toWire } from '../../../../../shared/money';

/** An amount from the API as a Decimal; a malformed one counts as zero rather than breaking a screen. */
export function amountOf(text: string | null | undefined): Decimal {
  if (!text) return new Decimal(0);
  const parsed = parseMoney(text);
  return parsed.ok ? parsed.value : new Decimal(0);
}

export function sumOf(texts: readonly (string | null | undefined)[]): Decimal {
  return sum(texts.map(amountOf));
}

export interface BudgetStanding {
  /** No budget set (zero) while something is estimated: neither over nor under in a useful sense. */
  unbudgeted: boolean;
  over: boolean;
  /** How far over, or how much is left; never negative. */
  difference: Decimal;
  /** Estimate as a share of the budget, 0 to 100, as text for a CSS width (display only, never money). */
  fillPercent: string;
}

export function budgetStanding(estimate: Decimal, budget: Decimal): BudgetStanding {
  const over = estimate.greaterThan(budget);
  const difference = over ? subtract(estimate, budget) : subtract(budget, estimate);
  const unbudgeted = budget.isZero() && !estimate.isZero();
  let fillPercent = '0';
  if (budget.isZero()) fillPercent = estimate.isZero() ? '0' : '100';
  else fillPercent = toWire(Decimal.min(estimate.dividedBy(budget).times(100), 100).toDecimalPlaces(1));
  return { unbudgeted, over, difference, fillPercent };
}
