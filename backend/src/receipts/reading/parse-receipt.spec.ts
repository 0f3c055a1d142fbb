// The receipt parser on plain text laid out like OCR output: layouts, kinds, totals, reconciliation, notes.
import { Decimal } from '../../../../shared/money';
import { lineKind, looksLikePartNumber, parseReceipt, repairUnitPrice } from './parse-receipt';
import { CHAR, ROW, slipPage as page } from './slip-page';

const counterSlip = [
  '      QUAYSIDE PARTS COUNTER',
  '       2 HARBOUR YARD UNIT 7',
  'INVOICE 30523   DATE 10/27/2026',
  'PART NO   DESCRIPTION            QTY    PRICE    AMOUNT',
  '-------------------------------------------------------',
  'OF-2210   OIL FILTER               2     6.49     12.98',
  'BP-4471C  CERAMIC BRAKE PAD SET    3    38.49    115.47',
  '          HAZMAT FEE               1     6.00      6.00',
  '-------------------------------------------------------',
  'SUBTOTAL                                 $134.45',
  'SALES TAX 7.25%                            $9.75',
  'TOTAL                                    $144.20',
  'VISA ****4410  APPROVED',
  'CHANGE                                     $0.00',
];

describe('parseReceipt: a counter slip with columns', () => {
  const receipt = parseReceipt([page(counterSlip)], { locale: 'en-US' });

  it('reads vendor, date and currency', () => {
    expect(receipt.vendor).toEqual({ value: 'QUAYSIDE PARTS COUNTER', confidence: 0.95 });
    expect(receipt.date.value).toBe('2026-10-27');
    expect(receipt.currency).toEqual({ value: 'USD', confidence: 0.85 });
  });

  it('reads part number, quantity, unit price and amount from the columns', () => {
    expect(receipt.lines.map(({ kind, description, partNumber, quantity, unitPrice, amount }) => ({ kind, description, partNumber, quantity, unitPrice, amount }))).toEqual([
      { kind: 'part', description: 'OIL FILTER', partNumber: 'OF-2210', quantity: '2', unitPrice: '6.49', amount: '12.98' },
      { kind: 'part', description: 'CERAMIC BRAKE PAD SET', partNumber: 'BP-4471C', quantity: '3', unitPrice: '38.49', amount: '115.47' },
      { kind: 'fee', description: 'HAZMAT FEE', partNumber: null, quantity: '1', unitPrice: '6.00', amount: '6.00' },
    ]);
  });

  it('reads the totals; they reconcile, so they are trusted, and there are no notes', () => {
    expect(receipt.subtotal).toEqual({ value: '134.45', confidence: 0.95 });
    expect(receipt.tax).toEqual({ value: '9.75', confidence: 0.95 });
    expect(receipt.total).toEqual({ value: '144.20', confidence: 0.95 });
    expect(receipt.shipping).toEqual({ value: null, confidence: 0 });
    expect(receipt.discount).toEqual({ value: null, confidence: 0 });
    expect(receipt.notes).toEqual([]);
  });

  it('boxes each line in page pixels and keeps every word', () => {
    expect(receipt.lines[0].box).toEqual({ page: 0, x: 0, y: 5 * ROW, w: 55 * CHAR, h: 20 });
    expect(receipt.words).toHaveLength(counterSlip.join(' ').split(/\s+/).filter((word) => word !== '').length);
    expect(receipt.pages).toEqual([{ width: 600, height: counterSlip.length * ROW, source: 'ocr' }]);
  });
});

describe('parseReceipt: a shelf-store slip', () => {
  const slip = [
    'Fernbrook Garage Goods',
    '1200 Orchard Parkway',
    'Feb 13, 2026  2:47 PM',
    'IGNITION COIL                $85.50',
    '   2 @ $42.75',
    '   SKU IC-3350',
    'OIL FILTER                    $6.49',
    '   SKU OF-2210',
    'CABIN AIR FILTER             $33.78',
    '   2@$16.89',
    'LOYALTY DISCOUNT             -$5.00',
    'Subtotal                    $120.77',
    'Sales Tax 6.5%                $7.85',
    'TOTAL                       $128.62',
    'Card                        $128.62',
  ];
  const receipt = parseReceipt([page(slip)], { locale: 'en-US' });

  it('takes quantity and unit price from the "qty @ price" line and the part number from the SKU line under it', () => {
    expect(receipt.lines.map(({ kind, description, partNumber, quantity, unitPrice, amount }) => [kind, description, partNumber, quantity, unitPrice, amount])).toEqual([
      ['part', 'IGNITION COIL', 'IC-3350', '2', '42.75', '85.50'],
      ['part', 'OIL FILTER', 'OF-2210', '1', '6.49', '6.49'],
      ['part', 'CABIN AIR FILTER', null, '2', '16.89', '33.78'],
      ['discount', 'LOYALTY DISCOUNT', null, '1', '-5.00', '-5.00'],
    ]);
  });

  it('boxes an item together with its quantity and SKU lines', () => {
    expect(receipt.lines[0].box).toEqual({ page: 0, x: 0, y: 3 * ROW, w: 35 * CHAR, h: 2 * ROW + 20 });
  });

  it('reads the date written with a month name, and stops at the total (the card line is not a line)', () => {
    expect(receipt.date.value).toBe('2026-02-13');
    expect(receipt.total.value).toBe('128.62');
    expect(receipt.lines).toHaveLength(4);
  });
});

describe('parseReceipt: returns and cores', () => {
  it('reads a return slip with trailing minus signs as returns with negative prices and total', () => {
    const receipt = parseReceipt(
      [
        page([
          'QUAYSIDE PARTS COUNTER',
          'DATE 08/21/2026',
          'PART NO   DESCRIPTION            QTY    PRICE    AMOUNT',
          'EO-5W305  ENGINE OIL 5W30 5QT      1   27.99-    27.99-',
          'WB-2000   WIPER BLADE 20IN         1   14.99-    14.99-',
          'SUBTOTAL                    $42.98-',
          'TAX                          $3.12-',
          'REFUND TOTAL                $46.10-',
        ]),
      ],
      { locale: 'en-US' },
    );
    expect(receipt.lines.map(({ kind, partNumber, unitPrice, amount }) => [kind, partNumber, unitPrice, amount])).toEqual([
      ['return', 'EO-5W305', '-27.99', '-27.99'],
      ['return', 'WB-2000', '-14.99', '-14.99'],
    ]);
    expect([receipt.subtotal.value, receipt.tax.value, receipt.total.value]).toEqual(['-42.98', '-3.12', '-46.10']);
    expect(receipt.notes).toEqual([]);
  });

  it('reads core charges and core refunds (and never takes CORE CHARGE for a CHANGE line)', () => {
    const receipt = parseReceipt(
      [
        page([
          'BRACKENRIDGE AUTO SPARES',
          'DATE 09/21/2026',
          'ALT-3307R ALTERNATOR REMAN 110A     1   189.00   189.00',
          'ALT-3307R CORE CHARGE              1    45.00    45.00',
          'CAL-7120  CORE REFUND              1   (18.00)  (18.00)',
          'SUBTOTAL                          $216.00',
          'TOTAL                             $216.00',
        ]),
      ],
      { locale: 'en-US' },
    );
    expect(receipt.lines.map(({ kind, partNumber, amount }) => [kind, partNumber, amount])).toEqual([
      ['part', 'ALT-3307R', '189.00'],
      ['core_charge', 'ALT-3307R', '45.00'],
      ['core_refund', 'CAL-7120', '-18.00'],
    ]);
    expect(receipt.total.value).toBe('216.00');
  });
});

describe('parseReceipt: an invoice with shipping, a receipt-level discount and EUR', () => {
  const receipt = parseReceipt(
    [
      page([
        'Ostler & Pike Restorations',
        'INVOICE',
        'Invoice date: 16 Aug 2026',
        'Item      Description           Qty   Unit price     Amount',
        'IC-3350   IGNITION COIL           3   EUR 42.75   EUR 128.25',
        'OF-2210   OIL FILTER              1    EUR 6.49     EUR 6.49',
        '          Handling fee            1    EUR 3.50     EUR 3.50',
        '                             Subtotal             EUR 138.24',
        '                             Shipping               EUR 9.80',
        '                             Discount             -EUR 10.00',
        '                             VAT 20%               EUR 27.65',
        '                             Total                EUR 165.69',
      ]),
    ],
    { locale: 'en-GB' },
  );

  it('reads currency, shipping and the discount as a positive amount to subtract', () => {
    expect(receipt.currency).toEqual({ value: 'EUR', confidence: 0.95 });
    expect([receipt.subtotal.value, receipt.shipping.value, receipt.discount.value, receipt.tax.value, receipt.total.value]).toEqual(['138.24', '9.80', '10.00', '27.65', '165.69']);
    expect(receipt.total.confidence).toBe(0.95);
  });

  it('reads the table lines, with the mark printed apart from the number', () => {
    expect(receipt.lines.map(({ kind, partNumber, quantity, unitPrice, amount }) => [kind, partNumber, quantity, unitPrice, amount])).toEqual([
      ['part', 'IC-3350', '3', '42.75', '128.25'],
      ['part', 'OF-2210', '1', '6.49', '6.49'],
      ['fee', null, '1', '3.50', '3.50'],
    ]);
    expect(receipt.vendor.value).toBe('Ostler & Pike Restorations');
    expect(receipt.date.value).toBe('2026-08-16');
  });
});

describe('parseReceipt: OCR damage and what the receipt does not say', () => {
  it('reads amounts with letters for digits and a comma for the dot, and lowers those lines\' confidence', () => {
    const receipt = parseReceipt(
      [
        page([
          'HOLLOWELL MOTOR SUPPLY',
          'THERMOSTAT 180F          1O.5O',
          'WIPER BLADE 20IN          6,49',
          'OIL FILTER                6.49',
          'TOTAL                    23.48',
        ]),
      ],
      { locale: 'en-US' },
    );
    expect(receipt.lines.map((line) => [line.amount, line.confidence])).toEqual([
      ['10.50', 0.7],
      ['6.49', 0.85],
      ['6.49', 0.95],
    ]);
    expect(receipt.total).toEqual({ value: '23.48', confidence: 0.95 });
  });

  it('corrects a badly read total one character off when everything else adds up, and says so', () => {
    const receipt = parseReceipt(
      [page(['KESTREL PARTS', 'BRAKE FLUID DOT4 1L    13.99', 'HEADLAMP BULB H4        9.49', 'SUBTOTAL    $23.48', 'TOTAL      $523.48'], 0.95, { 4: 0.4 })],
      { locale: 'en-US' },
    );
    expect(receipt.total).toEqual({ value: '23.48', confidence: 0.4 });
    expect(receipt.notes).toEqual(['The total reads 523.48; taken as 23.48, what the lines and charges add up to. Check it.']);
  });

  it('reports well-read totals that do not add up instead of changing them', () => {
    const receipt = parseReceipt([page(['KESTREL PARTS', 'BRAKE FLUID DOT4 1L    13.99', 'SUBTOTAL    $13.99', 'TAX    $1.00', 'TOTAL      $19.99'])], { locale: 'en-US' });
    expect(receipt.total).toEqual({ value: '19.99', confidence: 0.95 });
    expect(receipt.notes).toEqual(['The lines and charges add up to 14.99 but the total reads 19.99; check the amounts.']);
  });

  it('reports a subtotal the lines miss', () => {
    const receipt = parseReceipt([page(['KESTREL PARTS', 'BRAKE FLUID DOT4 1L    13.99', 'SUBTOTAL    $20.00', 'TOTAL      $20.00'])], { locale: 'en-US' });
    expect(receipt.notes).toEqual(['The lines add up to 13.99 but the subtotal reads 20.00; a line may be missing or misread.']);
    expect(receipt.lines[0].confidence).toBe(0.95);
  });

  it('corrects the one line that, one character off, keeps the lines from adding up to the subtotal', () => {
    const receipt = parseReceipt(
      [page(['KESTREL PARTS', 'THERMOSTAT 180F   1   11.179   11.179', 'OIL FILTER        1    6.49     6.49', 'SUBTOTAL    $18.28', 'TOTAL      $18.28'])],
      { locale: 'en-US' },
    );
    expect(receipt.lines.map(({ unitPrice, amount, confidence }) => [unitPrice, amount, confidence])).toEqual([
      ['11.79', '11.79', 0.57],
      ['6.49', '6.49', 1],
    ]);
    expect(receipt.notes).toEqual(['A line reads 11.179; taken as 11.79 so the lines add up to the subtotal. Check it.']);
  });

  it('uses the arithmetic of a line to repair a unit price that lost its dot', () => {
    const receipt = parseReceipt([page(['FERNBROOK', 'IGNITION COIL   $85.50', '  2 @ $4275', 'TOTAL $85.50'])], { locale: 'en-US' });
    expect(receipt.lines[0]).toMatchObject({ quantity: '2', unitPrice: '42.75', amount: '85.50' });
  });

  it('reports an ambiguous date with a low confidence and a note, read in the locale\'s order', () => {
    const us = parseReceipt([page(['KESTREL PARTS', 'DATE 03/04/2026', 'OIL FILTER 6.49', 'TOTAL 6.49'])], { locale: 'en-US' });
    const gb = parseReceipt([page(['KESTREL PARTS', 'DATE 03/04/2026', 'OIL FILTER 6.49', 'TOTAL 6.49'])], { locale: 'en-GB' });
    expect(us.date).toEqual({ value: '2026-03-04', confidence: 0.48 });
    expect(gb.date).toEqual({ value: '2026-04-03', confidence: 0.48 });
    expect(us.notes[0]).toMatch(/^The date 03\/04\/2026 could be 4 March 2026 or 3 April 2026/);
  });

  it('reads RM amounts as MYR and a day-first short date for en-MY', () => {
    const receipt = parseReceipt([page(['TAMARIND SPARE PARTS', '14-11-26', 'HOSE CLAMP 12PK   RM 5.49', 'TOTAL   RM 5.49'])], { locale: 'en-MY' });
    expect([receipt.currency.value, receipt.date.value, receipt.total.value, receipt.lines[0].amount]).toEqual(['MYR', '2026-11-14', '5.49', '5.49']);
  });

  it('assumes the locale\'s currency when no mark is printed, with a low confidence and a note', () => {
    const receipt = parseReceipt([page(['QUAYSIDE', 'OIL FILTER 6.49', 'TOTAL 6.49'])], { locale: 'en-GB' });
    expect(receipt.currency).toEqual({ value: 'GBP', confidence: 0.4 });
    expect(receipt.notes).toEqual(["The receipt prints no currency; GBP assumed from the build's locale (en-GB)."]);
  });

  it('returns nulls and a note for a page with no receipt on it', () => {
    const receipt = parseReceipt([page(['12', '--'])], { locale: 'en-US' });
    expect(receipt.vendor).toEqual({ value: null, confidence: 0 });
    expect(receipt.date).toEqual({ value: null, confidence: 0 });
    expect(receipt.total).toEqual({ value: null, confidence: 0 });
    expect(receipt.lines).toEqual([]);
    expect(receipt.notes).toContain('No item lines were found; enter them by hand.');
  });

  it('weighs the vendor by the OCR confidence of its line', () => {
    const receipt = parseReceipt([page(['BRACKENRIDGE AUTO SPARES', 'OIL FILTER 6.49'], 0.6)], { locale: 'en-US' });
    expect(receipt.vendor).toEqual({ value: 'BRACKENRIDGE AUTO SPARES', confidence: 0.6 });
  });
});

describe('lineKind', () => {
  it.each([
    ['ALTERNATOR REMAN', '189.00', 'part'],
    ['CORE CHARGE', '45.00', 'core_charge'],
    ['CORE DEPOSIT', '18.00', 'core_charge'],
    ['CORE REFUND', '-45.00', 'core_refund'],
    ['C0RE CREDIT', '45.00', 'core_refund'],
    ['RTN WIPER BLADE', '-14.99', 'return'],
    ['WIPER BLADE', '-14.99', 'return'],
    ['HAZMAT FEE', '6.00', 'fee'],
    ['BATTERY DISPOSAL', '3.00', 'fee'],
    ['LOYALTY DISCOUNT', '-5.00', 'discount'],
    ['COUPON 10OFF', '-10.00', 'discount'],
  ])('%s (%s) is a %s line', (description, amount, kind) => {
    expect(lineKind(description, new Decimal(amount))).toBe(kind);
  });
});

describe('looksLikePartNumber', () => {
  it.each(['BP-4471C', 'OF-2210', 'ALT-3307R', '88213-0', '551234', 'SB-6K1870'])('%s is a part number', (text) => {
    expect(looksLikePartNumber(text)).toBe(true);
  });
  it.each(['OIL', 'FILTER', 'Thermostat', '12', 'A-B', '$6.49x'])('%s is not', (text) => {
    expect(looksLikePartNumber(text)).toBe(false);
  });
});

describe('repairUnitPrice', () => {
  const read = (value: string) => ({ value, mark: '$', confidence: 0.9 });
  it('keeps a price that fits', () => {
    expect(repairUnitPrice(read('11.79'), '2', new Decimal('23.58'))).toEqual(read('11.79'));
  });
  it('repairs one lost digit', () => {
    expect(repairUnitPrice(read('1.79'), '2', new Decimal('23.58'))).toEqual({ value: '11.79', mark: '$', confidence: 0.7 });
  });
  it('leaves a price two characters off alone', () => {
    expect(repairUnitPrice(read('7.79'), '2', new Decimal('23.58'))).toEqual(read('7.79'));
  });
});
