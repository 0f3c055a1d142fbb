// The money module checked against outside references: ISO 4217 minor units, the rounding-mode table,
// and the definition of the largest-remainder method (as a property over many random cases).
import fc from 'fast-check';
import { Decimal, allocate, minorUnits, roundToMinor, sum, toWire } from '../../shared/money';

describe('ISO 4217 minor units', () => {
  // Source: ISO 4217 list one (current currency & funds code list), column "minor unit"; values from memory.
  it.each([
    ['USD', 2],
    ['EUR', 2],
    ['JPY', 0],
    ['BHD', 3],
    ['KWD', 3],
    ['CLF', 4],
    ['usd', 2],
  ])('%s has %i minor units', (currencyCode, expected) => {
    expect(minorUnits(currencyCode)).toBe(expected);
  });

  it('refuses a code that is not in the list', () => {
    expect(() => minorUnits('ZZZ')).toThrow('Unknown currency code "ZZZ": use an ISO 4217 code such as USD or EUR.');
    expect(() => minorUnits('')).toThrow('Unknown currency code ""');
  });
});

describe('rounding half up', () => {
  // Source: the rounding-mode table in the decimal.js documentation (ROUND_HALF_UP, "rounds towards nearest
  // neighbour; if equidistant, rounds away from zero"), the same table as Java's java.math.RoundingMode
  // docs, column HALF_UP. Reproduced from memory. HALF_EVEN would differ at 2.5 → 2 and -2.5 → -2.
  it.each([
    ['5.5', '6'],
    ['2.5', '3'],
    ['1.6', '2'],
    ['1.1', '1'],
    ['1.0', '1'],
    ['-1.0', '-1'],
    ['-1.1', '-1'],
    ['-1.6', '-2'],
    ['-2.5', '-3'],
    ['-5.5', '-6'],
  ])('rounds %s yen to %s', (input, expected) => {
    expect(toWire(roundToMinor(new Decimal(input), 'JPY'))).toBe(expected);
  });

  // The same table one step to the right: cents instead of whole units.
  it.each([
    ['0.055', '0.06'],
    ['0.025', '0.03'],
    ['0.016', '0.02'],
    ['0.011', '0.01'],
    ['-0.011', '-0.01'],
    ['-0.016', '-0.02'],
    ['-0.025', '-0.03'],
    ['-0.055', '-0.06'],
  ])('rounds %s dollars to %s', (input, expected) => {
    expect(toWire(roundToMinor(new Decimal(input), 'USD'))).toBe(expected);
  });
});

describe('allocate satisfies the largest-remainder definition', () => {
  // Definition of the largest-remainder (Hamilton) method: with quota_i = total × weight_i / Σ weights,
  // each part is floor(quota_i) or floor(quota_i) + 1; the units left after the floors go one each to the
  // largest remainders (our tie rule: lower index first); the parts add up to the total.
  // Note: dinero.js's allocate is a different method (100 over 1:2:3 gives 16/33/51, not 17/33/50),
  // so it is not a reference for this one.
  // The check below is an independent BigInt computation, not the module's Decimal code.
  const decimalText = (units: bigint, decimals: number): string => {
    const negative = units < 0n;
    const digits = (negative ? -units : units).toString().padStart(decimals + 1, '0');
    const text = decimals === 0 ? digits : `${digits.slice(0, -decimals)}.${digits.slice(-decimals)}`;
    return negative ? `-${text}` : text;
  };
  const toUnits = (value: Decimal, decimals: number): bigint => BigInt(toWire(value.times(new Decimal(10).pow(decimals)), 0));

  const currencies = fc.constantFrom(['JPY', 0], ['USD', 2], ['BHD', 3], ['CLF', 4]) as fc.Arbitrary<[string, number]>;
  const testCase = fc.record({
    currency: currencies,
    totalUnits: fc.bigInt({ min: -(10n ** 17n), max: 10n ** 17n }),
    weightUnits: fc.array(fc.oneof(fc.constant(0n), fc.bigInt({ min: 0n, max: 10n ** 12n }), fc.bigInt({ min: 0n, max: 9n })), { minLength: 1, maxLength: 12 }),
    weightDecimals: fc.integer({ min: 0, max: 4 }),
  });

  it('holds for 2000 random cases', () => {
    fc.assert(
      fc.property(testCase, ({ currency: [currencyCode, decimals], totalUnits, weightUnits, weightDecimals }) => {
        const weightTotal = weightUnits.reduce((total, weight) => total + weight, 0n);
        fc.pre(weightTotal > 0n);
        const amount = new Decimal(decimalText(totalUnits, decimals));
        const weights = weightUnits.map((weight) => new Decimal(decimalText(weight, weightDecimals)));

        const parts = allocate(amount, weights, currencyCode);

        const sign = totalUnits < 0n ? -1n : 1n;
        const absoluteTotal = totalUnits * sign;
        const quotas = weightUnits.map((weight, index) => ({
          index,
          floor: (absoluteTotal * weight) / weightTotal,
          remainder: (absoluteTotal * weight) % weightTotal,
        }));
        const partUnits = parts.map((part) => toUnits(part, decimals) * sign);

        // The sum is exact, in Decimal and in whole units.
        expect(sum(parts).equals(amount)).toBe(true);
        expect(partUnits.reduce((total, part) => total + part, 0n)).toBe(absoluteTotal);
        // Each part is floor(quota) or floor(quota) + 1, and has no more decimals than the currency.
        parts.forEach((part) => expect(part.decimalPlaces()).toBeLessThanOrEqual(decimals));
        const extras = quotas.map((quota, index) => partUnits[index] - quota.floor);
        extras.forEach((extra) => expect(extra === 0n || extra === 1n).toBe(true));
        // The extra units went to the largest remainders, ties to the lower index.
        const ranked = [...quotas].sort((a, b) => (a.remainder === b.remainder ? a.index - b.index : a.remainder > b.remainder ? -1 : 1));
        const leftover = absoluteTotal - quotas.reduce((total, quota) => total + quota.floor, 0n);
        ranked.forEach((quota, rank) => expect(extras[quota.index]).toBe(BigInt(rank) < leftover ? 1n : 0n));
      }),
      { numRuns: 2000 },
    );
  });

  it('reproduces the worked example 100 over 1:2:3 = 17/33/50 (not dinero.js\'s 16/33/51)', () => {
    expect(allocate(new Decimal(100), [new Decimal(1), new Decimal(2), new Decimal(3)], 0).map((part) => toWire(part))).toEqual(['17', '33', '50']);
  });
});
