// Renders an invented receipt slip to a PNG (counter, shelf, return and core layouts), with where each line landed:
// shared by the demo seed and the test fixtures, so both show the same kind of paper.
import path from 'node:path';
import { GlobalFonts, createCanvas, type Canvas } from '@napi-rs/canvas';
import type { LineKind } from '../../../shared/api/receipt-reading';

const NODE_MODULES = path.resolve(__dirname, '../../../node_modules');
// Family names of our own, so a machine's installed fonts can never stand in for these.
export const MONO = 'FixtureMono';
export const SANS = 'FixtureSans';
export const SANS_BOLD = 'FixtureSansBold';
GlobalFonts.registerFromPath(path.join(NODE_MODULES, 'pdfjs-dist/standard_fonts/FoxitFixed.pfb'), MONO);
GlobalFonts.registerFromPath(path.join(NODE_MODULES, '@fontsource/work-sans/files/work-sans-latin-400-normal.woff2'), SANS);
GlobalFonts.registerFromPath(path.join(NODE_MODULES, '@fontsource/work-sans/files/work-sans-latin-700-normal.woff2'), SANS_BOLD);

export type SlipLayout = 'counter' | 'shelf' | 'pdf-invoice' | 'return' | 'core' | 'scanned-pdf';

export interface SlipLine {
  kind: LineKind;
  description: string;
  partNumber: string | null;
  quantity: string;
  unitPrice: string;
  amount: string;
}

/** What a slip prints; money as Decimal text in the currency's minor units. */
export interface SlipReceipt {
  id: string;
  layout: SlipLayout;
  locale: string;
  vendor: string;
  address: readonly string[];
  date: string;
  /** How the date is printed on the slip. */
  printedDate: string;
  currency: string;
  /** What the slip prints before amounts ("$", "RM", "EUR", or nothing). */
  mark: string;
  lines: SlipLine[];
  subtotal: string;
  tax: string | null;
  taxLabel: string;
  shipping: string | null;
  discount: string | null;
  total: string;
  receiptNumber: string;
}

export type NegativeStyle = 'minus' | 'trailing' | 'parentheses';

export function slipMoney(amount: string, mark: string, negativeStyle: NegativeStyle = 'minus'): string {
  const negative = amount.startsWith('-');
  const digits = negative ? amount.slice(1) : amount;
  const withMark = mark === '' ? digits : mark === '$' ? `$${digits}` : `${mark} ${digits}`;
  if (!negative) return withMark;
  if (negativeStyle === 'trailing') return `${withMark}-`;
  if (negativeStyle === 'parentheses') return `(${withMark})`;
  return `-${withMark}`;
}

/** A row of a slip: text at the left, optional text at the right margin, in a font; `line` is the receipt line it shows. */
interface Row {
  left: string;
  right?: string;
  center?: boolean;
  bold?: boolean;
  size?: number;
  line?: number;
}

function pad(text: string, width: number, alignRight = false): string {
  const cut = text.slice(0, width);
  return alignRight ? cut.padStart(width) : cut.padEnd(width);
}

function counterRows(slip: SlipReceipt, negativeStyle: NegativeStyle = 'minus'): Row[] {
  const rows: Row[] = [
    { left: slip.vendor, center: true },
    ...slip.address.map((text) => ({ left: text, center: true })),
    { left: '' },
    { left: `INVOICE ${slip.receiptNumber}   DATE ${slip.printedDate}` },
    { left: '' },
    { left: `${pad('PART NO', 10)}${pad('DESCRIPTION', 22)}${pad('QTY', 4, true)}${pad('PRICE', 9, true)}${pad('AMOUNT', 10, true)}` },
    { left: '-'.repeat(55) },
  ];
  for (const [index, item] of slip.lines.entries()) {
    const amount = slipMoney(item.amount, '', negativeStyle);
    const unit = slipMoney(item.unitPrice, '', negativeStyle);
    rows.push({ left: `${pad(item.partNumber ?? '', 10)}${pad(item.description, 22)}${pad(item.quantity, 4, true)}${pad(unit, 9, true)}${pad(amount, 10, true)}`, line: index });
  }
  rows.push({ left: '-'.repeat(55) });
  const totalRow = (label: string, amount: string | null) => {
    if (amount !== null) rows.push({ left: `${pad(label, 36)}${pad(slipMoney(amount, slip.mark, negativeStyle), 19, true)}` });
  };
  totalRow('SUBTOTAL', slip.subtotal);
  totalRow('SHIPPING', slip.shipping);
  totalRow('DISCOUNT', slip.discount === null ? null : `-${slip.discount}`);
  totalRow(slip.taxLabel, slip.tax);
  totalRow(slip.layout === 'return' ? 'REFUND TOTAL' : 'TOTAL', slip.total);
  rows.push({ left: '' }, { left: slip.layout === 'return' ? 'REFUNDED TO CARD ****4410' : 'VISA ****4410  APPROVED' }, { left: 'KEEP THIS SLIP FOR RETURNS AND CORES', center: true });
  return rows;
}

function shelfRows(slip: SlipReceipt): Row[] {
  const rows: Row[] = [
    { left: slip.vendor, center: true, bold: true, size: 34 },
    ...slip.address.map((text) => ({ left: text, center: true })),
    { left: `${slip.printedDate}  2:47 PM`, center: true },
    { left: `Receipt ${slip.receiptNumber}` },
    { left: '' },
  ];
  for (const [index, item] of slip.lines.entries()) {
    rows.push({ left: item.description, right: slipMoney(item.amount, slip.mark), line: index });
    if (item.quantity !== '1') rows.push({ left: `   ${item.quantity} @ ${slipMoney(item.unitPrice, slip.mark)}`, line: index });
    if (item.partNumber) rows.push({ left: `   SKU ${item.partNumber}`, line: index });
  }
  rows.push({ left: '' }, { left: 'Subtotal', right: slipMoney(slip.subtotal, slip.mark) });
  if (slip.shipping !== null) rows.push({ left: 'Shipping', right: slipMoney(slip.shipping, slip.mark) });
  if (slip.discount !== null) rows.push({ left: 'Discount', right: slipMoney(`-${slip.discount}`, slip.mark) });
  if (slip.tax !== null) rows.push({ left: slip.taxLabel, right: slipMoney(slip.tax, slip.mark) });
  rows.push({ left: 'TOTAL', right: slipMoney(slip.total, slip.mark), bold: true });
  rows.push({ left: '' }, { left: `Card ${slipMoney(slip.total, slip.mark)}` }, { left: 'Thank you for shopping with us', center: true });
  return rows;
}

/** A rectangle in the slip image's pixels. */
export interface SlipBox {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface RenderedSlip {
  png: Buffer;
  width: number;
  height: number;
  /** Per receipt line, the box around the rows that print it. */
  lineBoxes: (SlipBox | null)[];
  /** Every printed row with its box, as a reader would find the words. */
  rows: { text: string; box: SlipBox }[];
}

type DrawnSlip = Omit<RenderedSlip, 'png'> & { canvas: Canvas };

function drawRows(rows: Row[], lineCount: number, family: string, width: number, fontSize: number): DrawnSlip {
  const lineHeight = Math.round(fontSize * 1.45);
  const margin = 36;
  const height = margin * 2 + rows.reduce((total, row) => total + Math.round((row.size ?? fontSize) * 1.45), 0);
  const canvas = createCanvas(width, height);
  const context = canvas.getContext('2d');
  context.fillStyle = '#ffffff';
  context.fillRect(0, 0, width, height);
  context.fillStyle = '#111111';
  context.textBaseline = 'top';
  const lineBoxes: (SlipBox | null)[] = Array.from({ length: lineCount }, () => null);
  const printed: RenderedSlip['rows'] = [];
  let y = margin;
  for (const row of rows) {
    const size = row.size ?? fontSize;
    const rowFamily = row.bold && family === SANS ? SANS_BOLD : family;
    context.font = `${size}px ${rowFamily}`;
    if (row.center) {
      context.textAlign = 'center';
      context.fillText(row.left, width / 2, y);
    } else {
      context.textAlign = 'left';
      context.fillText(row.left, margin, y);
    }
    if (row.right) {
      context.textAlign = 'right';
      context.fillText(row.right, width - margin, y);
    }
    const rowHeight = row.size ? Math.round(row.size * 1.45) : lineHeight;
    const box = { x: margin - 6, y: y - 4, w: width - 2 * margin + 12, h: rowHeight };
    const text = [row.left.trim(), row.right ?? ''].filter(Boolean).join(' ');
    if (text) printed.push({ text, box });
    if (row.line !== undefined) {
      const seen = lineBoxes[row.line];
      lineBoxes[row.line] = seen ? { ...seen, h: box.y + box.h - seen.y } : box;
    }
    y += rowHeight;
  }
  return { canvas, width, height, lineBoxes, rows: printed };
}

function drawSlip(slip: SlipReceipt): DrawnSlip {
  const count = slip.lines.length;
  switch (slip.layout) {
    case 'counter':
      return drawRows(counterRows(slip), count, MONO, 1100, 30);
    case 'return':
      return drawRows(counterRows(slip, slip.locale === 'en-US' ? 'trailing' : 'parentheses'), count, MONO, 1100, 30);
    case 'core':
      // Core slips reuse the counter layout; the core lines are what matters.
      return drawRows(counterRows(slip), count, MONO, 1100, 30);
    case 'shelf':
    case 'scanned-pdf':
      return drawRows(shelfRows(slip), count, SANS, 820, 28);
    case 'pdf-invoice':
      throw new Error('PDF invoices are written as PDF, not rendered as images.');
  }
}

/** Draws a slip in its layout's paper width and font; PDF invoices are written as PDF elsewhere. */
export function renderSlip(slip: SlipReceipt): RenderedSlip {
  const { canvas, ...drawn } = drawSlip(slip);
  return { ...drawn, png: canvas.toBuffer('image/png') };
}

/** The same, encoding the PNG off the main thread, so a seed can do other work meanwhile. */
export async function renderSlipAsync(slip: SlipReceipt): Promise<RenderedSlip> {
  const { canvas, ...drawn } = drawSlip(slip);
  return { ...drawn, png: await canvas.encode('png') };
}
