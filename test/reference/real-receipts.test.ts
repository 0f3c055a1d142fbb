// Receipt reading against real scanned shop receipts and their published truth: the SROIE set of the ICDAR 2019
// Robust Reading Challenge on Scanned Receipts OCR and Information Extraction (Huang et al., ICDAR 2019), kept
// outside the repository in ../shared/receipts-real/sroie (img/, key/ truth, box/ true text of every line).
// The parser is checked on the true text for each summary rule with the figures the slips print; a fixed sample
// of 20 scans is read end to end with floors at the measured values. Without the folder, both say they skipped.
import { Decimal } from 'decimal.js';
import { closeReaders } from '../../backend/src/receipts/reading/read-document';
import { parseReceipt } from '../../backend/src/receipts/reading/parse-receipt';
import { REAL_LOCALE, RealResult, dateRight, loadRealReceipts, readScans, realReceiptFolder, totalRight, trueTextPage, truthDate, vendorRight } from '../bench/real-receipts';

const folder = realReceiptFolder();
const whenPresent = folder ? describe : describe.skip;
if (!folder) console.log('Skipped the real-receipt checks: ../shared/receipts-real/sroie is not beside this checkout (set REAL_RECEIPTS to name another).');

// About 30 s on an idle 2-core machine; the margin is for a machine shared with other work.
jest.setTimeout(300_000);

/** The parser on the true text of one receipt of the set, as the build of a Malaysian shop (en-MY, MYR) reads it. */
function parseTrue(id: string) {
  return parseReceipt([trueTextPage(`${folder}/box/${id}.csv`)], { locale: REAL_LOCALE, minorUnits: 2, readOn: '2026-12-01' });
}

const figures = (read: ReturnType<typeof parseTrue>) => ({ total: read.total.value, subtotal: read.subtotal.value, tax: read.tax.value });
const roundingLine = (read: ReturnType<typeof parseTrue>) => read.lines.find((line) => line.description === 'Rounding adjustment')?.amount ?? null;

describe("the bench's reading of the truth's printed dates (the set prints them as the slips do, day first)", () => {
  it.each([
    ['25/12/2018', '2018-12-25'],
    ['2018-03-30', '2018-03-30'],
    ['15 MAR 2018', '2018-03-15'],
    ['05-02-18', '2018-02-05'],
    // Eight digits: year first only when that is a real date, else day first.
    ['20180330', '2018-03-30'],
    ['25032018', '2018-03-25'],
  ])('reads %s as %s', (printed, iso) => {
    expect(truthDate(printed)).toBe(iso);
  });
});

whenPresent('the parser on the true text of real receipts (SROIE truth, box/ files)', () => {
  it('takes the cash-rounded amount paid as the total and keeps the adjustment as its own line (receipt 002)', () => {
    // Printed: TOTAL RM 33.92, ROUNDING ADJUSTMENT -RM 0.02, TOTAL ROUNDED RM 33.90, CASH RM 50.00, CHANGE RM 16.10.
    const read = parseTrue('002');
    expect(read.total.value).toBe('33.90');
    expect(roundingLine(read)).toBe('-0.02');
    expect(read.agreements).toEqual(expect.arrayContaining(['the total plus the rounding adjustment gives it', 'the amount tendered minus the change matches it']));
    expect(read.total.confidence).toBeGreaterThanOrEqual(0.95);
  });

  it('checks subtotal + tax + rounding against the total, and the tax table under it (receipt 008)', () => {
    // Printed: SUB TOTAL 106.10, TOTAL GST 6.37, ROUNDING -0.02, TOTAL 112.45, CASH 112.45; table "SR 6 106.10 6.37".
    const read = parseTrue('008');
    expect(figures(read)).toEqual({ total: '112.45', subtotal: '106.10', tax: '6.37' });
    expect(roundingLine(read)).toBe('-0.02');
    // CHANGE 0.00 is printed: the cash handed over was the total to the cent.
    expect(read.agreements).toEqual([
      'it is printed beside a total word',
      'the amount tendered minus the change matches it',
      'the subtotal plus tax plus the rounding adjustment matches it',
      'the lines and charges add up to it',
      'net plus tax in the tax table gives it',
      'the lines add up to the subtotal',
    ]);
    // Lines below the total (cash, change, the tax table) are never parts.
    expect(read.lines.filter((line) => line.kind === 'part').map((line) => line.amount)).toEqual(['15.00', '21.00', '18.00', '50.00', '2.10']);
  });

  it('adds a service charge and takes a discount off before rounding (receipt 037)', () => {
    // Printed: SUBTOTAL 79.60, DISCOUNT -30.00, SERV CHARGE 10% 4.96, GST @ 6% 3.27, ROUNDING ADJ -0.03, TOTAL 57.80.
    const read = parseTrue('037');
    expect(figures(read)).toEqual({ total: '57.80', subtotal: '79.60', tax: '3.27' });
    expect(read.discount.value).toBe('30.00');
    expect(read.lines.filter((line) => line.kind === 'fee').map((line) => [line.description, line.amount])).toEqual([['SERV CHARGE 10%', '4.96']]);
    expect(roundingLine(read)).toBe('-0.03');
  });

  it('finds the lines adding up to the subtotal and subtotal + tax to a total printed without its word (receipt 016)', () => {
    // Printed: 2.83 and 66.04 as lines, SUB TOTAL RM 68.87, GST/TAX 6% RM 4.13, "TO : RM 73.00" (label cut short), and
    // under it a GST summary "SR @ 6% 68.87 4.13", found although no total word stands above it.
    const read = parseTrue('016');
    expect(figures(read)).toEqual({ total: '73.00', subtotal: '68.87', tax: '4.13' });
    expect(read.agreements).toEqual(['the subtotal plus tax matches it', 'the lines and charges add up to it', 'net plus tax in the tax table gives it', 'the lines add up to the subtotal']);
  });

  it('takes a figure beside a rounding word that is the size of the total for the rounded total (receipt 186)', () => {
    // Printed: TOTAL SALES (INCLUSIVE GST) RM 45.34, ROUNDING ADJUSTMENT RM .01, ROUNDING RM 45.35, CREDIT 45.35, CHANGE .00.
    const read = parseTrue('186');
    expect(read.total.value).toBe('45.35');
    expect(roundingLine(read)).toBe('0.01');
    expect(read.agreements).toEqual(['it is printed beside a total word', 'the total plus the rounding adjustment gives it', 'the lines and charges add up to it', 'net plus tax in the tax table gives it']);
  });

  it('takes a figure printed without its word between two totals, and their difference, for the adjustment (receipt 104)', () => {
    // Printed: TOTAL: 102.39, then 0.01 alone, then TOTAL 102.40.
    const read = parseTrue('104');
    expect(read.total.value).toBe('102.40');
    expect(roundingLine(read)).toBe('0.01');
  });

  it('takes the amount tendered minus the change as a check of the total (receipt 003)', () => {
    const read = parseTrue('003');
    expect(read.total.value).toBe('80.90');
    expect(read.agreements).toContain('the amount tendered minus the change matches it');
  });

  it('reads 96.5 % of the 200 totals and every date from the true text (measured: 96.5 % and 100 %)', () => {
    const receipts = loadRealReceipts(folder!);
    const results: RealResult[] = receipts.map((truth) => ({ truth, read: parseReceipt([trueTextPage(truth.boxFile)], { locale: REAL_LOCALE, minorUnits: 2 }), ms: 0 }));
    const share = (test: (result: RealResult) => boolean) => results.filter(test).length / results.length;
    expect(share(totalRight)).toBeGreaterThanOrEqual(0.965);
    expect(share(dateRight)).toBe(1);
  });
});

whenPresent('20 real scans read end to end (tesseract.js, the image preparation, the parser)', () => {
  let results: RealResult[];
  beforeAll(async () => {
    // A fixed sample spread over the set: every tenth receipt.
    const sample = loadRealReceipts(folder!).filter((_, index) => index % 10 === 0).slice(0, 20);
    results = await readScans(sample);
  });
  afterAll(() => closeReaders());

  it('holds the floors measured on this sample', () => {
    expect(results).toHaveLength(20);
    const right = (test: (result: RealResult) => boolean) => results.filter(test).length;
    expect(right(totalRight)).toBeGreaterThanOrEqual(TOTAL_FLOOR);
    expect(right(dateRight)).toBeGreaterThanOrEqual(DATE_FLOOR);
    expect(right(vendorRight)).toBeGreaterThanOrEqual(VENDOR_FLOOR);
    for (const { read } of results) if (read.total.value !== null) expect(new Decimal(read.total.value).isFinite()).toBe(true);
  });
});

// Measured on the sample (receipts 000, 010, ... 190): 17 totals, 18 dates and 15 shop names right (with a total
// whose last decimal was garbled backed by the arithmetic within its range; before it 16; with two independent facts
// for a figure printed nowhere, the date and heading looks; before them 15, 18 and not held); see the bench's
// real-receipt section for the whole set.
const TOTAL_FLOOR = 17;
const DATE_FLOOR = 18;
const VENDOR_FLOOR = 15;
