// A second, cheap look at the part of a slip that holds its sums, when the first reading's figures do not agree:
// only the band of lines with summary words (total, tax, cash, change, rounding) is read again, enlarged, and its
// lines replace the first reading's lines there; when the item lines did not add up, the band starts at the first
// line with an amount. A band is a fraction of the page, so this costs a fraction of a whole second read.
import sharp from 'sharp';
import { keywordOf, readLabel } from './label-words';
import type { NormalisedImage } from './normalise';
import type { OcrPool } from './ocr';
import type { TextLine } from './text-lines';

/**
 * The sizes the band is read at, relative to the page, in turn until one agrees: larger first (small faint points
 * and digits need the pixels), then a little smaller (noisy print breaks up less), which gives other OCR errors.
 */
export const BAND_SCALES = [1.5, 0.875];

/** Lines whose words before any digit read as a summary label. */
function summaryLines(lines: TextLine[]): TextLine[] {
  return lines.filter((line) => {
    const label: string[] = [];
    for (const word of line.words) {
      if (/[0-9]/.test(word.text)) break;
      for (const piece of word.text.split(/[/\-]/)) {
        const keyword = keywordOf(piece);
        if (keyword !== '') label.push(keyword);
      }
    }
    return readLabel(label).role !== null;
  });
}

/** The page's lines with those of its summary band read again; null when no line reads as a summary label. */
export async function rereadSummaryBand(pool: OcrPool, image: NormalisedImage, lines: TextLine[], withItems: boolean, scale: number): Promise<TextLine[] | null> {
  const sums = summaryLines(lines);
  if (sums.length === 0) return null;
  const rowHeight = Math.max(...sums.map((line) => line.box.h));
  const firstAmount = lines.find((line) => line.words.some((word) => /[0-9][.,][0-9]{2}/.test(word.text)));
  const bandStart = Math.min(...sums.map((line) => line.box.y), withItems && firstAmount ? firstAmount.box.y : Infinity);
  const top = Math.max(0, bandStart - rowHeight);
  const bottom = Math.min(image.height, Math.max(...sums.map((line) => line.box.y + line.box.h)) + rowHeight);
  if (bottom - top < rowHeight) return null;
  const band = await sharp(image.png)
    .extract({ left: 0, top, width: image.width, height: bottom - top })
    .resize({ width: Math.round(image.width * scale), kernel: 'lanczos3' })
    .png({ compressionLevel: 1 })
    .toBuffer();
  const reread = (await pool.read(band, 0)).lines.map((line) => ({
    words: line.words.map((word) => ({ ...word, box: { ...word.box, x: Math.round(word.box.x / scale), y: Math.round(word.box.y / scale) + top, w: Math.round(word.box.w / scale), h: Math.round(word.box.h / scale) } })),
    box: { ...line.box, x: Math.round(line.box.x / scale), y: Math.round(line.box.y / scale) + top, w: Math.round(line.box.w / scale), h: Math.round(line.box.h / scale) },
  }));
  const middle = (line: TextLine) => line.box.y + line.box.h / 2;
  const outside = lines.filter((line) => middle(line) < top || middle(line) > bottom);
  return [...outside, ...reread].sort((a, b) => a.box.y - b.box.y);
}
