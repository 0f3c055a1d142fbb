// Worked examples by hand for reconciliation and the allocation of a receipt's tax, shipping and discount.
import fc from 'fast-check';
import { Decimal, sum } from './money';
import { allocateCharges, reconcile, type MathLine } from './receipt-math';

const d = (text: string) => new Decimal(text);
const line = (amount: string, kind: MathLine['kind'] = 'part', taxable = true): MathLine => ({ kind, amount: d(amount), taxable });
const text = (values: Decimal[]) => values.map((v) => v.toFixed(2));

describe('reconcile', () => {
  it('adds lines, tax and shipping and takes off the discount (worked by hand)', () => {
    // 24.99 + 2 x 4.99 + 18.00 = 52.97 ; + 4.37 tax + 9.95 shipping - 5.00 discount = 62.29
    const result = reconcile([line('24.99'), line('9.98'), line('18.00')], { tax: d('4.37'), shipping: d('9.95'), discount: d('5.00'), total: d('62.29') });
    expect(result.linesTotal.toFixed(2)).toBe('52.97');
    expect(result.computedTotal.toFixed(2)).toBe('62.29');
    expect(result.difference!.toFixed(2)).toBe('0.00');
    expect(result.reconciles).toBe(true);
  });

  it('shows the difference when the printed total disagrees, and does not reconcile without a total', () => {
    const off = reconcile([line('10.00')], { tax: d('0.80'), shipping: null, discount: null, total: d('10.90') });
    expect(off.difference!.toFixed(2)).toBe('0.10');
    expect(off.reconciles).toBe(false);
    expect(reconcile([line('10.00')], { tax: null, shipping: null, discount: null, total: null }).reconciles).toBe(false);
  });

  it('handles a return slip with negative amounts', () => {
    // Returned: -45.00 and -12.50 ; tax given back -4.60 ; total -62.10
    const result = reconcile([line('-45.00', 'return'), line('-12.50', 'return')], { tax: d('-4.60'), shipping: null, discount: null, total: d('-62.10') });
    expect(result.reconciles).toBe(true);
  });
});

describe('allocateCharges', () => {
  it('allocates tax to taxable lines only and shipping to all, each adding up to the cent (worked by hand)', () => {
    // Lines 60.00 (taxable), 30.00 (taxable), 10.00 (labour, not taxable); tax 7.21, shipping 9.99.
    // Tax over 60:30 -> quotas 4.8066.. and 2.4033.. cents-wise 480.66 / 240.33: floors 480 + 240 = 720, one cent left,
    // largest remainder .66 -> first line: 4.81, 2.40, 0.00.
    // Shipping over 60:30:10 -> 599.4, 299.7, 99.9 cents: floors 599 + 299 + 99 = 997, two left to .9 (third) and .7 (second)
    // -> 5.99, 3.00, 1.00.
    const lines = [line('60.00'), line('30.00'), line('10.00', 'fee', false)];
    const result = allocateCharges(lines, { tax: d('7.21'), shipping: d('9.99'), discount: null }, 'USD');
    expect(text(result.map((r) => r.tax))).toEqual(['4.81', '2.40', '0.00']);
    expect(text(result.map((r) => r.shipping))).toEqual(['5.99', '3.00', '1.00']);
  });

  it('gives a printed discount to purchase lines, not to core deposits', () => {
    const lines = [line('80.00'), line('22.00', 'core_charge'), line('20.00')];
    const result = allocateCharges(lines, { tax: null, shipping: null, discount: d('5.00') }, 'USD');
    // 500 cents over 80:20 -> 400, 100.
    expect(text(result.map((r) => r.discount))).toEqual(['4.00', '0.00', '1.00']);
  });

  it('allocates tax given back on a return slip over the returned lines', () => {
    const result = allocateCharges([line('-45.00', 'return'), line('-15.00', 'return')], { tax: d('-4.80'), shipping: null, discount: null }, 'USD');
    expect(text(result.map((r) => r.tax))).toEqual(['-3.60', '-1.20']);
  });

  it('refuses a charge no line can carry', () => {
    expect(() => allocateCharges([line('10.00', 'part', false)], { tax: d('0.80'), shipping: null, discount: null }, 'USD')).toThrow(/no line to carry/);
  });

  it('always adds up to the printed figures exactly (property, 500 random receipts)', () => {
    const cents = fc.integer({ min: 1, max: 500_000 }).map((c) => new Decimal(c).dividedBy(100));
    fc.assert(
      fc.property(fc.array(fc.tuple(cents, fc.boolean()), { minLength: 1, maxLength: 30 }), cents, cents, (rows, tax, shipping) => {
        const lines = rows.map(([amount, taxable]) => ({ kind: 'part' as const, amount, taxable }));
        if (!lines.some((l) => l.taxable)) lines[0].taxable = true;
        const result = allocateCharges(lines, { tax, shipping, discount: null }, 'USD');
        expect(sum(result.map((r) => r.tax)).equals(tax)).toBe(true);
        expect(sum(result.map((r) => r.shipping)).equals(shipping)).toBe(true);
        result.forEach((r, i) => {
          if (!lines[i].taxable) expect(r.tax.isZero()).toBe(true);
        });
      }),
      { numRuns: 500 },
    );
  });
});
