// A second look at the heading of a slip whose shop name the first reading lost: shops print their names large,
// often in a heavy or decorated face, and the page was scaled for the small print. The band above the address is
// read again at a smaller size, where the name's rows come near the height the OCR reads best.
import sharp from 'sharp';
import type { ReadField } from '../../../../shared/api/receipt-reading';
import { keywordOf } from './label-words';
import type { NormalisedImage } from './normalise';
import type { OcrPool } from './ocr';
import { type TextLine, lineText } from './text-lines';
import { findVendor, lostHeadingBottom, type VendorLine } from './vendor';

/** Names print at about twice the height of the body text (common practice); measured here: 0.5 and 0.7 both read them. */
export const HEADING_SCALE = 0.6;

function vendorLines(lines: TextLine[]): VendorLine[] {
  return lines.map((line) => {
    const text = lineText(line);
    const confidence = line.words.reduce((total, word) => total + word.confidence, 0) / Math.max(line.words.length, 1);
    return { line, text, keywords: text.split(/\s+/).map(keywordOf).filter((word) => word !== ''), confidence, hasAmount: /[0-9][.,][0-9]{2}\b/.test(text) };
  });
}

/** The shop's name read again from the heading band, or the first reading's when a name was read above the address. */
export async function lookAgainAtHeading(pool: OcrPool, image: NormalisedImage, lines: TextLine[], first: ReadField<string>, knownVendors: string[] = []): Promise<ReadField<string>> {
  const bottom = lostHeadingBottom(vendorLines(lines));
  if (bottom === null || bottom < 16) return first;
  const band = await sharp(image.png)
    .extract({ left: 0, top: 0, width: image.width, height: bottom })
    .resize({ width: Math.max(1, Math.round(image.width * HEADING_SCALE)), kernel: 'lanczos3' })
    .png({ compressionLevel: 1 })
    .toBuffer();
  const scaled = (value: number) => Math.round(value / HEADING_SCALE);
  const reread = (await pool.read(band, 0)).lines.map((line) => ({
    words: line.words.map((word) => ({ ...word, box: { ...word.box, x: scaled(word.box.x), y: scaled(word.box.y), w: scaled(word.box.w), h: scaled(word.box.h) } })),
    box: { ...line.box, x: scaled(line.box.x), y: scaled(line.box.y), w: scaled(line.box.w), h: scaled(line.box.h) },
  }));
  const joined = vendorLines([...reread, ...lines.filter((line) => line.box.y + line.box.h / 2 >= bottom)]);
  // Taken only when the band now holds a name above the address.
  if (lostHeadingBottom(joined) !== null) return first;
  const found = findVendor(joined, knownVendors);
  return found.value === null ? first : found;
}
