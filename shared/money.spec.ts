// Unit tests for the money module: parsing, arithmetic, rounding, wire text, display and allocation.
import {
  Decimal,
  MONEY_MESSAGES,
  MoneyError,
  add,
  allocate,
  fitsMinorUnits,
  formatMoney,
  minorUnits,
  moneyString,
  multiply,
  parseMoney,
  roundToMinor,
  subtract,
  storedToWire,
  sum,
  toDecimal,
  toWire,
} from './money';
import fc from 'fast-check';

const d = (text: string) => new Decimal(text);
const wire = (values: Decimal[], decimals?: number) => values.map((value) => toWire(value, decimals));

describe('parseMoney', () => {
  it.each([
    ['12.50', '12.5'],
    ['-3', '-3'],
    ['0.1234', '0.1234'],
    ['  7.25 ', '7.25'],
    ['007.5', '7.5'],
    ['999999999999999.9999', '999999999999999.9999'],
  ])('accepts %j as %s', (text, expected) => {
    const parsed = parseMoney(text);
    expect(parsed.ok && toWire(parsed.value)).toBe(expected);
  });

  it('reads "-0" as a plain zero, not a negative one', () => {
    const parsed = parseMoney('-0.00', { maxDecimals: 2 });
    if (!parsed.ok) throw new Error(parsed.message);
    expect(parsed.value.isZero()).toBe(true);
    expect(parsed.value.isNegative()).toBe(false);
  });

  it.each([
    ['', 4, 'Enter an amount.'],
    ['   ', 4, 'Enter an amount.'],
    ['1,234.5', 4, 'Use a dot for decimals and no thousands separators.'],
    ['12,50', 4, 'Use a dot for decimals and no thousands separators.'],
    ['1.234.5', 4, 'Use a dot for decimals and no thousands separators.'],
    ["1'234", 4, 'Use a dot for decimals and no thousands separators.'],
    ['NaN', 4, 'NaN is not an amount: enter digits, such as 12.50.'],
    ['-Infinity', 4, 'Infinity is not an amount: enter digits, such as 12.50.'],
    ['Infinity', 4, 'Infinity is not an amount: enter digits, such as 12.50.'],
    ['1e3', 4, 'Write the amount in full, without an exponent such as 1e3.'],
    ['2.5E-2', 4, 'Write the amount in full, without an exponent such as 1e3.'],
    ['$12.50', 4, 'Leave out the currency symbol: enter only the number, such as 12.50.'],
    ['12.50 €', 4, 'Leave out the currency symbol: enter only the number, such as 12.50.'],
    ['1 234', 4, 'Remove the spaces inside the amount.'],
    ['+5', 4, 'Leave out the plus sign.'],
    ['.5', 4, 'Put a 0 before the dot, such as 0.50.'],
    ['5.', 4, 'Put digits after the dot, or leave the dot out.'],
    ['0x1F', 4, 'Enter digits with an optional leading minus and one dot for decimals, such as 12.50.'],
    ['--1', 4, 'Enter digits with an optional leading minus and one dot for decimals, such as 12.50.'],
    ['-', 4, 'Enter digits with an optional leading minus and one dot for decimals, such as 12.50.'],
    ['１２', 4, 'Enter digits with an optional leading minus and one dot for decimals, such as 12.50.'],
    ['0.12345', 4, 'Too many decimals: use at most 4 decimals.'],
    ['12.345', 2, 'Too many decimals: use at most 2 decimals.'],
    ['12.34', 1, 'Too many decimals: use at most 1 decimal.'],
    ['1500.5', 0, 'Too many decimals: use a whole number.'],
    ['1000000000000000', 4, 'That amount is too large: use at most 15 digits before the dot.'],
  ])('refuses %j (max %i decimals) with a message naming the problem', (text, maxDecimals, message) => {
    expect(parseMoney(text, { maxDecimals })).toEqual({ ok: false, message });
  });

  it('refuses a value that is not text at all', () => {
    expect(parseMoney(12.5 as unknown as string)).toEqual({ ok: false, message: 'Send the amount as text, such as "12.50".' });
  });

  it('refuses a nonsensical decimals limit as a programming error', () => {
    expect(() => parseMoney('1', { maxDecimals: -1 })).toThrow('maxDecimals must be a whole number from 0 to 20.');
    expect(() => parseMoney('1', { maxDecimals: 2.5 })).toThrow(MoneyError);
  });
});

describe('toDecimal', () => {
  it('returns the exact value of valid text', () => {
    expect(toWire(toDecimal('19.99'))).toBe('19.99');
  });

  it('throws a MoneyError carrying the parse message', () => {
    expect(() => toDecimal('1e3')).toThrow(new MoneyError(MONEY_MESSAGES.exponent));
    expect(() => toDecimal('3.14159', { maxDecimals: 2 })).toThrow('Too many decimals: use at most 2 decimals.');
  });

  it('passes a finite Decimal through and refuses NaN and Infinity', () => {
    expect(toWire(toDecimal(d('2.5')))).toBe('2.5');
    expect(() => toDecimal(d('NaN'))).toThrow(MONEY_MESSAGES.notANumber);
    expect(() => toDecimal(d('-Infinity'))).toThrow(MONEY_MESSAGES.infinity);
  });
});

describe('moneyString schema', () => {
  const price = moneyString({ maxDecimals: 4 });
  const refund = moneyString({ maxDecimals: 2, allowNegative: true });
  const payment = moneyString({ maxDecimals: 2, min: '0.01' });

  it('outputs the exact Decimal', () => {
    const parsed = price.parse('0.125');
    expect(parsed).toBeInstanceOf(Decimal);
    expect(toWire(parsed)).toBe('0.125');
  });

  it.each([
    [price, 12.5, 'Send the amount as text, such as "12.50".'],
    [price, '1,234.5', 'Use a dot for decimals and no thousands separators.'],
    [price, '1e3', 'Write the amount in full, without an exponent such as 1e3.'],
    [price, '', 'Enter an amount.'],
    [price, '-5', 'Enter an amount of zero or more.'],
    [refund, '4.999', 'Too many decimals: use at most 2 decimals.'],
    [payment, '0.00', 'Enter an amount of at least 0.01.'],
  ])('refuses %#: %j with its message', (schema, input, message) => {
    const result = schema.safeParse(input);
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((issue) => issue.message)).toEqual([message]);
  });

  it('accepts a negative amount only where allowed', () => {
    expect(toWire(refund.parse('-5.00'))).toBe('-5');
    expect(price.safeParse('-5').success).toBe(false);
  });
});

describe('arithmetic', () => {
  // The classic binary floating point example (decimal.js README; IEEE 754 doubles give 0.30000000000000004).
  it('adds 0.1 and 0.2 to exactly 0.3', () => {
    const total = add(d('0.1'), d('0.2'));
    expect(total.equals(d('0.3'))).toBe(true);
    expect(toWire(total)).toBe('0.3');
  });

  it('sums a list exactly, and an empty list to zero', () => {
    expect(toWire(sum([d('19.99'), d('0.01'), d('-5.005'), d('1000000000000000')]))).toBe('1000000000000014.995');
    expect(toWire(sum([]))).toBe('0');
  });

  it('keeps values past a double precision exact', () => {
    expect(toWire(add(d('999999999999999.9999'), d('0.0001')))).toBe('1000000000000000');
    expect(toWire(subtract(d('9007199254740993.01'), d('0.01')))).toBe('9007199254740993');
  });

  it('multiplies a unit price by a quantity without rounding', () => {
    expect(toWire(multiply(d('0.125'), d('250')))).toBe('31.25');
    expect(toWire(multiply(d('3.3333'), d('3')))).toBe('9.9999');
    expect(toWire(multiply(d('19.99'), d('-2')))).toBe('-39.98');
  });

  it('refuses NaN amounts', () => {
    expect(() => add(d('NaN'), d('1'))).toThrow(MONEY_MESSAGES.notANumber);
  });
});

describe('rounding and wire text', () => {
  it('rounds half up to the currency minor units (ties away from zero)', () => {
    expect(toWire(roundToMinor(d('-0.125'), 'USD'))).toBe('-0.13');
    // 2.675 as a double is 2.67499999999999982236431605997495353221893310546875 and would round down.
    expect(toWire(roundToMinor(d('2.675'), 'USD'))).toBe('2.68');
    expect(toWire(roundToMinor(d('1234.5'), 'JPY'))).toBe('1235');
    expect(toWire(roundToMinor(d('0.0005'), 'BHD'))).toBe('0.001');
    expect(toWire(roundToMinor(d('-0.004'), 'USD'))).toBe('0');
  });

  it('tells whether an amount fits the minor units', () => {
    expect(fitsMinorUnits(d('12.50'), 'USD')).toBe(true);
    expect(fitsMinorUnits(d('12.505'), 'USD')).toBe(false);
    expect(fitsMinorUnits(d('1200'), 'JPY')).toBe(true);
    expect(fitsMinorUnits(d('1200.5'), 'JPY')).toBe(false);
  });

  it('writes plain decimal strings, never exponent notation', () => {
    expect(toWire(d('12.5'), 2)).toBe('12.50');
    expect(toWire(d('12.345'), 2)).toBe('12.35');
    expect(toWire(d('-12.345'), 2)).toBe('-12.35');
    expect(toWire(d('1e21'))).toBe('1000000000000000000000');
    expect(toWire(d('1e-7'))).toBe('0.0000001');
    expect(toWire(d('-0.001'), 2)).toBe('0.00');
    expect(toWire(d('7'), 4)).toBe('7.0000');
  });
});

describe('storedToWire (wire text of stored figures without a Decimal)', () => {
  it.each([
    { text: '12.5000', decimals: undefined, expected: '12.5' },
    { text: '1.0000', decimals: undefined, expected: '1' },
    { text: '0.0000', decimals: 2, expected: '0.00' },
    { text: '-0.0000', decimals: undefined, expected: '0' },
    { text: '-3.2500', decimals: 2, expected: '-3.25' },
    { text: '2400.00000000', decimals: 2, expected: '2400.00' },
    { text: '100', decimals: 2, expected: '100.00' },
    { text: '1234.0000', decimals: 0, expected: '1234' },
    { text: '0.1250', decimals: 2, expected: '0.13' },
    { text: '-0.0010', decimals: 2, expected: '0.00' },
    { text: '007.50', decimals: undefined, expected: '7.5' },
  ])('writes $text with $decimals decimals as $expected', ({ text, decimals, expected }) => {
    expect(storedToWire(text, decimals)).toBe(expected);
  });

  it('answers exactly what toWire answers for the same figure, rounding included', () => {
    const stored = fc
      .tuple(fc.boolean(), fc.stringMatching(/^\d{1,19}$/), fc.option(fc.stringMatching(/^\d{1,10}$/), { nil: undefined }))
      .map(([negative, integer, fraction]) => `${negative ? '-' : ''}${integer}${fraction === undefined ? '' : `.${fraction}`}`);
    fc.assert(
      fc.property(stored, fc.option(fc.integer({ min: 0, max: 4 }), { nil: undefined }), (text, decimals) => {
        expect(storedToWire(text, decimals)).toBe(toWire(toDecimal(text, { maxDecimals: 20 }), decimals));
      }),
      { numRuns: 2000 },
    );
  });

  it('refuses what is not a plain decimal, as toDecimal does', () => {
    expect(() => storedToWire('1e3')).toThrow(MoneyError);
    expect(() => storedToWire('12,50', 2)).toThrow(MoneyError);
  });
});

describe('formatMoney', () => {
  it('formats en-US dollars with a minus sign for negatives', () => {
    expect(formatMoney(d('-1234.5'), 'USD', 'en-US')).toBe('-$1,234.50');
    expect(formatMoney(d('0.005'), 'USD', 'en-US')).toBe('$0.01');
  });

  it('formats de-DE euros', () => {
    expect(formatMoney(d('1234567.891'), 'EUR', 'de-DE')).toBe('1.234.567,89\u00a0€');
    expect(formatMoney(d('-0.5'), 'EUR', 'de-DE')).toBe('-0,50\u00a0€');
  });

  it('formats ja-JP yen with no decimals', () => {
    expect(formatMoney(d('1234.5'), 'JPY', 'ja-JP')).toBe('￥1,235');
  });

  it('keeps every digit of an amount a double cannot hold', () => {
    // As a JS number 12345678901234567.05 would become 12345678901234568.
    expect(formatMoney(d('12345678901234567.05'), 'USD', 'en-US')).toBe('$12,345,678,901,234,567.05');
  });

  it('shows unit prices with up to the requested decimals', () => {
    expect(formatMoney(d('0.125'), 'USD', 'en-US', { maxDecimals: 4 })).toBe('$0.125');
    expect(formatMoney(d('3'), 'USD', 'en-US', { maxDecimals: 4 })).toBe('$3.00');
    expect(formatMoney(d('0.12345'), 'USD', 'en-US', { maxDecimals: 4 })).toBe('$0.1235');
  });

  it('never shows a negative zero', () => {
    expect(formatMoney(d('-0.001'), 'USD', 'en-US')).toBe('$0.00');
  });

  it('refuses an unknown currency', () => {
    expect(() => formatMoney(d('1'), 'ABC', 'en-US')).toThrow('Unknown currency code "ABC": use an ISO 4217 code such as USD or EUR.');
    expect(() => minorUnits('US')).toThrow(MoneyError);
  });
});

describe('allocate (largest-remainder method)', () => {
  // Worked examples of the largest-remainder (Hamilton) method by its definition: quotas 16.67, 33.33, 50
  // give 16 + 33 + 50 = 99 whole cents; the one cent left goes to the largest remainder (0.67).
  it('splits 100 cents over 1:2:3 as 17, 33, 50', () => {
    expect(wire(allocate(d('1.00'), [d('1'), d('2'), d('3')], 'USD'), 2)).toEqual(['0.17', '0.33', '0.50']);
  });

  // Quotas 1.5 and 3.5: the remainders tie, so the left-over cent goes to the lower index.
  it('splits 5 cents over 3:7 as 2, 3', () => {
    expect(wire(allocate(d('0.05'), [d('3'), d('7')], 'USD'), 2)).toEqual(['0.02', '0.03']);
  });

  it('splits a negative amount as its absolute value, negated', () => {
    expect(wire(allocate(d('-1.00'), [d('1'), d('2'), d('3')], 'USD'), 2)).toEqual(['-0.17', '-0.33', '-0.50']);
  });

  it('gives nothing to a zero weight, even on a tie', () => {
    expect(wire(allocate(d('10.00'), [d('0'), d('1'), d('1')], 'USD'), 2)).toEqual(['0.00', '5.00', '5.00']);
    expect(wire(allocate(d('0.01'), [d('0'), d('1'), d('1')], 'USD'), 2)).toEqual(['0.00', '0.01', '0.00']);
  });

  it('allocates receipt tax over line amounts with decimals, adding up to the cent', () => {
    const shares = allocate(d('2.47'), [d('12.99'), d('0.125'), d('40.00')], 'USD');
    expect(wire(shares, 2)).toEqual(['0.60', '0.01', '1.86']);
    expect(toWire(sum(shares), 2)).toBe('2.47');
  });

  it('works in yen (no minor units) and with a plain decimals count', () => {
    expect(wire(allocate(d('1000'), [d('1'), d('1'), d('1')], 'JPY'))).toEqual(['334', '333', '333']);
    expect(wire(allocate(d('0.010'), [d('1'), d('1'), d('1')], 3), 3)).toEqual(['0.004', '0.003', '0.003']);
  });

  it('gives zeros for a zero amount, even when every weight is zero', () => {
    expect(wire(allocate(d('0'), [d('0'), d('0')], 'USD'))).toEqual(['0', '0']);
  });

  it('refuses what it cannot split', () => {
    expect(() => allocate(d('5.00'), [d('0'), d('0')], 'USD')).toThrow('Cannot allocate 5.00 when every weight is zero.');
    expect(() => allocate(d('5.00'), [], 'USD')).toThrow('Nothing to allocate to: give at least one weight.');
    expect(() => allocate(d('5.00'), [d('1'), d('-1')], 'USD')).toThrow('Weights cannot be negative (got -1).');
    expect(() => allocate(d('10.005'), [d('1')], 'USD')).toThrow('Cannot allocate 10.005 in units of 2 decimals: round it first.');
    expect(() => allocate(d('1'), [d('1')], 'XYZ')).toThrow(MoneyError);
  });
});
