// Reads a warranty from a receipt line's description ("LIFETIME WARRANTY", "WTY 12 MO", "2 YR WARRANTY"), to suggest
// it for the line's part when the receipt is checked. Only a suggestion: the person can change it on the part.
import { MAX_WARRANTY_MONTHS, type Warranty } from '../../../shared/warranty';
import { WARRANTY_WORDS } from './warranty-words';

const alternatives = (words: string[]) => [...words].sort((a, b) => b.length - a.length).map((word) => word.replace(/ /g, '\\s+')).join('|');
const WARRANTY = `(?:${alternatives(WARRANTY_WORDS.warranty)})`;
const UNIT = `(${alternatives(Object.keys(WARRANTY_WORDS.units))})`;
const LENGTH = `(\\d{1,4})\\s*-?\\s*${UNIT}\\.?`;
const NEGATED = new RegExp(`\\b(?:${alternatives(WARRANTY_WORDS.negations)})\\s+${WARRANTY}\\b`);
const LIFETIME = new RegExp(`\\b(?:${alternatives(WARRANTY_WORDS.lifetime)})\\s*-?\\s*${WARRANTY}\\b`);
/** "12 month warranty", "2-yr wty", and "warranty 12 mo", "wty: 24 months". */
const LENGTH_BEFORE = new RegExp(`\\b${LENGTH}\\s*${WARRANTY}\\b`);
const LENGTH_AFTER = new RegExp(`\\b${WARRANTY}\\s*[:.]?\\s*${LENGTH}(?![a-z])`);

export function suggestWarranty(description: string): Warranty {
  const text = description.toLowerCase();
  if (NEGATED.test(text)) return null;
  if (LIFETIME.test(text)) return 'lifetime';
  const found = LENGTH_BEFORE.exec(text) ?? LENGTH_AFTER.exec(text);
  if (!found) return null;
  const months = Number(found[1]) * WARRANTY_WORDS.units[found[2]];
  return months >= 1 && months <= MAX_WARRANTY_MONTHS ? months : null;
}
