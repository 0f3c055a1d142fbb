// Live reconciliation from typed text: exact sums, blanks as "not printed", and a message for text that is not an amount.
import { liveReconciliation } from './live-reconciliation';

describe('liveReconciliation', () => {
  it('adds lines, tax and shipping, takes off the discount, and compares with the printed total exactly', () => {
    // 19.99 + 0.125 would drift in binary floating point; 0.1 + 0.2 style sums must stay exact.
    const live = liveReconciliation(
      [
        { kind: 'part', amount: '19.99', taxable: true },
        { kind: 'core_charge', amount: '22.00', taxable: false },
        { kind: 'return', amount: '-5.10', taxable: true },
      ],
      { tax: '2.08', shipping: '0.10', discount: '1.00', total: '38.10' },
    );
    expect(live.ok).toBe(true);
    if (!live.ok) return;
    expect(live.result.linesTotal.toFixed(2)).toBe('36.89');
    expect(live.result.computedTotal.toFixed(2)).toBe('38.07');
    expect(live.result.difference?.toFixed(2)).toBe('0.03');
    expect(live.result.reconciles).toBe(false);
  });

  it('reconciles when the sum equals the printed total; blank charges count as not printed', () => {
    const live = liveReconciliation([{ kind: 'part', amount: '10.00', taxable: true }], { tax: '', shipping: '', discount: '', total: '10' });
    expect(live.ok && live.result.reconciles).toBe(true);
    expect(live.ok && live.result.difference?.toFixed(2)).toBe('0.00');
  });

  it('has no difference when no total was printed', () => {
    const live = liveReconciliation([{ kind: 'part', amount: '10.00', taxable: true }], { tax: '', shipping: '', discount: '', total: '' });
    expect(live.ok && live.result.difference).toBeNull();
    expect(live.ok && live.result.reconciles).toBe(false);
  });

  it('says what to fix when a line amount or a charge is not an amount', () => {
    expect(liveReconciliation([{ kind: 'part', amount: '$10', taxable: true }], { tax: '', shipping: '', discount: '', total: '10' })).toEqual({
      ok: false,
      message: 'Fix the line amounts marked in the table to see the total.',
    });
    expect(liveReconciliation([], { tax: '1,50', shipping: '', discount: '', total: '' })).toEqual({
      ok: false,
      message: 'Fix the tax, shipping, discount or total above to see the reconciliation.',
    });
  });
});
