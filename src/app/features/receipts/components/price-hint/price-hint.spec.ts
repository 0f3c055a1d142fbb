// The price hint's words: shown only when a purchase line is more than 10 % above the lowest price filed elsewhere.
import { inputBinding } from '@angular/core';
import { render } from '@testing-library/angular/zoneless';
import type { PriceHistoryResponse } from '../../../../../../shared/api/price-history';
import { testPriceItem, testPricePaid } from '../../../../../testing/build-fixtures';
import { PriceHint, type PriceHintLine } from './price-hint';

/** Pads bought at 31.00 (Marrow Lane Motors), 30.00 (Fernhill Auto Spares, 3 March) and, on the receipt being checked, 20.00 before a reopening. */
const HISTORY: PriceHistoryResponse = {
  currency: 'USD',
  items: [
    testPriceItem('number:bp4410', 'Brake pads, front', [
      testPricePaid('r-1', 'Marrow Lane Motors', '2026-02-14', '31.00'),
      testPricePaid('r-2', 'Fernhill Auto Spares', '2026-03-03', '30.00', '2'),
      testPricePaid('checking', 'Fernhill Auto Spares', '2026-04-01', '20.00'),
    ], 'BP-4410'),
  ],
};

const pads = (fields: Partial<PriceHintLine>): PriceHintLine => ({
  kind: 'part',
  partNumber: 'bp 4410',
  description: 'Pads',
  quantity: '1',
  unitPrice: null,
  amount: '33.60',
  ...fields,
});

async function wordsFor(line: PriceHintLine, history: PriceHistoryResponse | null = HISTORY, locale = 'en-GB'): Promise<string> {
  const { fixture } = await render(PriceHint, {
    bindings: [
      inputBinding('line', () => line),
      inputBinding('receiptId', () => 'checking'),
      inputBinding('history', () => history),
      inputBinding('locale', () => locale),
    ],
  });
  return (fixture.nativeElement as HTMLElement).querySelector('.words')?.textContent?.trim() ?? '';
}

// One render per test: rows of line, locale and the words expected.
describe('PriceHint', () => {
  it.each([
    // 33.60 against 30.00 is 12 %; the 20.00 on the receipt being checked does not count.
    { name: 'names the lowest price paid on another receipt, its shop and date', line: pads({}), locale: 'en-GB', words: '12 % above the lowest this build paid: US$30.00 at Fernhill Auto Spares, 3 Mar 2026' },
    { name: 'formats money and date in the build locale', line: pads({}), locale: 'en-US', words: '12 % above the lowest this build paid: $30.00 at Fernhill Auto Spares, Mar 3, 2026' },
    // 66.02 for 2 is 33.01, 10.03 % above: a hint, shown as 10 %.
    { name: 'works the unit price from amount and quantity', line: pads({ quantity: '2', amount: '66.02' }), locale: 'en-US', words: '10 % above the lowest this build paid: $30.00 at Fernhill Auto Spares, Mar 3, 2026' },
    { name: 'takes the unit price: 33.00 is 10 % exactly, no hint', line: pads({ quantity: '2', unitPrice: '33.00', amount: '66.00' }), locale: 'en-US', words: '' },
    { name: 'no hint at 10 % exactly', line: pads({ amount: '33.00' }), locale: 'en-US', words: '' },
    { name: 'no hint for a return', line: pads({ kind: 'return', amount: '99.00' }), locale: 'en-US', words: '' },
    { name: 'no hint for an item never filed', line: pads({ partNumber: 'BP-4411', amount: '99.00' }), locale: 'en-US', words: '' },
  ] as { name: string; line: PriceHintLine; locale: string; words: string }[])('$name', async ({ line, locale, words }) => {
    expect(await wordsFor(line, HISTORY, locale)).toBe(words);
  });

  it('says nothing before the history arrives', async () => {
    expect(await wordsFor(pads({ amount: '99.00' }), null)).toBe('');
  });
});
