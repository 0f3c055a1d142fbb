// Chooses the date a receipt was issued among every date printed on it: a date that cannot be (after the upload
// day, long before) is refused, one beside a date word or near the top is preferred, and one beside an expiry,
// due or warranty word is passed over.
import type { ReadField } from '../../../../shared/api/receipt-reading';
import { DateLimits, ReadDate, addDays, findDates } from './dates';
import { hasWord } from './label-words';

export interface DatedLine {
  text: string;
  keywords: string[];
  confidence: number;
}

/** Words printed beside the issue date, in the languages of the summary table (common practice / memory). */
export const DATE_WORDS = ['DATE', 'DATED', 'DT', 'DATUM', 'FECHA', 'DATA', 'TARIKH', 'BILL DATE', 'INVOICE DATE', 'TRANSACTION', 'DATE/TIME'];
/** Words beside dates that are not the issue date (memory). */
const OTHER_DATE_WORDS = ['DUE', 'EXPIRY', 'EXPIRES', 'EXP', 'VALID', 'UNTIL', 'BEFORE', 'WARRANTY', 'RETURN', 'RETURNS', 'GUELTIG', 'GULTIG', 'BIS', 'VALIDO', 'VALABLE', 'VENCIMIENTO', 'SCADENZA', 'GELDIG', 'VALIDADE', 'TAMAT', 'POINTS', 'MEMBER', 'SINCE'];

export interface DateChoice {
  field: ReadField<string>;
  note: string | null;
}

/** Parts are often bought well ahead of a build, but not this many years before it began (our choice). */
export const YEARS_BOUGHT_AHEAD = 5;

/** The earliest day a receipt of a build that began on `buildStartedOn` can carry; null when the start is not set. */
export function earliestReceiptDay(buildStartedOn: string | null): string | null {
  if (!buildStartedOn) return null;
  const [year, month, day] = buildStartedOn.split('-').map(Number);
  // Date.UTC rolls a 29 February into 1 March of a common year.
  return new Date(Date.UTC(year - YEARS_BOUGHT_AHEAD, month - 1, day)).toISOString().slice(0, 10);
}

/** Upload day and the earliest believable day; without them, today and twenty-five years before it. */
export function dateLimits(readOn?: string, notBefore?: string): DateLimits {
  const today = readOn ?? new Date().toISOString().slice(0, 10);
  return { notAfter: today, notBefore: notBefore ?? addDays(today, -25 * 366) };
}

export function chooseReceiptDate(lines: DatedLine[], locale: string, limits: DateLimits): DateChoice {
  let best: { found: ReadDate; score: number; line: DatedLine } | null = null;
  lines.forEach((line, index) => {
    for (const found of findDates(line.text, locale, limits)) {
      // Near the top is where slips print the issue date; the last lines often repeat it, which is fine too.
      const position = index < lines.length / 3 ? 0.15 : index >= lines.length - 3 ? 0.1 : 0;
      const labelled = hasWord(line.keywords, ...DATE_WORDS) ? 0.3 : 0;
      const other = hasWord(line.keywords, ...OTHER_DATE_WORDS) ? -0.5 : 0;
      // A time beside the date is how tills print the moment of sale.
      const timed = /\b[0-2]?[0-9]:[0-5][0-9]\b/.test(line.text) ? 0.1 : 0;
      const score = found.confidence + position + labelled + other + timed;
      if (!best || score > best.score) best = { found, score, line };
    }
  });
  if (!best) return { field: { value: null, confidence: 0 }, note: null };
  const { found, line } = best as { found: ReadDate; score: number; line: DatedLine };
  return { field: { value: found.value, confidence: Math.round(found.confidence * Math.max(line.confidence, 0.5) * 100) / 100 }, note: found.note };
}
