// Receipts as shops print them around the world, on small invented slips (invented shops and prices): each
// language's total word, tendered and change, cash rounding, currencies without or with three minor units, and
// dates that cannot be. The summary words themselves are trade vocabulary from summary-words.ts.
import { readAmount } from './amounts';
import { findDates } from './dates';
import { parseReceipt } from './parse-receipt';
import { slipPage } from './slip-page';

const read = (rows: string[], locale: string, minorUnits = 2) => parseReceipt([slipPage(rows)], { locale, minorUnits, readOn: '2026-06-30' });
const parts = (receipt: ReturnType<typeof read>) => receipt.lines.filter((line) => line.kind === 'part').map((line) => line.amount);

describe('the total word of each language, with tendered minus change checking it', () => {
  it.each([
    [
      'German (SUMME, GEGEBEN BAR, RÜCKGELD, a VAT table)',
      'de-DE',
      ['BLECHWERK TEILEHANDEL GMBH', 'Hafenstr. 12, 20457 Hamburg', '06.04.2026 14:32', 'Bremsscheibe vorne     49,99 A', 'Zündkerze 4x 7,50     30,00 A', 'SUMME EUR              79,99', 'GEGEBEN BAR           100,00', 'RÜCKGELD               20,01', 'MwSt-Satz  Netto  MwSt  Brutto', 'A 19%   67,22  12,77  79,99'],
      { total: '79.99', date: '2026-04-06', vendor: 'BLECHWERK TEILEHANDEL GMBH', parts: ['49.99', '30.00'], tax: '12.77' },
    ],
    [
      'French (TOTAL TTC, dont TVA, CB)',
      'fr-FR',
      ['GARAGE DES PINS SARL', '12 rue des Lilas 69003 Lyon', 'le 15 mars 2026 à 10:12', 'Plaquettes de frein      38,50', 'Liquide refroidissement  12,50', 'TOTAL TTC                51,00', 'dont TVA 20%              8,50', 'CB                       51,00'],
      { total: '51.00', date: '2026-03-15', vendor: 'GARAGE DES PINS SARL', parts: ['38.50', '12.50'], tax: '8.50' },
    ],
    [
      'Spanish (BASE IMPONIBLE, IVA, EFECTIVO, CAMBIO)',
      'es-ES',
      ['RECAMBIOS SOLANA S.L.', 'C/ Mayor 5, 28013 Madrid', 'Fecha: 25/12/2025 10:15', 'Filtro de aceite      12,95', 'Escobillas            21,40', 'BASE IMPONIBLE        28,38', 'IVA 21%                5,97', 'TOTAL                 34,35', 'EFECTIVO              40,00', 'CAMBIO                 5,65'],
      { total: '34.35', date: '2025-12-25', vendor: 'RECAMBIOS SOLANA S.L.', parts: ['12.95', '21.40'], tax: '5.97' },
    ],
    [
      'Italian (TOTALE EURO, CONTANTI, RESTO)',
      'it-IT',
      ['AUTORICAMBI BELLINI S.R.L.', 'Via Roma 10, 40121 Bologna', '2 gennaio 2026', 'Candele accensione     24,00', 'Olio motore 5W30       31,90', 'TOTALE EURO            55,90', 'CONTANTI               60,00', 'RESTO                   4,10'],
      { total: '55.90', date: '2026-01-02', vendor: 'AUTORICAMBI BELLINI S.R.L.', parts: ['24.00', '31.90'], tax: null },
    ],
    [
      'Dutch (TOTAAL, PIN, BTW)',
      'nl-NL',
      ['ONDERDELENHUIS VAN DAM B.V.', 'Kerkstraat 3, 1017 GB Amsterdam', '12-02-2026 16:40', 'Ruitenwisser           14,95', 'Lamp H7                 9,50', 'TOTAAL                 24,45', 'PIN                    24,45'],
      { total: '24.45', date: '2026-02-12', vendor: 'ONDERDELENHUIS VAN DAM B.V.', parts: ['14.95', '9.50'], tax: null },
    ],
    [
      'Portuguese (TOTAL A PAGAR, DINHEIRO, TROCO)',
      'pt-PT',
      ['PEÇAS AUTO LUSITANA LDA', 'Rua Augusta 45, 1100-048 Lisboa', '3 de março de 2026', 'Pastilhas de travão    42,00', 'TOTAL A PAGAR          42,00', 'DINHEIRO               50,00', 'TROCO                   8,00'],
      { total: '42.00', date: '2026-03-03', vendor: 'PEÇAS AUTO LUSITANA LDA', parts: ['42.00'], tax: null },
    ],
    [
      'Malay (JUMLAH, TUNAI, BAKI)',
      'ms-MY',
      ['KEDAI ALAT GANTI SETIA SDN BHD', 'NO 5 JALAN MAWAR, 81100 JOHOR BAHRU', 'TARIKH: 14/11/2025', 'MINYAK ENJIN          45.90', 'PENAPIS UDARA         18.60', 'JUMLAH                64.50', 'TUNAI                100.00', 'BAKI                  35.50'],
      { total: '64.50', date: '2025-11-14', vendor: 'KEDAI ALAT GANTI SETIA SDN BHD', parts: ['45.90', '18.60'], tax: null },
    ],
  ])('%s', (_name, locale, rows, expected) => {
    const receipt = read(rows, locale);
    expect({ total: receipt.total.value, date: receipt.date.value, vendor: receipt.vendor.value, parts: parts(receipt), tax: receipt.tax.value }).toEqual(expected);
    // The figures below the total (tendered, change, the VAT table) never become parts, and the total is sure.
    expect(receipt.total.confidence).toBeGreaterThanOrEqual(0.95);
  });

  it('says in words which facts agreed on the total', () => {
    const receipt = read(['RECAMBIOS SOLANA S.L.', 'Filtro de aceite  12,95', 'Escobillas  21,40', 'BASE IMPONIBLE  28,38', 'IVA 21%  5,97', 'TOTAL  34,35', 'EFECTIVO  40,00', 'CAMBIO  5,65'], 'es-ES');
    expect(receipt.agreements).toEqual(['it is printed beside a total word', 'the amount tendered minus the change matches it', 'the subtotal plus tax matches it', 'the lines add up to it']);
  });
});

describe('cash rounding', () => {
  const slip = ['KEDAI ALAT GANTI SETIA SDN BHD', 'FIUS 10A        3.12', 'PITA PENEBAT    5.40', 'TOTAL           8.52', 'ROUNDING ADJ   -0.02', 'ROUNDED TOTAL   8.50', 'CASH           10.00', 'CHANGE          1.50'];

  it('takes the rounded amount paid as the total and keeps the adjustment as a line, so the lines reconcile to the cent', () => {
    const receipt = read(slip, 'en-MY');
    expect(receipt.total.value).toBe('8.50');
    expect(receipt.lines.map((line) => [line.kind, line.description, line.amount])).toEqual([
      ['part', 'FIUS 10A', '3.12'],
      ['part', 'PITA PENEBAT', '5.40'],
      ['discount', 'Rounding adjustment', '-0.02'],
    ]);
    expect(receipt.agreements).toEqual(['it is printed as the amount to pay', 'the total plus the rounding adjustment gives it', 'the amount tendered minus the change matches it', 'the lines and charges add up to it']);
    expect(receipt.notes).toEqual(["The receipt prints no currency; MYR assumed from the build's locale (en-MY)."]);
  });

  it('takes a rounding adjustment whose minus OCR lost by the rounded total printed after it', () => {
    const receipt = read(slip.map((row) => row.replace('-0.02', '0.02')), 'en-MY');
    expect(receipt.total.value).toBe('8.50');
    expect(receipt.lines[2].amount).toBe('-0.02');
  });
});

describe('cash rounding rows as tills and OCR leave them (Malaysia\'s 5-sen rounding mechanism: common practice)', () => {
  it('takes a figure beside a rounding word that is the size of the total for the rounded total, not an adjustment', () => {
    const receipt = read(['KEDAI SETIA', 'FIUS 10A  3.14', 'PITA PENEBAT  5.40', 'TOTAL SALES (INCLUSIVE GST) RM 8.54', 'ROUNDING ADJUSTMENT RM .01', 'ROUNDING RM 8.55', 'CASH RM 10.00', 'CHANGE RM 1.45'], 'en-MY');
    expect(receipt.total.value).toBe('8.55');
    expect(receipt.lines.map((line) => [line.kind, line.description, line.amount])).toEqual([
      ['part', 'FIUS 10A', '3.14'],
      ['part', 'PITA PENEBAT', '5.40'],
      ['fee', 'Rounding adjustment', '0.01'],
    ]);
    expect(receipt.agreements).toEqual(['it is printed beside a total word', 'the total plus the rounding adjustment gives it', 'the amount tendered minus the change matches it', 'the lines and charges add up to it']);
  });

  it('takes a figure whose word was lost between two totals, and their difference, for the rounding adjustment', () => {
    const receipt = read(['KEDAI SETIA', 'FIUS 10A  3.12', 'PITA PENEBAT  5.40', 'TOTAL: 8.52', '0.02', 'TOTAL 8.50'], 'en-MY');
    expect(receipt.total.value).toBe('8.50');
    expect(receipt.lines.map((line) => line.amount)).toEqual(['3.12', '5.40', '-0.02']);
    expect(receipt.agreements).toEqual(['it is printed beside a total word', 'the total plus the rounding adjustment gives it', 'the lines and charges add up to it']);
  });

  it('takes the total plus the adjustment as paid when OCR lost the rounded line', () => {
    const receipt = read(['KEDAI SETIA', 'FIUS 10A  3.13', 'PITA PENEBAT  5.40', 'TOTAL SALES (INCL GST 6%) RM 8.53', 'ROUNDING ADJUSTMENT RM 0.02'], 'en-MY');
    expect([receipt.total.value, receipt.lines.map((line) => line.amount)]).toEqual(['8.55', ['3.13', '5.40', '0.02']]);
    expect(receipt.agreements).toEqual(['it is printed as a total before its rounding adjustment', 'the lines and charges add up to it']);
  });

  it('reads a minus OCR turned into "=" before an adjustment, and a "~" before the cash, as marks of no value', () => {
    const receipt = read(['KEDAI SETIA', 'FIUS 10A  3.12', 'PITA PENEBAT  5.40', 'Total (Inclusive of GST): 8.52', 'Rounding Adj: =0.02', 'TOTAL: 8.50', 'Cash ~10.00', 'CHANGE 1.50'], 'en-MY');
    expect([receipt.total.value, receipt.lines.map((line) => line.amount)]).toEqual(['8.50', ['3.12', '5.40', '-0.02']]);
    expect(receipt.agreements).toContain('the amount tendered minus the change matches it');
  });

  it('takes no figure of a unit or more between two sums for an adjustment (a tax row between a gross and a net)', () => {
    const receipt = read(['KEDAI SETIA', 'UBAT SAPU  20.50', 'TOTAL SALES (INCLUSIVE OF GST)  20.50', 'SR 6  1.16', 'TOTAL : 19.34'], 'en-MY');
    expect([receipt.total.value, receipt.lines.map((line) => line.amount)]).toEqual(['20.50', ['20.50']]);
  });

  it('keeps a small figure between two equal totals as no adjustment', () => {
    const receipt = read(['KEDAI SETIA', 'FIUS 10A  3.12', 'PITA PENEBAT  5.40', 'TOTAL: 8.52', '0.02', 'TOTAL 8.52'], 'en-MY');
    expect([receipt.total.value, receipt.lines.map((line) => line.amount)]).toEqual(['8.52', ['3.12', '5.40']]);
  });
});

describe('total words with their qualifiers (common practice)', () => {
  it.each([
    ['en-MY', 'Total RM Incl. of GST 31.47'],
    ['de-DE', 'Summe EUR inkl. MwSt 31,47'],
    ['fr-FR', 'Total TTC en EUR 31,47'],
  ])('%s: "%s" is the total, not an item', (locale, row) => {
    const receipt = read(['KEDAI SETIA', 'ARTICLE A  20,00'.replace(',', locale === 'en-MY' ? '.' : ','), 'ARTICLE B  11,47'.replace(',', locale === 'en-MY' ? '.' : ','), row], locale);
    expect([receipt.total.value, receipt.lines.map((line) => line.amount)]).toEqual(['31.47', ['20.00', '11.47']]);
  });

  it('still reads a long description that holds a total word as an item', () => {
    const receipt = read(['KEDAI SETIA', 'TOTAL SHINE CAR WAX POLISH KIT  12.00', 'TOTAL  12.00'], 'en-MY');
    expect([receipt.total.value, receipt.lines.map((line) => line.description)]).toEqual(['12.00', ['TOTAL SHINE CAR WAX POLISH KIT']]);
  });
});

describe('tendered minus change', () => {
  it('finds the total when its word is lost, from cash minus change and the lines', () => {
    const receipt = read(['KEDAI SETIA', 'FIUS 10A        3.10', 'PITA PENEBAT    5.40', '%%%% ::         8.50', 'CASH           10.00', 'CHANGE          1.50'], 'en-MY');
    expect(receipt.total.value).toBe('8.50');
    expect(receipt.agreements).toEqual(['the amount tendered minus the change matches it', 'the lines add up to it']);
  });

  it('never takes the cash handed over for the total', () => {
    const receipt = read(['KEDAI SETIA', 'FIUS 10A   3.10', 'TOTAL   3.10', 'CASH   50.00', 'CHANGE   46.90'], 'en-MY');
    expect([receipt.total.value, parts(receipt)]).toEqual(['3.10', ['3.10']]);
  });
});

describe('currencies with other minor units (ISO 4217)', () => {
  it('reads a yen slip: no decimals, thousands grouped (JPY has 0 minor units)', () => {
    const receipt = read(['TOKO MOTOR PARTS', '2026-05-14', 'OIL FILTER       ¥1,200', 'SPARK PLUG 2 x ¥800  ¥1,600', 'TOTAL  ¥2,800'], 'ja-JP', 0);
    expect([receipt.total.value, receipt.lines.map((line) => [line.quantity, line.unitPrice, line.amount])]).toEqual([
      '2800',
      [
        ['1', '1200', '1200'],
        ['2', '800', '1600'],
      ],
    ]);
    expect(receipt.currency.value).toBe('JPY');
  });

  it('reads a dinar slip: three decimals (BHD has 3 minor units)', () => {
    const receipt = read(['GULF SPARES W.L.L.', 'BRAKE PADS     BD 12.250', 'WIPER          BD 3.500', 'TOTAL          BD 15.750'], 'en-BH', 3);
    expect([receipt.total.value, parts(receipt), receipt.currency.value]).toEqual(['15.750', ['12.250', '3.500'], 'BHD']);
  });
});

describe('amounts as printed around the world', () => {
  it.each([
    ['1.234,56', {}, '1234.56'],
    ['1,234.56', {}, '1234.56'],
    ['1 234,56', {}, '1234.56'],
    ['EUR 12,40', { decimalComma: true }, '12.40'],
    ['12,40 €', { decimalComma: true }, '12.40'],
    ['12,40€', { decimalComma: true }, '12.40'],
    ['RM12.40', {}, '12.40'],
    ['$5.00', {}, '5.00'],
    ['¥1,200', { minorUnits: 0 }, '1200'],
    ['1.200', { minorUnits: 0 }, '1200'],
    ['5,00-', { decimalComma: true }, '-5.00'],
    ['49,99A', { decimalComma: true }, '49.99'],
    ['*9.00', {}, '9.00'],
    ['9.00*', {}, '9.00'],
    ['1.250', { minorUnits: 3 }, '1.250'],
    ['1,250', { minorUnits: 3 }, '1.250'],
    // No whole part before the decimals, as some tills print amounts under one unit (from memory).
    ['.01', {}, '0.01'],
    ['RM .57', {}, '0.57'],
    ['-.02', {}, '-0.02'],
    [',50', { decimalComma: true }, '0.50'],
  ])('reads %s (%j) as %s', (printed, options, value) => {
    expect(readAmount(printed, options)?.value).toBe(value);
  });

  it('lets the locale decide an ambiguous "1.234": a thousand where the comma is the decimal mark, else 1.234', () => {
    expect(readAmount('1.234', { decimalComma: true, requireDecimals: false })?.value).toBe('1234');
    expect(readAmount('1.234', { decimalComma: false })?.value).toBe('1.234');
  });

  it('keeps a tax-class letter printed apart from the amount out of the description', () => {
    const receipt = read(['BLECHWERK GMBH', 'Bremsscheibe  49,99 A', 'SUMME  49,99'], 'de-DE');
    expect(receipt.lines.map((line) => [line.description, line.amount])).toEqual([['Bremsscheibe', '49.99']]);
  });

  it('joins an amount whose decimal point OCR read as a space on a summary line ("RM 64 13")', () => {
    const receipt = read(['KEDAI SETIA', 'FIUS 10A  64.13', 'TOTAL RM 64 13'], 'en-MY');
    expect(receipt.total.value).toBe('64.13');
  });

  it.each([
    ['SDN 8HD', 'KEDAI SETIA SDN 8HD'],
    ['8HD', 'KEDAI SETIA 8HD'],
  ])('knows the legal form "SDN BHD" as OCR misreads it (%s), so the name beats a handwritten line above it', (_, name) => {
    const receipt = read(['ali bin abu', `${name} (12345-X)`, 'NO 5 JALAN MAWAR', 'TOTAL RM 9.00'], 'en-MY');
    expect(receipt.vendor.value).toBe(name);
  });

  it('joins a decimal point OCR read but parted from its decimals, even beside a unit price ("17.25  51.. 75")', () => {
    const receipt = read(['HOSE SHOP', 'UPPER HOSE  3  17.25  51.. 75', 'LOWER HOSE  1  12.00  12. 00', 'OIL 5QT  1  27.99-  27 .99-', 'TOTAL  35.76'], 'en-US');
    expect(receipt.lines.map((line) => line.amount)).toEqual(['51.75', '12.00', '-27.99']);
    expect(receipt.total.value).toBe('35.76');
  });

  it('leaves two bare numbers beside a well-read amount apart: a quantity and a code, not lost decimals', () => {
    const receipt = read(['HOSE SHOP', 'CLAMP 12.00  3 15', 'TOTAL  12.00'], 'en-US');
    expect(parts(receipt)).toEqual(['12.00']);
  });
});

describe('dates that can be true', () => {
  it('refuses years after the upload day and long before it, as OCR misreads of the year', () => {
    const limits = { notAfter: '2026-06-30', notBefore: '2001-06-30' };
    // 2048: one digit changed gives 2008 or 2018, both possible, so neither is guessed.
    expect(findDates('25/12/2048', 'en-GB', limits)).toEqual([]);
    // 1925: no single digit changed gives a year within the limits.
    expect(findDates('25/12/1925', 'en-GB', limits)).toEqual([]);
    expect(findDates('25/12/2025', 'en-GB', limits).map((date) => date.value)).toEqual(['2025-12-25']);
  });

  it('mends an impossible year when exactly one changed digit makes it possible, unsure and with a note', () => {
    const limits = { notAfter: '2026-06-30', notBefore: '2001-06-30' };
    const [mended] = findDates('12/03/2518 13:07', 'en-MY', limits);
    expect(mended.value).toBe('2018-03-12');
    expect(mended.confidence).toBeLessThan(0.45);
    expect(mended.note).toBe('The year of the date printed reads as 2518, which cannot be; read as 12 March 2018. Check it against the receipt.');
    expect(findDates('25/12/2625', 'en-GB', limits).map((date) => date.value)).toEqual(['2025-12-25']);
  });

  it('reads eight digits whose separators OCR lost in the locale order or year first, less sure than a printed date', () => {
    expect(findDates('27032018 No.:CS-20242', 'en-MY').map((date) => [date.value, date.confidence])).toEqual([['2018-03-27', 0.4]]);
    expect(findDates('03272018', 'en-US').map((date) => date.value)).toEqual(['2018-03-27']);
    expect(findDates('20180327', 'en-GB').map((date) => date.value)).toEqual(['2018-03-27']);
    // Not a calendar day in any order, or part of a longer number: no date.
    expect(findDates('45032018', 'en-GB')).toEqual([]);
    expect(findDates('000364929024 1270320181', 'en-GB')).toEqual([]);
    // A date printed plainly on the slip wins over run-together digits.
    const receipt = read(['KEDAI SETIA', 'DOC 26032018', 'TARIKH: 27/03/2018 10:02', 'TOTAL 5.00'], 'en-MY');
    expect(receipt.date.value).toBe('2018-03-27');
  });

  it('takes the issue date beside its word over a later expiry date, and refuses an impossible year on the slip', () => {
    const receipt = read(['KEDAI SETIA', 'TARIKH: 14/11/2025 10:02', 'VOUCHER VALID UNTIL 31/12/2026', 'PRINTED 01/01/2048', 'TOTAL 5.00'], 'en-MY');
    expect(receipt.date.value).toBe('2025-11-14');
  });

  it.each([
    ['06.04.20', 'de-DE', '2020-04-06'],
    ['15 MAR 2018', 'en-MY', '2018-03-15'],
    ['15. März 2026', 'de-DE', '2026-03-15'],
    ['3 févr. 2026', 'fr-FR', '2026-02-03'],
    ['12 de diciembre de 2025', 'es-ES', '2025-12-12'],
    ['1 ottobre 2025', 'it-IT', '2025-10-01'],
    ['7 mei 2026', 'nl-NL', '2026-05-07'],
    ['9 Ogos 2025', 'ms-MY', '2025-08-09'],
  ])('reads %s (%s) as %s', (printed, locale, value) => {
    expect(findDates(printed, locale).map((date) => date.value)).toEqual([value]);
  });

  it('keeps an ambiguous day and month marked for the person to check', () => {
    const receipt = read(['KESTREL PARTS', 'DATE 03/04/2026', 'OIL  5.00', 'TOTAL  5.00'], 'en-US');
    expect(receipt.date.value).toBe('2026-03-04');
    expect(receipt.notes[0]).toMatch(/^The date 03\/04\/2026 could be 4 March 2026 or 3 April 2026/);
  });
});

describe('the shop name', () => {
  it('passes over a slogan, an address and a tax id, takes the business with its legal form, and prefers a known shop', () => {
    const rows = ['WELCOME! BEST PRICES IN TOWN!', 'BLECHWERK TEILEHANDEL GMBH', 'Hafenstr. 12, 20457 Hamburg', 'USt-IdNr DE123456789', 'Bremsscheibe  49,99', 'SUMME  49,99'];
    expect(read(rows, 'de-DE').vendor.value).toBe('BLECHWERK TEILEHANDEL GMBH');
    const known = parseReceipt([slipPage(rows.map((row) => row.replace('TEILEHANDEL', 'TEILEHANDFL')))], { locale: 'de-DE', knownVendors: ['Blechwerk Teilehandel GmbH'] });
    expect(known.vendor.value).toBe('Blechwerk Teilehandel GmbH');
  });
});
