// The one money module: parsing, arithmetic, rounding, allocation and display of exact decimal amounts.
// Imported by the server and the Angular client, so it uses no Node-only API.
import { Decimal } from 'decimal.js';
import { code as currencyByCode } from 'currency-codes';
import { z } from 'zod';

export { Decimal };

/**
 * Our own Decimal constructor, so the settings below never depend on (or change) the global one.
 * 100 significant digits keep every sum and product of numeric(19,4) values exact; `fitsPrecision`
 * refuses anything larger instead of rounding it silently. Half up = ties away from zero.
 */
const Exact = Decimal.clone({ precision: 100, rounding: Decimal.ROUND_HALF_UP, toExpNeg: -9e15, toExpPos: 9e15 });
const PRECISION = 100;

/** A money problem a person or a caller can act on: bad input, unknown currency, impossible allocation. */
export class MoneyError extends Error {
  override readonly name = 'MoneyError';
}

/** Unit prices may carry 4 decimals (wire at 0.125 per foot); the database column is numeric(19,4). */
export const UNIT_PRICE_DECIMALS = 4;
/** numeric(19,4) leaves 15 digits before the point. */
export const MAX_INTEGER_DIGITS = 15;
/**
 * Digits before the point `toDecimal` reads in a stored figure: a product of two numeric(19,4) values has up to 30,
 * and a sum of such products a few more; 60 stays well within PRECISION.
 */
const STORED_SUM_INTEGER_DIGITS = 60;
const STORED_LIMIT = new Exact(10).pow(MAX_INTEGER_DIGITS);

/** Whether an amount (a product or a sum worked out by the server) fits a numeric(19,4) column. */
export function fitsStoredAmount(value: Decimal): boolean {
  return new Exact(value).abs().toDecimalPlaces(UNIT_PRICE_DECIMALS, Decimal.ROUND_HALF_UP).lessThan(STORED_LIMIT);
}

export const MONEY_MESSAGES = {
  empty: 'Enter an amount.',
  notText: 'Send the amount as text, such as "12.50".',
  separators: 'Use a dot for decimals and no thousands separators.',
  notANumber: 'NaN is not an amount: enter digits, such as 12.50.',
  infinity: 'Infinity is not an amount: enter digits, such as 12.50.',
  exponent: 'Write the amount in full, without an exponent such as 1e3.',
  currencySymbol: 'Leave out the currency symbol: enter only the number, such as 12.50.',
  spaces: 'Remove the spaces inside the amount.',
  plusSign: 'Leave out the plus sign.',
  leadingDot: 'Put a 0 before the dot, such as 0.50.',
  trailingDot: 'Put digits after the dot, or leave the dot out.',
  invalid: 'Enter digits with an optional leading minus and one dot for decimals, such as 12.50.',
  negative: 'Enter an amount of zero or more.',
} as const;

export function tooManyDecimalsMessage(maxDecimals: number): string {
  if (maxDecimals === 0) return 'Too many decimals: use a whole number.';
  return `Too many decimals: use at most ${maxDecimals} ${maxDecimals === 1 ? 'decimal' : 'decimals'}.`;
}

export function tooLargeMessage(maxIntegerDigits: number): string {
  return `That amount is too large: use at most ${maxIntegerDigits} digits before the dot.`;
}

export function belowMinimumMessage(min: Decimal): string {
  return `Enter an amount of at least ${toWire(min)}.`;
}

export interface ParseMoneyOptions {
  /** Decimals allowed after the dot; 4 for unit prices, the currency's minor units for amounts paid. */
  maxDecimals?: number;
  /** Digits allowed before the dot (leading zeros not counted); 15 fits numeric(19,4). */
  maxIntegerDigits?: number;
}

export type ParseMoneyResult = { ok: true; value: Decimal } | { ok: false; message: string };

const STRICT_AMOUNT = /^-?(\d+)(?:\.(\d+))?$/;

/** Reads "12.50" or "-3" into an exact Decimal; every refusal says what is wrong with the text. */
export function parseMoney(text: string, options: ParseMoneyOptions = {}): ParseMoneyResult {
  const maxDecimals = checkedCount(options.maxDecimals ?? UNIT_PRICE_DECIMALS, 'maxDecimals');
  const maxIntegerDigits = checkedCount(options.maxIntegerDigits ?? MAX_INTEGER_DIGITS, 'maxIntegerDigits', STORED_SUM_INTEGER_DIGITS);
  if (typeof text !== 'string') return refuse(MONEY_MESSAGES.notText);
  const trimmed = text.trim();
  if (trimmed === '') return refuse(MONEY_MESSAGES.empty);

  const match = STRICT_AMOUNT.exec(trimmed);
  if (!match) return refuse(explainRefusal(trimmed));

  const [, integerDigits, decimalDigits = ''] = match;
  if (decimalDigits.length > maxDecimals) return refuse(tooManyDecimalsMessage(maxDecimals));
  if (integerDigits.replace(/^0+/, '').length > maxIntegerDigits) return refuse(tooLargeMessage(maxIntegerDigits));

  const value = new Exact(trimmed);
  // "-0" and "-0.00" mean zero; a negative zero would print as "-$0.00".
  return { ok: true, value: value.isZero() ? new Exact(0) : value };
}

/**
 * Like `parseMoney`, for text that must already be valid (stored values, trusted wire data); throws a
 * MoneyError otherwise. A Decimal passes through (as long as it is finite); the options apply to text.
 */
export function toDecimal(value: string | Decimal, options: ParseMoneyOptions = {}): Decimal {
  if (typeof value !== 'string') return positiveZero(new Exact(finite(value)));
  // A stored sum of numeric(19,4) values has as many digits as the rows make it: read any of them exactly.
  const parsed = parseMoney(value, { maxIntegerDigits: STORED_SUM_INTEGER_DIGITS, ...options });
  if (!parsed.ok) throw new MoneyError(parsed.message);
  return parsed.value;
}

// Names the first problem a person would notice, most specific first.
function explainRefusal(text: string): string {
  const unsigned = text.replace(/^[+-]/, '');
  if (/^nan$/i.test(unsigned)) return MONEY_MESSAGES.notANumber;
  if (/^(inf|infinity|∞)$/i.test(unsigned)) return MONEY_MESSAGES.infinity;
  if (/^(\d+\.?\d*|\.\d+)e[+-]?\d+$/i.test(unsigned)) return MONEY_MESSAGES.exponent;
  if (/\p{Sc}/u.test(text)) return MONEY_MESSAGES.currencySymbol;
  // Commas, apostrophes, underscores and a second dot are thousands marks in some locale or other.
  if (/[,'’_]/.test(text) || (text.match(/\./g) ?? []).length > 1) return MONEY_MESSAGES.separators;
  if (/\s/.test(text)) return MONEY_MESSAGES.spaces;
  if (/^\+\d/.test(text)) return MONEY_MESSAGES.plusSign;
  if (/^-?\.\d+$/.test(text)) return MONEY_MESSAGES.leadingDot;
  if (/^-?\d+\.$/.test(text)) return MONEY_MESSAGES.trailingDot;
  return MONEY_MESSAGES.invalid;
}

function refuse(message: string): ParseMoneyResult {
  return { ok: false, message };
}

function checkedCount(count: number, name: string, max = 20): number {
  if (!Number.isInteger(count) || count < 0 || count > max) throw new MoneyError(`${name} must be a whole number from 0 to ${max}.`);
  return count;
}

export interface MoneyStringOptions extends ParseMoneyOptions {
  maxDecimals: number;
  /** The smallest amount accepted, inclusive. */
  min?: Decimal | string;
  /** Negative amounts (refunds, discounts entered as negatives) are refused unless this is true. */
  allowNegative?: boolean;
}

/** A zod schema for an amount sent as a string; its output is the exact Decimal, its errors the messages above. */
export function moneyString(options: MoneyStringOptions) {
  const min = options.min === undefined ? undefined : toDecimal(options.min);
  return z.string({ error: MONEY_MESSAGES.notText }).transform((text, context) => {
    const parsed = parseMoney(text, options);
    if (!parsed.ok) {
      context.addIssue({ code: 'custom', message: parsed.message });
      return z.NEVER;
    }
    if (!options.allowNegative && parsed.value.isNegative()) {
      context.addIssue({ code: 'custom', message: MONEY_MESSAGES.negative });
      return z.NEVER;
    }
    if (min && parsed.value.lessThan(min)) {
      context.addIssue({ code: 'custom', message: belowMinimumMessage(min) });
      return z.NEVER;
    }
    return parsed.value;
  });
}

/** Minor units by code as asked: the package's lookup is a scan of every currency, and lists and exports ask per row. */
const minorUnitsByCode = new Map<string, number>();

/** ISO 4217 minor units (decimals) of a currency, from the `currency-codes` registry package. */
export function minorUnits(currencyCode: string): number {
  const known = minorUnitsByCode.get(currencyCode);
  if (known !== undefined) return known;
  const record = /^[A-Za-z]{3}$/.test(currencyCode) ? currencyByCode(currencyCode) : undefined;
  if (!record) throw new MoneyError(`Unknown currency code "${currencyCode}": use an ISO 4217 code such as USD or EUR.`);
  minorUnitsByCode.set(currencyCode, record.digits);
  return record.digits;
}

/** Rounds to the currency's minor units, half up (ties away from zero: -0.125 USD becomes -0.13). */
export function roundToMinor(amount: Decimal, currencyCode: string): Decimal {
  return roundHalfUp(amount, minorUnits(currencyCode));
}

/** Rounds to a number of decimals, half up (ties away from zero). */
export function roundHalfUp(amount: Decimal, decimals: number): Decimal {
  return positiveZero(new Exact(finite(amount)).toDecimalPlaces(checkedCount(decimals, 'decimals'), Decimal.ROUND_HALF_UP));
}

/** True when the amount needs no more decimals than the currency's minor units (an amount a person can pay). */
export function fitsMinorUnits(amount: Decimal, currencyCode: string): boolean {
  return finite(amount).decimalPlaces() <= minorUnits(currencyCode);
}

export function add(left: Decimal, right: Decimal): Decimal {
  return sum([left, right]);
}

export function subtract(left: Decimal, right: Decimal): Decimal {
  return sum([left, finite(right).negated()]);
}

/** Exact sum; an empty list sums to zero. */
export function sum(amounts: readonly Decimal[]): Decimal {
  let total = new Exact(0);
  for (const amount of amounts) {
    fitsPrecision(digitsForSum(total, finite(amount)));
    total = total.plus(amount);
  }
  return positiveZero(total);
}

/** Exact product of a unit price and a quantity; round it with `roundToMinor` where a person pays it. */
export function multiply(unitPrice: Decimal, quantity: Decimal): Decimal {
  fitsPrecision(finite(unitPrice).precision(true) + finite(quantity).precision(true));
  return positiveZero(new Exact(unitPrice).times(quantity));
}

/**
 * A plain decimal string for JSON and the database, never exponent notation. With `decimals` the value is
 * rounded half up to exactly that many places ("12.50"); without, it keeps its own decimals.
 */
export function toWire(amount: Decimal, decimals?: number): string {
  const value = new Exact(finite(amount));
  const places = decimals === undefined ? value.decimalPlaces() : checkedCount(decimals, 'decimals');
  // The only place this module turns a Decimal into text: decimal.js's own fixed-point output.
  return value.toDecimalPlaces(places, Decimal.ROUND_HALF_UP).toFixed(places);
}

/** A decimal as PostgreSQL prints a numeric: optional minus, digits, optional dot and digits. */
const STORED_DECIMAL = /^(-?)(\d{1,60})(?:\.(\d{1,20}))?$/;

/**
 * `toWire(toDecimal(text, { maxDecimals: 20 }), decimals)` for stored text ("12.5000", a sum or product read from
 * SQL), by string operations whenever no rounding is needed, which is the usual case (stored amounts carry the
 * currency's decimals); text that needs rounding goes through Decimal. Lists and exports call it per cell, where
 * making a Decimal of every figure cost most of their time.
 */
export function storedToWire(text: string, decimals?: number): string {
  const match = STORED_DECIMAL.exec(text);
  const places = decimals === undefined ? undefined : checkedCount(decimals, 'decimals');
  const [, sign, integerDigits, fraction = ''] = match ?? [];
  if (!match || (places !== undefined && /[1-9]/.test(fraction.slice(places)))) return toWire(toDecimal(text, { maxDecimals: 20 }), places);
  const kept = places === undefined ? fraction.replace(/0+$/, '') : fraction.slice(0, places).padEnd(places, '0');
  const integer = integerDigits.replace(/^0+(?=\d)/, '');
  const isZero = integer === '0' && !/[1-9]/.test(kept);
  return `${isZero ? '' : sign}${integer}${kept ? `.${kept}` : ''}`;
}

export interface FormatMoneyOptions {
  /** Show up to this many decimals (unit prices), never fewer than the currency's minor units. */
  maxDecimals?: number;
}

/**
 * Display text for an amount in a locale, e.g. "-$1,234.50" or "1.234,50 €". The Decimal reaches Intl
 * as a string (Intl.NumberFormat v3 formats string values exactly), never as a JS number.
 */
export function formatMoney(amount: Decimal, currencyCode: string, locale: string, options: FormatMoneyOptions = {}): string {
  const minor = minorUnits(currencyCode);
  const places = Math.max(minor, checkedCount(options.maxDecimals ?? minor, 'maxDecimals'));
  const exactText = toWire(roundHalfUp(amount, places)) as Intl.StringNumericLiteral;
  return new Intl.NumberFormat(locale, {
    style: 'currency',
    currency: currencyCode.toUpperCase(),
    currencySign: 'standard',
    minimumFractionDigits: minor,
    maximumFractionDigits: places,
  }).format(exactText);
}

/**
 * Splits an amount into parts proportional to the weights by the largest-remainder (Hamilton) method, in
 * the currency's minor units: each part gets the whole units of its quota, and the units left over go one
 * each to the largest remainders (ties to the lower index), so the parts add up to the amount exactly.
 * A negative amount is split as its absolute value and negated.
 */
export function allocate(amount: Decimal, weights: readonly Decimal[], currencyOrDecimals: string | number): Decimal[] {
  const decimals = typeof currencyOrDecimals === 'string' ? minorUnits(currencyOrDecimals) : checkedCount(currencyOrDecimals, 'decimals');
  if (weights.length === 0) throw new MoneyError('Nothing to allocate to: give at least one weight.');
  for (const weight of weights) {
    if (finite(weight).isNegative() && !weight.isZero()) throw new MoneyError(`Weights cannot be negative (got ${toWire(weight)}).`);
  }
  const minorScale = new Exact(10).pow(decimals);
  const minorUnitsTotal = new Exact(finite(amount)).times(minorScale);
  if (!minorUnitsTotal.isInteger()) {
    throw new MoneyError(`Cannot allocate ${toWire(amount)} in units of ${decimals} decimals: round it first.`);
  }
  if (minorUnitsTotal.isZero()) return weights.map(() => new Exact(0));

  // Whole-number weights keep every quota an exact fraction: quota = units × weight / total.
  const weightScale = new Exact(10).pow(Math.max(...weights.map((weight) => weight.decimalPlaces())));
  const wholeWeights = weights.map((weight) => new Exact(weight).times(weightScale));
  const weightTotal = sum(wholeWeights);
  if (weightTotal.isZero()) throw new MoneyError(`Cannot allocate ${toWire(amount, decimals)} when every weight is zero.`);

  const units = minorUnitsTotal.abs();
  fitsPrecision(units.precision(true) + weightTotal.precision(true));
  const quotas = wholeWeights.map((weight, index) => {
    const numerator = units.times(weight);
    return { index, whole: numerator.divToInt(weightTotal), remainder: numerator.mod(weightTotal) };
  });
  let leftover = units.minus(sum(quotas.map((quota) => quota.whole)));
  const byRemainder = [...quotas].sort((a, b) => b.remainder.comparedTo(a.remainder) || a.index - b.index);
  const shares = quotas.map((quota) => quota.whole);
  for (const quota of byRemainder) {
    if (leftover.isZero()) break;
    shares[quota.index] = shares[quota.index].plus(1);
    leftover = leftover.minus(1);
  }
  const sign = amount.isNegative() ? -1 : 1;
  return shares.map((share) => positiveZero(share.times(sign).dividedBy(minorScale)));
}

function finite(value: Decimal): Decimal {
  // isDecimal also knows a Decimal from a second copy of decimal.js (its CommonJS and ES module builds).
  if (!Decimal.isDecimal(value)) throw new MoneyError('Expected a Decimal amount.');
  if (!value.isFinite()) throw new MoneyError(value.isNaN() ? MONEY_MESSAGES.notANumber : MONEY_MESSAGES.infinity);
  return value;
}

function positiveZero(value: Decimal): Decimal {
  return value.isZero() ? new Exact(0) : value;
}

// Digits an exact sum can need: the longer integer part, one carry, the longer decimal part.
function digitsForSum(left: Decimal, right: Decimal): number {
  const integerDigits = (value: Decimal) => Math.max(value.abs().precision(true) - value.decimalPlaces(), 0);
  return Math.max(integerDigits(left), integerDigits(right)) + 1 + Math.max(left.decimalPlaces(), right.decimalPlaces());
}

function fitsPrecision(digits: number): void {
  if (digits > PRECISION) throw new MoneyError(`That calculation needs ${digits} digits; money is kept exact to ${PRECISION}.`);
}
