// When the summary band is read again, and which reading is kept: decided by how many independent facts of the slip's
// own arithmetic agree on each reading's total (invented slips, read as the first and the second look gave them).
import { parseReceipt } from './parse-receipt';
import { figuresSettled, secondLookBetter } from './second-look';
import { slipPage } from './slip-page';

const read = (rows: string[]) => parseReceipt([slipPage(['KEDAI SETIA', ...rows])], { locale: 'en-MY', minorUnits: 2, readOn: '2026-06-30' });

// Facts on the total: none (a word only), one (cash minus change), two (cash minus change and the lines).
const wordOnly = read(['PAIP  40.00', 'KLIP  23.60', 'TOTAL  63.80']);
const oneFact = read(['PAIP  40.00', 'KLIP  23.80', 'TOTAL  63.60', 'CASH  100.00', 'CHANGE  36.40']);
const twoFacts = read(['PAIP  40.00', 'KLIP  23.60', 'TOTAL  63.60', 'CASH  100.00', 'CHANGE  36.40']);
const linesOnly = read(['PAIP  40.00', 'KLIP  23.60', 'TOTAL  63.60']);

describe('the second look at the summary band', () => {
  it('counts the facts of each reading as expected here', () => {
    expect([wordOnly.agreements, oneFact.agreements, twoFacts.agreements, linesOnly.agreements]).toEqual([
      ['it is printed beside a total word'],
      ['it is printed beside a total word', 'the amount tendered minus the change matches it'],
      ['it is printed beside a total word', 'the amount tendered minus the change matches it', 'the lines add up to it'],
      ['it is printed beside a total word', 'the lines add up to it'],
    ]);
  });

  it('is skipped when two facts, or one with the lines adding up, settle the total', () => {
    expect([wordOnly, oneFact, twoFacts, linesOnly].map(figuresSettled)).toEqual([false, false, true, true]);
  });

  it('is kept with two facts more than the first had, or with one where the first had none', () => {
    expect(secondLookBetter(oneFact, twoFacts)).toBe(true);
    expect(secondLookBetter(wordOnly, oneFact)).toBe(true);
    // One fact against one: the first reading stays (a second reading backed by one fact had cost a right total).
    expect(secondLookBetter(oneFact, read(['PAIP  40.00', 'KLIP  23.60', 'TOTAL  63.50', 'CASH  100.00', 'CHANGE  36.50']))).toBe(false);
    expect(secondLookBetter(twoFacts, twoFacts)).toBe(false);
    expect(secondLookBetter(oneFact, wordOnly)).toBe(false);
  });
});
