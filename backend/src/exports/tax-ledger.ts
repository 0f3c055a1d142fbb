// The tax ledger: one row per money line of the build's filed receipts, streamed straight from PostgreSQL.
import type { EntityManager } from '@mikro-orm/postgresql';
import { pipeline, type Readable } from 'node:stream';
import { minorUnits, storedToWire } from '../../../shared/money';
import type { Build } from '../builds/build.entity';
import { csvEncoder, neutralise } from './csv';

export const TAX_LEDGER_COLUMNS = [
  'date', 'vendor', 'receipt number', 'description', 'part number', 'system', 'kind', 'quantity', 'unit price',
  'amount', 'allocated tax', 'allocated shipping', 'allocated discount', 'net', 'currency', 'review state',
];

export interface ExportFilter {
  from?: string;
  to?: string;
  systemId?: string;
}

/** One row as the query reads it, in `select` order (rows come as arrays: no object per row). */
type LedgerRow = [
  purchaseDate: string | null,
  vendor: string | null,
  receiptNumber: string,
  description: string,
  partNumber: string,
  system: string | null,
  kind: string,
  quantity: string,
  unitPrice: string | null,
  amount: string,
  allocatedTax: string,
  allocatedShipping: string,
  allocatedDiscount: string,
  net: string,
  reviewState: string,
];

function ledgerQuery(em: EntityManager, build: Build, filter: ExportFilter) {
  const knex = em.getKnex();
  const query = knex('receipt_line as l')
    .join('receipt as r', 'r.id', 'l.receipt_id')
    .leftJoin('vendor as v', 'v.id', 'r.vendor_id')
    .leftJoin('vehicle_system as s', 's.id', 'l.system_id')
    .where('l.build_id', build.id)
    .andWhere('r.state', 'filed')
    .select(
      knex.raw(`to_char(r.purchase_date, 'YYYY-MM-DD') as purchase_date`),
      'v.name as vendor',
      'r.receipt_number',
      'l.description',
      'l.part_number',
      's.name as system',
      'l.kind',
      'l.quantity',
      'l.unit_price',
      'l.amount',
      'l.allocated_tax',
      'l.allocated_shipping',
      'l.allocated_discount',
      // numeric addition is exact; the sum is rounded to the currency by storedToWire below, as toWire would.
      knex.raw('l.amount + l.allocated_tax + l.allocated_shipping - l.allocated_discount as net'),
      'r.review_state',
    )
    .orderBy([{ column: 'r.purchase_date' }, { column: 'r.created_at' }, { column: 'l.position' }]);
  if (filter.from) query.andWhere('r.purchase_date', '>=', filter.from);
  if (filter.to) query.andWhere('r.purchase_date', '<=', filter.to);
  if (filter.systemId) query.andWhere('l.system_id', filter.systemId);
  return query;
}

/** Rows fetched from the cursor per round trip: 100 (the default) spent most of the export waiting on them. */
const CURSOR_BATCH_ROWS = 2000;

/** Rows go from a database cursor through the CSV encoder to the response: memory stays flat at any size. */
export function taxLedgerCsv(em: EntityManager, build: Build, filter: ExportFilter): Readable {
  const places = minorUnits(build.currency);
  const rows = ledgerQuery(em, build, filter).stream({ batchSize: CURSOR_BATCH_ROWS, rowMode: 'array' }) as unknown as Readable;
  const csv = csvEncoder(TAX_LEDGER_COLUMNS, (row: LedgerRow) => {
    const [purchaseDate, vendor, receiptNumber, description, partNumber, system, kind, quantity, unitPrice, amount, tax, shipping, discount, net, reviewState] = row;
    return [
      purchaseDate ?? '',
      neutralise(vendor ?? ''),
      neutralise(receiptNumber),
      neutralise(description),
      neutralise(partNumber),
      neutralise(system ?? ''),
      kind,
      storedToWire(quantity),
      unitPrice === null ? '' : storedToWire(unitPrice),
      storedToWire(amount, places),
      storedToWire(tax, places),
      storedToWire(shipping, places),
      storedToWire(discount, places),
      storedToWire(net, places),
      build.currency,
      reviewState,
    ];
  });
  // pipeline ends the CSV on a database error, and closes the cursor (giving its connection back) when the download
  // is abandoned half-way and the CSV destroyed.
  return pipeline(rows, csv, () => undefined);
}
