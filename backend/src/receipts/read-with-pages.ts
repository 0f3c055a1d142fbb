// Reads a document and keeps the page images the reading's word boxes refer to, for the check screen.
import path from 'node:path';
import type { DocumentReading, PageImage, ReadingContext } from '../jobs/read-receipt.job';
import { importEsm } from './reading/esm-import';
import { normaliseImage } from './reading/normalise';
import { MAX_RENDER_PIXELS, readPdfPages, TEXT_SCALE } from './reading/pdf-text';
import { MAIL_CONTENT_TYPE } from './reading/mail-text';
import { readDocumentWithImages } from './reading/read-document';
import { sniffReceiptType, UnreadableDocumentError } from './reading/sniff';

type PdfJs = typeof import('pdfjs-dist/legacy/build/pdf.mjs');

/** Renders the text-layer pages at the scale their boxes use; scanned pages come out as the reader saw them. */
async function pdfPageImages(bytes: Buffer): Promise<PageImage[]> {
  const read = await readPdfPages(bytes);
  const pdfjs = await importEsm<PdfJs>('pdfjs-dist/legacy/build/pdf.mjs');
  const document = await pdfjs.getDocument({
    data: new Uint8Array(bytes),
    verbosity: 0,
    disableFontFace: true,
    useSystemFonts: false,
    standardFontDataUrl: `${path.join(path.dirname(require.resolve('pdfjs-dist/package.json')), 'standard_fonts')}${path.sep}`,
  }).promise;
  try {
    const images: PageImage[] = [];
    for (const [index, page] of read.entries()) {
      if (page.image) {
        images.push(await normaliseImage(page.image.png, 'png'));
        continue;
      }
      const pdfPage = await document.getPage(index + 1);
      const viewport = pdfPage.getViewport({ scale: TEXT_SCALE });
      // The word boxes are at TEXT_SCALE, so a page too large to render at it cannot be shown: refused, not rendered.
      if (viewport.width * viewport.height > MAX_RENDER_PIXELS) throw new UnreadableDocumentError('A page of this PDF is too large to show. Send the invoice at a usual paper size.');
      const factory = (document as unknown as { canvasFactory: { create(w: number, h: number): { canvas: { toBuffer(mime: string): Buffer }; context: unknown } } }).canvasFactory;
      const { canvas, context } = factory.create(Math.round(viewport.width), Math.round(viewport.height));
      await pdfPage.render({ canvasContext: context as never, canvas: canvas as never, viewport }).promise;
      images.push({ png: canvas.toBuffer('image/png'), width: Math.round(viewport.width), height: Math.round(viewport.height) });
      pdfPage.cleanup();
    }
    return images;
  } finally {
    await document.destroy();
  }
}

export async function readWithPageImages(bytes: Buffer, locale: string, context?: ReadingContext): Promise<DocumentReading> {
  const { reading, images } = await readDocumentWithImages(bytes, {
    locale,
    currency: context?.currency,
    readOn: context?.readOn,
    notBefore: context?.notBefore,
    knownVendors: context?.knownVendors,
    contentType: context?.contentType,
  });
  // A mailed message has no page image: the check screen offers the message itself.
  if (context?.contentType === MAIL_CONTENT_TYPE) return { reading, pageImages: [] };
  const type = await sniffReceiptType(bytes);
  // A photo's page image is the one the OCR read, so the word boxes fall on it.
  const pageImages = type === 'pdf' ? await pdfPageImages(bytes) : images.filter((image): image is PageImage => image !== null);
  return { reading, pageImages };
}
