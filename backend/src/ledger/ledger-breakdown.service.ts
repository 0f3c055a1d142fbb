// The ledger broken down: spend over time, spend by vendor, and the receipt lines behind any figure, all summed in SQL
// from the same line filters as the ledger itself, so every breakdown adds up to the ledger's own figures.
import type { EntityManager } from '@mikro-orm/postgresql';
import type {
  LedgerLineDto,
  LedgerLinesQuery,
  LedgerLinesResponse,
  SpendPeriod,
  SpendResponse,
  VendorsResponse,
} from '../../../shared/api/ledger';
import { WEEK_PATTERN } from '../../../shared/api/ledger';
import type { ReceiptLineKind } from '../../../shared/enums';
import { minorUnits, roundHalfUp, sum, toDecimal, toWire } from '../../../shared/money';
import type { Build } from '../builds/build.entity';
import { NotFound } from '../http/errors';
import { FIGURE_FILTER, filedLines, LINE_TOTAL } from './figure-lines';

/** The label of a purchase's period: a month 2026-07 or an ISO 8601 week 2026-W27 (the week's Thursday decides its year). */
const PERIOD_LABEL: Record<SpendPeriod, string> = {
  month: `to_char(r.purchase_date, 'YYYY-MM')`,
  week: `to_char(r.purchase_date, 'IYYY-"W"IW')`,
};
const LABEL_OF_START: Record<SpendPeriod, string> = {
  month: `to_char(g.period_start, 'YYYY-MM')`,
  week: `to_char(g.period_start, 'IYYY-"W"IW')`,
};

function money(value: string | number | null, places: number): string {
  return toWire(roundHalfUp(toDecimal(String(value ?? '0')), places), places);
}

export async function spendOverTime(em: EntityManager, build: Build, by: SpendPeriod): Promise<SpendResponse> {
  const places = minorUnits(build.currency);
  // date_trunc's 'week' starts on Monday, as ISO 8601 weeks do; the series fills the periods nothing was bought in.
  const rows = await em.execute<{ period: string; spent: string; net_cost: string }[]>(
    `with per as (
       select date_trunc('${by}', r.purchase_date::timestamp) as period_start,
              sum(${LINE_TOTAL}) filter (where ${FIGURE_FILTER.spent}) as spent,
              sum(${LINE_TOTAL}) filter (where ${FIGURE_FILTER.netCost}) as net_cost
         ${filedLines()} and r.purchase_date is not null
        group by 1
     )
     select ${LABEL_OF_START[by]} as period, coalesce(per.spent, 0) as spent, coalesce(per.net_cost, 0) as net_cost
       from (select min(period_start) as first, max(period_start) as last from per) bounds
      cross join generate_series(bounds.first, bounds.last, interval '1 ${by}') as g(period_start)
       left join per on per.period_start = g.period_start
      order by g.period_start`,
    [build.id],
  );
  return {
    currency: build.currency,
    by,
    periods: rows.map((row) => ({ period: row.period, spent: money(row.spent, places), netCost: money(row.net_cost, places) })),
  };
}

export async function spendByVendor(em: EntityManager, build: Build): Promise<VendorsResponse> {
  const places = minorUnits(build.currency);
  const rows = await em.execute<{ vendor_id: string | null; vendor: string | null; receipts: string; spent: string; net_cost: string }[]>(
    `select r.vendor_id, v.name as vendor, count(distinct r.id) as receipts,
            coalesce(sum(${LINE_TOTAL}) filter (where ${FIGURE_FILTER.spent}), 0) as spent,
            coalesce(sum(${LINE_TOTAL}) filter (where ${FIGURE_FILTER.netCost}), 0) as net_cost
       ${filedLines('left join vendor v on v.id = r.vendor_id')}
      group by r.vendor_id, v.name
      order by net_cost desc, v.name nulls last`,
    [build.id],
  );
  return {
    currency: build.currency,
    vendors: rows.map((row) => ({
      vendorId: row.vendor_id,
      vendor: row.vendor,
      receipts: Number(row.receipts),
      spent: money(row.spent, places),
      netCost: money(row.net_cost, places),
    })),
  };
}

interface LineRow {
  line_id: string;
  receipt_id: string;
  purchase_date: string;
  vendor_id: string | null;
  vendor: string | null;
  description: string;
  kind: ReceiptLineKind;
  system_id: string;
  system: string;
  amount: string;
  allocated_tax: string;
  allocated_shipping: string;
  allocated_discount: string;
  line_total: string;
}

/** The lines a figure counts, narrowed to a system, a vendor and a period when asked; unknown ones answer 404. */
export async function linesBehind(em: EntityManager, build: Build, query: LedgerLinesQuery): Promise<LedgerLinesResponse> {
  const places = minorUnits(build.currency);
  const where: string[] = [FIGURE_FILTER[query.figure]];
  const params: unknown[] = [build.id];
  if (query.systemId) {
    const [found] = await em.execute(`select 1 from vehicle_system where id = ? and build_id = ?`, [query.systemId, build.id]);
    if (!found) throw new NotFound('That system');
    where.push('l.system_id = ?');
    params.push(query.systemId);
  }
  if (query.vendorId === 'none') {
    where.push('r.vendor_id is null');
  } else if (query.vendorId) {
    const [found] = await em.execute(`select 1 from vendor where id = ? and build_id = ?`, [query.vendorId, build.id]);
    if (!found) throw new NotFound('That shop');
    where.push('r.vendor_id = ?');
    params.push(query.vendorId);
  }
  if (query.period) {
    where.push(`${WEEK_PATTERN.test(query.period) ? PERIOD_LABEL.week : PERIOD_LABEL.month} = ?`);
    params.push(query.period);
  }
  const rows = await em.execute<LineRow[]>(
    `select l.id as line_id, r.id as receipt_id, to_char(r.purchase_date, 'YYYY-MM-DD') as purchase_date,
            r.vendor_id, v.name as vendor, l.description, l.kind, l.system_id, s.name as system,
            l.amount, l.allocated_tax, l.allocated_shipping, l.allocated_discount, ${LINE_TOTAL} as line_total
       ${filedLines('join vehicle_system s on s.id = l.system_id left join vendor v on v.id = r.vendor_id')}
        and ${where.join(' and ')}
      order by r.purchase_date, r.created_at, r.id, l.position`,
    params,
  );
  const lines: LedgerLineDto[] = rows.map((row) => ({
    lineId: row.line_id,
    receiptId: row.receipt_id,
    purchaseDate: row.purchase_date,
    vendorId: row.vendor_id,
    vendor: row.vendor,
    description: row.description,
    kind: row.kind,
    systemId: row.system_id,
    system: row.system,
    amount: money(row.amount, places),
    allocatedTax: money(row.allocated_tax, places),
    allocatedShipping: money(row.allocated_shipping, places),
    allocatedDiscount: money(row.allocated_discount, places),
    lineTotal: money(row.line_total, places),
  }));
  // Summed before rounding, as the ledger sums its figures, so the total is the figure to the cent.
  const total = sum(rows.map((row) => toDecimal(String(row.line_total))));
  return { currency: build.currency, figure: query.figure, lines, total: toWire(roundHalfUp(total, places), places) };
}
