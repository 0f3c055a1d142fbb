// Reads a PDF: the text layer with positions where a page has one; pages without text are rendered for OCR.
import path from 'node:path';
import { MAX_UPLOAD_MEGAPIXELS } from '../../../../shared/api/receipts';
import { importEsm } from './esm-import';
import { TextLine, TextPage, TextWord, makeLine } from './text-lines';

/** Text-layer boxes are in pixels at 2 px per PDF point (144 dpi), like a rendered page. */
export const TEXT_SCALE = 2;
/** Scanned pages are rendered about this wide, enough for receipt text, capped at 4 px per point. */
const RENDER_WIDTH = 1700;
/** A rendered page holds at most this many pixels (the photo limit): a page box of any size cannot exhaust memory. */
export const MAX_RENDER_PIXELS = MAX_UPLOAD_MEGAPIXELS * 1_000_000;

/** The largest scale at most `wanted` at which a page of this size in points stays within MAX_RENDER_PIXELS. */
export function cappedRenderScale(widthPoints: number, heightPoints: number, wanted: number): number {
  return Math.min(wanted, Math.sqrt(MAX_RENDER_PIXELS / Math.max(1, widthPoints * heightPoints)));
}

type PdfJs = typeof import('pdfjs-dist/legacy/build/pdf.mjs');

interface TextItemLike {
  str: string;
  transform: number[];
  width: number;
  height: number;
}

export interface PdfPage {
  /** Lines of the text layer, or null when the page has no text (a scan) and `image` holds it. */
  text: TextPage | null;
  image: { png: Buffer; width: number; height: number } | null;
}

function standardFontFolder(): string {
  return `${path.join(path.dirname(require.resolve('pdfjs-dist/package.json')), 'standard_fonts')}${path.sep}`;
}

export async function readPdfPages(bytes: Buffer): Promise<PdfPage[]> {
  const pdfjs = await importEsm<PdfJs>('pdfjs-dist/legacy/build/pdf.mjs');
  const document = await pdfjs.getDocument({
    data: new Uint8Array(bytes),
    verbosity: 0,
    disableFontFace: true,
    useSystemFonts: false,
    standardFontDataUrl: standardFontFolder(),
  }).promise;
  try {
    const pages: PdfPage[] = [];
    for (let pageNumber = 1; pageNumber <= document.numPages; pageNumber += 1) {
      const page = await document.getPage(pageNumber);
      const content = await page.getTextContent();
      const items = (content.items as TextItemLike[]).filter((item) => typeof item.str === 'string' && item.str.trim() !== '');
      if (items.length > 0) {
        const viewport = page.getViewport({ scale: TEXT_SCALE });
        pages.push({ text: { width: Math.round(viewport.width), height: Math.round(viewport.height), source: 'text', lines: linesFromItems(items, viewport, pageNumber - 1) }, image: null });
      } else {
        const base = page.getViewport({ scale: 1 });
        const viewport = page.getViewport({ scale: cappedRenderScale(base.width, base.height, Math.min(4, Math.max(TEXT_SCALE, RENDER_WIDTH / base.width))) });
        const factory = (document as unknown as { canvasFactory: { create(w: number, h: number): { canvas: { toBuffer(mime: string): Buffer }; context: unknown } } }).canvasFactory;
        const { canvas, context } = factory.create(Math.ceil(viewport.width), Math.ceil(viewport.height));
        await page.render({ canvasContext: context as never, canvas: canvas as never, viewport }).promise;
        pages.push({ text: null, image: { png: canvas.toBuffer('image/png'), width: Math.ceil(viewport.width), height: Math.ceil(viewport.height) } });
      }
      page.cleanup();
    }
    return pages;
  } finally {
    await document.destroy();
  }
}

interface ViewportLike {
  convertToViewportPoint(x: number, y: number): number[];
}

function linesFromItems(items: TextItemLike[], viewport: ViewportLike, page: number): TextLine[] {
  const words: TextWord[] = [];
  for (const item of items) {
    const [left, baseline] = viewport.convertToViewportPoint(item.transform[4], item.transform[5]);
    const fontHeight = Math.hypot(item.transform[2], item.transform[3]) * TEXT_SCALE || item.height * TEXT_SCALE;
    const width = item.width * TEXT_SCALE;
    // Split the item into words, placing each by its share of the characters (close enough for highlighting).
    const characters = item.str.length;
    for (const match of item.str.matchAll(/\S+/g)) {
      const start = match.index ?? 0;
      words.push({
        text: match[0],
        confidence: 1,
        box: {
          page,
          x: Math.round(left + (width * start) / characters),
          y: Math.round(baseline - fontHeight * 0.8),
          w: Math.max(1, Math.round((width * match[0].length) / characters)),
          h: Math.round(fontHeight),
        },
      });
    }
  }
  // Words whose boxes share most of their height belong to one line.
  words.sort((a, b) => a.box.y - b.box.y || a.box.x - b.box.x);
  const groups: TextWord[][] = [];
  for (const word of words) {
    const group = groups[groups.length - 1];
    const middle = word.box.y + word.box.h / 2;
    if (group && Math.abs(middle - (group[0].box.y + group[0].box.h / 2)) < Math.min(word.box.h, group[0].box.h) * 0.5) group.push(word);
    else groups.push([word]);
  }
  return groups.map(makeLine);
}
