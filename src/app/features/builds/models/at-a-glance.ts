// What a build's overview tells at a glance: the budget used, and the things that need someone, in the order the role acts on them.
import type { LedgerDto } from '../../../../../shared/api/ledger';
import type { CoreDto, ReceiptSummaryDto } from '../../../../../shared/api/receipts';
import type { BuildRole } from '../../../../../shared/enums';
import { isOverBudget, percentOfBudget } from '../../../../../shared/build-figures';
import { Decimal, sum, toWire } from '../../../../../shared/money';
import { amountOf, budgetStanding } from '../../parts/models/budget-math';

export interface BudgetUse {
  /** No budget set for the systems: nothing to measure against. */
  noBudget: boolean;
  over: boolean;
  /** Net cost as a whole percent of the budget (may pass 100), rounded as everywhere else; display only. */
  usedPercent: string;
  /** 0 to 100 for the meter's width. */
  fillPercent: string;
  /** Budget left, or how far over; never negative. */
  difference: Decimal;
}

/** Net cost against the systems' budget, as the ledger counts it (the contingency is kept aside). */
export function budgetUse(ledger: LedgerDto): BudgetUse {
  const budget = amountOf(ledger.total.budget);
  const netCost = amountOf(ledger.total.netCost);
  const standing = budgetStanding(netCost, budget);
  const usedPercent = percentOfBudget(ledger.total.netCost, ledger.total.budget) ?? '0';
  return { noBudget: budget.isZero(), over: standing.over, usedPercent, fillPercent: standing.fillPercent, difference: standing.difference };
}

export type AttentionItem =
  | { kind: 'to_check' | 'reading' | 'failed' | 'questions' | 'review' | 'answers' | 'duplicates'; count: number }
  | { kind: 'cores'; count: number; amount: string; nearestDue: string; overdue: number }
  | { kind: 'over_budget'; count: number; systems: string[] };

export interface AttentionSources {
  role: BuildRole;
  /** Every receipt of the build, in any state. */
  receipts: ReceiptSummaryDto[];
  reviewQueue: ReceiptSummaryDto[];
  cores: CoreDto[];
  ledger: LedgerDto | null;
  /** YYYY-MM-DD in the person's own time zone. */
  today: string;
}

/**
 * What a role can act on. The reviewer reviews (and may say a likely duplicate is two purchases): checking, cores and
 * budgets are the builders' work, so they are no task of the reviewer's. Crew give no verdicts, so the queue is none of theirs.
 */
const TASKS: Record<BuildRole, ReadonlySet<AttentionItem['kind']>> = {
  owner: new Set(['to_check', 'reading', 'failed', 'questions', 'review', 'answers', 'cores', 'over_budget', 'duplicates']),
  crew: new Set(['to_check', 'reading', 'failed', 'questions', 'cores', 'over_budget', 'duplicates']),
  reviewer: new Set(['review', 'answers', 'duplicates']),
};

/** Only the lines with something in them that this role can act on; the reviewing first for a reviewer, otherwise the checking that blocks the ledger. */
export function attentionItems(sources: AttentionSources): AttentionItem[] {
  const count = (test: (receipt: ReceiptSummaryDto) => boolean) => sources.receipts.filter(test).length;
  const owed = sources.cores.filter((core) => core.state === 'owed');
  const overBudget = (sources.ledger?.systems ?? []).filter((system) => {
    // The one rule of every screen: the forecast at completion passes the budget; no budget set is never over.
    return isOverBudget(system);
  });

  const review: AttentionItem = { kind: 'review', count: sources.reviewQueue.filter((receipt) => receipt.reviewState === 'none').length };
  const answers: AttentionItem = { kind: 'answers', count: sources.reviewQueue.filter((receipt) => receipt.reviewState === 'answered').length };
  const items: AttentionItem[] = [
    { kind: 'to_check', count: count((receipt) => receipt.state === 'to_check') },
    { kind: 'reading', count: count((receipt) => receipt.state === 'queued' || receipt.state === 'reading') },
    { kind: 'failed', count: count((receipt) => receipt.state === 'failed') },
    { kind: 'questions', count: count((receipt) => receipt.state === 'filed' && receipt.reviewState === 'questioned') },
    review,
    answers,
    {
      kind: 'cores',
      count: owed.length,
      amount: toWire(sum(owed.map((core) => amountOf(core.amount)))),
      // Due dates are calendar dates (YYYY-MM-DD), so text order is date order.
      nearestDue: owed.map((core) => core.dueDate).sort()[0] ?? '',
      overdue: owed.filter((core) => core.dueDate < sources.today).length,
    },
    { kind: 'over_budget', count: overBudget.length, systems: overBudget.map((system) => system.name) },
    { kind: 'duplicates', count: count((receipt) => receipt.duplicateOf.length > 0) },
  ];
  const ordered = sources.role === 'reviewer' ? [review, answers, ...items.filter((item) => item !== review && item !== answers)] : items;
  return ordered.filter((item) => item.count > 0 && TASKS[sources.role].has(item.kind));
}

/** Today as YYYY-MM-DD in the person's own time zone, to compare with calendar due dates. */
export function todayIso(now = new Date()): string {
  const month = String(now.getMonth() + 1).padStart(2, '0');
  const day = String(now.getDate()).padStart(2, '0');
  return `${now.getFullYear()}-${month}-${day}`;
}
