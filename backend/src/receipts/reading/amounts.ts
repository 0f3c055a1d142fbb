// OCR-tolerant reading of printed amounts ("$1,234.50", "RM 12.40", "6,49", "(38.49)", "11.79-", "1O.S0")
// into exact Decimal text; never through a JS number.
import { Decimal, toWire } from '../../../../shared/money';

export interface ReadAmount {
  /** Decimal text with the sign applied, e.g. "-38.49". */
  value: string;
  /** ISO 4217 code named by the printed mark, if any ("$" is resolved later, from the locale). */
  mark: string | null;
  /** 1 for a clean reading; lower when letters were read as digits or a comma taken for the decimal point. */
  confidence: number;
}

// Currency marks printed before or after amounts, longest first so "US$" wins over "$".
const MARKS: Array<[string, string]> = [
  ['US$', 'USD'],
  ['USD', 'USD'],
  ['EUR', 'EUR'],
  ['GBP', 'GBP'],
  ['MYR', 'MYR'],
  ['JPY', 'JPY'],
  ['BHD', 'BHD'],
  ['CHF', 'CHF'],
  ['RM', 'MYR'],
  ['BD', 'BHD'],
  ['$', '$'],
  ['€', 'EUR'],
  ['£', 'GBP'],
  ['¥', 'JPY'],
  ['￥', 'JPY'],
  ['円', 'JPY'],
];

export interface AmountOptions {
  /** False also accepts whole numbers (unit prices printed "4"). */
  requireDecimals?: boolean;
  /**
   * ISO 4217 minor units of the build's currency: 2 (EUR, USD, MYR), 0 (JPY: "¥1,200" is 1200 and amounts print
   * no decimals), 3 (BHD: "1.250" is one dinar 250 fils). Default 2.
   */
  minorUnits?: number;
  /** The build's locale writes a decimal comma (de, fr, es, it, nl, pt): "1.234" is a thousand, "12,5" is decimal. */
  decimalComma?: boolean;
}

/** Whether a locale writes its decimals after a comma, from Intl's own number format. */
export function usesDecimalComma(locale: string): boolean {
  try {
    return new Intl.NumberFormat(locale).formatToParts(1.5).find((part) => part.type === 'decimal')?.value === ',';
  } catch {
    return false;
  }
}

/** The mark a word consists of, when a receipt prints it apart from the number ("RM 12.40"). */
export function currencyMark(word: string): string | null {
  const trimmed = word.trim();
  for (const [printed, code] of MARKS) if (trimmed.toUpperCase() === printed) return code;
  return null;
}

// Letters OCR engines give for digits in receipt fonts (common practice in OCR post-correction).
const DIGIT_LOOKALIKES: Record<string, string> = {
  O: '0',
  o: '0',
  D: '0',
  Q: '0',
  S: '5',
  s: '5',
  l: '1',
  I: '1',
  i: '1',
  '|': '1',
  '!': '1',
  B: '8',
  Z: '2',
  z: '2',
  G: '6',
  g: '9',
};

/**
 * Reads one printed token as an amount with decimals. Returns null for anything that is not one: integers
 * (quantities), dates, times, percentages and words. `requireDecimals` false also accepts whole numbers.
 */
export function readAmount(token: string, options: AmountOptions = {}): ReadAmount | null {
  const minorUnits = options.minorUnits ?? 2;
  // A currency without minor units prints whole amounts only.
  const requireDecimals = (options.requireDecimals ?? true) && minorUnits > 0;
  // OCR gives "~" or "_" for a faint trailing minus ("3.12~"); "*" marks and a tax-class letter glued to the
  // amount ("49,99A", "9.00*", "*9.00") are not part of it.
  let text = token
    .trim()
    .replace(/[−–]/g, '-')
    .replace(/(?<=[0-9])[~_]$/, '-')
    .replace(/^\*+|\*+$/g, '')
    .replace(/(?<=[0-9][.,][0-9]{2})[A-HJ-NP-Z]$/, '');
  let confidence = 1;
  // A stray stroke OCR put before an amount ("/18.00", "~50.00", "=0.01"): a slash, tilde or equals sign glued before
  // the digits is no part of them (a minus read as "=" loses its sign; the rounding rules try both signs).
  if (/^[/~=][0-9]+[.,][0-9]+$/.test(text)) {
    text = text.slice(1);
    confidence = 0.8;
  }
  if (text === '' || /[%/:]/.test(text)) return null;

  let negative = false;
  if (/^\(.*\)-?$/.test(text)) {
    negative = true;
    text = text.replace(/^\(|\)-?$/g, '');
  }
  if (/(-|CR)$/i.test(text) && /\d/.test(text)) {
    negative = true;
    text = text.replace(/(-|CR)$/i, '');
  }
  if (text.startsWith('-')) {
    negative = true;
    text = text.slice(1);
  }

  let mark: string | null = null;
  for (const [printed, code] of MARKS) {
    if (text.toUpperCase().startsWith(printed)) {
      mark = code;
      text = text.slice(printed.length);
      break;
    }
    if (text.toUpperCase().endsWith(printed)) {
      mark = code;
      text = text.slice(0, -printed.length);
      break;
    }
  }
  // A minus between the mark and the digits ("$-5.00").
  text = text.trim();
  if (text.startsWith('-')) {
    negative = true;
    text = text.slice(1);
  }
  // "$" is often read as "S" or "§" in front of an amount with decimals.
  if (mark === null && /^[S§][0-9OolI]+[.,][0-9OolIS]{2}$/.test(text)) {
    mark = '$';
    text = text.slice(1);
    confidence = Math.min(confidence, 0.8);
  }

  if (!/[0-9]/.test(text)) return null;
  let fixed = '';
  for (const character of text) {
    if (/[0-9.,' ]/.test(character)) fixed += character;
    else if (DIGIT_LOOKALIKES[character] !== undefined) {
      fixed += DIGIT_LOOKALIKES[character];
      confidence = Math.min(confidence, 0.7);
    } else return null;
  }
  // Most of the token must have been digits already: "SOIL" is a word, not 5011.
  const realDigits = (text.match(/[0-9]/g) ?? []).length;
  const allDigits = (fixed.match(/[0-9]/g) ?? []).length;
  if (realDigits * 2 < allDigits) return null;

  // A point read twice before the decimals ("51..75", "12,,50"): one separator, a little less sure.
  if (/[0-9]([.,])\1[0-9]+$/.test(fixed)) {
    fixed = fixed.replace(/([.,])\1(?=[0-9]+$)/, '$1');
    confidence = Math.min(confidence, 0.8);
  }
  const digits = normaliseSeparators(fixed, requireDecimals, minorUnits, options.decimalComma ?? false);
  if (digits === null) return null;
  if (digits.commaDecimal && !options.decimalComma) confidence = Math.min(confidence, 0.85);
  const value = new Decimal(digits.text);
  // Keep the printed decimals: "6.00" stays "6.00", not "6".
  const decimals = digits.text.includes('.') ? digits.text.split('.')[1].length : 0;
  return { value: toWire(negative && !value.isZero() ? value.negated() : value, decimals), mark, confidence };
}

/**
 * Decides which separator is the decimal point: the last one when 1 to 4 digits follow it and the
 * groups before it are thousands groups of 3 ("1,234.56", "1.234,56", "1 234,56"); a lone comma before
 * two digits is a decimal comma (also what OCR makes of a faint dot).
 */
function normaliseSeparators(text: string, requireDecimals: boolean, minorUnits: number, decimalComma: boolean): { text: string; commaDecimal: boolean } | null {
  const compact = text.trim();
  if (!/^[0-9.,][0-9.,' ]*$/.test(compact) || !/[0-9]/.test(compact) || /[.,' ]$/.test(compact)) return null;
  const match = /^(.*?)([.,])([0-9]{1,4})$/.exec(compact);
  const wholeNumber = () => {
    if (requireDecimals) return null;
    const whole = stripThousands(compact);
    return whole === null ? null : { text: whole, commaDecimal: false };
  };
  if (!match) return wholeNumber();
  const [, integerPart, separator, decimals] = match;
  const otherSeparator = separator === ',' ? '.' : ',';
  // Three digits after the only separator: a thousands group ("1,234"; "1.234" where the locale writes a decimal
  // comma; any "1.200" in a currency without minor units), or the decimals of a three-decimal currency ("1.250").
  if (decimals.length === 3 && !integerPart.includes(otherSeparator)) {
    const thousands = minorUnits === 0 || (minorUnits !== 3 && (separator === ',' ? !decimalComma : decimalComma));
    if (thousands) return wholeNumber();
  }
  // A currency without minor units: a whole amount, grouped or not.
  if (minorUnits === 0 && decimals.length !== 2) return wholeNumber();
  // Decimals after a comma are two, or three where the locale or the currency uses them.
  if (separator === ',' && decimals.length !== 2 && !(decimals.length === 3 && (decimalComma || minorUnits === 3))) return null;
  // Two decimals for amounts; three or four only for unit prices (wire at 0.125 per foot).
  if (decimals.length === 1) return null;
  // No whole part printed before the currency's decimals (".01", "RM .57"): less than one unit.
  if (integerPart === '') return decimals.length === minorUnits ? { text: `0.${decimals}`, commaDecimal: separator === ',' } : null;
  const whole = stripThousands(integerPart, separator);
  if (whole === null) return null;
  return { text: `${whole}.${decimals}`, commaDecimal: separator === ',' };
}

function stripThousands(text: string, decimalSeparator?: string): string | null {
  if (/^[0-9]+$/.test(text)) return text;
  const groups = text.split(/[.,' ]/);
  const separators: string[] = text.match(/[.,' ]/g) ?? [];
  if (decimalSeparator && separators.includes(decimalSeparator)) return null;
  if (new Set(separators).size !== 1) return null;
  if (!/^[0-9]{1,3}$/.test(groups[0]) || groups.slice(1).some((group) => !/^[0-9]{3}$/.test(group))) return null;
  return groups.join('');
}

/** A quantity as printed ("2", "12.5", "1O" read as 10); null when it is not one. */
export function readQuantity(token: string): string | null {
  const text = token.trim().replace(/^[xX]|[xX]$/g, '');
  if (!/^[0-9OolI]{1,4}(?:[.,][0-9]{1,3})?$/.test(text) || !/[0-9]/.test(text)) return null;
  const fixed = text.replace(/[Oo]/g, '0').replace(/[lI]/g, '1').replace(',', '.');
  const value = new Decimal(fixed);
  return value.isZero() ? null : toWire(value);
}
