// Reading accuracy on real scanned receipts kept outside the repository, in the layout of
// ../shared/receipts-real/sroie/ (img/NNN.jpg, key/NNN.json with company/date/total as printed, box/NNN.csv with
// the true text of each printed line and its quadrilateral). Two modes: the whole reader on the scans, and the
// parser alone on the true text (rows joined in reading order), which tells OCR misses from parsing misses.
//   npx tsx test/bench/real-receipts.ts [--parser-only] [--limit N] [--folder DIR] [--verbose]
//   REAL_RECEIPTS=DIR npm run bench
import { runSection } from './print-figures';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { loadavg } from 'node:os';
import path from 'node:path';
import { Decimal } from '../../shared/money';
import type { ReadReceipt } from '../../shared/api/receipt-reading';
import { closeReaders, ocrPool, readDocument } from '../../backend/src/receipts/reading/read-document';
import { editDistance } from '../../backend/src/receipts/reading/label-words';
import { parseReceipt } from '../../backend/src/receipts/reading/parse-receipt';
import type { TextLine, TextPage, TextWord } from '../../backend/src/receipts/reading/text-lines';
import { makeLine } from '../../backend/src/receipts/reading/text-lines';

/** The shared folder beside the checkout, when present; REAL_RECEIPTS names another. */
export function realReceiptFolder(): string | null {
  const named = process.env['REAL_RECEIPTS'];
  if (named) return existsSync(path.join(named, 'key')) ? named : null;
  const shared = path.resolve(__dirname, '../../../shared/receipts-real/sroie');
  return existsSync(path.join(shared, 'key')) ? shared : null;
}

export interface RealTruth {
  id: string;
  image: string;
  company: string;
  /** ISO 8601, or null when the printed truth is not a date this bench can read. */
  date: string | null;
  /** Decimal text, or null when the truth holds no total. */
  total: string | null;
  boxFile: string;
}

/** The receipts of a folder, sorted by name; the build these slips belong to writes day first (en-MY). */
export function loadRealReceipts(folder: string): RealTruth[] {
  return readdirSync(path.join(folder, 'key'))
    .filter((file) => file.endsWith('.json'))
    .sort()
    .map((file) => {
      const id = file.replace(/\.json$/, '');
      const key = JSON.parse(readFileSync(path.join(folder, 'key', file), 'utf8')) as { company?: string; date?: string; total?: string };
      const totalText = (key.total ?? '').replace(/^(RM|\$)\s*/i, '').replace(/,/g, '').trim();
      return {
        id,
        image: path.join(folder, 'img', `${id}.jpg`),
        company: key.company ?? '',
        date: truthDate(key.date ?? ''),
        total: /^[0-9]+(\.[0-9]+)?$/.test(totalText) ? totalText : null,
        boxFile: path.join(folder, 'box', `${id}.csv`),
      };
    });
}

const MONTHS = ['JAN', 'FEB', 'MAR', 'APR', 'MAY', 'JUN', 'JUL', 'AUG', 'SEP', 'OCT', 'NOV', 'DEC'];

/** The truth's printed date as ISO, read independently of the reader under test (day-first slips). */
export function truthDate(printed: string): string | null {
  const text = printed.trim().toUpperCase();
  const pad = (value: number) => String(value).padStart(2, '0');
  const make = (year: number, month: number, day: number) => (month >= 1 && month <= 12 && day >= 1 && day <= 31 ? `${year < 100 ? 2000 + year : year}-${pad(month)}-${pad(day)}` : null);
  let match = /^(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})$/.exec(text);
  if (match) return make(Number(match[1]), Number(match[2]), Number(match[3]));
  match = /^(\d{1,2})[-/.](\d{1,2})[-/.](\d{2}|\d{4})$/.exec(text);
  // Day first, as these slips print; a slip whose second number cannot be a month prints month first.
  if (match) return make(Number(match[3]), Number(match[2]), Number(match[1])) ?? make(Number(match[3]), Number(match[1]), Number(match[2]));
  match = /^(\d{1,2})[\s-]*([A-Z]{3})[A-Z]*[\s-]*(\d{2}|\d{4})$/.exec(text);
  if (match && MONTHS.includes(match[2])) return make(Number(match[3]), MONTHS.indexOf(match[2]) + 1, Number(match[1]));
  match = /^(\d{4})(\d{2})(\d{2})$/.exec(text);
  // Eight digits are year first only when that makes a real date ("25032018" is day first).
  const yearFirst = match && Number(match[1]) > 1990 ? make(Number(match[1]), Number(match[2]), Number(match[3])) : null;
  if (yearFirst) return yearFirst;
  match = /^(\d{2})(\d{2})(\d{4})$/.exec(text);
  if (match) return make(Number(match[3]), Number(match[2]), Number(match[1]));
  return null;
}

/**
 * The true text of a receipt as the OCR would give it: boxes grouped into rows by vertical overlap, each row
 * read left to right; a box's words share its width by their length and keep its height.
 */
export function trueTextPage(boxFile: string): TextPage {
  const boxes = readFileSync(boxFile, 'utf8')
    .split(/\r?\n/)
    .map((row) => {
      const cells = row.split(',');
      if (cells.length < 9) return null;
      const [x1, y1, x2, , x3, y3, , y4] = cells.slice(0, 8).map(Number);
      const text = cells.slice(8).join(',').trim();
      if (text === '' || [x1, y1, x3, y3].some(Number.isNaN)) return null;
      return { x: Math.min(x1, x3), y: Math.min(y1, y3), right: Math.max(x2, x3), bottom: Math.max(y3, y4), text };
    })
    .filter((box): box is NonNullable<typeof box> => box !== null)
    .sort((a, b) => a.y + a.bottom - (b.y + b.bottom));
  const rows: Array<{ top: number; bottom: number; boxes: typeof boxes }> = [];
  for (const box of boxes) {
    const middle = (box.y + box.bottom) / 2;
    const row = rows.find((candidate) => middle >= candidate.top && middle <= candidate.bottom);
    if (row) {
      row.boxes.push(box);
      row.top = Math.min(row.top, box.y);
      row.bottom = Math.max(row.bottom, box.bottom);
    } else rows.push({ top: box.y, bottom: box.bottom, boxes: [box] });
  }
  const lines: TextLine[] = rows
    .sort((a, b) => a.top - b.top)
    .map((row) => {
      const words: TextWord[] = [];
      for (const box of row.boxes) {
        const pieces = box.text.split(/\s+/).filter((piece) => piece !== '');
        const characters = pieces.reduce((count, piece) => count + piece.length + 1, 0);
        let x = box.x;
        for (const piece of pieces) {
          const w = Math.max(1, Math.round(((box.right - box.x) * (piece.length + 1)) / characters));
          words.push({ text: piece, confidence: 0.95, box: { page: 0, x, y: box.y, w, h: box.bottom - box.y } });
          x += w;
        }
      }
      return makeLine(words);
    });
  const width = Math.max(1, ...boxes.map((box) => box.right));
  const height = Math.max(1, ...boxes.map((box) => box.bottom));
  return { width, height, source: 'ocr', lines };
}

export interface RealResult {
  truth: RealTruth;
  read: ReadReceipt;
  ms: number;
  /** CPU time of the whole process (OCR workers and picture threads included): what a busy shared machine does not inflate. */
  cpuMs?: number;
}

/** Letters and digits only, upper case: how two spellings of a shop's name compare. */
const squeeze = (text: string) => text.toUpperCase().replace(/[^A-Z0-9]/g, '');

function similarity(left: string, right: string): number {
  return 1 - editDistance(left, right) / Math.max(left.length, right.length, 1);
}

export const totalRight = ({ truth, read }: RealResult) => truth.total !== null && read.total.value !== null && new Decimal(read.total.value).equals(truth.total);
export const dateRight = ({ truth, read }: RealResult) => truth.date !== null && read.date.value === truth.date;
/** The shop's name read with at most a fifth of its letters wrong (OCR slips, a dropped branch suffix). */
export const vendorRight = ({ truth, read }: RealResult) => similarity(squeeze(read.vendor.value ?? ''), squeeze(truth.company)) >= 0.8;

export const REAL_LOCALE = 'en-MY';

/** The parser alone on each receipt's true text. */
export function parseTrueText(receipts: RealTruth[]): RealResult[] {
  return receipts.map((truth) => {
    const page = trueTextPage(truth.boxFile);
    const began = performance.now();
    const read = parseReceipt([page], { locale: REAL_LOCALE, minorUnits: 2 });
    return { truth, read, ms: performance.now() - began };
  });
}

/** The whole reader (image preparation, OCR, parser) on each scan, one after another. */
export async function readScans(receipts: RealTruth[]): Promise<RealResult[]> {
  const results: RealResult[] = [];
  for (const truth of receipts) {
    const bytes = readFileSync(truth.image);
    const began = performance.now();
    const cpuBefore = process.cpuUsage();
    const read = await readDocument(bytes, { locale: REAL_LOCALE, currency: 'MYR' });
    const cpu = process.cpuUsage(cpuBefore);
    results.push({ truth, read, ms: performance.now() - began, cpuMs: (cpu.user + cpu.system) / 1000 });
  }
  return results;
}

const percentile = (values: number[], share: number) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted.length === 0 ? 0 : sorted[Math.min(sorted.length - 1, Math.floor(share * sorted.length))];
};
const percent = (results: RealResult[], test: (result: RealResult) => boolean) => Number(((100 * results.filter(test).length) / Math.max(results.length, 1)).toFixed(1));

export function realFigures(prefix: string, results: RealResult[]): Record<string, string | number> {
  return {
    [`${prefix}: receipts`]: results.length,
    [`${prefix}: total right %`]: percent(results, totalRight),
    [`${prefix}: date right %`]: percent(results, dateRight),
    [`${prefix}: vendor right %`]: percent(results, vendorRight),
    [`${prefix}: ms per receipt p50`]: Math.round(percentile(results.map((result) => result.ms), 0.5)),
    [`${prefix}: ms per receipt p95`]: Math.round(percentile(results.map((result) => result.ms), 0.95)),
    ...(results.some((result) => result.cpuMs !== undefined)
      ? {
          [`${prefix}: CPU ms per receipt p50`]: Math.round(percentile(results.map((result) => result.cpuMs ?? 0), 0.5)),
          [`${prefix}: CPU ms per receipt p95`]: Math.round(percentile(results.map((result) => result.cpuMs ?? 0), 0.95)),
          [`${prefix}: load average (1 min) at the end`]: loadavg()[0].toFixed(2),
        }
      : {}),
  };
}

/** One line per miss: what the truth says and what was read. */
export function describeMisses(results: RealResult[]): string[] {
  const misses: string[] = [];
  for (const result of results) {
    const { truth, read } = result;
    const wrong: string[] = [];
    if (!totalRight(result)) wrong.push(`total ${read.total.value} ≠ ${truth.total}`);
    if (!dateRight(result)) wrong.push(`date ${read.date.value} ≠ ${truth.date}`);
    if (!vendorRight(result)) wrong.push(`vendor "${read.vendor.value}" ≠ "${truth.company}"`);
    if (wrong.length > 0) misses.push(`${truth.id}: ${wrong.join('; ')}`);
  }
  return misses;
}

/** The bench section: parser alone, then the whole reader (skipped with a message when the folder is absent). */
export async function benchRealReceipts(options: { parserOnly?: boolean; limit?: number; folder?: string; verbose?: boolean } = {}): Promise<Record<string, string | number>> {
  const folder = options.folder ?? realReceiptFolder();
  if (!folder) return { 'real receipts': 'skipped: no ../shared/receipts-real/sroie (or REAL_RECEIPTS) folder' };
  const receipts = loadRealReceipts(folder).slice(0, options.limit ?? Infinity);
  const parsed = parseTrueText(receipts);
  const figures: Record<string, string | number> = { 'real receipts folder': folder, ...realFigures('parser on true text', parsed) };
  const misses = describeMisses(parsed);
  if (options.parserOnly) {
    figures['parser on true text: misses'] = `\n  ${misses.join('\n  ')}`;
    return figures;
  }
  try {
    await ocrPool().start();
    const scanned = await readScans(receipts);
    Object.assign(figures, realFigures('scans read end to end', scanned));
    figures['scans read end to end: misses'] = `\n  ${describeMisses(scanned).join('\n  ')}`;
    if (options.verbose) figures['parser on true text: misses'] = `\n  ${misses.join('\n  ')}`;
  } finally {
    await closeReaders();
  }
  return figures;
}

if (require.main === module) {
  const argv = process.argv.slice(2);
  const valueOf = (flag: string) => {
    const index = argv.indexOf(flag);
    return index === -1 ? undefined : argv[index + 1];
  };
  const limit = valueOf('--limit');
  runSection(() => benchRealReceipts({ parserOnly: argv.includes('--parser-only'), limit: limit ? Number(limit) : undefined, folder: valueOf('--folder'), verbose: argv.includes('--verbose') }));
}
