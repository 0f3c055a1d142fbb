// The ledger: budget, estimate and money spent per system, from the parts and the running totals of the filed lines
// (ledger-totals.ts); rounding and the forecast through the shared money module, so the systems always add up to the
// build total to the cent.
import type { EntityManager } from '@mikro-orm/postgresql';
import { OVERRUN_MIN_SAMPLE, type LedgerDto } from '../../../shared/api/ledger';
import { addSystemFigures, budgetWithContingency, systemFigures } from '../../../shared/build-figures';
import { Decimal, minorUnits, roundHalfUp, toDecimal, toWire } from '../../../shared/money';
import { needsSafetyCaution } from '../../../shared/safety';
import type { Build } from '../builds/build.entity';
import { ensureLedgerTotals } from './ledger-totals';

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

// The lines' sums come from the running totals (ledger-totals.ts), which hold exactly what an aggregate of the filed
// lines would give; a system with a row there has filed lines, as one with a group in that aggregate had.
const SYSTEM_FIGURES = `
  with parts as (
    select p.system_id,
           sum(round(p.quantity * p.estimated_unit_cost, ?)) as estimate,
           sum(round(p.quantity * p.estimated_unit_cost, ?)) filter (where p.status = 'planned') as remaining_estimate
      from part p where p.build_id = ? group by p.system_id
  )
  select s.id, s.name,
         -- An archived system's budget has left the build's budget; its parts and money stay in the figures.
         case when s.archived_at is null then s.budget else 0 end as budget,
         coalesce(parts.estimate, 0) as estimate, coalesce(parts.remaining_estimate, 0) as remaining_estimate,
         coalesce(lines.spent, 0) as spent, coalesce(lines.net_cost, 0) as net_cost,
         coalesce(lines.cores_outstanding, 0) as cores_outstanding, coalesce(lines.returns_awaiting, 0) as returns_awaiting
    from vehicle_system s
    left join parts on parts.system_id = s.id
    left join ledger_system_total lines on lines.system_id = s.id
   where s.build_id = ? and (s.archived_at is null or lines.system_id is not null)
   order by s.sort_order, s.created_at`;

/** Actual cost (the running total of each part's filed purchase lines) over estimate, for bought parts. */
const OVERRUN = `
  select count(*) as sample, coalesce(sum(bought.actual), 0) as actual,
         coalesce(sum(round(p.quantity * p.estimated_unit_cost, ?)), 0) as estimate
    from part p
    join ledger_part_total bought on bought.part_id = p.id
   where p.build_id = ? and p.estimated_unit_cost > 0`;

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
  await ensureLedgerTotals(em, build.id);
  const rows = await em.execute<SystemRow[]>(SYSTEM_FIGURES, [places, places, build.id, build.id]);
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
