// Finds the trade words of TRADE_WORDS in a line's description and the build's systems of each kind they name.
import { TRADE_WORDS, type TradeVocabulary } from './trade-words';

/** Lower case words separated by single spaces: "Heat-shrink, 3/8" becomes "heat shrink 3 8". */
export function wordsOf(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, ' ').trim();
}

function escape(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

interface Pattern {
  vocabulary: TradeVocabulary;
  word: string;
  /** Words in the entry: a phrase that matches says more than one word. */
  weight: number;
  pattern: RegExp;
}

// Whole words only, and a plain English plural of the last word ("relays", "fuses", "hose clamps").
const PATTERNS: Pattern[] = TRADE_WORDS.flatMap((vocabulary) =>
  vocabulary.words.map((word) => {
    const normal = wordsOf(word);
    return { vocabulary, word, weight: normal.split(' ').length, pattern: new RegExp(`(?:^| )${escape(normal)}(?:e?s)?(?= |$)`) };
  }),
);

export interface TradeWordMatch {
  vocabulary: TradeVocabulary;
  /** The longest entry of that kind found in the description, for the reason. */
  word: string;
  /** The weights of every entry of that kind found. */
  weight: number;
}

/** The kinds whose words the description holds, the best first (more and longer words; then the vocabulary's order). */
export function tradeWordMatches(description: string): TradeWordMatch[] {
  const text = wordsOf(description);
  const byKind = new Map<TradeVocabulary, TradeWordMatch>();
  for (const entry of PATTERNS) {
    if (!entry.pattern.test(text)) continue;
    const found = byKind.get(entry.vocabulary);
    if (!found) byKind.set(entry.vocabulary, { vocabulary: entry.vocabulary, word: entry.word, weight: entry.weight });
    else {
      found.weight += entry.weight;
      if (entry.weight > wordsOf(found.word).split(' ').length) found.word = entry.word;
    }
  }
  const order = (match: TradeWordMatch) => TRADE_WORDS.indexOf(match.vocabulary);
  return [...byKind.values()].sort((a, b) => b.weight - a.weight || order(a) - order(b));
}

/** Whether a system's own name marks it as of this kind: "Cooling", "Cooling and heating", "Brakes (front)". */
export function systemIsOfKind(systemName: string, vocabulary: TradeVocabulary): boolean {
  const names = wordsOf(systemName).split(' ');
  return vocabulary.systemWords.some((word) => names.includes(word));
}
