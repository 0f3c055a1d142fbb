// The one entry point of receipt reading: bytes in (photo, PDF or a mailed message's body), a ReadReceipt out.
import type { ReadReceipt } from '../../../../shared/api/receipt-reading';
import { NormalisedImage, normaliseImage } from './normalise';
import { minorUnits } from '../../../../shared/money';
import { OcrPool, modelFor } from './ocr';
import { parseReceipt } from './parse-receipt';
import { MAIL_CONTENT_TYPE, mailTextPage } from './mail-text';
import { readPdfPages } from './pdf-text';
import { lookAgainAtDate } from './date-look';
import { lookAgainAtHeading } from './heading-look';
import { dateLimits } from './receipt-date';
import { BAND_SCALES, figuresSettled, linesAddUp, rereadSummaryBand, secondLookBetter } from './second-look';
import { sniffReceiptType } from './sniff';
import type { TextPage } from './text-lines';

export interface ReadOptions {
  /** BCP 47 tag of the build, e.g. "en-US" (month first) or "en-GB" (day first). */
  locale?: string;
  /** ISO 4217 code of the build's currency: how many decimals its amounts carry. */
  currency?: string;
  /** ISO date the receipt was uploaded: no receipt is dated after it. */
  readOn?: string;
  /** ISO date before which no receipt of this build can be dated (see earliestReceiptDay). */
  notBefore?: string;
  /** Shops the build already knows. */
  knownVendors?: string[];
  /** The stored document's type when it is known; only a mailed message (message/rfc822) is read by it, not sniffed. */
  contentType?: string;
}

export const DEFAULT_LOCALE = 'en-US';

const pools = new Map<string, OcrPool>();
let poolSize = Number(process.env['RECEIPT_OCR_WORKERS'] ?? 1) || 1;

/** The process's OCR workers for a locale's language, started on first use and kept for every later document. */
export function ocrPool(locale = DEFAULT_LOCALE): OcrPool {
  const model = modelFor(locale);
  let pool = pools.get(model.language);
  if (!pool) {
    pool = new OcrPool(poolSize, model);
    pools.set(model.language, pool);
  }
  return pool;
}

/** Sets how many OCR workers the next pool starts with (1–2 fit two cores). */
export function setOcrWorkers(count: number): void {
  poolSize = Math.max(1, Math.min(4, Math.floor(count)));
}

/** Stops the OCR workers; a later read starts them again. */
export async function closeReaders(): Promise<void> {
  const current = [...pools.values()];
  pools.clear();
  await Promise.all(current.map((pool) => pool.close()));
}

export function checkLocale(locale: string): string {
  try {
    return Intl.getCanonicalLocales(locale)[0];
  } catch {
    throw new RangeError(`"${locale}" is not a language tag; use one such as en-US or en-GB.`);
  }
}

export interface DocumentRead {
  reading: ReadReceipt;
  /** The prepared page images the OCR read (null for PDF pages read from their text layer). */
  images: Array<NormalisedImage | null>;
}

export async function readDocument(bytes: Buffer, options: ReadOptions = {}): Promise<ReadReceipt> {
  return (await readDocumentWithImages(bytes, options)).reading;
}

export async function readDocumentWithImages(bytes: Buffer, options: ReadOptions = {}): Promise<DocumentRead> {
  const locale = checkLocale(options.locale ?? DEFAULT_LOCALE);
  const parseOptions = {
    locale,
    minorUnits: options.currency ? minorUnits(options.currency) : undefined,
    readOn: options.readOn,
    notBefore: options.notBefore,
    knownVendors: options.knownVendors,
  };
  if (options.contentType === MAIL_CONTENT_TYPE) return { reading: parseReceipt([await mailTextPage(bytes)], parseOptions), images: [] };
  const type = await sniffReceiptType(bytes);
  const pages: TextPage[] = [];
  const images: Array<NormalisedImage | null> = [];
  const pool = ocrPool(locale);
  if (type === 'pdf') {
    const pdfPages = await readPdfPages(bytes);
    for (const [index, pdfPage] of pdfPages.entries()) {
      if (pdfPage.text) {
        pages.push(pdfPage.text);
        images.push(null);
        continue;
      }
      const image = await normaliseImage(pdfPage.image!.png, 'png');
      const read = await pool.read(image.png, index);
      pages.push({ width: image.width, height: image.height, source: 'ocr', lines: read.lines });
      images.push(image);
    }
    return { reading: parseReceipt(pages, parseOptions), images };
  }
  const image = await normaliseImage(bytes, type);
  const first = await pool.read(image.png, 0);
  const page = (lines: TextPage['lines']): TextPage => ({ width: image.width, height: image.height, source: 'ocr', lines });
  const reading = await readFigures(pool, image, first.lines, page, parseOptions);
  // The date is looked at again on its own: its lines are few, and the figures' second look does not read them.
  const { date } = await lookAgainAtDate(pool, image, first.lines, reading.date, locale, dateLimits(options.readOn, options.notBefore));
  // So is the heading, when the shop's name in its large print was lost.
  const vendor = await lookAgainAtHeading(pool, image, first.lines, reading.vendor, options.knownVendors);
  return { reading: date === reading.date && vendor === reading.vendor ? reading : { ...reading, date, vendor }, images: [image] };
}

/** The first reading's figures, or those of a second look at the summary band when the first did not agree. */
async function readFigures(pool: OcrPool, image: NormalisedImage, lines: TextPage['lines'], page: (lines: TextPage['lines']) => TextPage, parseOptions: Parameters<typeof parseReceipt>[1]): Promise<ReadReceipt> {
  const reading = parseReceipt([page(lines)], parseOptions);
  if (figuresSettled(reading)) return reading;
  // A second look, only when the first reading's figures do not agree: the band of summary lines read again at
  // another size (from the first item line when the lines did not add up).
  for (const scale of BAND_SCALES) {
    const reread = await rereadSummaryBand(pool, image, lines, !linesAddUp(reading), scale);
    if (!reread) break;
    const second = parseReceipt([page(reread)], parseOptions);
    // The band was read again for its figures: the date and the shop's name stay as the first reading found them,
    // unless it found none (a band may cut through a date line and misread it).
    if (secondLookBetter(reading, second)) return { ...second, date: reading.date.value !== null ? reading.date : second.date, vendor: reading.vendor.value !== null ? reading.vendor : second.vendor };
  }
  return reading;
}
