// The one money model of a build: every figure a screen, an export or a mail shows is named and defined here, with
// its words, and worked out here from the few sums the database gives. The server fills the ledger with it; the
// screens only read and word it, so the same name is the same value everywhere.
import { Decimal, multiply, roundHalfUp, subtract, sum, toDecimal, toWire } from './money';

/** Every figure of a build, in the order a person reads them. */
export const FIGURE_NAMES = [
  'budget',
  'contingency',
  'budgetWithContingency',
  'planned',
  'spent',
  'netCost',
  'remainingEstimate',
  'forecast',
  'forecastAdjusted',
  'variance',
  'planningGap',
  'coreDepositsOutstanding',
  'returnsAwaitingRefund',
] as const;
export type FigureName = (typeof FIGURE_NAMES)[number];

export interface FigureWords {
  /** The figure's name on every screen, export and mail. */
  label: string;
  /** One sentence saying what it counts. */
  meaning: string;
}

export const FIGURE_WORDS: Record<FigureName, FigureWords> = {
  budget: { label: 'Budget', meaning: 'What the systems were given; the contingency is kept apart.' },
  contingency: { label: 'Contingency', meaning: 'Held back for the unexpected, outside every system.' },
  budgetWithContingency: { label: 'Budget with contingency', meaning: 'The systems’ budgets plus the contingency.' },
  planned: { label: 'Planned', meaning: 'Every part on the bill of materials at its estimate.' },
  spent: { label: 'Spent', meaning: 'Cash out on filed receipts, deposits and fees included, less money back.' },
  netCost: {
    label: 'Net cost',
    meaning: 'What the parts cost with their tax and shipping, less discounts and refunds; a core deposit counts only when lost.',
  },
  remainingEstimate: { label: 'Still to buy', meaning: 'Estimates of the parts not bought yet.' },
  forecast: { label: 'Forecast at completion', meaning: 'Net cost plus the estimates of the parts still to buy.' },
  forecastAdjusted: {
    label: 'Adjusted forecast',
    meaning: 'Net cost plus the parts still to buy, scaled by how far bought parts have run over their estimates.',
  },
  variance: { label: 'Forecast against budget', meaning: 'Budget less the forecast at completion: above zero is under budget.' },
  planningGap: { label: 'Planned against budget', meaning: 'Budget less what is planned: above zero is room left to plan.' },
  coreDepositsOutstanding: {
    label: 'Core deposits outstanding',
    meaning: 'Deposits paid on rebuildable parts, with their tax, not yet refunded or lost.',
  },
  returnsAwaitingRefund: { label: 'Returns awaiting refund', meaning: 'What was paid, with tax, for parts sent back whose refund is not filed yet.' },
};

/** The sums the database gives for one system (or the whole build), already rounded to the currency. */
export interface FigureSums {
  budget: Decimal;
  planned: Decimal;
  /** Estimates of the parts still planned (not bought). */
  remainingEstimate: Decimal;
  spent: Decimal;
  netCost: Decimal;
  coreDepositsOutstanding: Decimal;
  returnsAwaitingRefund: Decimal;
}

/** A system's (or the build's) figures on the wire, as decimal strings in the currency's minor units. */
export interface SystemFigures {
  budget: string;
  planned: string;
  spent: string;
  netCost: string;
  coreDepositsOutstanding: string;
  returnsAwaitingRefund: string;
  remainingEstimate: string;
  forecast: string;
  forecastAdjusted: string;
  variance: string;
  planningGap: string;
}

/** The figures of one system from its sums; the overrun factor scales what is still to buy (rounded per system). */
export function systemFigures(sums: FigureSums, overrunFactor: Decimal, places: number): SystemFigures {
  const forecast = sum([sums.netCost, sums.remainingEstimate]);
  const wire = (value: Decimal) => toWire(value, places);
  return {
    budget: wire(sums.budget),
    planned: wire(sums.planned),
    spent: wire(sums.spent),
    netCost: wire(sums.netCost),
    coreDepositsOutstanding: wire(sums.coreDepositsOutstanding),
    returnsAwaitingRefund: wire(sums.returnsAwaitingRefund),
    remainingEstimate: wire(sums.remainingEstimate),
    forecast: wire(forecast),
    forecastAdjusted: wire(sum([sums.netCost, roundHalfUp(multiply(sums.remainingEstimate, overrunFactor), places)])),
    variance: wire(subtract(sums.budget, forecast)),
    planningGap: wire(subtract(sums.budget, sums.planned)),
  };
}

/** The build's figures: each is the sum of the systems' (so the systems add up to it to the cent). */
export function addSystemFigures(rows: readonly SystemFigures[], places: number): SystemFigures {
  const total = (key: keyof SystemFigures) => toWire(sum(rows.map((row) => toDecimal(row[key]))), places);
  return {
    budget: total('budget'),
    planned: total('planned'),
    spent: total('spent'),
    netCost: total('netCost'),
    coreDepositsOutstanding: total('coreDepositsOutstanding'),
    returnsAwaitingRefund: total('returnsAwaitingRefund'),
    remainingEstimate: total('remainingEstimate'),
    forecast: total('forecast'),
    forecastAdjusted: total('forecastAdjusted'),
    variance: total('variance'),
    planningGap: total('planningGap'),
  };
}

/** The build's budget with the contingency: the one place the two are added. */
export function budgetWithContingency(budget: string, contingency: string, places: number): string {
  return toWire(sum([toDecimal(budget), toDecimal(contingency)]), places);
}

/** What a comparison with the budget is made on. */
export type BudgetBasis = 'forecast' | 'planned' | 'net cost';

export interface BudgetComparison {
  basis: BudgetBasis;
  /** No budget set: nothing to compare with. */
  noBudget: boolean;
  over: boolean;
  /** How far over or under, never negative, as a decimal string. */
  amount: string;
}

/** A figure against a budget: over when the figure passes the budget; equal is not over. */
export function compareWithBudget(basis: BudgetBasis, figure: string, budget: string): BudgetComparison {
  const difference = subtract(toDecimal(budget), toDecimal(figure));
  return { basis, noBudget: toDecimal(budget).isZero(), over: difference.isNegative(), amount: toWire(difference.abs()) };
}

/**
 * A comparison in words that say against what, with the amount already formatted by the caller:
 * "forecast $45.48 over budget", "planned $120.00 under budget", "net cost at budget".
 */
export function comparisonWords(comparison: BudgetComparison, formattedAmount: string): string {
  const { before, amount, after } = comparisonParts(comparison, formattedAmount);
  return [before, amount, after].filter(Boolean).join(' ');
}

/** The same words in their three parts, for a screen that sets the amount apart from the words around it. */
export function comparisonParts(comparison: BudgetComparison, formattedAmount: string): { before: string; amount: string; after: string } {
  if (comparison.noBudget) return { before: 'no budget set', amount: '', after: '' };
  if (toDecimal(comparison.amount).isZero()) return { before: `${comparison.basis} at budget`, amount: '', after: '' };
  return { before: comparison.basis, amount: formattedAmount, after: `${comparison.over ? 'over' : 'under'} budget` };
}

/**
 * A system is over budget when its forecast at completion passes its budget: the one rule behind every "over
 * budget" count, badge and colour. A system with no budget is never over (it says "no budget set").
 */
export function isOverBudget(figures: Pick<SystemFigures, 'budget' | 'forecast'>): boolean {
  const budget = toDecimal(figures.budget);
  return budget.greaterThan(0) && toDecimal(figures.forecast).greaterThan(budget);
}

/** A figure as a whole percent of the budget, rounded half up, the same on screens and in mail; null with no budget. */
export function percentOfBudget(figure: string, budget: string): string | null {
  const base = toDecimal(budget);
  if (base.isZero()) return null;
  return toWire(roundHalfUp(toDecimal(figure).times(100).dividedBy(base), 0), 0);
}

/** A system's figures with another budget (one being typed): the budget, the variance and the planning gap follow it. */
export function withBudget(figures: SystemFigures, budget: Decimal, places: number): SystemFigures {
  return {
    ...figures,
    budget: toWire(budget, places),
    variance: toWire(subtract(budget, toDecimal(figures.forecast)), places),
    planningGap: toWire(subtract(budget, toDecimal(figures.planned)), places),
  };
}
