// Turns receipts and their lines into the API's shapes, with reconciliation and likely duplicates.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { ReceiptDto, ReceiptLineDto, ReceiptSummaryDto } from '../../../shared/api/receipts';
import type { BuildRole } from '../../../shared/enums';
import { Decimal, minorUnits, storedToWire, toWire } from '../../../shared/money';
import { reconcile } from '../../../shared/receipt-math';
import { ReceiptLine } from './receipt-line.entity';
import { Receipt } from './receipt.entity';
import { suggestWarranty } from './warranty-suggestion';

/** A figure of a loaded entity (Decimal) or of a row read straight from SQL (stored text), as wire text. */
const money = (value: Decimal | string | null, places: number) =>
  value === null ? null : typeof value === 'string' ? storedToWire(value, places) : toWire(value, places);

export function lineDto(line: ReceiptLine, currency: string): ReceiptLineDto {
  const places = minorUnits(currency);
  return {
    id: line.id,
    position: line.position,
    kind: line.kind,
    description: line.description,
    partNumber: line.partNumber,
    quantity: toWire(line.quantity),
    unitPrice: line.unitPrice === null ? null : toWire(line.unitPrice),
    amount: toWire(line.amount, places),
    taxable: line.taxable,
    allocatedTax: toWire(line.allocatedTax, places),
    allocatedShipping: toWire(line.allocatedShipping, places),
    allocatedDiscount: toWire(line.allocatedDiscount, places),
    partId: line.part?.id ?? null,
    partDescription: line.part && line.part.description !== undefined ? line.part.description : null,
    systemId: line.system?.id ?? null,
    returnOfLineId: line.returnOf?.id ?? null,
    box: line.box,
    confidence: line.confidence ?? {},
    warrantySuggestion: line.kind === 'part' ? suggestWarranty(line.description) : null,
    version: line.version,
  };
}

/**
 * The likely duplicates among build ?'s receipts, as rows (id, others): for each receipt with any, the ids of the
 * other receipts of the build with the same document, or the same shop, date and total, oldest first, less the
 * pairs someone marked as two purchases (stored in id order, hence least/greatest). Takes the build's id four times.
 * Two equality joins over the build's receipts, one per kind of likeness: a subquery per receipt with either
 * condition cost the receipts list most of its time in PostgreSQL (`npm run bench`, list routes).
 */
export const LIKELY_DUPLICATES_SQL = `select pair.id, array_agg(pair.other_id order by pair.other_created_at, pair.other_id) as others
  from (select a.id, o.id as other_id, o.created_at as other_created_at
          from receipt a join receipt o on o.sha256 = a.sha256
         where a.build_id = ? and o.build_id = ? and o.id <> a.id
        union
        select a.id, o.id, o.created_at
          from receipt a join receipt o on o.vendor_id = a.vendor_id and o.purchase_date = a.purchase_date and o.total = a.total
         where a.build_id = ? and o.build_id = ? and o.id <> a.id) pair
 where not exists (select 1 from not_duplicate d where d.first_id = least(pair.id, pair.other_id) and d.second_id = greatest(pair.id, pair.other_id))
 group by pair.id`;

/** The likely duplicates of each of the receipts (see LIKELY_DUPLICATES_SQL). */
export async function findDuplicates(em: EntityManager, buildId: string, receiptIds: string[]): Promise<Map<string, string[]>> {
  const result = new Map<string, string[]>(receiptIds.map((id) => [id, []]));
  if (receiptIds.length === 0) return result;
  const rows: { id: string; others: string[] }[] = await em.execute(
    `select d.id, d.others from (${LIKELY_DUPLICATES_SQL}) d where d.id = any(?::uuid[])`,
    [buildId, buildId, buildId, buildId, `{${receiptIds.join(',')}}`],
  );
  for (const row of rows) result.set(row.id, row.others);
  return result;
}

/** What a receipt's summary is made of: a loaded Receipt, or a row of the list read straight from SQL. */
export type ReceiptSummaryFields = Pick<
  Receipt,
  | 'id' | 'purchaseDate' | 'receiptNumber' | 'state' | 'readingProgress' | 'reviewState' | 'originalFilename'
  | 'contentType' | 'version'
> & {
  /** A Date, or the list's ISO text made by PostgreSQL (isoTimeSql). */
  createdAt: Date | string;
  total: Decimal | string | null;
  build: { currency: string };
  vendor?: { name: string } | null;
  uploadedBy: { displayName?: string | null };
};

export function summaryDto(receipt: ReceiptSummaryFields, extra: { lineCount: number; duplicateOf: string[]; systemIds: string[] }): ReceiptSummaryDto {
  const places = minorUnits(receipt.build.currency);
  return {
    id: receipt.id,
    vendorName: receipt.vendor?.name ?? null,
    purchaseDate: receipt.purchaseDate ?? null,
    receiptNumber: receipt.receiptNumber,
    total: money(receipt.total, places),
    state: receipt.state,
    readingProgress: receipt.readingProgress,
    reviewState: receipt.reviewState,
    originalFilename: receipt.originalFilename,
    contentType: receipt.contentType,
    lineCount: extra.lineCount,
    duplicateOf: extra.duplicateOf,
    systemIds: extra.systemIds,
    uploadedBy: receipt.uploadedBy.displayName ?? '',
    createdAt: typeof receipt.createdAt === 'string' ? receipt.createdAt : receipt.createdAt.toISOString(),
    version: receipt.version,
  };
}

export async function receiptDto(em: EntityManager, receipt: Receipt, role: BuildRole): Promise<ReceiptDto> {
  const currency = receipt.build.currency;
  const places = minorUnits(currency);
  const lines = await em.find(ReceiptLine, { receipt }, { populate: ['part'], orderBy: { position: 'asc', createdAt: 'asc' } });
  await em.populate(receipt, ['reading', 'uploadedBy', 'vendor']);
  const duplicates = await findDuplicates(em, receipt.build.id, [receipt.id]);
  const reading = (receipt.reading ?? {}) as { fieldConfidence?: Record<string, number>; notes?: string[] };
  const rec = reconcile(lines, receipt);
  // A filed receipt is read-only for everyone until the owner reopens it: its allocations and cores follow its lines.
  const editable = (role === 'owner' || role === 'crew') && receipt.state !== 'filed';
  return {
    ...summaryDto(receipt, {
      lineCount: lines.length,
      duplicateOf: duplicates.get(receipt.id) ?? [],
      systemIds: [...new Set(lines.map((l) => l.system?.id).filter((id): id is string => !!id))],
    }),
    currency,
    locale: receipt.build.locale,
    subtotal: money(receipt.subtotal, places),
    tax: money(receipt.tax, places),
    shipping: money(receipt.shipping, places),
    discount: money(receipt.discount, places),
    differenceAccepted: receipt.differenceAccepted,
    differenceReason: receipt.differenceReason,
    readingError: receipt.readingError,
    reviewComment: receipt.reviewComment,
    pages: receipt.pageImages.map((page, index) => ({ index, width: page.width, height: page.height })),
    fieldConfidence: reading.fieldConfidence ?? {},
    readingNotes: reading.notes ?? [],
    lines: lines.map((line) => lineDto(line, currency)),
    reconciliation: {
      linesTotal: toWire(rec.linesTotal, places),
      computedTotal: toWire(rec.computedTotal, places),
      printedTotal: money(rec.printedTotal, places),
      difference: money(rec.difference, places),
      reconciles: rec.reconciles,
    },
    editable,
  };
}
