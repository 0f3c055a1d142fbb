// The earliest day a build's receipt can carry, and the parser refusing a date before it (a year OCR misread).
import { parseReceipt } from './parse-receipt';
import { YEARS_BOUGHT_AHEAD, earliestReceiptDay } from './receipt-date';
import { slipPage } from './slip-page';

describe('earliestReceiptDay', () => {
  it('is the build start less the years parts are bought ahead, and nothing without a start', () => {
    expect(YEARS_BOUGHT_AHEAD).toBe(5);
    expect(earliestReceiptDay('2026-03-14')).toBe('2021-03-14');
    expect(earliestReceiptDay(null)).toBeNull();
  });

  it('rolls a 29 February start into 1 March of a common year (as Date.UTC does, ECMA-262 MakeDay)', () => {
    expect(earliestReceiptDay('2024-02-29')).toBe('2019-03-01');
  });
});

describe('a receipt dated before the build could have bought it', () => {
  // An invented slip whose year OCR read as 2013 for 2018 in one place, and correctly beside the till's time.
  const rows = ['FERNHILL AUTO SPARES', 'DATE 21/03/2013', 'RELAY 12.00', 'TOTAL 12.00', '21/03/2018 14:02'];

  it('keeps the first date the slip prints when the build sets no earliest day', () => {
    const receipt = parseReceipt([slipPage(rows)], { locale: 'en-GB', minorUnits: 2, readOn: '2018-04-01' });
    expect(receipt.date.value).toBe('2013-03-21');
  });

  it('refuses the impossible year and takes the date that can be true', () => {
    const receipt = parseReceipt([slipPage(rows)], { locale: 'en-GB', minorUnits: 2, readOn: '2018-04-01', notBefore: earliestReceiptDay('2018-06-01')! }); // 2013-06-01
    expect(receipt.date.value).toBe('2018-03-21');
  });
});
