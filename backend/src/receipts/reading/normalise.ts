// Prepares a receipt photo for OCR: HEIC to JPEG, orientation from EXIF, greyscale, contrast, a sensible size.
import sharp from 'sharp';
import type { Sharp } from 'sharp';
import { findPaper } from './paper';
import { UnreadableDocumentError, type ReceiptFileType } from './sniff';

export interface NormalisedImage {
  /** Greyscale PNG, upright. */
  png: Buffer;
  width: number;
  height: number;
}

/** Phone photos are 3000–4000 px wide; OCR gains nothing past this and slows down a lot. */
export const MAX_WIDTH = 2000;
/** Height in pixels of a row of print (ascender to descender) that tesseract's LSTM model reads best (measured here: 32 beat 26 and 40). */
const TEXT_ROW_HEIGHT = 32;
// Print is never shrunk below its own size, only enlarged (or the whole picture fitted to MAX_WIDTH).
const MIN_SCALE = 1;
const MAX_SCALE = 3.5;
/** Slants smaller than this (a pixel of drift over about 190 px of row) do not disturb the OCR. */
const MIN_SKEW_DEGREES = 0.3;
/** Small screenshots and thumbnails are enlarged so receipt text is tall enough for the OCR model. */
export const MIN_WIDTH = 800;
const ENLARGED_WIDTH = 1200;

type Raw = { data: Buffer; info: { width: number; height: number; channels: number } };

const fromRaw = ({ data, info }: Raw) => sharp(data, { raw: { width: info.width, height: info.height, channels: info.channels as 1 } });

/** sharp turns a picture before resizing it whatever the call order: the steps so far are run first to keep ours. */
async function settled(pipeline: Sharp): Promise<Sharp> {
  return fromRaw(await pipeline.raw().toBuffer({ resolveWithObject: true }));
}

/**
 * The darkest 1 % to black and the brightest 1 % to white, as sharp's normalise() does; measured here on the finished
 * pixels because normalise() runs every earlier step twice (once for its histogram), doubling the time of this step.
 */
function stretched(image: Raw): Sharp {
  const histogram = new Uint32Array(256);
  for (const value of image.data) histogram[value] += 1;
  const level = (share: number) => {
    for (let value = 0, seen = 0; value < 256; value += 1) {
      seen += histogram[value];
      if (seen > image.data.length * share) return value;
    }
    return 255;
  };
  const dark = level(0.01);
  const bright = level(0.99);
  const gain = bright - dark > 0 ? 255 / (bright - dark) : 1;
  return fromRaw(image).linear(gain, -dark * gain);
}

interface HeicConvert {
  (options: { buffer: Buffer; format: 'JPEG' | 'PNG'; quality?: number }): Promise<ArrayBuffer>;
}

/**
 * A photo that cannot be decoded (damaged, cut off, over sharp's pixel limit) fails the same way every time, so it is
 * an UnreadableDocumentError: the reading job marks the receipt unreadable at once instead of retrying.
 */
export async function normaliseImage(bytes: Buffer, type: ReceiptFileType, options: { rowHeight?: number } = {}): Promise<NormalisedImage> {
  try {
    return await decodeAndPrepare(bytes, type, options);
  } catch (error) {
    console.error('[reading] the photo could not be decoded:', (error as Error).message);
    throw new UnreadableDocumentError('This photo could not be opened: it may be damaged, cut off or too large. Upload it again, or enter the lines by hand.');
  }
}

async function decodeAndPrepare(bytes: Buffer, type: ReceiptFileType, options: { rowHeight?: number }): Promise<NormalisedImage> {
  let input = bytes;
  if (type === 'heic') {
    // sharp's prebuilt libvips has no HEVC decoder, so HEIC goes through a pure JS converter first.
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    const convert = require('heic-convert') as HeicConvert;
    input = Buffer.from(await convert({ buffer: bytes, format: 'JPEG', quality: 0.92 }));
  }
  // rotate() with no angle applies the EXIF orientation, so a phone photo taken sideways comes upright; one
  // greyscale decode serves both the layout analysis and the picture handed to the OCR.
  const grey = await sharp(input, { failOn: 'error' }).rotate().greyscale().raw().toBuffer({ resolveWithObject: true });
  const raw = { raw: { width: grey.info.width, height: grey.info.height, channels: grey.info.channels } } as const;
  const layout = await findPaper(sharp(grey.data, raw), grey.info.width, grey.info.height);
  const { crop, textHeight } = layout;
  // Small print is enlarged and large print reduced to the size the OCR model reads best.
  let scale = textHeight ? (options.rowHeight ?? TEXT_ROW_HEIGHT) / textHeight : crop.width < MIN_WIDTH ? ENLARGED_WIDTH / crop.width : 1;
  scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, scale));
  const targetWidth = Math.min(MAX_WIDTH, Math.round(crop.width * scale));
  let pipeline = sharp(grey.data, raw).extract(crop);
  if (Math.abs(targetWidth - crop.width) > 4) pipeline = pipeline.resize({ width: targetWidth, kernel: targetWidth > crop.width ? 'lanczos3' : 'lanczos2' });
  // Uneven light: local contrast first, so a shadow across the slip does not swallow its print. It costs about a
  // second of CPU on a slip, so an evenly lit one (most scans, with or without a dark border) is only stretched.
  if (layout.unevenLight) pipeline = pipeline.clahe({ width: 64, height: 64, maxSlope: 3 });
  // Stretched before any turn: the white corners a turn adds would count as the paper's brightest tone and leave grey
  // paper grey, which tesseract's own threshold then takes for ink (a whole slip read as nothing).
  pipeline = stretched(await pipeline.raw().toBuffer({ resolveWithObject: true }));
  // A crooked slip is turned straight from the slant of its print rows (paper.ts), after enlarging so the turn blurs
  // the letters less: cheaper than tesseract's rotateAuto, which spends a whole layout pass finding the angle.
  if (Math.abs(layout.skewDegrees) >= MIN_SKEW_DEGREES) pipeline = (await settled(pipeline)).rotate(-layout.skewDegrees, { background: '#ffffff' });
  pipeline = pipeline.toColourspace('b-w');
  const { data, info } = await pipeline.png({ compressionLevel: 1 }).toBuffer({ resolveWithObject: true });
  return { png: data, width: info.width, height: info.height };
}
