// Finds the date printed on a receipt in its many forms and returns it as ISO 8601 (YYYY-MM-DD). Whether
// 03/04/2026 is day-first comes from the build's locale; an ambiguous reading is reported, never hidden.

export interface ReadDate {
  value: string;
  confidence: number;
  /** Set when the reading depends on the locale's day/month order or on a guess. */
  note: string | null;
  /** Where the date starts and ends in the searched text. */
  start: number;
  end: number;
}

/**
 * Month names and their printed abbreviations, accents folded, in English, German, French, Spanish, Italian,
 * Dutch, Portuguese and Malay (from memory of each language's calendar words).
 */
const MONTH_WORDS_BY_NUMBER: string[][] = [
  ['january', 'jan', 'januar', 'janner', 'janvier', 'janv', 'enero', 'ene', 'gennaio', 'gen', 'januari', 'janeiro'],
  ['february', 'feb', 'februar', 'fevrier', 'fevr', 'fev', 'febrero', 'febbraio', 'februari', 'fevereiro'],
  ['march', 'mar', 'marz', 'maerz', 'mrz', 'mars', 'marzo', 'maart', 'mrt', 'marco', 'mac'],
  ['april', 'apr', 'avril', 'avr', 'abril', 'abr', 'aprile'],
  ['may', 'mai', 'mayo', 'maggio', 'mag', 'mei', 'maio'],
  ['june', 'jun', 'juni', 'juin', 'junio', 'giugno', 'giu', 'junho'],
  ['july', 'jul', 'juli', 'juillet', 'juil', 'julio', 'luglio', 'lug', 'julho', 'julai'],
  ['august', 'aug', 'aout', 'agosto', 'ago', 'augustus', 'ogos'],
  ['september', 'sep', 'sept', 'septembre', 'septiembre', 'setiembre', 'settembre', 'set', 'setembro'],
  ['october', 'oct', 'oktober', 'okt', 'octobre', 'octubre', 'ottobre', 'ott', 'outubro', 'out'],
  ['november', 'nov', 'novembre', 'noviembre', 'novembro'],
  ['december', 'dec', 'dezember', 'dez', 'decembre', 'diciembre', 'dic', 'dicembre', 'dezembro', 'disember'],
];
const MONTH_BY_WORD = new Map(MONTH_WORDS_BY_NUMBER.flatMap((words, index) => words.map((word) => [word, index + 1] as const)));
// Longest first, so "september" wins over "sep"; OCR may give 0 for o inside the word ("N0v").
const MONTH_WORDS = [...MONTH_BY_WORD.keys()].sort((a, b) => b.length - a.length).map((word) => word.replace(/o/g, '[o0]')).join('|');
const ENGLISH_MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

/** True when the locale writes the day before the month (en-GB 14/11/2026), from Intl's own pattern. */
export function isDayFirst(locale: string): boolean {
  const parts = new Intl.DateTimeFormat(locale, { year: 'numeric', month: '2-digit', day: '2-digit' }).formatToParts(new Date(Date.UTC(2026, 10, 14)));
  const types = parts.map((part) => part.type);
  return types.indexOf('day') < types.indexOf('month');
}

/** The order the locale prints a short numeric date in: "mdy" (en-US), "dmy" (en-GB) or "ymd" (en-CA, ja). */
export function numericOrder(locale: string): 'mdy' | 'dmy' | 'ymd' {
  const parts = new Intl.DateTimeFormat(locale, { year: '2-digit', month: '2-digit', day: '2-digit', timeZone: 'UTC' }).formatToParts(new Date(Date.UTC(2026, 10, 14)));
  const order = parts
    .filter((part) => part.type === 'year' || part.type === 'month' || part.type === 'day')
    .map((part) => part.type[0])
    .join('');
  return order === 'ymd' ? 'ymd' : isDayFirst(locale) ? 'dmy' : 'mdy';
}

function daysInMonth(year: number, month: number): number {
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}

function iso(year: number, month: number, day: number): string | null {
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return null;
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/** Two-digit years are this century (receipts are recent); common practice. */
function fullYear(text: string): number {
  const year = Number(text);
  return text.length === 2 ? 2000 + year : year;
}

// Receipts are recent: a year far from now is more likely an OCR error, so it lowers the confidence.
function yearConfidence(year: number): number {
  return year >= 2000 && year <= 2099 ? 1 : 0.3;
}

function describe(isoDate: string): string {
  const [year, month, day] = isoDate.split('-').map(Number);
  return `${day} ${ENGLISH_MONTHS[month - 1]} ${year}`;
}

/** Digits OCR reads as letters inside a date (1O/O7/2026). */
function fixDigits(text: string): string {
  return text.replace(/[Oo]/g, '0').replace(/[lI|]/g, '1').replace(/S/g, '5');
}

const ORDER_WORDS: Record<string, string> = { mdy: 'the month first', dmy: 'the day first', ymd: 'the year first' };

type Candidate = Omit<ReadDate, 'start' | 'end'> & { index: number; length: number };

function numericCandidates(text: string, locale: string): Candidate[] {
  const found: Candidate[] = [];
  const pattern = /(?<![0-9A-Za-z])([0-9OolIS]{1,4})([-/.])([0-9OolIS]{1,2})\2([0-9OolIS]{2,4})(?![0-9A-Za-z])/g;
  // A faint second separator OCR lost before a four-digit year ("22/122017"): read, a little less sure.
  const lostSeparator = /(?<![0-9A-Za-z])([0-9]{1,2})([-/.])([0-9]{2})()((?:19|20)[0-9]{2})(?![0-9A-Za-z])/g;
  const matches = [...[...text.matchAll(pattern)].map((match) => ({ match, lost: false })), ...[...text.matchAll(lostSeparator)].map((match) => ({ match, lost: true }))];
  for (const { match, lost } of matches) {
    const [whole, firstText, , secondText, lastText] = lost ? [match[0], match[1], '', match[3], match[5]] : match.map((part) => fixDigits(part ?? ''));
    const corrected = lost || whole !== match[0];
    const penalty = corrected ? 0.8 : 1;
    const index = match.index ?? 0;
    if (firstText.length === 4) {
      // Year first: ISO 8601 order (2026-11-14), never day-month.
      const year = Number(firstText);
      const value = lastText.length <= 2 ? iso(year, Number(secondText), Number(lastText)) : null;
      if (value) found.push({ value, confidence: 0.95 * penalty * yearConfidence(year), note: null, index, length: whole.length });
      continue;
    }
    if (firstText.length > 2 || (lastText.length !== 2 && lastText.length !== 4)) continue;
    const first = Number(firstText);
    const second = Number(secondText);
    const last = Number(lastText);
    const order = numericOrder(locale);
    // Every reading that makes a real date; year-first with a two-digit year only where the locale writes so.
    const readings: Array<{ order: string; value: string | null }> = [
      { order: 'mdy', value: iso(fullYear(lastText), first, second) },
      { order: 'dmy', value: iso(fullYear(lastText), second, first) },
      { order: 'ymd', value: order === 'ymd' && lastText.length === 2 ? iso(2000 + first, second, last) : null },
    ];
    const valid = readings.filter((reading): reading is { order: string; value: string } => reading.value !== null);
    const distinct = [...new Set(valid.map((reading) => reading.value))];
    if (distinct.length === 0) continue;
    const preferred = lastText.length === 4 && order === 'ymd' ? 'mdy' : order;
    const chosen = valid.find((reading) => reading.order === preferred) ?? valid[0];
    const year = Number(chosen.value.slice(0, 4));
    const confidence = 0.95 * penalty * yearConfidence(year) * (lastText.length === 2 ? 0.9 : 1);
    if (distinct.length > 1) {
      const others = distinct.filter((value) => value !== chosen.value).map(describe);
      found.push({
        value: chosen.value,
        confidence: Math.min(confidence, 0.5),
        note: `The date ${match[0]} could be ${describe(chosen.value)} or ${others.join(' or ')}; read as ${describe(chosen.value)} because the build's locale (${locale}) writes ${ORDER_WORDS[preferred]}. Check it against the receipt.`,
        index,
        length: whole.length,
      });
    } else {
      // Only one order makes a real date; a slip that disagrees with the locale is still read, a little less sure.
      found.push({ value: chosen.value, confidence: chosen.order === preferred ? confidence : confidence * 0.9, note: null, index, length: whole.length });
    }
  }
  return found;
}

/**
 * Eight digits whose separators OCR lost ("27032018" for 27/03/2018): read in the locale's order, or year first
 * (20180327), and much less sure than a printed date, so any date printed plainly wins.
 */
function runTogetherCandidates(text: string, locale: string): Candidate[] {
  const found: Candidate[] = [];
  const order = numericOrder(locale);
  for (const match of text.matchAll(/(?<![0-9A-Za-z])([0-9]{8})(?![0-9A-Za-z])/g)) {
    const digits = match[1];
    const [a, b] = [Number(digits.slice(0, 2)), Number(digits.slice(2, 4))];
    const yearLast = Number(digits.slice(4));
    const value =
      /^(19|20)/.test(digits) && order === 'ymd'
        ? iso(Number(digits.slice(0, 4)), Number(digits.slice(4, 6)), Number(digits.slice(6)))
        : /^(19|20)/.test(digits.slice(4))
          ? order === 'mdy' ? iso(yearLast, a, b) : iso(yearLast, b, a)
          : /^(19|20)/.test(digits) ? iso(Number(digits.slice(0, 4)), Number(digits.slice(4, 6)), Number(digits.slice(6))) : null;
    if (value) found.push({ value, confidence: 0.4, note: null, index: match.index ?? 0, length: digits.length });
  }
  return found;
}

function foldAccents(text: string): string {
  return text.normalize('NFD').replace(/\p{M}/gu, '');
}

function monthIndex(word: string): number {
  return MONTH_BY_WORD.get(foldAccents(word).toLowerCase().replace(/0/g, 'o')) ?? 0;
}

function wordCandidates(printed: string): Candidate[] {
  const found: Candidate[] = [];
  // Accents folded for the month words ("März", "février", "août"); the folded text keeps the same positions
  // for the letters the patterns need, so indexes stay close enough for ordering.
  const text = foldAccents(printed);
  // OCR may give 0 for o inside the month word ("N0v"), so the letter class allows it.
  const month = `((?:${MONTH_WORDS}))\\.?`;
  const dayMonthYear = new RegExp(`(?<![0-9A-Za-z])([0-9OlI]{1,2})(?:st|nd|rd|th|er|º|o)?[\\s\\-/.]*(?:de\\s+)?${month}[\\s\\-/.,]*(?:de\\s+)?([0-9OlI]{4}|[0-9]{2})(?![0-9A-Za-z])`, 'gi');
  const monthDayYear = new RegExp(`(?<![A-Za-z])${month}[\\s\\-/.]*([0-9OlI]{1,2})(?:st|nd|rd|th)?[\\s,.]+([0-9OlI]{4})(?![0-9A-Za-z])`, 'gi');
  for (const match of text.matchAll(dayMonthYear)) {
    const year = fullYear(fixDigits(match[3]));
    const value = iso(year, monthIndex(match[2]), Number(fixDigits(match[1])));
    if (value) found.push({ value, confidence: 0.95 * yearConfidence(year), note: null, index: match.index ?? 0, length: match[0].length });
  }
  for (const match of text.matchAll(monthDayYear)) {
    const year = fullYear(fixDigits(match[3]));
    const value = iso(year, monthIndex(match[1]), Number(fixDigits(match[2])));
    if (value) found.push({ value, confidence: 0.95 * yearConfidence(year), note: null, index: match.index ?? 0, length: match[0].length });
  }
  return found;
}

export interface DateLimits {
  /** ISO date after which no receipt can be dated: the day it was uploaded (a day's grace for time zones). */
  notAfter?: string;
  /** ISO date before which a receipt date is not believed (long before the build began). */
  notBefore?: string;
}

/** The ISO date a number of days after another. */
export function addDays(isoDate: string, days: number): string {
  const date = new Date(`${isoDate}T00:00:00Z`);
  date.setUTCDate(date.getUTCDate() + days);
  return date.toISOString().slice(0, 10);
}

/**
 * A date whose year cannot be (OCR's 2518 for 2018) with its year mended, when exactly one digit changed gives a year
 * within the limits: OCR misreads one digit far more often than two. Null when none or several would do.
 */
function mendedYear(candidate: Candidate, within: (value: string) => boolean): Candidate | null {
  const [year, month, day] = candidate.value.split('-');
  const mended = new Set<string>();
  for (let position = 0; position < 4; position += 1) {
    for (let digit = 0; digit <= 9; digit += 1) {
      const other = `${year.slice(0, position)}${digit}${year.slice(position + 1)}`;
      const value = other === year ? null : iso(Number(other), Number(month), Number(day));
      if (value && within(value)) mended.add(value);
    }
  }
  if (mended.size !== 1) return null;
  const [value] = mended;
  return {
    ...candidate,
    value,
    confidence: Math.min(candidate.confidence, 0.4),
    note: `The year of the date printed reads as ${year}, which cannot be; read as ${describe(value)}. Check it against the receipt.`,
  };
}

/**
 * Every date in a piece of text, in reading order; a date outside the limits (OCR's 2048 for 2018) is refused unless
 * one digit of its year mends it.
 */
export function findDates(text: string, locale: string, limits: DateLimits = {}): ReadDate[] {
  const latest = limits.notAfter ? addDays(limits.notAfter, 1) : null;
  const within = (value: string) => (latest === null || value <= latest) && (limits.notBefore === undefined || value >= limits.notBefore);
  const candidates = [...wordCandidates(text), ...numericCandidates(text, locale), ...runTogetherCandidates(text, locale)]
    .flatMap((candidate) => {
      if (within(candidate.value)) return [candidate];
      const mended = mendedYear(candidate, within);
      return mended ? [mended] : [];
    })
    .sort((a, b) => a.index - b.index);
  // A month-word match and a numeric one can overlap ("14-Nov-26" is not numeric, but be safe): keep the first.
  const kept: Candidate[] = [];
  for (const candidate of candidates) {
    const previous = kept[kept.length - 1];
    if (previous && candidate.index < previous.index + previous.length) continue;
    kept.push(candidate);
  }
  return kept.map(({ index, length, ...rest }) => ({ ...rest, start: index, end: index + length }));
}

/** The first date in the text, or null. */
export function findDate(text: string, locale: string, limits: DateLimits = {}): ReadDate | null {
  return findDates(text, locale, limits)[0] ?? null;
}
