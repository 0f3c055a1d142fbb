// The result of reading a receipt (OCR or a PDF text layer): fields with confidences, lines and word boxes.

import { RECEIPT_LINE_KINDS, type ReceiptLineKind } from '../enums';

/** What a receipt line is (one list, in shared/enums): the ledger treats each kind differently. */
export const LINE_KINDS = RECEIPT_LINE_KINDS;
export type LineKind = ReceiptLineKind;

/** A rectangle in the pixel coordinates of one normalised page image (PDF text pages: 2 px per point). */
export interface ReadBox {
  /** 0-based page index. */
  page: number;
  x: number;
  y: number;
  w: number;
  h: number;
}

/** A value read from the document with how sure the reader is (0 = a guess, 1 = certain). */
export interface ReadField<T> {
  value: T | null;
  confidence: number;
}

export interface ReadLine {
  kind: LineKind;
  description: string;
  partNumber: string | null;
  /** Decimal text, e.g. "2" or "12.5" (wire by the foot). */
  quantity: string;
  /** Money as Decimal text; null when the receipt prints only the amount and it cannot be derived. */
  unitPrice: string | null;
  /** Money as Decimal text; negative for returns, core refunds and discounts. */
  amount: string;
  confidence: number;
  box: ReadBox | null;
}

export interface ReadWord {
  text: string;
  confidence: number;
  box: ReadBox;
}

export interface ReadPage {
  width: number;
  height: number;
  /** 'text' when the PDF's own text layer was used, 'ocr' when the page image was read. */
  source: 'text' | 'ocr';
}

export interface ReadReceipt {
  vendor: ReadField<string>;
  /** ISO 8601 calendar date, YYYY-MM-DD. */
  date: ReadField<string>;
  /** ISO 4217 code. */
  currency: ReadField<string>;
  lines: ReadLine[];
  subtotal: ReadField<string>;
  tax: ReadField<string>;
  shipping: ReadField<string>;
  discount: ReadField<string>;
  total: ReadField<string>;
  /** Things a person should check, in plain words (an ambiguous date, totals that do not add up). */
  notes: string[];
  /**
   * The facts of the receipt's own arithmetic that agreed on its figures, in words ("the amount tendered minus the
   * change matches it"); empty when the total rests on its printed word alone.
   */
  agreements?: string[];
  pages: ReadPage[];
  words: ReadWord[];
}

/** The flat JSON printed by `npm run scan`, one object per file. */
export interface ScanOutput {
  file: string;
  vendor: string | null;
  date: string | null;
  currency: string | null;
  lines: Array<Pick<ReadLine, 'kind' | 'description' | 'partNumber' | 'quantity' | 'unitPrice' | 'amount'>>;
  subtotal: string | null;
  tax: string | null;
  shipping: string | null;
  discount: string | null;
  total: string | null;
}

export function toScanOutput(file: string, receipt: ReadReceipt): ScanOutput {
  return {
    file,
    vendor: receipt.vendor.value,
    date: receipt.date.value,
    currency: receipt.currency.value,
    lines: receipt.lines.map(({ kind, description, partNumber, quantity, unitPrice, amount }) => ({
      kind,
      description,
      partNumber,
      quantity,
      unitPrice,
      amount,
    })),
    subtotal: receipt.subtotal.value,
    tax: receipt.tax.value,
    shipping: receipt.shipping.value,
    discount: receipt.discount.value,
    total: receipt.total.value,
  };
}
