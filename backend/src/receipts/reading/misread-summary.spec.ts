// The summary figures of slips OCR misread in part (invented shops and prices, laid out the way real scans come
// back): a figure printed nowhere is taken only when two independent facts agree on it, a point lost from a summary
// amount, a tax table's own total row, a printed zero change, a stray stroke before an amount.
import { readAmount } from './amounts';
import { parseReceipt } from './parse-receipt';
import { slipPage } from './slip-page';

const read = (rows: string[], locale = 'en-MY') => parseReceipt([slipPage(rows)], { locale, minorUnits: 2, readOn: '2026-06-30' });

describe('a figure printed nowhere needs two independent facts', () => {
  it('keeps the printed total over cash minus a misread change (100.00 - 16.10 = 83.90 stands alone)', () => {
    const receipt = read(['KEDAI SETIA', 'BEG SEKOLAH  80.90', 'TOTAL  80.90', 'CASH  100.00', 'CHANGE  16.10']);
    expect(receipt.total).toEqual({ value: '80.90', confidence: 0.95 });
    expect(receipt.agreements).toEqual(['it is printed beside a total word', 'the lines add up to it']);
  });

  it('takes cash minus change when the lines agree with it, over a total whose digit was misread', () => {
    const receipt = read(['KEDAI SETIA', 'PAIP  40.00', 'KLIP  23.60', 'TOTAL  63.80', 'CASH  100.00', 'CHANGE  36.40']);
    expect(receipt.total.value).toBe('63.60');
    expect(receipt.agreements).toEqual(['the amount tendered minus the change matches it', 'the lines add up to it']);
  });

  it('keeps cash minus change when the total line is lost and the lines are one line short, never mends it to their sum', () => {
    // The grand total's line was lost to OCR and a 20.00 item line lost its point ("2000"): the lines add up to
    // 72.80, one digit from 92.80, but 92.80 was given by the cash block, not misread.
    const receipt = read(['KEDAI SETIA', 'PAIP  28.00', 'KLIP  13.00', 'HOS  2000', 'MINYAK  31.80', 'CASH  100.00', 'CHANGE  7.20']);
    expect(receipt.total.value).toBe('92.80');
    expect(receipt.agreements).toEqual(['the amount tendered minus the change matches it']);
    expect(receipt.notes.join(' ')).not.toContain('taken as 72.80');
  });

  it('takes the figure the arithmetic gives within a total whose last decimal OCR garbled ("TOTAL 213.9%")', () => {
    // 180.00 + 10 % service 18.00 + 6 % tax 11.88 - rounding 0.03 = 209.85; a tax-table net (198.00) lies below.
    const receipt = read(['KEDAI SETIA', 'PAIP  100.00', 'KLIP  80.00', 'SUB TOTAL  180.00', 'SERVICE CHARGE 10%  18.00', 'GST 6%  11.88', 'ROUNDING ADJ  -0.03', 'TOTAL  209.8%', 'SR GST  198.00']);
    expect(receipt.total.value).toBe('209.85');
    expect(receipt.agreements).toContain('it is printed beside a total word, its last digit unclear');
    // One decimal short ("NET TOTAL 209.8") reads the same way.
    expect(read(['KEDAI SETIA', 'PAIP  100.00', 'KLIP  80.00', 'SUB TOTAL  180.00', 'SERVICE CHARGE 10%  18.00', 'GST 6%  11.88', 'ROUNDING ADJ  -0.03', 'NET TOTAL  209.8', 'SR GST  198.00']).total.value).toBe('209.85');
  });

  it('gives a garbled total no figure the arithmetic does not make within its range', () => {
    const receipt = read(['KEDAI SETIA', 'PAIP  100.00', 'TOTAL  343.9%']);
    expect(receipt.total.value).toBeNull();
    expect(receipt.notes).toContain('No total was found; enter it from the receipt.');
  });

  it('makes the total from subtotal + tax + rounding when the tax table agrees, over a misread total and change', () => {
    // Printed 112.45 (read 112.46), CASH 112.45 (read 112.48), CHANGE 0.00 (read 6.00).
    const receipt = read(['KEDAI SETIA', 'PAIP  106.10', 'SUB TOTAL  106.10', 'TOTAL GST  6.37', 'ROUNDING  -0.02', 'TOTAL  112.46', 'CASH  112.48', 'CHANGE  6.00', 'GST SUMMARY', 'TAX CODE  %  AMOUNT  GST', 'SR  6  106.10  6.37']);
    expect(receipt.total.value).toBe('112.45');
    expect(receipt.agreements).toEqual([
      'the subtotal plus tax plus the rounding adjustment matches it',
      // The lines adding up to that very subtotal are said once, of the subtotal: no second fact for the sum.
      'net plus tax in the tax table gives it',
      'the lines add up to the subtotal',
    ]);
    expect(receipt.lines.map((line) => [line.description, line.amount])).toEqual([
      ['PAIP', '106.10'],
      ['Rounding adjustment', '-0.02'],
    ]);
  });

  it('counts the lines adding up to the subtotal the sum was made from as no second fact', () => {
    // 26.00 + a misread tax 1.66 = 27.66 rests on one printed sum only: the printed total stays.
    const receipt = read(['KEDAI SETIA', 'FAIL  26.00', 'SUB-TOTAL  26.00', 'TOTAL TAX  1.66', 'TOTAL  27.56']);
    expect(receipt.total.value).toBe('27.56');
  });

  it('offers a sum that stands alone, unsure, when nothing is printed beside a total word', () => {
    const receipt = read(['KEDAI SETIA', 'FAIL  26.00', 'SUB-TOTAL  26.00', 'TOTAL TAX  1.56', 'ROUNDING  -0.01', 'GEE, CE JAX  7.55']);
    expect(receipt.total).toEqual({ value: '27.55', confidence: 0.5 });
    expect(receipt.notes).toContain("No total could be read beside its word; taken as 27.55, what the slip's other figures give. Check it.");
  });
});

describe('summary amounts OCR misread', () => {
  it('reads a summary amount whose decimal point was lost ("5142", "308", "-001") with the currency\'s decimals', () => {
    const receipt = read(['KEDAI SETIA', 'NASI  51.42', 'Total Sales (Excluding GST)  5142', 'Total GST  308', 'Rounding  -001', 'Total Sales (Inclusive of GST)  54.49']);
    expect([receipt.subtotal.value, receipt.tax.value, receipt.total.value]).toEqual(['51.42', '3.08', '54.49']);
    expect(receipt.lines.find((line) => line.description === 'Rounding adjustment')?.amount).toBe('-0.01');
    expect(receipt.agreements).toContain('the subtotal plus tax plus the rounding adjustment matches it');
  });

  it('never reads a lost point into a count beside a total word, nor into a yen amount', () => {
    expect(read(['KEDAI SETIA', 'NASI  5.00', 'TOTAL QTY  120', 'TOTAL  5.00']).total.value).toBe('5.00');
    const yen = parseReceipt([slipPage(['TOKO MOTOR', 'OIL FILTER  1200', 'TOTAL  1200'])], { locale: 'ja-JP', minorUnits: 0 });
    expect(yen.total.value).toBe('1200');
  });

  it('takes a printed zero change as proof that the cash handed over was the total', () => {
    const receipt = read(['KEDAI SETIA', 'FAIL  16.98', 'SUB-TOTAL  16.98', 'TOTAL  /18.00', 'CASH  18.00', 'CHANGE  0.00', 'GST SUMMARY', 'TAX CODE  %  AMOUNT  TAX', 'SR  6.00  16.98  1.02', 'TOTAL:  16.98  1.02']);
    expect(receipt.total.value).toBe('18.00');
    expect(receipt.agreements).toEqual(['it is printed beside a total word', 'the amount tendered minus the change matches it', 'net plus tax in the tax table gives it', 'the lines add up to the subtotal']);
    // Without the zero change, the cash handed over is only "the amount paid".
    expect(read(['KEDAI SETIA', 'FAIL  16.98', 'TOTAL  18.00', 'CASH  18.00']).agreements).toEqual(['it is printed beside a total word', 'the amount paid matches it']);
  });

  it('never takes the tax of a tax table\'s own total row for the receipt\'s total', () => {
    const receipt = read(['KEDAI SETIA', 'FAIL  16.98', 'T0T4L  18.00', 'GST SUMMARY', 'TAX CODE  %  AMOUNT  TAX', 'TOTAL:  16.98  1.02']);
    expect(receipt.total.value).not.toBe('1.02');
    expect(receipt.tax.value).toBe('1.02');
  });

  it('reads an amount after a stray stroke ("/153.35"), a little less sure, but no date or fraction', () => {
    expect(readAmount('/153.35')).toEqual({ value: '153.35', mark: null, confidence: 0.8 });
    expect(readAmount('12/25')).toBeNull();
    expect(readAmount('1/2.50')).toBeNull();
  });
});
