// Unit conversions checked against the exact definitions of NIST SP 811 and NIST Handbook 44.
import fc from 'fast-check';
import { Decimal } from 'decimal.js';
import { UNITS, UnitConversionError, canConvert, convertQuantity, isUnit, Unit } from '../../shared/units';

const d = (text: string) => new Decimal(text);
const plain = (value: Decimal) => value.toFixed();

describe('NIST factors', () => {
  // Source: NIST SP 811 appendix B and NIST Handbook 44 appendix C (from memory): 1 in = 2.54 cm exactly
  // (the 1959 international yard and pound), 1 ft = 12 in, 1 US gallon = 231 in³ exactly, 1 qt = 1/4 gal.
  const inchInDecimetres = d('0.254');

  it('1 ft is 0.3048 m exactly', () => {
    expect(plain(convertQuantity(d('1'), 'ft', 'm'))).toBe('0.3048');
    expect(convertQuantity(d('1'), 'ft', 'm').equals(d('0.0254').times(12))).toBe(true);
  });

  it('1 US gallon is 3.785411784 L exactly (231 cubic inches)', () => {
    expect(plain(convertQuantity(d('1'), 'gal', 'L'))).toBe('3.785411784');
    expect(convertQuantity(d('1'), 'gal', 'L').equals(inchInDecimetres.pow(3).times(231))).toBe(true);
  });

  it('1 US liquid quart is 0.946352946 L exactly (a quarter gallon)', () => {
    expect(plain(convertQuantity(d('1'), 'qt', 'L'))).toBe('0.946352946');
    expect(convertQuantity(d('1'), 'qt', 'L').equals(inchInDecimetres.pow(3).times(231).dividedBy(4))).toBe(true);
  });

  it('4 qt make 1 gal, both ways', () => {
    expect(plain(convertQuantity(d('1'), 'gal', 'qt'))).toBe('4');
    expect(plain(convertQuantity(d('1'), 'qt', 'gal'))).toBe('0.25');
    expect(plain(convertQuantity(d('6.5'), 'qt', 'gal'))).toBe('1.625');
  });

  it('converts larger quantities exactly', () => {
    expect(plain(convertQuantity(d('25'), 'ft', 'm'))).toBe('7.62');
    expect(plain(convertQuantity(d('5.5'), 'qt', 'L'))).toBe('5.204941203');
    expect(plain(convertQuantity(d('0.0001'), 'gal', 'L'))).toBe('0.0003785411784');
  });

  it('rounds a conversion that never ends to 60 significant digits', () => {
    expect(plain(convertQuantity(d('1'), 'm', 'ft'))).toBe('3.28083989501312335958005249343832020997375328083989501312336');
  });
});

describe('round trips', () => {
  const quantity = fc
    .tuple(fc.bigInt({ min: -(10n ** 15n), max: 10n ** 15n }), fc.integer({ min: 0, max: 4 }))
    .map(([units, decimals]) => new Decimal(units.toString()).dividedBy(new Decimal(10).pow(decimals)));

  const exactPairs: [Unit, Unit][] = [
    ['ft', 'm'],
    ['qt', 'L'],
    ['gal', 'L'],
    ['gal', 'qt'],
    ['qt', 'gal'],
  ];

  it.each(exactPairs)('%s → %s → back is exact', (from, to) => {
    fc.assert(
      fc.property(quantity, (value) => {
        expect(convertQuantity(convertQuantity(value, from, to), to, from).equals(value)).toBe(true);
      }),
      { numRuns: 500 },
    );
  });

  it.each([
    ['m', 'ft'],
    ['L', 'qt'],
    ['L', 'gal'],
  ] as [Unit, Unit][])('%s → %s → back equals the original at its stored 4 decimals', (from, to) => {
    fc.assert(
      fc.property(quantity, (value) => {
        expect(convertQuantity(convertQuantity(value, from, to), to, from).toDecimalPlaces(4).equals(value)).toBe(true);
      }),
      { numRuns: 500 },
    );
  });
});

describe('units that do not convert', () => {
  it('lists the units', () => {
    expect(UNITS).toEqual(['each', 'pair', 'set', 'ft', 'm', 'qt', 'L', 'gal']);
    expect(isUnit('L')).toBe(true);
    expect(isUnit('l')).toBe(false);
  });

  it('converts counts only to themselves', () => {
    expect(plain(convertQuantity(d('3'), 'pair', 'pair'))).toBe('3');
    expect(canConvert('each', 'pair')).toBe(false);
    expect(() => convertQuantity(d('2'), 'each', 'pair')).toThrow('Cannot convert each to pair: they measure different things.');
    expect(() => convertQuantity(d('1'), 'set', 'each')).toThrow(UnitConversionError);
  });

  it('refuses length to volume and unknown units', () => {
    expect(() => convertQuantity(d('1'), 'ft', 'L')).toThrow('Cannot convert feet to litres: they measure different things.');
    expect(() => convertQuantity(d('1'), 'yd' as Unit, 'm')).toThrow('Unknown unit "yd": use one of each, pair, set, ft, m, qt, L, gal.');
    expect(() => convertQuantity(d('NaN'), 'ft', 'm')).toThrow('The quantity must be a finite Decimal.');
  });
});
