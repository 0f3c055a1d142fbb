// Receipts of a build: upload (stored in object storage, queued for reading), list with filters, view, edit header.
import { afterCommit } from '../http/request-transaction';
import type { EntityManager } from '@mikro-orm/postgresql';
import { createHash, randomUUID } from 'node:crypto';
import type { ReceiptSummaryDto, UpdateReceiptRequest } from '../../../shared/api/receipts';
import type { ReceiptState, ReviewState } from '../../../shared/enums';
import { type Decimal, fitsMinorUnits, minorUnits } from '../../../shared/money';
import type { User } from '../auth/user.entity';
import type { Build } from '../builds/build.entity';
import { recordAudit } from '../audit/audit';
import { Conflict, Forbidden, NotFound, StaleVersion, ValidationFailed } from '../http/errors';
import type { JobQueue } from '../jobs/queue';
import type { ObjectStore } from '../storage/object-store';
import { isoTimeSql } from '../db/iso-time-sql';
import { preparedRows } from '../db/prepared-rows';
import { LIKELY_DUPLICATES_SQL, summaryDto } from './receipt-dto';
import { ReceiptLine } from './receipt-line.entity';
import { Receipt } from './receipt.entity';
import { Vendor, normalizeVendorName } from './vendor.entity';
import type { SniffedDocument } from './upload-check';

export interface UploadedDocument {
  originalFilename: string;
  bytes: Buffer;
  /** What the upload check found (a mailed message's body is stored as the message itself, message/rfc822). */
  sniffed: Pick<SniffedDocument, 'mime' | 'ext' | 'pages'>;
}

/** Stores one document under the build's key scheme and makes its receipt row (flushed by the caller), queued for reading. */
export async function storeReceiptDocument(em: EntityManager, store: ObjectStore, build: Build, user: User, document: UploadedDocument): Promise<Receipt> {
  const sha256 = createHash('sha256').update(document.bytes).digest('hex');
  const receipt = em.create(Receipt, {
    build,
    uploadedBy: user,
    originalFilename: document.originalFilename.slice(0, 255) || `receipt.${document.sniffed.ext}`,
    documentKey: '',
    contentType: document.sniffed.mime,
    sha256,
    size: document.bytes.length,
    pages: document.sniffed.pages,
  });
  receipt.documentKey = `builds/${build.id}/receipts/${receipt.id}/original.${document.sniffed.ext}`;
  // The document is stored before the row exists, so a row never points at nothing.
  await store.put(receipt.documentKey, document.bytes, document.sniffed.mime);
  return receipt;
}

export async function createReceipts(
  em: EntityManager,
  deps: { store: ObjectStore; queue: JobQueue },
  build: Build,
  user: User,
  documents: UploadedDocument[],
): Promise<Receipt[]> {
  const receipts: Receipt[] = [];
  for (const document of documents) receipts.push(await storeReceiptDocument(em, deps.store, build, user, document));
  await em.flush();
  // Reading starts once the receipts are committed: a worker must find them.
  await afterCommit(em, async () => {
    for (const receipt of receipts) await deps.queue.readReceipt(receipt.id);
  });
  return receipts;
}

export interface ReceiptFilter {
  state?: ReceiptState;
  vendor?: string;
  from?: string;
  to?: string;
  systemId?: string;
  review?: ReviewState;
}

interface ReceiptSummaryRow {
  id: string;
  purchaseDate: string | null;
  receiptNumber: string;
  total: string | null;
  state: ReceiptState;
  readingProgress: number;
  reviewState: Receipt['reviewState'];
  originalFilename: string;
  contentType: string;
  createdAt: string;
  version: number;
  vendorName: string | null;
  uploadedBy: string | null;
  lineCount: number;
  systemIds: string[];
  duplicateOf: string[];
}

/**
 * The list is read as plain rows, not entities: making an entity of every receipt, its shop and its uploader cost
 * most of the route's time under load, and a list only answers.
 */
export async function listReceipts(em: EntityManager, build: Build, filter: ReceiptFilter): Promise<ReceiptSummaryDto[]> {
  // The line counts and systems, and the likely duplicates, come from one aggregate each over the build's rows,
  // joined to the receipts: a subquery per receipt cost several times as much (`npm run bench`, list routes).
  const params: unknown[] = [build.id, build.id, build.id, build.id, build.id, build.id];
  let where = 'r.build_id = ?';
  const and = (condition: string, value: unknown) => {
    where += ` and ${condition}`;
    params.push(value);
  };
  if (filter.state) and('r.state = ?', filter.state);
  if (filter.review) and('r.review_state = ?', filter.review);
  if (filter.vendor) and('v.normalized_name like ?', `%${normalizeVendorName(filter.vendor)}%`);
  if (filter.from) and('r.purchase_date >= ?', filter.from);
  if (filter.to) and('r.purchase_date <= ?', filter.to);
  if (filter.systemId) and('r.id in (select l.receipt_id from receipt_line l where l.system_id = ?)', filter.systemId);
  const rows = await preparedRows<ReceiptSummaryRow>(
    em,
    `select r.id, r.purchase_date as "purchaseDate", r.receipt_number as "receiptNumber", r.total, r.state,
            r.reading_progress as "readingProgress", r.review_state as "reviewState", r.original_filename as "originalFilename",
            r.content_type as "contentType", ${isoTimeSql('r.created_at')} as "createdAt", r.version, v.name as "vendorName", u.display_name as "uploadedBy",
            coalesce(lines.count, 0) as "lineCount", coalesce(lines.systems, '{}') as "systemIds", coalesce(duplicates.others, '{}') as "duplicateOf"
       from receipt r
       left join vendor v on v.id = r.vendor_id
       join app_user u on u.id = r.uploaded_by_id
       left join (select l.receipt_id, count(*)::int as count, array_remove(array_agg(distinct l.system_id), null) as systems
                    from receipt_line l where l.build_id = ? group by l.receipt_id) lines on lines.receipt_id = r.id
       left join (${LIKELY_DUPLICATES_SQL}) duplicates on duplicates.id = r.id
      where ${where}
      order by r.purchase_date desc nulls first, r.created_at desc`,
    params,
  );
  // Field by field, not by rest and spread of the row: those cost several times the rest of the mapping together
  // (`npm run bench`, list routes).
  return rows.map((row) =>
    summaryDto(
      {
        id: row.id,
        purchaseDate: row.purchaseDate,
        receiptNumber: row.receiptNumber,
        total: row.total,
        state: row.state,
        readingProgress: row.readingProgress,
        reviewState: row.reviewState,
        originalFilename: row.originalFilename,
        contentType: row.contentType,
        createdAt: row.createdAt,
        version: row.version,
        build,
        vendor: row.vendorName === null ? null : { name: row.vendorName },
        uploadedBy: { displayName: row.uploadedBy },
      },
      { lineCount: row.lineCount, duplicateOf: row.duplicateOf, systemIds: row.systemIds },
    ),
  );
}

export async function findReceipt(em: EntityManager, build: Build, receiptId: string): Promise<Receipt> {
  const receipt = await em.findOne(Receipt, { id: receiptId, build }, { populate: ['vendor', 'uploadedBy', 'build'] });
  if (!receipt) throw new NotFound('That receipt');
  return receipt;
}

/** Crew edit until the receipt is filed; the owner edits always (each change to money is audited). */
export function assertEditable(receipt: Receipt, role: string): void {
  if (role === 'reviewer') throw new Forbidden();
  // Filing derived the lines' shares of tax and shipping, the cores and the refunds from what the receipt said then;
  // a change afterwards would leave them stale, so a filed receipt changes only after it is reopened and filed again.
  if (receipt.state === 'filed' && role !== 'owner') throw new Forbidden('This receipt is filed: only the owner can reopen it to change it.');
  if (receipt.state === 'filed') throw new Conflict('This receipt is filed. Reopen it to change it, then file it again.');
  if (receipt.state === 'queued' || receipt.state === 'reading') throw new ValidationFailed({ state: 'Wait until the receipt has been read.' }, 'The receipt is still being read.');
}

export async function vendorNamed(em: EntityManager, build: Build, name: string): Promise<Vendor | null> {
  const trimmed = name.trim();
  const normalizedName = normalizeVendorName(trimmed);
  if (!normalizedName) return null;
  const known = await em.findOne(Vendor, { build, normalizedName });
  if (known) return known;
  // Two readings of a new shop's receipts at once: ON CONFLICT DO NOTHING waits for the other to commit, then the
  // lookup finds its row, instead of one reading failing on the unique name.
  await em.execute(
    'insert into vendor (id, build_id, name, normalized_name) values (?, ?, ?, ?) on conflict (build_id, normalized_name) do nothing',
    [randomUUID(), build.id, trimmed, normalizedName],
    'run',
    em.getTransactionContext(),
  );
  return em.findOneOrFail(Vendor, { build, normalizedName });
}

const MONEY_FIELDS = ['subtotal', 'tax', 'shipping', 'discount', 'total'] as const;

export function moneySnapshot(receipt: Receipt): Record<string, string | null> {
  return Object.fromEntries(MONEY_FIELDS.map((field) => [field, receipt[field]?.toString() ?? null]));
}

export async function updateReceipt(
  em: EntityManager,
  receipt: Receipt,
  user: User,
  role: string,
  input: Omit<UpdateReceiptRequest, (typeof MONEY_FIELDS)[number]> & Partial<Record<(typeof MONEY_FIELDS)[number], Decimal | null>>,
): Promise<Receipt> {
  assertEditable(receipt, role);
  if (receipt.version !== input.version) throw new StaleVersion('This receipt');
  const currency = receipt.build.currency;
  const places = minorUnits(currency);
  const fields: Record<string, string> = {};
  for (const field of MONEY_FIELDS) {
    const value = input[field];
    if (value && !fitsMinorUnits(value, currency)) fields[field] = `${currency} amounts have ${places === 0 ? 'no decimals' : `at most ${places} decimals`}.`;
  }
  if (Object.keys(fields).length) throw new ValidationFailed(fields);
  const before = moneySnapshot(receipt);
  if (input.vendorName !== undefined) receipt.vendor = await vendorNamed(em, receipt.build, input.vendorName);
  if (input.purchaseDate !== undefined) receipt.purchaseDate = input.purchaseDate;
  if (input.receiptNumber !== undefined) receipt.receiptNumber = input.receiptNumber;
  for (const field of MONEY_FIELDS) if (input[field] !== undefined) receipt[field] = input[field] ?? null;
  const after = moneySnapshot(receipt);
  if (JSON.stringify(before) !== JSON.stringify(after)) {
    recordAudit(em, { build: receipt.build, user, entity: 'receipt', entityId: receipt.id, receiptId: receipt.id, action: 'edit', before, after });
  }
  await em.flush();
  return receipt;
}
