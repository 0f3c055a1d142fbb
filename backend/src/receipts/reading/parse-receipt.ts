// Turns the positioned text lines of a receipt into vendor, date, currency, lines and totals, each with a
// confidence. Pure: no OCR, no I/O, so every layout rule is unit-tested on plain text.
import { Decimal, multiply, roundHalfUp, sum, toWire } from '../../../../shared/money';
import type { LineKind, ReadBox, ReadField, ReadLine, ReadReceipt } from '../../../../shared/api/receipt-reading';
import { AmountOptions, ReadAmount, currencyMark, readAmount, readQuantity, usesDecimalComma } from './amounts';
import { findDate } from './dates';
import { chooseReceiptDate, dateLimits } from './receipt-date';
import { findVendor } from './vendor';
import { editDistance, hasWord, keywordOf, readLabel, sameWord } from './label-words';
import { chooseFigures, SummaryEntry, TaxTable, TaxTableRow, UnclearTotal } from './summary-figures';
import { TAX_TABLE_WORDS } from './summary-words';
import type { SummaryRole } from './summary-words';
import { TextLine, TextPage, TextWord, lineText, unionBox } from './text-lines';

export interface ParseOptions {
  /** BCP 47 tag of the build: day/month order and the currency a bare "$" means. */
  locale: string;
  /** ISO 4217 minor units of the build's currency (2 for EUR, 0 for JPY, 3 for BHD); 2 when not given. */
  minorUnits?: number;
  /** Names of the shops the build already has receipts from: a name read close to one of them is taken as it. */
  knownVendors?: string[];
  /** ISO date the receipt was uploaded: no receipt is dated after it. Today when not given. */
  readOn?: string;
  /** ISO date before which a printed date is taken for an OCR error (long before the build began). */
  notBefore?: string;
}

interface Token {
  text: string;
  words: TextWord[];
  amount: ReadAmount | null;
  quantity: string | null;
  at: boolean;
}

interface AnalysedLine {
  line: TextLine;
  text: string;
  tokens: Token[];
  /** Upper-case letters-only words for keyword matching, with digits OCR put in words turned back to letters. */
  keywords: string[];
  confidence: number;
  summary: SummaryRole | null;
  /** The summary role of a line that prints a summary word but no amount. */
  labelOnly: SummaryRole | null;
  /** A total word beside a count or points ("TOTAL QTY: 9"): ends the item lines but is no figure. */
  notASum: boolean;
}

// ------------------------------------------------------------------------------------------------------
// Tokens and keywords

function tokenize(line: TextLine, options: AmountOptions): Token[] {
  // "@" glued to numbers ("2@4.99") becomes its own token.
  const words: TextWord[] = [];
  for (const word of line.words) {
    // "AMOUNT:$6.90" printed without a space: the label and the amount are two tokens.
    const pieces = word.text
      .split(/(@)|(?<=[A-Za-z)]:)(?=[-$€£¥(]?[0-9])|(?<=[A-Za-z)]:)(?=RM)/)
      .filter((piece): piece is string => piece !== undefined && piece !== '');
    for (const piece of pieces) words.push({ ...word, text: piece });
  }
  const tokens: Token[] = [];
  for (let index = 0; index < words.length; index += 1) {
    const word = words[index];
    const next = words[index + 1];
    // A currency mark printed apart from its number ("RM 12.40", "$ 5.00", "- 5.00").
    if (next && (currencyMark(word.text.replace(/^[-−]/, '')) || word.text === '-') && readAmount(next.text, options)) {
      const joined = `${word.text}${next.text}`;
      tokens.push(makeToken(joined, [word, next], options));
      index += 1;
      continue;
    }
    tokens.push(makeToken(word.text, [word], options));
  }
  return joinLostDecimalPoint(tokens, options);
}

/**
 * OCR often reads a faint decimal point as a space: "RM 64 13", "14 00" at the end of a line are 64.13 and 14.00.
 * Only a whole number followed by the currency's exact count of decimals, ending the line, is joined, a little less sure.
 * A point that was read but split from its number ("51.. 75", "51. 75", "27 .99-") is joined even beside other amounts.
 */
function joinLostDecimalPoint(tokens: Token[], options: AmountOptions): Token[] {
  const decimals = options.minorUnits ?? 2;
  const last = tokens.length - 1;
  if (decimals === 0 || last < 1) return tokens;
  const [whole, fraction] = [tokens[last - 1], tokens[last]];
  // The decimals, with the point when it was read before them (" .99-"), and a trailing minus or marker kept.
  const tail = new RegExp(`^([.,]?)([0-9]{${decimals}})([-~_]*)$`).exec(fraction.text);
  if (whole.amount || !tail) return tokens;
  const mark = /^(.*?)([0-9]{1,4})([.,]{0,2})$/.exec(whole.text);
  if (!mark || (mark[1] !== '' && !currencyMark(mark[1]))) return tokens;
  // With no point read, only where the line has no other amount: beside a well-read one, two numbers are more likely
  // something else (a quantity and a code).
  if (mark[3] === '' && tail[1] === '' && tokens.some((token) => token.amount)) return tokens;
  const joined = makeToken(`${mark[1]}${mark[2]}.${tail[2]}${tail[3]}`, [...whole.words, ...fraction.words], options);
  if (!joined.amount) return tokens;
  joined.amount = { ...joined.amount, confidence: Math.min(joined.amount.confidence, 0.6) };
  return [...tokens.slice(0, last - 1), joined];
}

function makeToken(text: string, words: TextWord[], options: AmountOptions): Token {
  const at = /^[@©®]$/.test(text) || /^(at|x)$/i.test(text);
  let amount = at ? null : readAmount(text, options);
  // Where amounts carry no decimals (JPY), a bare one- or two-digit number is a count, not money.
  if (amount && options.minorUnits === 0 && amount.mark === null && /^[0-9]{1,2}$/.test(text)) amount = null;
  return { text, words, amount, quantity: readQuantity(text), at };
}

/** Words before the first amount: the label of a summary line. */
function labelKeywords(tokens: Token[]): string[] {
  const labels: string[] = [];
  for (const token of tokens) {
    if (token.amount) break;
    // "GST/TAX", "SUB-TOTAL": words joined by a slash or a dash are read one by one.
    for (const piece of token.text.split(/[/\-]/)) {
      const keyword = keywordOf(piece);
      if (keyword !== '') labels.push(keyword);
    }
  }
  return labels;
}

/**
 * A summary line whose amount lost its decimal point entirely ("Total GST 308", "Rounding -001", "SUB TOTAL 14014"):
 * a whole number of three or more digits ending the line is read with the currency's decimals, a little less sure.
 * Only after a summary word: anywhere else such a number is a code or a count.
 */
function readLostPoint(tokens: Token[], options: AmountOptions): void {
  const decimals = options.minorUnits ?? 2;
  const last = tokens[tokens.length - 1];
  if (decimals === 0 || !last) return;
  const match = /^([-−]?)(.*?)([0-9]{3,7})([-~_]?)$/.exec(last.text);
  if (!match || (match[2] !== '' && !currencyMark(match[2]))) return;
  const digits = match[3];
  if (digits.length <= decimals) return;
  const joined = readAmount(`${match[1]}${digits.slice(0, -decimals)}.${digits.slice(-decimals)}${match[4]}`, options);
  if (joined) last.amount = { ...joined, mark: match[2] === '' ? null : currencyMark(match[2]), confidence: Math.min(joined.confidence, 0.6) };
}

function analyse(line: TextLine, options: AmountOptions): AnalysedLine {
  const tokens = tokenize(line, options);
  const confidence = line.words.reduce((total, word) => total + word.confidence, 0) / Math.max(line.words.length, 1);
  const label = readLabel(labelKeywords(tokens));
  if (label.role !== null && !label.notASum && !tokens.some((token) => token.amount)) readLostPoint(tokens, options);
  const hasAmount = tokens.some((token) => token.amount);
  return {
    line,
    text: lineText(line),
    tokens,
    keywords: tokens.map((token) => keywordOf(token.text)).filter((word) => word !== ''),
    confidence,
    summary: hasAmount ? label.role : null,
    labelOnly: hasAmount ? null : label.role,
    notASum: label.notASum,
  };
}

/** A summary word on a line of its own takes the amount printed alone on the line below ("TOTAL:" / "9.00"). */
function labelAmountsBelow(lines: AnalysedLine[]): void {
  for (let index = 0; index + 1 < lines.length; index += 1) {
    const role = lines[index].labelOnly;
    const below = lines[index + 1];
    if ((role === 'total' || role === 'final_total' || role === 'tendered') && below.summary === null && !below.notASum && below.tokens.some((token) => token.amount) && labelKeywords(below.tokens).length === 0) {
      below.summary = role;
    }
  }
}

// ------------------------------------------------------------------------------------------------------
// Item lines

/** Looks like a part number: letters and digits, often with a dash, no lower case ("BP-4471C", "88213-0"). */
export function looksLikePartNumber(text: string): boolean {
  const cleaned = text.replace(/^[#:]+|[:,;]+$/g, '');
  return cleaned.length >= 4 && cleaned.length <= 20 && /[0-9]/.test(cleaned) && /^[A-Z0-9][A-Z0-9\-./]*[A-Z0-9]$/.test(cleaned) && !/^[0-9]+$/.test(cleaned) || /^[0-9]{5,}(-[0-9A-Z]+)?$/.test(cleaned);
}

const PART_NUMBER_LABEL = /^(SKU|PART|PARTNO|PN|P\/N|ITEM|ITEMNO|UPC|REF|ART)[#:.]*$/i;

/** A line that only carries a part number under its item ("SKU TS-180B", "Part# 4471", "  BP-4471C"). */
function partNumberLine(analysed: AnalysedLine): string | null {
  const texts = analysed.tokens.map((token) => token.text);
  if (texts.length === 0 || analysed.tokens.some((token) => token.amount)) return null;
  const withoutLabel = PART_NUMBER_LABEL.test(texts[0]) ? texts.slice(1) : texts;
  if (withoutLabel.length === 0) return null;
  const labelled = withoutLabel.length !== texts.length;
  // "Part # 4471": the "#" may stand alone.
  const candidates = withoutLabel.filter((text) => !/^[#:]$/.test(text));
  if (candidates.length !== 1) return null;
  const candidate = candidates[0].replace(/^[#:]+/, '');
  if (labelled && /^[A-Z0-9][A-Z0-9\-./]{2,}$/i.test(candidate) && /[0-9]/.test(candidate)) return candidate.toUpperCase();
  return looksLikePartNumber(candidate) ? candidate : null;
}

interface QuantityAt {
  quantity: string;
  unitPrice: ReadAmount;
  /** Index of the first token of the pattern. */
  start: number;
  end: number;
}

/** "2 @ 4.99", "2 x 4.99", "2 @4.99" in a line. */
function quantityAt(tokens: Token[], options: AmountOptions): QuantityAt | null {
  for (let index = 1; index < tokens.length - 1; index += 1) {
    if (!tokens[index].at) continue;
    const quantity = tokens[index - 1].quantity;
    const unitPrice = readAmount(tokens[index + 1].text, { ...options, requireDecimals: false });
    if (quantity && unitPrice) return { quantity, unitPrice, start: index - 1, end: index + 1 };
  }
  return null;
}

const CORE_WORDS = ['CORE'];
const REFUND_WORDS = ['REFUND', 'CREDIT', 'RETURN', 'RETURNED', 'RTN'];
const DISCOUNT_WORDS = ['DISCOUNT', 'COUPON', 'PROMO', 'SAVINGS', 'MARKDOWN'];
const FEE_WORDS = ['FEE', 'HAZMAT', 'DISPOSAL', 'ENVIRONMENTAL', 'HANDLING', 'SURCHARGE', 'SUPPLIES', 'LEVY'];

export function lineKind(description: string, amount: Decimal): LineKind {
  const keywords = description.split(/\s+/).map(keywordOf).filter((word) => word !== '');
  const negative = amount.isNegative();
  if (hasWord(keywords, ...CORE_WORDS)) return negative || hasWord(keywords, ...REFUND_WORDS) ? 'core_refund' : 'core_charge';
  if (hasWord(keywords, ...DISCOUNT_WORDS)) return 'discount';
  if (hasWord(keywords, ...FEE_WORDS)) return 'fee';
  if (negative || hasWord(keywords, ...REFUND_WORDS)) return 'return';
  return 'part';
}

interface DraftLine {
  description: string;
  partNumber: string | null;
  quantity: string | null;
  unitPrice: string | null;
  amount: Decimal;
  confidence: number;
  boxes: ReadBox[];
  /** The receipt line the amount was read from. */
  lineIndex?: number;
}

function itemFromLine(analysed: AnalysedLine, hasPartColumn: boolean, options: AmountOptions): DraftLine | null {
  const { tokens } = analysed;
  const amountIndexes = tokens.flatMap((token, index) => (token.amount ? [index] : []));
  if (amountIndexes.length === 0) return null;
  const amountIndex = amountIndexes[amountIndexes.length - 1];
  const amount = tokens[amountIndex].amount!;
  let confidence = Math.min(amount.confidence, analysed.confidence);
  let quantity: string | null = null;
  let unitPrice: ReadAmount | null = null;
  let descriptionEnd = amountIndex;

  const pattern = quantityAt(tokens.slice(0, amountIndex), options);
  if (pattern) {
    quantity = pattern.quantity;
    unitPrice = pattern.unitPrice;
    descriptionEnd = pattern.start;
  } else if (amountIndexes.length >= 2 && amountIndexes[amountIndexes.length - 2] === amountIndex - 1) {
    // Columns: [part number] description [qty] unit-price amount.
    unitPrice = tokens[amountIndex - 1].amount;
    descriptionEnd = amountIndex - 1;
    if (descriptionEnd > 0 && tokens[descriptionEnd - 1].quantity && !tokens[descriptionEnd - 1].amount) {
      quantity = tokens[descriptionEnd - 1].quantity;
      descriptionEnd -= 1;
    }
  } else if (amountIndex > 1 && tokens[amountIndex - 1].quantity && /^[0-9]{1,3}$/.test(tokens[amountIndex - 1].text) && hasPartColumn) {
    // A table with a quantity column but no unit price column.
    quantity = tokens[amountIndex - 1].quantity;
    descriptionEnd = amountIndex - 1;
  }

  const descriptionTokens = tokens.slice(0, descriptionEnd).filter((token) => !/^[-=_*.|]+$/.test(token.text));
  let partNumber: string | null = null;
  if (descriptionTokens.length >= 2 && looksLikePartNumber(descriptionTokens[0].text) && (hasPartColumn || descriptionTokens.length >= 2)) {
    // A part number printed in its own column before the description.
    partNumber = descriptionTokens.shift()!.text;
  }
  const description = descriptionTokens.map((token) => token.text).join(' ').replace(/\s+/g, ' ').trim();

  const value = new Decimal(amount.value);
  // Negative lines print a negative unit price too, but one printed without a sign follows the amount.
  if (unitPrice && value.isNegative() && !new Decimal(unitPrice.value).isNegative()) {
    unitPrice = { ...unitPrice, value: toWire(new Decimal(unitPrice.value).negated()) };
  }
  if (quantity && unitPrice) {
    unitPrice = repairUnitPrice(unitPrice, quantity, value);
    const expected = roundHalfUp(multiply(new Decimal(unitPrice.value), new Decimal(quantity)), 2);
    confidence = expected.equals(value) ? Math.min(1, confidence + 0.1) : confidence * 0.6;
    confidence = Math.min(confidence, unitPrice.confidence);
  }
  return {
    description,
    partNumber,
    quantity,
    unitPrice: unitPrice?.value ?? null,
    amount: value,
    confidence,
    boxes: [analysed.line.box],
  };
}

/** Digits only, without sign, dot or leading zeros: how two readings of one printed number compare. */
function digitsOf(value: string): string {
  return value.replace(/[^0-9]/g, '').replace(/^0+/, '');
}

/**
 * When quantity × unit price misses the amount and the price that would fit differs from the one read by a
 * single character or a lost dot ("$4275", "$1.79" for $11.79), the receipt's own arithmetic corrects it.
 */
export function repairUnitPrice(unitPrice: ReadAmount, quantity: string, amount: Decimal): ReadAmount {
  const read = new Decimal(unitPrice.value);
  if (roundHalfUp(multiply(read, new Decimal(quantity)), 2).equals(amount)) return unitPrice;
  const fitting = amount.dividedBy(quantity);
  if (fitting.decimalPlaces() > 4) return unitPrice;
  const fittingText = toWire(fitting, Math.max(2, fitting.decimalPlaces()));
  const fittingDigits = digitsOf(fittingText);
  const readDigits = digitsOf(unitPrice.value);
  // One slip, or part of the price lost ("$79" for $11.79) where what was read still stands in the fitting price.
  const partLost = readDigits.length >= 2 && fittingDigits.includes(readDigits);
  if (editDistance(fittingDigits, readDigits) > 1 && !partLost) return unitPrice;
  return { ...unitPrice, value: fittingText, confidence: Math.min(unitPrice.confidence, 0.7) };
}

function isColumnHeader(analysed: AnalysedLine): boolean {
  const words = analysed.keywords;
  const headerWords = ['DESCRIPTION', 'QTY', 'QUANTITY', 'PRICE', 'AMOUNT', 'ITEM', 'PART', 'UNIT', 'SKU', 'EACH', 'EXT'];
  return !analysed.tokens.some((token) => token.amount) && words.filter((word) => headerWords.some((header) => sameWord(word, header))).length >= 2;
}

function finishLine(draft: DraftLine, minor: number): ReadLine {
  const quantity = draft.quantity ?? (draft.unitPrice ? quantityFromPrices(draft.amount, new Decimal(draft.unitPrice)) : '1');
  const unitPrice = draft.unitPrice ?? (quantity === '1' ? toWire(draft.amount, Math.max(minor, draft.amount.decimalPlaces())) : null);
  const kind = lineKind(draft.description, draft.amount);
  return {
    kind,
    description: draft.description,
    partNumber: draft.partNumber,
    quantity,
    unitPrice,
    amount: toWire(draft.amount, Math.max(minor, draft.amount.decimalPlaces())),
    confidence: round2(draft.confidence),
    box: unionBox(draft.boxes),
  };
}

function quantityFromPrices(amount: Decimal, unitPrice: Decimal): string {
  if (unitPrice.isZero()) return '1';
  const ratio = amount.dividedBy(unitPrice);
  return ratio.isInteger() && ratio.isPositive() ? toWire(ratio) : '1';
}

function round2(value: number): number {
  return Math.round(Math.max(0, Math.min(1, value)) * 100) / 100;
}

// ------------------------------------------------------------------------------------------------------
// Vendor, currency

/** The currency a bare "$" means in a region (from the locale), common practice; USD elsewhere. */
const DOLLAR_BY_REGION: Record<string, string> = { US: 'USD', CA: 'CAD', AU: 'AUD', NZ: 'NZD', SG: 'SGD', HK: 'HKD', MX: 'MXN', TW: 'TWD' };
/** A region's usual currency, for slips that print no mark at all (common practice). */
const CURRENCY_BY_REGION: Record<string, string> = {
  ...DOLLAR_BY_REGION,
  GB: 'GBP',
  MY: 'MYR',
  IE: 'EUR',
  DE: 'EUR',
  FR: 'EUR',
  ES: 'EUR',
  IT: 'EUR',
  NL: 'EUR',
  BE: 'EUR',
  AT: 'EUR',
  FI: 'EUR',
  PT: 'EUR',
  IN: 'INR',
  JP: 'JPY',
  CH: 'CHF',
  ZA: 'ZAR',
};

function regionOf(locale: string): string {
  try {
    return new Intl.Locale(locale).maximize().region ?? 'US';
  } catch {
    return 'US';
  }
}

function findCurrency(lines: AnalysedLine[], locale: string, notes: string[]): ReadField<string> {
  const counts = new Map<string, number>();
  for (const analysed of lines) {
    for (const token of analysed.tokens) {
      const mark = token.amount?.mark;
      if (mark) counts.set(mark, (counts.get(mark) ?? 0) + 1);
    }
  }
  const region = regionOf(locale);
  const ranked = [...counts.entries()].sort((a, b) => b[1] - a[1]);
  if (ranked.length > 0) {
    const [mark] = ranked[0];
    if (mark !== '$') return { value: mark, confidence: 0.95 };
    const dollar = DOLLAR_BY_REGION[region];
    if (dollar) return { value: dollar, confidence: 0.85 };
    notes.push(`The receipt prints "$" and the build's locale (${locale}) names no dollar; read as USD. Check the currency.`);
    return { value: 'USD', confidence: 0.5 };
  }
  const usual = CURRENCY_BY_REGION[region];
  if (!usual) return { value: null, confidence: 0 };
  notes.push(`The receipt prints no currency; ${usual} assumed from the build's locale (${locale}).`);
  return { value: usual, confidence: 0.4 };
}

// ------------------------------------------------------------------------------------------------------

/** The last amount of a line, its confidence lowered to that of the OCR words it was read from. */
function rightmostAmount(analysed: AnalysedLine): ReadAmount | null {
  const amounts = analysed.tokens.filter((token) => token.amount);
  if (amounts.length === 0) return null;
  const last = amounts[amounts.length - 1];
  return { ...last.amount!, confidence: Math.min(last.amount!.confidence, ...last.words.map((word) => word.confidence)) };
}

/** A total word beside an amount one decimal short, or with its last decimal garbled into a mark ("174.9", "343.9%"). */
function unclearTotal(analysed: AnalysedLine, minorUnits: number, index: number): UnclearTotal | null {
  const role = analysed.summary ?? analysed.labelOnly;
  if ((role !== 'total' && role !== 'final_total') || analysed.notASum || minorUnits < 1) return null;
  const words = analysed.line.words;
  const last = words[words.length - 1]?.text ?? '';
  const match = new RegExp(`^([0-9]+)[.,]([0-9]{${minorUnits - 1}})[^0-9A-Za-z]?$`).exec(last);
  if (!match) return null;
  return { from: new Decimal(`${match[1]}.${match[2] || '0'}`), step: new Decimal(1).dividedBy(10 ** minorUnits), index };
}

function field(value: string | null, confidence: number): ReadField<string> {
  return { value, confidence: value === null ? 0 : round2(confidence) };
}

export function parseReceipt(pages: TextPage[], options: ParseOptions): ReadReceipt {
  const notes: string[] = [];
  const amountOptions: AmountOptions = { minorUnits: options.minorUnits ?? 2, decimalComma: usesDecimalComma(options.locale) };
  const lines = pages
    .flatMap((page) => page.lines)
    .filter((line) => line.words.length > 0)
    .map((line) => analyse(line, amountOptions));
  labelAmountsBelow(lines);

  // The item region ends at the first summary line; everything after the total is payment and small print.
  // A column header that names a "Total" column ("Item  Qty  Price  Total", as order mails print) reads like "total
  // items", which is no sum: it opens the items, it does not end them.
  const firstSummary = lines.findIndex((analysed) => ((analysed.summary !== null && analysed.summary !== 'discount') || analysed.notASum) && !isColumnHeader(analysed));
  const itemEnd = firstSummary === -1 ? lines.length : firstSummary;
  const headerIndex = lines.findIndex((analysed, index) => index < itemEnd && isColumnHeader(analysed));
  const hasPartColumn = headerIndex !== -1 && hasWord(lines[headerIndex].keywords, 'PART', 'ITEM', 'SKU', 'PARTNO');

  const drafts: DraftLine[] = [];
  let pendingDescription: AnalysedLine | null = null;
  let seenItem = false;
  for (let index = headerIndex + 1; index < itemEnd; index += 1) {
    const analysed = lines[index];
    const pattern = quantityAt(analysed.tokens, amountOptions);
    const amounts = analysed.tokens.filter((token) => token.amount);
    const previous = drafts[drafts.length - 1];
    // "2 @ $11.79" under (or over) its item, carrying no amount of its own.
    if (pattern && (amounts.length === 0 || (amounts.length === 1 && pattern.end === analysed.tokens.indexOf(amounts[0])))) {
      if (previous && previous.quantity === null && previous.unitPrice === null) {
        previous.quantity = pattern.quantity;
        previous.unitPrice = repairUnitPrice(pattern.unitPrice, pattern.quantity, previous.amount.abs()).value;
        if (previous.amount.isNegative() && !previous.unitPrice.startsWith('-')) previous.unitPrice = toWire(new Decimal(previous.unitPrice).negated());
        const expected = roundHalfUp(multiply(new Decimal(previous.unitPrice), new Decimal(pattern.quantity)), 2);
        previous.confidence = expected.equals(previous.amount) ? Math.min(1, previous.confidence + 0.1) : previous.confidence * 0.6;
        previous.boxes.push(analysed.line.box);
      }
      continue;
    }
    const partNumber = partNumberLine(analysed);
    if (partNumber && previous && previous.partNumber === null && seenItem) {
      previous.partNumber = partNumber;
      previous.boxes.push(analysed.line.box);
      continue;
    }
    if (amounts.length === 0) {
      // A description printed on its own line above its amount line; header lines before the first item too.
      pendingDescription = seenItem || headerIndex !== -1 ? analysed : null;
      continue;
    }
    const draft = itemFromLine(analysed, hasPartColumn, amountOptions);
    if (!draft) continue;
    if (draft.description === '' && pendingDescription) {
      draft.description = pendingDescription.text.trim();
      draft.boxes.unshift(pendingDescription.line.box);
    }
    pendingDescription = null;
    if (draft.description === '' && draft.quantity === null) continue;
    draft.lineIndex = index;
    drafts.push(draft);
    seenItem = true;
  }
  // A total whose word OCR lost reads like one more item: the last "item" that is exactly the sum of all before it
  // is taken back out and offered as a total instead.
  const lastDraft = drafts[drafts.length - 1];
  const lostTotal = drafts.length >= 3 && sum(drafts.slice(0, -1).map((draft) => draft.amount)).equals(lastDraft.amount) ? drafts.pop()! : null;
  const minor = amountOptions.minorUnits ?? 2;
  const readLines = drafts.map((draft) => finishLine(draft, minor));

  // Summary figures: every figure printed beside a summary word is a candidate; the receipt's arithmetic chooses.
  const entries: SummaryEntry[] = lostTotal ? [{ role: 'unlabelled', value: lostTotal.amount, index: lostTotal.lineIndex!, confidence: lostTotal.confidence }] : [];
  const taxTable = readTaxTable(lines, itemEnd);
  const unclearTotals: UnclearTotal[] = [];
  for (let index = itemEnd; index < lines.length; index += 1) {
    const analysed = lines[index];
    const amount = rightmostAmount(analysed);
    const unclear = amount ? null : unclearTotal(analysed, amountOptions.minorUnits ?? 2, index);
    if (unclear) unclearTotals.push(unclear);
    // The tax table's own total row ("TOTAL: 26.00 1.56") ends on the tax, not on the receipt's total.
    if (!amount || analysed.notASum || index === taxTable.totalIndex) continue;
    entries.push({ role: analysed.summary ?? 'unlabelled', value: new Decimal(amount.value), index, confidence: Math.min(amount.confidence, analysed.confidence) });
  }
  repairSubtotal(entries, readLines);
  const printedSubtotal = entries.find((entry) => entry.role === 'subtotal');
  const repairedLine = printedSubtotal ? repairOneLine(readLines, printedSubtotal.value, notes) : null;
  const itemSum = sum(readLines.map((item) => new Decimal(item.amount)));
  const chosen = chooseFigures(entries, readLines.length > 0 ? itemSum : null, taxTable, unclearTotals);
  const { subtotal, shipping, discount } = chosen;
  // A slip that prints its tax only in the table under the total (common in Europe): the table's taxes add up.
  const tableRows = taxTable.rows.length > 0 ? taxTable.rows : taxTable.total ? [taxTable.total] : [];
  const tax = repairTax(chosen, notes) ?? (tableRows.length > 0 ? { value: sum(tableRows.map((row) => row.tax)), confidence: 0.8 } : null);
  const total = chosen.total ? { ...chosen.total } : null;
  const discountValue = discount ? discount.value.abs() : null;
  // A cash-rounded total is the amount paid; the adjustment stays as its own line so the receipt reconciles.
  if (chosen.rounding) {
    const roundingEntry = entries.find((entry) => entry.role === 'rounding' && entry.value.equals(chosen.rounding!));
    const amount = toWire(chosen.rounding, Math.max(minor, chosen.rounding.decimalPlaces()));
    readLines.push({ kind: chosen.rounding.isNegative() ? 'discount' : 'fee', description: 'Rounding adjustment', partNumber: null, quantity: '1', unitPrice: amount, amount, confidence: 0.95, box: roundingEntry ? lines[roundingEntry.index].line.box : null });
  }
  if (chosen.service) {
    const serviceEntry = entries.find((entry) => entry.role === 'service' && entry.value.equals(chosen.service!));
    const amount = toWire(chosen.service, Math.max(minor, chosen.service.decimalPlaces()));
    readLines.push({ kind: 'fee', description: serviceEntry ? lines[serviceEntry.index].text.replace(/\s*[-+]?\S*[0-9][.,][0-9]+\S*\s*$/, '').trim() || 'Service charge' : 'Service charge', partNumber: null, quantity: '1', unitPrice: amount, amount, confidence: 0.95, box: serviceEntry ? lines[serviceEntry.index].line.box : null });
  }
  const rounding = sum([chosen.rounding ?? new Decimal(0), chosen.service ?? new Decimal(0)]);

  // Reconciliation: printed figures that add up confirm each other.
  const lineSum = sum(readLines.map((item) => new Decimal(item.amount)));
  const linesMatchSubtotal = subtotal !== null && readLines.length > 0 && itemSum.equals(subtotal.value);
  const base = subtotal ? subtotal.value.plus(rounding) : lineSum;
  const computedTotal = sum([base, tax?.value ?? new Decimal(0), shipping?.value ?? new Decimal(0), (discountValue ?? new Decimal(0)).negated()]);
  let totalRepaired = false;
  // Only a printed total the OCR itself was unsure of is corrected; a well-read one that does not add up is reported,
  // and so is one the slip's own arithmetic gave (tendered minus change): no digit of it was misread, while lines
  // are often lost.
  if (total && chosen.totalIndex !== null && total.confidence < 0.8 && !computedTotal.equals(total.value) && (linesMatchSubtotal || subtotal === null) && readLines.length > 0) {
    // One misread character in the total ("$517.72" for $17.72) when everything else adds up.
    if (editDistance(digitsOf(toWire(computedTotal, 2)), digitsOf(toWire(total.value, 2))) <= 1 && computedTotal.isNegative() === total.value.isNegative()) {
      notes.push(`The total reads ${toWire(total.value, 2)}; taken as ${toWire(computedTotal, 2)}, what the lines and charges add up to. Check it.`);
      total.value = computedTotal;
      total.confidence = Math.min(total.confidence, 0.6);
      totalRepaired = true;
    }
  }
  const totalsAgree = total !== null && computedTotal.equals(total.value);
  const boost = (confidence: number, agreed: boolean) => (agreed ? Math.max(confidence, 0.95) : confidence);
  if (linesMatchSubtotal) for (const item of readLines) if (item !== repairedLine) item.confidence = round2(Math.max(item.confidence, 0.9));
  if (total && !totalsAgree && readLines.length > 0) {
    notes.push(`The lines and charges add up to ${toWire(computedTotal, 2)} but the total reads ${toWire(total.value, 2)}; check the amounts.`);
  }
  if (subtotal && readLines.length > 0 && !linesMatchSubtotal) {
    notes.push(`The lines add up to ${toWire(itemSum, 2)} but the subtotal reads ${toWire(subtotal.value, 2)}; a line may be missing or misread.`);
  }
  if (readLines.length === 0) notes.push('No item lines were found; enter them by hand.');
  if (!total) notes.push('No total was found; enter it from the receipt.');
  else if (chosen.unconfirmed) notes.push(`No total could be read beside its word; taken as ${toWire(total.value, minor)}, what the slip's other figures give. Check it.`);
  const agreements = [...chosen.agreements];
  if (linesMatchSubtotal) agreements.push('the lines add up to the subtotal');

  const dateChoice = chooseReceiptDate(lines, options.locale, dateLimits(options.readOn, options.notBefore));
  if (dateChoice.note) notes.push(dateChoice.note);
  const date = dateChoice.field;
  const currency = findCurrency(lines, options.locale, notes);
  const wire = (value: Decimal | null | undefined) => (value === null || value === undefined ? null : toWire(value, Math.max(minor, value.decimalPlaces())));

  return {
    vendor: findVendor(
      lines.map((analysed) => ({ line: analysed.line, text: analysed.text, keywords: analysed.keywords, confidence: analysed.confidence, hasAmount: analysed.tokens.some((token) => token.amount) })),
      options.knownVendors,
    ),
    date,
    currency,
    lines: readLines,
    subtotal: field(wire(subtotal?.value), boost(subtotal?.confidence ?? 0, linesMatchSubtotal || totalsAgree)),
    tax: field(wire(tax?.value), boost(tax?.confidence ?? 0, totalsAgree)),
    shipping: field(wire(shipping?.value), boost(shipping?.confidence ?? 0, totalsAgree)),
    discount: field(wire(discountValue), boost(discount?.confidence ?? 0, totalsAgree)),
    total: field(wire(total?.value), boost(total?.confidence ?? 0, totalsAgree && !totalRepaired && !chosen.unconfirmed)),
    agreements,
    notes,
    pages: pages.map(({ width, height, source }) => ({ width, height, source })),
    words: pages.flatMap((page) => page.lines.flatMap((line) => line.words)),
  };
}

/**
 * A tax table under the summary lines: the last two amounts of each line below its heading, net then tax
 * ("SR 6% 106.10 6.37", "A 19% 42,02 7,98 50,00" where the third is their gross), and its own total row, kept apart:
 * OCR reads the two independently, and that row's last amount is the tax, never the receipt's total.
 */
function readTaxTable(lines: AnalysedLine[], summaryStart: number): TaxTable {
  const table: TaxTable = { rows: [], total: null, totalIndex: null };
  const heading = lines.findIndex((analysed, index) => index >= summaryStart && analysed.tokens.every((token) => !token.amount) && hasWord(analysed.keywords, ...TAX_TABLE_WORDS) && hasWord(analysed.keywords, 'GST', 'VAT', 'TAX', 'MWST', 'TVA', 'IVA', 'BTW', 'SST', 'UST', 'STEUER', 'CUKAI'));
  if (heading === -1) return table;
  for (let index = heading + 1; index < Math.min(lines.length, heading + 6); index += 1) {
    const analysed = lines[index];
    const amounts = analysed.tokens.flatMap((token) => (token.amount ? [new Decimal(token.amount.value)] : []));
    if (amounts.length < 2) continue;
    const withGross = amounts.length >= 3 && amounts[amounts.length - 3].plus(amounts[amounts.length - 2]).equals(amounts[amounts.length - 1]);
    const [net, tax] = withGross ? amounts.slice(-3, -1) : amounts.slice(-2);
    // The tax of a rate is smaller than its net amount; anything else is not a row of the table.
    if (!tax.lessThan(net)) continue;
    const totalRow = analysed.summary === 'total' || analysed.summary === 'final_total' || analysed.summary === 'subtotal';
    if (!totalRow) table.rows.push({ net, tax });
    else if (!table.total) {
      table.total = { net, tax };
      // A row that prints its gross last ends on a total after all.
      if (!withGross) table.totalIndex = index;
    }
  }
  return table;
}

/**
 * A subtotal whose sign OCR lost on a return slip ("42.98" where every line is negative): the lines' sum is taken.
 * (One that lost its decimal point, "14014", is read as 140.14 with the other summary figures: readLostPoint.)
 */
function repairSubtotal(entries: SummaryEntry[], readLines: ReadLine[]): void {
  if (readLines.length === 0) return;
  const itemSum = sum(readLines.map((item) => new Decimal(item.amount)));
  const printed = entries.find((entry) => entry.role === 'subtotal');
  if (printed && itemSum.isNegative() && printed.value.equals(itemSum.abs())) printed.value = itemSum;
}

/** A tax the OCR was unsure of, one character off what the total less the subtotal leaves ("1.21" for 11.21) is corrected, and the person told. */
function repairTax(chosen: ReturnType<typeof chooseFigures>, notes: string[]): ReturnType<typeof chooseFigures>['tax'] {
  const { total, subtotal, tax, shipping, discount } = chosen;
  // Like the total, only a tax the OCR itself was unsure of is corrected.
  if (!total || !subtotal || !tax || tax.confidence >= 0.8 || shipping || discount || chosen.rounding || chosen.service) return tax;
  const expected = total.value.minus(subtotal.value);
  if (expected.equals(tax.value) || !expected.isPositive() || editDistance(digitsOf(toWire(expected, 2)), digitsOf(toWire(tax.value, 2))) > 1) return tax;
  notes.push(`The tax reads ${toWire(tax.value, 2)}; taken as ${toWire(expected, 2)}, the total less the subtotal. Check it.`);
  return { value: expected, confidence: 0.6 };
}

/**
 * When the lines miss the printed subtotal and exactly one line, changed by one character, would close the
 * gap (OCR's "11.179" for 11.79), that line is corrected and the person told.
 */
function repairOneLine(lines: ReadLine[], subtotal: Decimal, notes: string[]): ReadLine | null {
  const gap = subtotal.minus(sum(lines.map((item) => new Decimal(item.amount))));
  if (gap.isZero()) return null;
  const fixable = lines.filter((item) => {
    const corrected = new Decimal(item.amount).plus(gap);
    return corrected.decimalPlaces() <= 2 && !corrected.isZero() && corrected.isNegative() === item.amount.startsWith('-') && editDistance(digitsOf(toWire(corrected, 2)), digitsOf(item.amount)) <= 1;
  });
  if (fixable.length !== 1) return null;
  const [item] = fixable;
  const corrected = toWire(new Decimal(item.amount).plus(gap), 2);
  notes.push(`A line reads ${item.amount}; taken as ${corrected} so the lines add up to the subtotal. Check it.`);
  if (item.unitPrice === item.amount || item.quantity === '1') item.unitPrice = corrected;
  item.amount = corrected;
  item.confidence = Math.min(item.confidence, 0.6);
  return item;
}

