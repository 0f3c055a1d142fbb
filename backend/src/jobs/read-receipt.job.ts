// Reads one queued receipt: fetches the document, reads it, stores the page images and replaces the receipt's
// lines in one transaction. A retry after a crash starts over and never doubles lines.
import { LockMode } from '@mikro-orm/core';
import type { EntityManager, MikroORM } from '@mikro-orm/postgresql';
import type { ReadReceipt } from '../../../shared/api/receipt-reading';
import { Decimal, fitsMinorUnits, parseMoney } from '../../../shared/money';
import { ReceiptLine } from '../receipts/receipt-line.entity';
import { Receipt } from '../receipts/receipt.entity';
import { vendorNamed } from '../receipts/receipts.service';
import { Vendor } from '../receipts/vendor.entity';
import { earliestReceiptDay } from '../receipts/reading/receipt-date';
import { UnreadableDocumentError } from '../receipts/reading/sniff';
import type { ObjectStore } from '../storage/object-store';

export interface PageImage {
  png: Buffer;
  width: number;
  height: number;
}

export interface DocumentReading {
  reading: ReadReceipt;
  pageImages: PageImage[];
}

/** What the build knows that helps reading: its currency's decimals, the upload day, the shops it has seen. */
export interface ReadingContext {
  currency: string;
  /** ISO date the receipt was uploaded: no receipt is dated after it. */
  readOn: string;
  /** ISO date before which no receipt of this build can be dated. */
  notBefore?: string;
  knownVendors: string[];
  /** The stored document's type (a mailed message is read from its body). */
  contentType?: string;
}

export type DocumentReader = (bytes: Buffer, locale: string, context?: ReadingContext) => Promise<DocumentReading>;

export interface ReadReceiptDeps {
  orm: MikroORM;
  store: ObjectStore;
  read: DocumentReader;
}

/** Money the reading found, kept only when it is an amount the build's currency can hold. */
function readMoney(text: string | null, currency: string): Decimal | null {
  if (text === null) return null;
  const parsed = parseMoney(text, { maxDecimals: 4 });
  return parsed.ok && fitsMinorUnits(parsed.value, currency) ? parsed.value : null;
}

async function setProgress(em: EntityManager, receiptId: string, progress: number): Promise<void> {
  await em.nativeUpdate(Receipt, { id: receiptId }, { readingProgress: progress });
}

/** The facts that agreed on the total, as one sentence for the check screen. */
function agreementNotes(reading: ReadReceipt): string[] {
  const agreements = reading.agreements ?? [];
  if (reading.total.value === null || agreements.length === 0) return [];
  return [`Total ${reading.total.value}: ${agreements.join('; ')}.`];
}

/** Returns what happened, for logs and tests. */
export async function readQueuedReceipt(deps: ReadReceiptDeps, receiptId: string, finalAttempt: boolean): Promise<'read' | 'skipped' | 'failed'> {
  const em = deps.orm.em.fork();
  const receipt = await em.findOne(Receipt, { id: receiptId }, { populate: ['build'] });
  // Already read (a duplicate or late retry): nothing to do, so nothing doubles.
  if (!receipt || (receipt.state !== 'queued' && receipt.state !== 'reading')) return 'skipped';
  receipt.state = 'reading';
  receipt.readingProgress = 10;
  await em.flush();

  let result: DocumentReading;
  try {
    const bytes = await deps.store.get(receipt.documentKey);
    await setProgress(em, receipt.id, 25);
    const knownVendors = (await em.find(Vendor, { build: receipt.build }, { fields: ['name'], limit: 500 })).map((vendor) => vendor.name);
    result = await deps.read(bytes, receipt.build.locale, {
      currency: receipt.build.currency,
      readOn: receipt.createdAt.toISOString().slice(0, 10),
      notBefore: earliestReceiptDay(receipt.build.startedOn) ?? undefined,
      knownVendors,
      contentType: receipt.contentType,
    });
  } catch (error) {
    console.error(`[worker] reading receipt ${receipt.id} failed:`, error);
    if (error instanceof UnreadableDocumentError || finalAttempt) {
      await em.nativeUpdate(Receipt, { id: receipt.id }, {
        state: 'failed',
        readingProgress: 100,
        readingError: error instanceof UnreadableDocumentError ? error.message : 'The receipt could not be read. Enter its lines by hand, or upload a sharper photo.',
      });
      return 'failed';
    }
    throw error;
  }
  await setProgress(em, receipt.id, 85);
  const pageImages: { key: string; width: number; height: number }[] = [];
  for (const [index, page] of result.pageImages.entries()) {
    const key = `builds/${receipt.build.id}/receipts/${receipt.id}/page-${index + 1}.png`;
    await deps.store.put(key, page.png, 'image/png');
    pageImages.push({ key, width: page.width, height: page.height });
  }
  const reading = result.reading;
  const currency = receipt.build.currency;
  await em.transactional(async (tx) => {
    const locked = await tx.findOneOrFail(Receipt, { id: receipt.id }, { populate: ['build'], lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true });
    if (locked.state !== 'reading') return;
    // Lines from an earlier, interrupted attempt go; the reading's lines replace them.
    await tx.nativeDelete(ReceiptLine, { receipt: locked });
    // Nothing the reading found vanishes silently: a line the currency cannot hold, or a quantity that is not a
    // number, leaves a note for the person checking.
    const jobNotes: string[] = [];
    reading.lines.forEach((line, position) => {
      const amount = readMoney(line.amount, currency);
      if (amount === null) {
        jobNotes.push(`A line "${line.description.slice(0, 60)}" reads ${line.amount}, which is not an amount in ${currency}; it was left out. Add it by hand if it belongs.`);
        return;
      }
      const quantityRead = parseMoney(line.quantity, { maxDecimals: 4 }).ok;
      if (!quantityRead) jobNotes.push(`The quantity of "${line.description.slice(0, 60)}" reads "${line.quantity}"; 1 was entered. Check it.`);
      tx.create(ReceiptLine, {
        build: locked.build,
        receipt: locked,
        position,
        kind: line.kind,
        description: line.description.slice(0, 300) || '(no description read)',
        partNumber: (line.partNumber ?? '').slice(0, 80),
        quantity: quantityRead ? new Decimal(line.quantity) : new Decimal(1),
        unitPrice: line.unitPrice === null ? null : (readMoney(line.unitPrice, currency) ?? null),
        amount,
        box: line.box,
        confidence: { line: line.confidence },
      });
    });
    if (reading.vendor.value) locked.vendor = await vendorNamed(tx, locked.build, reading.vendor.value.slice(0, 120));
    locked.purchaseDate = reading.date.value;
    locked.subtotal = readMoney(reading.subtotal.value, currency);
    locked.tax = readMoney(reading.tax.value, currency);
    locked.shipping = readMoney(reading.shipping.value, currency);
    locked.discount = readMoney(reading.discount.value, currency);
    locked.total = readMoney(reading.total.value, currency);
    locked.pageImages = pageImages;
    locked.extractedText = reading.words.map((w) => w.text).join(' ');
    locked.reading = {
      fieldConfidence: {
        vendor: reading.vendor.confidence,
        date: reading.date.confidence,
        // Most slips print no subtotal, shipping or discount: a field the reader found nothing for is not a doubt.
        subtotal: reading.subtotal.value === null ? 1 : reading.subtotal.confidence,
        tax: reading.tax.confidence,
        shipping: reading.shipping.value === null ? 1 : reading.shipping.confidence,
        discount: reading.discount.value === null ? 1 : reading.discount.confidence,
        total: reading.total.confidence,
      },
      notes: [...agreementNotes(reading), ...reading.notes, ...jobNotes],
      currency: reading.currency.value,
      words: reading.words,
    };
    locked.state = 'to_check';
    locked.readingProgress = 100;
    locked.readingError = null;
  });
  return 'read';
}
