// Returns of a build: part lines that can still go back, those sent back awaiting their refund, and those refunded.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { AwaitingRefundItemDto, RefundedItemDto, ReturnableItemDto, ReturnsDto } from '../../../shared/api/receipts';
import type { PartStatus } from '../../../shared/enums';
import { minorUnits, roundHalfUp, toDecimal, toWire } from '../../../shared/money';
import type { Build } from '../builds/build.entity';
import { FIGURE_FILTER, LINE_TOTAL, filedLines } from '../ledger/figure-lines';

/** A returnable line stays listed this many days after its window closed, marked closed, so a late return is still in sight (our choice). */
export const CLOSED_WINDOW_GRACE_DAYS = 14;

/**
 * The one rule for "this part line can still go back", shared with the return-window alerts: a part line of a filed
 * receipt whose part is not fitted, sent back or sold, and that no return line (filed or not) points at yet.
 * Aliases: l (line), r (its receipt), p (its part, joined on l.part_id).
 */
export const RETURNABLE_LINE = `(l.kind = 'part' and r.state = 'filed'
       and p.status not in ('installed', 'returned', 'sold')
       and not exists (select 1 from receipt_line rl where rl.return_of_id = l.id))`;

/** The last day a line can go back: its purchase date + the build's return window. Aliases: r (receipt), b (build). */
export const RETURNABLE_UNTIL = `(r.purchase_date + b.return_window_days)`;

interface LineRow {
  line_id: string;
  receipt_id: string;
  vendor_name: string | null;
  purchase_date: string;
  description: string;
  part_number: string;
  paid: string;
  part_id: string | null;
  part_version: number | null;
  part_status: PartStatus | null;
}

/** What every list shows of a line; `part` is the alias its part is joined under. */
const lineColumns = (part: string) => `l.id as line_id, r.id as receipt_id, v.name as vendor_name, r.purchase_date::text as purchase_date,
       coalesce(${part}.description, l.description) as description,
       coalesce(nullif(${part}.part_number, ''), l.part_number) as part_number,
       ${LINE_TOTAL} as paid, ${part}.id as part_id, ${part}.version as part_version, ${part}.status as part_status`;

const RETURNABLE = `
  select ${lineColumns('p')}, ${RETURNABLE_UNTIL}::text as returnable_until, ${RETURNABLE_UNTIL} < ?::date as window_closed
    from receipt_line l
    join receipt r on r.id = l.receipt_id
    join build b on b.id = l.build_id
    join part p on p.id = l.part_id
    left join vendor v on v.id = r.vendor_id
   where l.build_id = ? and ${RETURNABLE_LINE} and ${RETURNABLE_UNTIL} >= ?::date - ${CLOSED_WINDOW_GRACE_DAYS}
   order by ${RETURNABLE_UNTIL}, r.purchase_date, l.position, l.id`;

// The ledger's own rows and condition, so the awaiting list always adds up to the ledger's figure.
const AWAITING = `
  select ${lineColumns('pa')}
    ${filedLines('join part pa on pa.id = l.part_id left join vendor v on v.id = r.vendor_id')}
     and ${FIGURE_FILTER.returnsAwaitingRefund}
   order by r.purchase_date, l.position, l.id`;

// The complement of the ledger's "awaiting": a filed return line points at the line or at its part. Several return
// slips for one line are added up and the latest is named.
const REFUND_OF_LINE = `
    left join part pa on pa.id = l.part_id
    left join vendor v on v.id = r.vendor_id
    cross join lateral (
      select (array_agg(rr.id order by rr.purchase_date desc nulls last, rr.id desc))[1] as receipt_id,
             max(rr.purchase_date)::text as refund_date,
             -sum(rl.amount + rl.allocated_tax + rl.allocated_shipping - rl.allocated_discount) as refunded,
             count(*) as found
        from receipt_line rl join receipt rr on rr.id = rl.receipt_id and rr.state = 'filed'
       where rl.kind = 'return' and (rl.return_of_id = l.id or rl.part_id = l.part_id)
    ) refund`;

const REFUNDED = `
  select ${lineColumns('pa')}, refund.receipt_id as refund_receipt_id, refund.refund_date, refund.refunded
    ${filedLines(REFUND_OF_LINE)}
     and l.kind = 'part' and refund.found > 0
   order by refund.refund_date desc nulls last, r.purchase_date, l.id`;

/** Today's date in UTC, the server's calendar (as the alerts use). */
export function utcToday(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

export async function listReturns(em: EntityManager, build: Build, today = utcToday()): Promise<ReturnsDto> {
  const places = minorUnits(build.currency);
  const money = (value: string) => toWire(roundHalfUp(toDecimal(String(value)), places), places);
  const line = (row: LineRow) => ({
    lineId: row.line_id,
    receiptId: row.receipt_id,
    vendorName: row.vendor_name,
    purchaseDate: row.purchase_date,
    description: row.description,
    partNumber: row.part_number,
    amountPaid: money(row.paid),
  });
  const part = (row: LineRow) => ({ partId: row.part_id!, partVersion: row.part_version!, partStatus: row.part_status! });

  const returnableRows = await em.execute<(LineRow & { returnable_until: string; window_closed: boolean })[]>(RETURNABLE, [today, build.id, today]);
  const awaitingRows = await em.execute<LineRow[]>(AWAITING, [build.id]);
  const refundedRows = await em.execute<(LineRow & { refund_receipt_id: string; refund_date: string | null; refunded: string })[]>(REFUNDED, [build.id]);

  const returnable: ReturnableItemDto[] = returnableRows.map((row) => ({
    ...line(row),
    ...part(row),
    returnableUntil: row.returnable_until,
    windowClosed: row.window_closed,
  }));
  const awaitingRefund: AwaitingRefundItemDto[] = awaitingRows.map((row) => ({ ...line(row), ...part(row) }));
  const refunded: RefundedItemDto[] = refundedRows.map((row) => ({
    ...line(row),
    partId: row.part_id,
    partVersion: row.part_version,
    partStatus: row.part_status,
    refundReceiptId: row.refund_receipt_id,
    refundDate: row.refund_date,
    refundedAmount: money(row.refunded),
  }));
  return { returnable, awaitingRefund, refunded };
}
