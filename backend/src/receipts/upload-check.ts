// Checks an uploaded document before anything is stored: its real type from the bytes, its size, its page count.
import sharp from 'sharp';
import { ACCEPTED_UPLOAD_LABEL, MAX_PDF_PAGES, MAX_UPLOAD_BYTES, MAX_UPLOAD_MEGAPIXELS } from '../../../shared/api/receipts';
import { importEsm } from './reading/esm-import';
import { sniffReceiptType, UnreadableDocumentError, type ReceiptFileType } from './reading/sniff';

export interface SniffedDocument {
  type: ReceiptFileType;
  mime: string;
  ext: string;
  pages: number;
}

const MIME: Record<ReceiptFileType, string> = { jpeg: 'image/jpeg', png: 'image/png', webp: 'image/webp', heic: 'image/heic', pdf: 'application/pdf' };
const EXT: Record<ReceiptFileType, string> = { jpeg: 'jpg', png: 'png', webp: 'webp', heic: 'heic', pdf: 'pdf' };

interface PdfJs {
  getDocument(options: { data: Uint8Array; isEvalSupported: boolean; disableFontFace: boolean; verbosity: number }): { promise: Promise<{ numPages: number; destroy(): Promise<void> }> };
}

async function pdfPageCount(bytes: Buffer): Promise<number> {
  const pdfjs = await importEsm<PdfJs>('pdfjs-dist/legacy/build/pdf.mjs');
  try {
    const document = await pdfjs.getDocument({ data: new Uint8Array(bytes), isEvalSupported: false, disableFontFace: true, verbosity: 0 }).promise;
    const pages = document.numPages;
    await document.destroy();
    return pages;
  } catch {
    throw new UnreadableDocumentError('This PDF could not be opened: it may be damaged or password-protected. Send another copy or a photo.');
  }
}

/** A photo's size from its header alone, so a small file declaring a huge image is refused before anything decodes it. */
async function checkPixels(bytes: Buffer): Promise<void> {
  // Header only (no pixel limit here: the check is ours). An image whose header sharp cannot read is left to the
  // reading, which marks it unreadable.
  const { width = 0, height = 0 } = await sharp(bytes, { limitInputPixels: false }).metadata().catch(() => ({ width: 0, height: 0 }));
  if (width * height > MAX_UPLOAD_MEGAPIXELS * 1_000_000) {
    throw new UnreadableDocumentError(
      `The photo is ${width} × ${height} pixels (${Math.round((width * height) / 1_000_000)} megapixels); at most ${MAX_UPLOAD_MEGAPIXELS} megapixels are read. Send a smaller photo.`,
    );
  }
}

/** Throws UnreadableDocumentError with a message that says what is accepted. */
export async function checkUpload(bytes: Buffer): Promise<SniffedDocument> {
  if (bytes.length === 0) throw new UnreadableDocumentError(`The file is empty. Send ${ACCEPTED_UPLOAD_LABEL}.`);
  if (bytes.length > MAX_UPLOAD_BYTES) throw new UnreadableDocumentError(`The file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MB. Send a smaller photo or PDF.`);
  const type = await sniffReceiptType(bytes);
  if (type !== 'pdf') await checkPixels(bytes);
  const pages = type === 'pdf' ? await pdfPageCount(bytes) : 1;
  if (pages > MAX_PDF_PAGES) throw new UnreadableDocumentError(`The PDF has ${pages} pages; at most ${MAX_PDF_PAGES} are read. Send the pages of the invoice only.`);
  return { type, mime: MIME[type], ext: EXT[type], pages };
}
