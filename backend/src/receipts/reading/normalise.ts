// Prepares a receipt photo for OCR: HEIC to JPEG, orientation from EXIF, greyscale, contrast, a sensible size.
import sharp from 'sharp';
import { UnreadableDocumentError, type ReceiptFileType } from './sniff';

export interface NormalisedImage {
  /** Greyscale PNG, upright. */
  png: Buffer;
  width: number;
  height: number;
}

/** Phone photos are 3000–4000 px wide; OCR gains nothing past this and slows down a lot. */
export const MAX_WIDTH = 2000;
/** Small screenshots and thumbnails are enlarged so receipt text is tall enough for the OCR model. */
export const MIN_WIDTH = 800;
const ENLARGED_WIDTH = 1200;

interface HeicConvert {
  (options: { buffer: Buffer; format: 'JPEG' | 'PNG'; quality?: number }): Promise<ArrayBuffer>;
}

/**
 * A photo that cannot be decoded (damaged, cut off, over sharp's pixel limit) fails the same way every time, so it is
 * an UnreadableDocumentError: the reading job marks the receipt unreadable at once instead of retrying.
 */
export async function normaliseImage(bytes: Buffer, type: ReceiptFileType): Promise<NormalisedImage> {
  try {
    return await decodeAndPrepare(bytes, type);
  } catch (error) {
    console.error('[reading] the photo could not be decoded:', (error as Error).message);
    throw new UnreadableDocumentError('This photo could not be opened: it may be damaged, cut off or too large. Upload it again, or enter the lines by hand.');
  }
}

async function decodeAndPrepare(bytes: Buffer, type: ReceiptFileType): Promise<NormalisedImage> {
  let input = bytes;
  if (type === 'heic') {
    // sharp's prebuilt libvips has no HEVC decoder, so HEIC goes through a pure JS converter first.
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    const convert = require('heic-convert') as HeicConvert;
    input = Buffer.from(await convert({ buffer: bytes, format: 'JPEG', quality: 0.92 }));
  }
  // rotate() with no angle applies the EXIF orientation, so a phone photo taken sideways comes upright.
  const upright = sharp(input, { failOn: 'error' }).rotate();
  const { width = 0 } = await upright.clone().metadata().then(async (metadata) => {
    // EXIF orientations 5–8 swap width and height.
    const swapped = (metadata.orientation ?? 1) >= 5;
    return { width: swapped ? metadata.height : metadata.width };
  });
  // One grey channel: a third of the bytes to hand to the OCR worker.
  let pipeline = upright.greyscale().normalise().toColourspace('b-w');
  if (width > MAX_WIDTH) pipeline = pipeline.resize({ width: MAX_WIDTH });
  else if (width > 0 && width < MIN_WIDTH) pipeline = pipeline.resize({ width: ENLARGED_WIDTH, kernel: 'lanczos3' });
  const { data, info } = await pipeline.png({ compressionLevel: 1 }).toBuffer({ resolveWithObject: true });
  return { png: data, width: info.width, height: info.height };
}
