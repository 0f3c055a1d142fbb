// OCR-tolerant matching of the words printed beside receipt figures against the summary word table: accents
// folded, digits OCR put inside words turned back into letters, one slip allowed in longer words, words split or
// glued by OCR ("SUB TOTAL", "ROUND D TOTAL", "GRANDTOTAL") still matched.
import { EXCLUDING_WORDS, INCLUDING_WORDS, NOT_A_SUM_WORDS, SUMMARY_WORDS, SummaryRole } from './summary-words';

const LETTER_FOR_DIGIT: Record<string, string> = { '0': 'O', '1': 'I', '5': 'S', '8': 'B', '6': 'G', '2': 'Z' };

/** A printed word as a keyword: upper case, accents folded, letters only ("Rückgeld" → "RUCKGELD", "T0TAL" → "TOTAL"). */
export function keywordOf(word: string): string {
  const folded = word.normalize('NFD').replace(/\p{M}/gu, '').replace(/ß/g, 'SS');
  const letters = (folded.match(/[A-Za-z]/g) ?? []).length;
  const digits = (folded.match(/[0-9]/g) ?? []).length;
  // Only words that are mostly letters get their stray digits turned back into letters ("T0TAL").
  const fixed = letters > digits ? folded.replace(/[015862]/g, (digit) => LETTER_FOR_DIGIT[digit]) : folded;
  return fixed.toUpperCase().replace(/[^A-Z&]/g, '');
}

export function editDistance(left: string, right: string): number {
  const previous = Array.from({ length: right.length + 1 }, (_, index) => index);
  for (let i = 1; i <= left.length; i += 1) {
    let diagonal = previous[0];
    previous[0] = i;
    for (let j = 1; j <= right.length; j += 1) {
      const above = previous[j];
      previous[j] = Math.min(previous[j] + 1, previous[j - 1] + 1, diagonal + (left[i - 1] === right[j - 1] ? 0 : 1));
      diagonal = above;
    }
  }
  return previous[right.length];
}

// Real words that sit one letter away from a keyword and must never be taken for it.
const NEAR_MISSES = new Set(['CHARGE', 'CHARGES', 'CHANGE', 'TOTALS', 'RETURN', 'REFUND', 'CASHIER', 'CARTE', 'CARTA']);

/** A word matches a keyword exactly, within one OCR slip from five letters, two from ten. */
export function sameWord(word: string, keyword: string): boolean {
  if (word === keyword) return true;
  if (NEAR_MISSES.has(word)) return false;
  const allowed = keyword.length >= 10 ? 2 : keyword.length >= 5 ? 1 : 0;
  return allowed > 0 && Math.abs(word.length - keyword.length) <= allowed && editDistance(word, keyword) <= allowed;
}

export function hasWord(keywords: string[], ...candidates: string[]): boolean {
  return keywords.some((word) => candidates.some((candidate) => sameWord(word, candidate)));
}

interface Phrase {
  role: SummaryRole;
  words: string[];
  joined: string;
}

const PHRASES: Phrase[] = SUMMARY_WORDS.flatMap((entry) =>
  entry.phrases.map((phrase) => {
    const words = phrase.split(/\s+/).map(keywordOf).filter((word) => word !== '');
    return { role: entry.role, words, joined: words.join('') };
  }),
);

interface PhraseMatch {
  phrase: Phrase;
  start: number;
  /** Label words covered. */
  length: number;
}

/** Where a phrase occurs in the label, word by word or with OCR's splits and joins. */
function findPhrase(label: string[], phrase: Phrase): PhraseMatch | null {
  for (let start = 0; start < label.length; start += 1) {
    // Short words ("BAR", "EC", "PIN", "TAX") are labels only at the start of a short line, not inside a description.
    if (phrase.joined.length <= 3 && (start > 1 || label.length > 4)) break;
    if (phrase.words.every((word, offset) => label[start + offset] !== undefined && sameWord(label[start + offset], word))) {
      return { phrase, start, length: phrase.words.length };
    }
    if (phrase.joined.length < 5) continue;
    let glued = '';
    for (let end = start; end < label.length && end < start + phrase.words.length + 2; end += 1) {
      glued += label[end];
      if (end > start || phrase.words.length > 1) {
        if (sameWord(glued, phrase.joined)) return { phrase, start, length: end - start + 1 };
      }
      if (glued.length > phrase.joined.length + 2) break;
    }
  }
  return null;
}

export interface LabelReading {
  role: SummaryRole | null;
  /** A total word together with a count, points or savings word ("TOTAL QTY"): no figure, but not an item either. */
  notASum: boolean;
}

/**
 * The summary role of a line from the words before its amount: the longest phrase of the table that occurs wins,
 * and words around a total ("QTY", "EXCL", "INCL") refine it.
 */
export function readLabel(label: string[]): LabelReading {
  const key = label.join(' ');
  let reading = readings.get(key);
  if (!reading) {
    reading = matchLabel(label);
    // Receipts repeat the same labels; the cache stays small by starting over when full.
    if (readings.size > 5000) readings.clear();
    readings.set(key, reading);
  }
  return reading;
}

const readings = new Map<string, LabelReading>();

function matchLabel(label: string[]): LabelReading {
  if (label.length === 0) return { role: null, notASum: false };
  const matches = PHRASES.map((phrase) => findPhrase(label, phrase)).filter((match): match is PhraseMatch => match !== null);
  if (matches.length === 0) return { role: null, notASum: false };
  // A description that merely contains a summary word ("DELIVERY VAN MIRROR LEFT") is an item.
  const best = matches.sort((a, b) => b.phrase.joined.length - a.phrase.joined.length || a.start - b.start)[0];
  // Words that only qualify a total (a tax word, "INCL", "OF", a currency's letters, OCR's stray letters) say nothing of
  // an item: "Total RM Incl. of GST 31.47" is a total.
  const covered = new Set(matches.flatMap((match) => Array.from({ length: match.length }, (_, offset) => match.start + offset)));
  const describing = label.filter((word, index) => !covered.has(index) && word.length > 2 && !hasWord([word], ...INCLUDING_WORDS, ...EXCLUDING_WORDS));
  if (describing.length > 3) return { role: null, notASum: false };
  const roles = new Set(matches.map((match) => match.phrase.role));
  let role = best.phrase.role;
  const totalish = role === 'total' || role === 'final_total' || role === 'subtotal';
  if (totalish && hasWord(label, ...NOT_A_SUM_WORDS)) return { role: null, notASum: true };
  if ((role === 'total' || role === 'final_total') && roles.has('tax')) {
    const taxStart = Math.min(...matches.filter((match) => match.phrase.role === 'tax').map((match) => match.start));
    if (hasWord(label, ...EXCLUDING_WORDS)) role = 'subtotal';
    else if (!(hasWord(label, ...INCLUDING_WORDS) && best.start < taxStart)) role = 'tax';
  }
  return { role, notASum: false };
}
