// A second look at the issue date, when the first reading found none or read its digits unsurely: the lines that
// hold date-like text (or a date word, or a time) are read again, each on its own, at other sizes. OCR's slips at one
// size (6 for 5, 8 for 3, "0f" for 06) are rarely the same at another, so a date is taken only when it is a real
// calendar day within the limits and, where the first reading had one, when a second reading agrees with it.
import sharp from 'sharp';
import type { ReadField } from '../../../../shared/api/receipt-reading';
import type { DateLimits } from './dates';
import { findDates } from './dates';
import { keywordOf } from './label-words';
import type { NormalisedImage } from './normalise';
import type { OcrLayout, OcrPool } from './ocr';
import { DATE_WORDS, chooseReceiptDate } from './receipt-date';
import { type TextLine, lineText, unionBox } from './text-lines';

/** The sizes a band of lines around a date is read at, in turn: larger first (faint small digits), then a little smaller. */
export const DATE_SCALES = [2, 0.875];

/**
 * The looks taken at a date line, in turn: as part of a block at the band's two sizes, then as one line (tesseract's
 * single-line mode) larger and between, then as sparse text at its own size and larger. Measured on the real scans,
 * each way reads dates the others misread: at the slip's own size OCR merges a 7 with the slash after it, the
 * single-line mode keeps faint separators, and the sparse mode reads past a pen stroke across the digits or a rule
 * printed under them.
 */
const DATE_LOOKS: Array<{ scale: number; layout: OcrLayout }> = [
  { scale: 2, layout: 'block' },
  { scale: 0.875, layout: 'block' },
  { scale: 2, layout: 'line' },
  { scale: 1.5, layout: 'line' },
  { scale: 1, layout: 'sparse' },
  { scale: 2, layout: 'sparse' },
];
/** Below this OCR confidence a date's digits are worth a second look (measured on real scans: 0.7). */
const UNSURE_DATE = 0.7;
/** At most this many lines are read again: a receipt prints its date on one or two. */
const MOST_LINES = 3;

/**
 * Text that may be a date OCR garbled ("3G/D3/26318", "0f/03/2016"), one whose separators it lost ("21032018" for
 * 27/03/2018, day-month-year or year-month-day), or a time printed beside one ("20:01").
 */
const DATE_LIKE = /[0-9A-Za-z]{1,2}\s?[/.-]\s?[0-9A-Za-z]{1,3}\s?[/.-]\s?[0-9A-Za-z]{2,5}|\b[0-2]?[0-9]:[0-5][0-9]\b|\b(?:[0-3][0-9][01][0-9](?:19|20)[0-9]{2}|(?:19|20)[0-9]{2}[01][0-9][0-3][0-9])\b/;

const keywordsOf = (text: string) => text.split(/\s+/).map(keywordOf).filter((word) => word !== '');

/** The receipt's date chosen among its lines, with some lines' text read again. */
function dateOf(lines: TextLine[], texts: Map<number, string>, locale: string, limits: DateLimits): string | null {
  const dated = lines.map((line, index) => {
    const text = texts.get(index) ?? lineText(line);
    const confidence = line.words.reduce((total, word) => total + word.confidence, 0) / Math.max(line.words.length, 1);
    return { text, keywords: keywordsOf(text), confidence };
  });
  return chooseReceiptDate(dated, locale, limits).field.value;
}

/** The lowest OCR confidence of the words that hold a date in a line, or null when the line holds none. */
function dateConfidence(line: TextLine, value: string, locale: string, limits: DateLimits): number | null {
  const found = findDates(lineText(line), locale, limits).find((date) => date.value === value);
  if (!found) return null;
  // A date read as a guess (separators lost, a year mended) counts as unsure, however clear its words.
  let lowest = found.confidence < 0.45 ? found.confidence : 1;
  let start = 0;
  for (const word of line.words) {
    const end = start + word.text.length;
    if (end > found.start && start < found.end) lowest = Math.min(lowest, word.confidence);
    start = end + 1;
  }
  return lowest;
}

/**
 * The text of some lines read again together, from a crop around them enlarged or shrunk by the scale, with a margin
 * of some rows' heights at either side (wider for a band: the first reading's boxes of a garbled line need not cover
 * its print).
 */
async function rereadLines(pool: OcrPool, image: NormalisedImage, lines: TextLine[], scale: number, sideRows: number, layout: OcrLayout = 'block'): Promise<string> {
  const box = unionBox(lines.map((line) => line.box));
  const rowHeight = Math.max(...lines.map((line) => line.box.h));
  const margin = Math.round(rowHeight * 0.6);
  const left = Math.max(0, box.x - sideRows * rowHeight);
  const top = Math.max(0, box.y - margin);
  const width = Math.min(image.width, box.x + box.w + sideRows * rowHeight) - left;
  const height = Math.min(image.height, box.y + box.h + margin) - top;
  if (width < 8 || height < 8) return lines.map(lineText).join(' ');
  const band = await sharp(image.png)
    .extract({ left, top, width, height })
    .resize({ width: Math.round(width * scale), kernel: 'lanczos3' })
    .png({ compressionLevel: 1 })
    .toBuffer();
  return (await pool.read(band, 0, layout)).lines.map(lineText).join(' ');
}

/** A line with the lines just above and below it, those printed within three rows of it. */
function besideLines(lines: TextLine[], index: number): TextLine[] {
  const line = lines[index];
  const near = (other: TextLine) => Math.abs(other.box.y + other.box.h / 2 - (line.box.y + line.box.h / 2)) <= 3 * line.box.h;
  return lines.slice(Math.max(0, index - 1), index + 2).filter((other) => other === line || near(other));
}

/**
 * With no line that looks like a date, the upper half of the slip (where the issue date is printed) read as sparse
 * text: a rule printed under the date or a stamp across it can leave the first reading nothing date-like at all.
 */
async function upperHalfDate(pool: OcrPool, image: NormalisedImage, locale: string, limits: DateLimits): Promise<ReadField<string>> {
  const height = Math.round(image.height / 2);
  if (height < 8) return { value: null, confidence: 0 };
  const half = await sharp(image.png).extract({ left: 0, top: 0, width: image.width, height }).png({ compressionLevel: 1 }).toBuffer();
  const lines = (await pool.read(half, 0, 'sparse')).lines;
  const value = dateOf(lines, new Map(), locale, limits);
  return value === null ? { value: null, confidence: 0 } : { value, confidence: 0.5 };
}

export interface DateLook {
  date: ReadField<string>;
  /** How many lines were read again (0 when the first date was sure). */
  reread: number;
}

/**
 * The date after a second look, or the first reading's when that was sure. With no date at first, the first real
 * date another look gives is taken, a little less sure; an unsure first date is replaced only when at least two
 * looks agree on another and outnumber those that read the first, and confirmed when one agrees with it.
 */
export async function lookAgainAtDate(pool: OcrPool, image: NormalisedImage, lines: TextLine[], first: ReadField<string>, locale: string, limits: DateLimits): Promise<DateLook> {
  let targets: number[];
  if (first.value !== null) {
    const value = first.value;
    const holding = lines.findIndex((line) => dateConfidence(line, value, locale, limits) !== null);
    const confidence = holding === -1 ? 1 : dateConfidence(lines[holding], value, locale, limits)!;
    if (confidence >= UNSURE_DATE) return { date: first, reread: 0 };
    targets = [holding];
  } else {
    // Lines beside a date word first, then any date-like text.
    const worded = lines.flatMap((line, index) => (keywordsOf(lineText(line)).some((word) => DATE_WORDS.includes(word)) ? [index] : []));
    const like = lines.flatMap((line, index) => (DATE_LIKE.test(lineText(line)) ? [index] : []));
    targets = [...new Set([...worded, ...like])].slice(0, MOST_LINES);
    if (targets.length === 0) return { date: await upperHalfDate(pool, image, locale, limits), reread: 0 };
  }
  const readings: string[] = [];
  for (const { scale, layout } of DATE_LOOKS) {
    const texts = new Map<number, string>();
    for (const index of targets) texts.set(index, await rereadLines(pool, image, [lines[index]], scale, 2, layout));
    const value = dateOf(lines, texts, locale, limits);
    if (first.value === null && value !== null) return { date: { value, confidence: 0.6 }, reread: targets.length };
    if (value !== null) readings.push(value);
  }
  if (first.value !== null) {
    // Every look votes. Another real date that at least two looks read, and more of them than read the first one,
    // outvotes the unsure first reading; a look that agrees with it confirms it.
    const votes = (value: string) => readings.filter((reading) => reading === value).length;
    const best = [...new Set(readings)].sort((a, b) => votes(b) - votes(a))[0];
    if (best !== undefined && best !== first.value && votes(best) >= 2 && votes(best) > votes(first.value)) {
      return { date: { value: best, confidence: 0.6 }, reread: targets.length };
    }
    if (votes(first.value) > 0) return { date: { value: first.value, confidence: Math.max(first.confidence, 0.8) }, reread: targets.length };
  }
  if (first.value === null) {
    // Still no date: it may be on a line beside the one that looks like it (a time printed under a date line OCR
    // garbled past recognition). The band from the line above to the line below is read, at both sizes.
    for (const scale of DATE_SCALES) {
      const texts = new Map<number, string>();
      for (const index of targets) texts.set(index, await rereadLines(pool, image, besideLines(lines, index), scale, 6));
      const value = dateOf(lines, texts, locale, limits);
      if (value !== null) return { date: { value, confidence: 0.6 }, reread: targets.length };
    }
  }
  return { date: first, reread: targets.length };
}
