// Which receipt lines each ledger figure counts: the ledger's running totals, its breakdowns and the returns lists all
// sum these rows with these filters, so every list adds up to the figure it explains.
import type { LedgerLineFigure } from '../../../shared/api/ledger';

// A line's full cost: its amount with its share of the receipt's tax and shipping, less its share of the discount.
export const LINE_TOTAL = `(l.amount + l.allocated_tax + l.allocated_shipping - l.allocated_discount)`;

/**
 * The rows every money figure is summed from: lines of filed receipts that carry a system (an unassigned fee or
 * discount was spread over the other lines at filing, so counting it too would count it twice). One parameter: the
 * build's id. Aliases: l (line), r (receipt), c (its core, if a core charge); `joins` adds tables for a breakdown.
 */
export function filedLines(joins = ''): string {
  return `
      from receipt_line l
      join receipt r on r.id = l.receipt_id and r.state = 'filed'
      left join core c on c.charge_line_id = l.id ${joins}
     where l.build_id = ? and l.system_id is not null`;
}

/**
 * Which of filedLines() each figure counts: the ledger, its spend over time, its vendors and the lines behind a
 * figure all use these, so the lines shown always add up to the figure shown.
 */
export const FIGURE_FILTER: Record<LedgerLineFigure, string> = {
  // Net cash out: everything, money back included.
  spent: `true`,
  netCost: `(l.kind in ('part', 'fee', 'discount', 'return') or (l.kind = 'core_charge' and c.state = 'forfeited'))`,
  coreDepositsOutstanding: `(l.kind = 'core_charge' and c.state in ('owed', 'dropped_off'))`,
  // Parts sent back with no filed return line yet: what was paid for them is owed back.
  // Each set is found once (a hashed subplan), never looked up per line: a correlated "not exists" ran once per line
  // even for lines without a part (null in "in (...)" is not false, so "and" went on), a scan of every line each time:
  // 13.5 s for a receipt of 8,000 lines, 18 ms this way. The "is not null" filters keep "not in" away from nulls.
  returnsAwaitingRefund: `(l.kind = 'part' and l.part_id is not null
      and l.part_id in (select p.id from part p where p.status = 'returned')
      and l.id not in (select rl.return_of_id from receipt_line rl join receipt rr on rr.id = rl.receipt_id and rr.state = 'filed'
                        where rl.kind = 'return' and rl.return_of_id is not null)
      and l.part_id not in (select rl.part_id from receipt_line rl join receipt rr on rr.id = rl.receipt_id and rr.state = 'filed'
                        where rl.kind = 'return' and rl.part_id is not null))`,
};
