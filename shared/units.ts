// Units a part is counted in, and exact conversion of quantities between units of the same kind.
import { Decimal } from 'decimal.js';

export const UNITS = ['each', 'pair', 'set', 'ft', 'm', 'qt', 'L', 'gal'] as const;
export type Unit = (typeof UNITS)[number];

export const UNIT_LABELS: Record<Unit, string> = {
  each: 'each',
  pair: 'pair',
  set: 'set',
  ft: 'feet',
  m: 'metres',
  qt: 'US quarts',
  L: 'litres',
  gal: 'US gallons',
};

/** Raised for a unit we do not know or a conversion between different kinds of unit. */
export class UnitConversionError extends Error {
  override readonly name = 'UnitConversionError';
}

// Enough digits that converting 15-digit quantities toward the base unit is exact.
const Exact = Decimal.clone({ precision: 60, rounding: Decimal.ROUND_HALF_UP });

/**
 * Size of each unit in its kind's base unit, exact by definition (NIST SP 811 and NIST Handbook 44
 * appendix C, cited from memory): 1 in = 2.54 cm, so 1 ft = 0.3048 m; 1 US gallon = 231 in³ =
 * 3.785411784 L; 1 US liquid quart = 1/4 gallon = 0.946352946 L. Counts (each, pair, set) have no common base: a set is not a fixed
 * number of pieces, and a pair of gloves is bought as one, so each converts only to itself.
 */
const UNIT_SIZES: Record<Unit, { kind: string; size: Decimal }> = {
  each: { kind: 'each', size: new Exact(1) },
  pair: { kind: 'pair', size: new Exact(1) },
  set: { kind: 'set', size: new Exact(1) },
  m: { kind: 'length', size: new Exact(1) },
  ft: { kind: 'length', size: new Exact('0.3048') },
  L: { kind: 'volume', size: new Exact(1) },
  qt: { kind: 'volume', size: new Exact('0.946352946') },
  gal: { kind: 'volume', size: new Exact('3.785411784') },
};

export function isUnit(value: unknown): value is Unit {
  return typeof value === 'string' && (UNITS as readonly string[]).includes(value);
}

/** True when a quantity in `from` can be expressed in `to`. */
export function canConvert(from: Unit, to: Unit): boolean {
  return isUnit(from) && isUnit(to) && UNIT_SIZES[from].kind === UNIT_SIZES[to].kind;
}

/**
 * Converts a quantity between units of one kind. From feet, quarts and gallons to metres and litres, and
 * between gallons and quarts, the result is exact. From metres or litres the true value may never end
 * (1 m = 3.2808398950… ft), so it is rounded half up to 60 significant digits: round it to the scale the
 * quantity is stored at.
 */
export function convertQuantity(quantity: Decimal, from: Unit, to: Unit): Decimal {
  if (!isUnit(from)) throw new UnitConversionError(`Unknown unit "${String(from)}": use one of ${UNITS.join(', ')}.`);
  if (!isUnit(to)) throw new UnitConversionError(`Unknown unit "${String(to)}": use one of ${UNITS.join(', ')}.`);
  if (!Decimal.isDecimal(quantity) || !quantity.isFinite()) throw new UnitConversionError('The quantity must be a finite Decimal.');
  if (!canConvert(from, to)) throw new UnitConversionError(`Cannot convert ${UNIT_LABELS[from]} to ${UNIT_LABELS[to]}: they measure different things.`);
  if (from === to) return new Exact(quantity);
  return new Exact(quantity).times(UNIT_SIZES[from].size).dividedBy(UNIT_SIZES[to].size);
}
