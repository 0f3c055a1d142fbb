// The tax ledger: one row per money line of the build's filed receipts, streamed straight from PostgreSQL.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Readable } from 'node:stream';
import { minorUnits, toDecimal, toWire } from '../../../shared/money';
import type { Build } from '../builds/build.entity';
import { csvStringifier, neutralise } from './csv';

export const TAX_LEDGER_COLUMNS = [
  'date', 'vendor', 'receipt number', 'description', 'part number', 'system', 'kind', 'quantity', 'unit price',
  'amount', 'allocated tax', 'allocated shipping', 'allocated discount', 'net', 'currency', 'review state',
];

export interface ExportFilter {
  from?: string;
  to?: string;
  systemId?: string;
}

interface LedgerRow {
  purchase_date: string | null;
  vendor: string | null;
  receipt_number: string;
  description: string;
  part_number: string;
  system: string | null;
  kind: string;
  quantity: string;
  unit_price: string | null;
  amount: string;
  allocated_tax: string;
  allocated_shipping: string;
  allocated_discount: string;
  review_state: string;
}

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
      'r.review_state',
    )
    .orderBy([{ column: 'r.purchase_date' }, { column: 'r.created_at' }, { column: 'l.position' }]);
  if (filter.from) query.andWhere('r.purchase_date', '>=', filter.from);
  if (filter.to) query.andWhere('r.purchase_date', '<=', filter.to);
  if (filter.systemId) query.andWhere('l.system_id', filter.systemId);
  return query;
}

/** Rows go from a database cursor through the CSV writer to the response: memory stays flat at any size. */
export function taxLedgerCsv(em: EntityManager, build: Build, filter: ExportFilter): Readable {
  const places = minorUnits(build.currency);
  const money = (value: string) => toWire(toDecimal(String(value)), places);
  const csv = csvStringifier(TAX_LEDGER_COLUMNS);
  const rows = ledgerQuery(em, build, filter).stream() as unknown as Readable;
  rows.on('data', (row: LedgerRow) => {
    const net = toDecimal(String(row.amount)).plus(toDecimal(String(row.allocated_tax))).plus(toDecimal(String(row.allocated_shipping))).minus(toDecimal(String(row.allocated_discount)));
    const ok = csv.write([
      row.purchase_date ?? '',
      neutralise(row.vendor ?? ''),
      neutralise(row.receipt_number),
      neutralise(row.description),
      neutralise(row.part_number),
      neutralise(row.system ?? ''),
      row.kind,
      toWire(toDecimal(String(row.quantity))),
      row.unit_price === null ? '' : toWire(toDecimal(String(row.unit_price))),
      money(row.amount),
      money(row.allocated_tax),
      money(row.allocated_shipping),
      money(row.allocated_discount),
      toWire(net, places),
      build.currency,
      row.review_state,
    ]);
    if (!ok) {
      rows.pause();
      csv.once('drain', () => rows.resume());
    }
  });
  rows.on('end', () => csv.end());
  rows.on('error', (error) => csv.destroy(error));
  // A download abandoned half-way destroys the CSV: the cursor must go too, or it holds its connection for good.
  csv.on('close', () => rows.destroy());
  return csv;
}
