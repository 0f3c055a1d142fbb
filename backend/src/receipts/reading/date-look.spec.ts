// The second look at a receipt's date, with tesseract on a drawn line of print ("DATE: 25/01/2018 13:22", an invented
// slip) and the first reading given as OCR might have returned it: unsure, garbled, or sure.
import sharp from 'sharp';
import type { ReadField } from '../../../../shared/api/receipt-reading';
import { lookAgainAtDate } from './date-look';
import type { NormalisedImage } from './normalise';
import { OcrPool } from './ocr';
import { type TextLine, makeLine } from './text-lines';

jest.setTimeout(60_000);

const LIMITS = { notAfter: '2026-06-30', notBefore: '2001-06-30' };
let pool: OcrPool;
let image: NormalisedImage;

beforeAll(async () => {
  pool = new OcrPool(1);
  const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="900" height="140"><rect width="900" height="140" fill="#fff"/><text x="40" y="85" font-family="DejaVu Sans Mono" font-size="32" fill="#000">DATE: 25/01/2018 13:22</text></svg>';
  const { data, info } = await sharp(Buffer.from(svg)).greyscale().png().toBuffer({ resolveWithObject: true });
  image = { png: data, width: info.width, height: info.height };
});
afterAll(() => pool.close());

/** The drawn line as the first reading returned it: these words, in the line's place, each with its confidence. */
function firstReading(words: Array<[string, number]>): TextLine[] {
  let x = 42;
  return [
    makeLine(
      words.map(([text, confidence]) => {
        const box = { page: 0, x, y: 61, w: text.length * 19, h: 27 };
        x += (text.length + 1) * 19;
        return { text, confidence, box };
      }),
    ),
  ];
}

const look = (lines: TextLine[], first: ReadField<string>) => lookAgainAtDate(pool, image, lines, first, 'en-MY', LIMITS);

describe('lookAgainAtDate', () => {
  it('replaces an unsure date when the two other sizes agree on another real day', async () => {
    const lines = firstReading([['DATE:', 0.9], ['26/01/2018', 0.5], ['13:22', 0.9]]);
    expect(await look(lines, { value: '2018-01-26', confidence: 0.5 })).toEqual({ date: { value: '2018-01-25', confidence: 0.6 }, reread: 1 });
  });

  it('confirms an unsure date another size reads the same', async () => {
    const lines = firstReading([['DATE:', 0.9], ['25/01/2018', 0.5], ['13:22', 0.9]]);
    expect(await look(lines, { value: '2018-01-25', confidence: 0.45 })).toEqual({ date: { value: '2018-01-25', confidence: 0.8 }, reread: 1 });
  });

  it('finds the date on a line whose digits the first reading garbled beside a time', async () => {
    const lines = firstReading([['Dale', 0.4], ['?5/D1/Z0i8', 0.2], ['13:22', 0.8]]);
    expect(await look(lines, { value: null, confidence: 0 })).toEqual({ date: { value: '2018-01-25', confidence: 0.6 }, reread: 1 });
  });

  it('reads nothing again when the first date was sure', async () => {
    const sure = { value: '2018-01-25', confidence: 0.9 };
    expect(await look(firstReading([['DATE:', 0.95], ['25/01/2018', 0.95]]), sure)).toEqual({ date: sure, reread: 0 });
  });

  it('reads the upper half of the slip as sparse text when no line of the first reading looks like a date', async () => {
    // The same print on a taller slip, its date line in the upper half; the first reading garbled it past recognition.
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="900" height="400"><rect width="900" height="400" fill="#fff"/><text x="40" y="85" font-family="DejaVu Sans Mono" font-size="32" fill="#000">DATE: 25/01/2018 13:22</text><text x="40" y="330" font-family="DejaVu Sans Mono" font-size="32" fill="#000">THANK YOU</text></svg>';
    const { data, info } = await sharp(Buffer.from(svg)).greyscale().png().toBuffer({ resolveWithObject: true });
    const tall = { png: data, width: info.width, height: info.height };
    const garbled = firstReading([['WOE', 0.2], ['1,15.)', 0.1], ['ORRIN,', 0.2]]);
    expect(await lookAgainAtDate(pool, tall, garbled, { value: null, confidence: 0 }, 'en-MY', LIMITS)).toEqual({ date: { value: '2018-01-25', confidence: 0.5 }, reread: 0 });
    // Nothing date-like in the upper half: still no date.
    const blank = await sharp({ create: { width: 900, height: 400, channels: 3, background: '#ffffff' } }).greyscale().png().toBuffer();
    expect(await lookAgainAtDate(pool, { png: blank, width: 900, height: 400 }, garbled, { value: null, confidence: 0 }, 'en-MY', LIMITS)).toEqual({ date: { value: null, confidence: 0 }, reread: 0 });
  });
});

describe('lookAgainAtDate beside a time (invented slip; tills print the time under the date: common practice)', () => {
  let twoLines: NormalisedImage;
  beforeAll(async () => {
    const svg =
      '<svg xmlns="http://www.w3.org/2000/svg" width="900" height="200"><rect width="900" height="200" fill="#fff"/>' +
      '<text x="40" y="75" font-family="DejaVu Sans Mono" font-size="32" fill="#000">DATE: 25/01/2018</text>' +
      '<text x="40" y="135" font-family="DejaVu Sans Mono" font-size="32" fill="#000">TIME: 13:22</text></svg>';
    const { data, info } = await sharp(Buffer.from(svg)).greyscale().png().toBuffer({ resolveWithObject: true });
    twoLines = { png: data, width: info.width, height: info.height };
  });

  it('reads the band from the line above to the line below a time when the date line itself read as no date at all', async () => {
    const lines = [
      makeLine([
        { text: 'Dale', confidence: 0.3, box: { page: 0, x: 42, y: 51, w: 76, h: 27 } },
        { text: 'Sinn', confidence: 0.2, box: { page: 0, x: 137, y: 51, w: 76, h: 27 } },
      ]),
      makeLine([
        { text: 'TIME:', confidence: 0.9, box: { page: 0, x: 42, y: 111, w: 95, h: 27 } },
        { text: '13:22', confidence: 0.9, box: { page: 0, x: 156, y: 111, w: 95, h: 27 } },
      ]),
    ];
    expect(await lookAgainAtDate(pool, twoLines, lines, { value: null, confidence: 0 }, 'en-MY', LIMITS)).toEqual({ date: { value: '2018-01-25', confidence: 0.6 }, reread: 1 });
  });

  it('reads again a date whose separators the first reading lost ("25012018")', async () => {
    const lines = firstReading([['DATE:', 0.9], ['25012018', 0.6], ['13:22', 0.9]]);
    expect(await look(lines, { value: null, confidence: 0 })).toEqual({ date: { value: '2018-01-25', confidence: 0.6 }, reread: 1 });
  });
});
