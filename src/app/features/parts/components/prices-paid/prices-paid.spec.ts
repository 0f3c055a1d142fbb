// The lowest and last price paid for a part, found by its part number or description; nothing for a part never rebought.
import { inputBinding } from '@angular/core';
import { render } from '@testing-library/angular/zoneless';
import type { PriceHistoryResponse } from '../../../../../../shared/api/price-history';
import { testPriceItem, testPricePaid } from '../../../../../testing/build-fixtures';
import { PricesPaid } from './prices-paid';

const HISTORY: PriceHistoryResponse = {
  currency: 'USD',
  items: [
    testPriceItem('number:bp4410', 'Brake pads, front', [
      testPricePaid('r-1', 'Fernhill Auto Spares', '2026-03-03', '30.00', '2'),
      testPricePaid('r-2', null, '2026-04-10', '33.60'),
    ], 'BP-4410'),
    testPriceItem('description:wiper blade', 'Wiper blade', [
      testPricePaid('r-1', 'Fernhill Auto Spares', '2026-03-03', '1234.00'),
      testPricePaid('r-2', 'Marrow Lane Motors', '2026-04-10', '1250.50', '2'),
    ]),
  ],
};

async function shown(part: { partNumber: string; description: string }, history: PriceHistoryResponse | null = HISTORY, locale = 'en-US') {
  const { fixture } = await render(PricesPaid, {
    bindings: [inputBinding('part', () => part), inputBinding('history', () => history), inputBinding('locale', () => locale)],
  });
  const element = fixture.nativeElement as HTMLElement;
  return { words: element.querySelector('.words')?.textContent?.trim() ?? '', details: element.querySelector('.prices-paid')?.getAttribute('title') ?? '' };
}

describe('PricesPaid', () => {
  it('finds a part by its part number, however it is written, and lists every price with shop and date', async () => {
    const { words, details } = await shown({ partNumber: 'bp 4410', description: 'Front pads' });
    expect(words).toBe('Paid before: lowest $30.00, last $33.60');
    expect(details).toBe('Fernhill Auto Spares, Mar 3, 2026: $30.00; No shop named, Apr 10, 2026: $33.60');
  });

  it('finds a part without a number by its description, in the build locale', async () => {
    const { words } = await shown({ partNumber: '', description: 'WIPER   blade' }, HISTORY, 'de-DE');
    // Intl puts a no-break space before the sign.
    expect(words).toBe('Paid before: lowest 1.234,00\u00a0$, last 1.250,50\u00a0$');
  });

  it('says nothing for a part not bought twice', async () => {
    expect((await shown({ partNumber: 'BP-4411', description: 'Brake pads, front' })).words).toBe('');
  });

  it('says nothing before the history arrives', async () => {
    expect((await shown({ partNumber: 'BP-4410', description: 'Brake pads, front' }, null)).words).toBe('');
  });
});
