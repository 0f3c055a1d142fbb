// The second look at a slip's heading, with tesseract on a drawn slip (an invented shop): the name printed large
// above a small address line, and the first reading given as OCR returns it when the large print was lost.
import sharp from 'sharp';
import { lookAgainAtHeading } from './heading-look';
import type { NormalisedImage } from './normalise';
import { OcrPool } from './ocr';
import { type TextLine, makeLine } from './text-lines';

jest.setTimeout(60_000);

let pool: OcrPool;
let image: NormalisedImage;

beforeAll(async () => {
  pool = new OcrPool(1);
  const text = (y: number, size: number, words: string) => `<text x="40" y="${y}" font-family="DejaVu Sans" font-weight="bold" font-size="${size}" fill="#000">${words}</text>`;
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="900" height="260"><rect width="900" height="260" fill="#fff"/>${text(90, 72, 'KEDAI CERIA')}${text(170, 26, 'NO 5 JALAN MAWAR')}${text(230, 26, 'TOTAL 5.00')}</svg>`;
  const { data, info } = await sharp(Buffer.from(svg)).greyscale().png().toBuffer({ resolveWithObject: true });
  image = { png: data, width: info.width, height: info.height };
});
afterAll(() => pool.close());

const line = (text: string, confidence: number, y: number, h: number): TextLine => makeLine(text.split(' ').map((word, index) => ({ text: word, confidence, box: { page: 0, x: 40 + index * 120, y, w: 110, h } })));
const address = line('NO 5 JALAN MAWAR', 0.95, 148, 26);
const total = line('TOTAL 5.00', 0.95, 208, 26);

describe('lookAgainAtHeading', () => {
  it('reads the name again from the band above the address when the first reading lost it', async () => {
    // 0.91: the OCR's own confidence in the drawn print (tesseract is deterministic on one picture).
    const lines = [line('Ee', 0.2, 20, 72), address, total];
    expect(await lookAgainAtHeading(pool, image, lines, { value: null, confidence: 0 })).toEqual({ value: 'KEDAI CERIA', confidence: 0.91 });
  });

  it('keeps the first reading when a name was read above the address', async () => {
    const first = { value: 'KEDAI CERIA', confidence: 0.9 };
    expect(await lookAgainAtHeading(pool, image, [line('KEDAI CERIA', 0.9, 20, 72), address, total], first)).toBe(first);
  });
});
