// The one entry point of receipt reading: bytes in (photo or PDF), a ReadReceipt out.
import type { ReadReceipt } from '../../../../shared/api/receipt-reading';
import { normaliseImage } from './normalise';
import { OcrPool } from './ocr';
import { parseReceipt } from './parse-receipt';
import { readPdfPages } from './pdf-text';
import { sniffReceiptType } from './sniff';
import type { TextPage } from './text-lines';

export interface ReadOptions {
  /** BCP 47 tag of the build, e.g. "en-US" (month first) or "en-GB" (day first). */
  locale?: string;
  /** ISO 4217 code of the build's currency: how many decimals its amounts carry. */
  currency?: string;
}

export const DEFAULT_LOCALE = 'en-US';

let pool: OcrPool | undefined;
let poolSize = Number(process.env['RECEIPT_OCR_WORKERS'] ?? 1) || 1;

/** The process's OCR workers, started on first use and kept for every later document. */
export function ocrPool(): OcrPool {
  pool ??= new OcrPool(poolSize);
  return pool;
}

/** Sets how many OCR workers the next pool starts with (1–2 fit two cores). */
export function setOcrWorkers(count: number): void {
  poolSize = Math.max(1, Math.min(4, Math.floor(count)));
}

/** Stops the OCR workers; a later read starts them again. */
export async function closeReaders(): Promise<void> {
  const current = pool;
  pool = undefined;
  await current?.close();
}

export function checkLocale(locale: string): string {
  try {
    return Intl.getCanonicalLocales(locale)[0];
  } catch {
    throw new RangeError(`"${locale}" is not a language tag; use one such as en-US or en-GB.`);
  }
}

export async function readDocument(bytes: Buffer, options: ReadOptions = {}): Promise<ReadReceipt> {
  const locale = checkLocale(options.locale ?? DEFAULT_LOCALE);
  const type = await sniffReceiptType(bytes);
  const pages: TextPage[] = [];
  if (type === 'pdf') {
    const pdfPages = await readPdfPages(bytes);
    for (const [index, pdfPage] of pdfPages.entries()) {
      if (pdfPage.text) {
        pages.push(pdfPage.text);
        continue;
      }
      const image = await normaliseImage(pdfPage.image!.png, 'png');
      const read = await ocrPool().read(image.png, index);
      pages.push({ width: image.width, height: image.height, source: 'ocr', lines: read.lines });
    }
  } else {
    const image = await normaliseImage(bytes, type);
    const read = await ocrPool().read(image.png, 0);
    pages.push({ width: image.width, height: image.height, source: 'ocr', lines: read.lines });
  }
  return parseReceipt(pages, { locale });
}
