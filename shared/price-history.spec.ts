import { Decimal } from './money';
import { isAboveLowest, itemKey, lineUnitPrice, lowestOf, percentAbove } from './price-history';

const d = (text: string) => new Decimal(text);

describe('itemKey', () => {
  it('compares part numbers without case, spaces or marks', () => {
    expect(itemKey('FH-2210.b', 'Brake hose')).toBe('number:fh2210b');
    expect(itemKey(' fh 2210 B ', 'Something else')).toBe(itemKey('FH-2210.b', 'Brake hose'));
  });

  it('falls back to the description, lower case with runs of spaces made one', () => {
    expect(itemKey('', '  Brake   Hose,  Front ')).toBe('description:brake hose, front');
    expect(itemKey('--', 'BRAKE HOSE, FRONT')).toBe('description:brake hose, front');
  });

  it('never takes a description for a part number', () => {
    expect(itemKey('', 'ab12')).not.toBe(itemKey('AB-12', 'Gasket'));
  });
});

describe('lineUnitPrice', () => {
  it('takes the unit price, rounded to the currency half up', () => {
    expect(lineUnitPrice({ unitPrice: '0.125', amount: '12.50', quantity: '100' }, 'USD')!.toFixed()).toBe('0.13');
    expect(lineUnitPrice({ unitPrice: '4.1249', amount: '8.25', quantity: '2' }, 'USD')!.toFixed()).toBe('4.12');
  });

  it('divides the amount by the quantity when there is no unit price', () => {
    // 10.00 / 3 = 3.3333… -> 3.33; 10.01 / 2 = 5.005 -> 5.01 (half up); yen have no minor units: 1000 / 3 -> 333.
    expect(lineUnitPrice({ unitPrice: null, amount: '10.00', quantity: '3' }, 'USD')!.toFixed()).toBe('3.33');
    expect(lineUnitPrice({ unitPrice: null, amount: '10.01', quantity: '2' }, 'USD')!.toFixed()).toBe('5.01');
    expect(lineUnitPrice({ unitPrice: null, amount: '1000', quantity: '3' }, 'JPY')!.toFixed()).toBe('333');
  });

  it('gives no price for a quantity of zero', () => {
    expect(lineUnitPrice({ unitPrice: null, amount: '10.00', quantity: '0' }, 'USD')).toBeNull();
  });
});

describe('percentAbove and the 10 % hint', () => {
  it('33.00 against 30.00 is exactly 10 %: no hint', () => {
    expect(percentAbove(d('33.00'), d('30.00'))).toBe(10);
    expect(isAboveLowest(d('33.00'), d('30.00'))).toBe(false);
  });

  it('33.01 against 30.00 is 10.03 %: shown as 10 %, with a hint', () => {
    expect(percentAbove(d('33.01'), d('30.00'))).toBe(10);
    expect(isAboveLowest(d('33.01'), d('30.00'))).toBe(true);
  });

  it('rounds whole percents half up', () => {
    expect(percentAbove(d('33.60'), d('30.00'))).toBe(12);
    // 0.15 / 20.10 = 0.746 % -> 1; 1.005 / 2.01 = 50 % exactly.
    expect(percentAbove(d('20.25'), d('20.10'))).toBe(1);
    expect(percentAbove(d('3.015'), d('2.01'))).toBe(50);
    // 2.5 % exactly rounds up to 3.
    expect(percentAbove(d('41.00'), d('40.00'))).toBe(3);
  });

  it('a price at or under the lowest, or a free lowest, earns no hint', () => {
    expect(isAboveLowest(d('30.00'), d('30.00'))).toBe(false);
    expect(isAboveLowest(d('25.00'), d('30.00'))).toBe(false);
    expect(percentAbove(d('25.00'), d('30.00'))).toBe(-17);
    expect(isAboveLowest(d('5.00'), d('0'))).toBe(false);
    expect(percentAbove(d('5.00'), d('0'))).toBeNull();
  });
});

describe('lowestOf', () => {
  it('finds the lowest price, the earliest of equal ones', () => {
    const prices = [
      { unitPrice: '31.00', receiptId: 'a' },
      { unitPrice: '30.00', receiptId: 'b' },
      { unitPrice: '30.00', receiptId: 'c' },
      { unitPrice: '30.50', receiptId: 'd' },
    ];
    expect(lowestOf(prices)?.receiptId).toBe('b');
    expect(lowestOf([])).toBeUndefined();
  });
});
