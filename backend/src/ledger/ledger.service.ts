// The ledger: budget, estimate and money spent per system, aggregated in SQL; rounding and the forecast through
// the shared money module, so the systems always add up to the build total to the cent.
import type { EntityManager } from '@mikro-orm/postgresql';
import { OVERRUN_MIN_SAMPLE, type LedgerDto, type LedgerLineFigure } from '../../../shared/api/ledger';
import { addSystemFigures, budgetWithContingency, systemFigures } from '../../../shared/build-figures';
import { Decimal, minorUnits, roundHalfUp, toDecimal, toWire } from '../../../shared/money';
import { needsSafetyCaution } from '../../../shared/safety';
import type { Build } from '../builds/build.entity';

export { OVERRUN_MIN_SAMPLE };

interface SystemRow {
  id: string;
  name: string;
  budget: string;
  estimate: string;
  remaining_estimate: string;
  spent: string;
  net_cost: string;
  cores_outstanding: string;
  returns_awaiting: string;
}

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

const SYSTEM_FIGURES = `
  with parts as (
    select p.system_id,
           sum(round(p.quantity * p.estimated_unit_cost, ?)) as estimate,
           sum(round(p.quantity * p.estimated_unit_cost, ?)) filter (where p.status = 'planned') as remaining_estimate
      from part p where p.build_id = ? group by p.system_id
  ), lines as (
    select l.system_id,
           sum(${LINE_TOTAL}) filter (where ${FIGURE_FILTER.spent}) as spent,
           sum(${LINE_TOTAL}) filter (where ${FIGURE_FILTER.netCost}) as net_cost,
           sum(${LINE_TOTAL}) filter (where ${FIGURE_FILTER.coreDepositsOutstanding}) as cores_outstanding,
           sum(${LINE_TOTAL}) filter (where ${FIGURE_FILTER.returnsAwaitingRefund}) as returns_awaiting
      ${filedLines()}
     group by l.system_id
  )
  select s.id, s.name,
         -- An archived system's budget has left the build's budget; its parts and money stay in the figures.
         case when s.archived_at is null then s.budget else 0 end as budget,
         coalesce(parts.estimate, 0) as estimate, coalesce(parts.remaining_estimate, 0) as remaining_estimate,
         coalesce(lines.spent, 0) as spent, coalesce(lines.net_cost, 0) as net_cost,
         coalesce(lines.cores_outstanding, 0) as cores_outstanding, coalesce(lines.returns_awaiting, 0) as returns_awaiting
    from vehicle_system s
    left join parts on parts.system_id = s.id
    left join lines on lines.system_id = s.id
   where s.build_id = ? and (s.archived_at is null or lines.spent is not null)
   order by s.sort_order, s.created_at`;

/** Actual cost over estimate for bought parts that carry filed purchase lines. */
const OVERRUN = `
  select count(*) as sample, coalesce(sum(actual), 0) as actual, coalesce(sum(estimate), 0) as estimate from (
    select p.id, round(p.quantity * p.estimated_unit_cost, ?) as estimate, sum(${LINE_TOTAL}) as actual
      from part p
      join receipt_line l on l.part_id = p.id and l.kind = 'part'
      join receipt r on r.id = l.receipt_id and r.state = 'filed'
     where p.build_id = ? and p.estimated_unit_cost > 0
     group by p.id
  ) bought`;

export interface OverrunFactor {
  factor: Decimal;
  sample: number;
}

export async function overrunFactor(em: EntityManager, build: Build): Promise<OverrunFactor> {
  const places = minorUnits(build.currency);
  const [row] = await em.execute<{ sample: string; actual: string; estimate: string }[]>(OVERRUN, [places, build.id]);
  const sample = Number(row.sample);
  const estimate = toDecimal(String(row.estimate));
  if (sample < OVERRUN_MIN_SAMPLE || estimate.isZero()) return { factor: new Decimal(1), sample };
  // Kept to 4 decimals: a ratio, not money; the forecast it scales is rounded to the currency afterwards.
  return { factor: roundHalfUp(toDecimal(String(row.actual)).dividedBy(estimate), 4), sample };
}

export async function buildLedger(em: EntityManager, build: Build): Promise<LedgerDto> {
  const places = minorUnits(build.currency);
  const rows = await em.execute<SystemRow[]>(SYSTEM_FIGURES, [places, places, build.id, build.id, build.id]);
  const { factor, sample } = await overrunFactor(em, build);
  const money = (value: string) => roundHalfUp(toDecimal(String(value)), places);
  const systems = rows.map((row) => ({
    systemId: row.id,
    name: row.name,
    safetyCaution: needsSafetyCaution(row.name),
    ...systemFigures(
      {
        budget: money(row.budget),
        planned: money(row.estimate),
        remainingEstimate: money(row.remaining_estimate),
        spent: money(row.spent),
        netCost: money(row.net_cost),
        coreDepositsOutstanding: money(row.cores_outstanding),
        returnsAwaitingRefund: money(row.returns_awaiting),
      },
      factor,
      places,
    ),
  }));
  const total = addSystemFigures(systems, places);
  const contingencyBudget = toWire(money(String(build.contingencyBudget)), places);
  return {
    currency: build.currency,
    systems,
    total,
    contingencyBudget,
    budgetWithContingency: budgetWithContingency(total.budget, contingencyBudget, places),
    overrunFactor: factor.toString(),
    overrunSample: sample,
  };
}
