// The render-size cap of PDF pages: a page box of any size renders within MAX_RENDER_PIXELS.
import { cappedRenderScale, MAX_RENDER_PIXELS, readPdfPages } from './pdf-text';

/** A one-page PDF without text whose page box is `size` points square (14,400 is the largest PDF 1.7 allows, ISO 32000-1 annex C). */
function blankPdf(size: number): Buffer {
  return Buffer.from(
    `%PDF-1.4\n1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n2 0 obj << /Type /Pages /Kids [3 0 R] /Count 1 >> endobj\n` +
      `3 0 obj << /Type /Page /Parent 2 0 R /MediaBox [0 0 ${size} ${size}] >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n`,
  );
}

describe('PDF page rendering', () => {
  it('keeps the wanted scale for a receipt-sized page and shrinks a huge one to the cap', () => {
    expect(cappedRenderScale(226, 600, 4)).toBe(4);
    const scale = cappedRenderScale(14_400, 14_400, 2);
    expect(scale).toBeCloseTo(Math.sqrt(40_000_000) / 14_400, 12);
    expect(14_400 * scale * (14_400 * scale)).toBeLessThanOrEqual(MAX_RENDER_PIXELS + 1);
  });

  it('renders a 14,400-point page within 40 megapixels instead of at 2 px per point (829 megapixels)', async () => {
    const [page] = await readPdfPages(blankPdf(14_400));
    expect(page.text).toBeNull();
    expect(page.image!.width).toBe(Math.ceil(14_400 * cappedRenderScale(14_400, 14_400, 2)));
    expect(page.image!.width * page.image!.height).toBeLessThanOrEqual(MAX_RENDER_PIXELS + 2 * page.image!.width + 1);
  }, 60_000);
});
