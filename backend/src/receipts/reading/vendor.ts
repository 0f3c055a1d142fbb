// Finds the shop's name: the most prominent text near the top (tallest print, first lines), a business suffix as
// a strong signal, and never a slogan, an address, a phone number, a tax id or a date. A shop the build already
// knows wins when the text is close to its name.
import type { ReadField } from '../../../../shared/api/receipt-reading';
import { findDate } from './dates';
import { ADDRESS_WORDS, NOT_A_NAME_WORDS } from './heading-words';
import { editDistance, hasWord, keywordOf } from './label-words';
import { type TextLine, lineText, makeLine } from './text-lines';

export interface VendorLine {
  line: TextLine;
  text: string;
  keywords: string[];
  confidence: number;
  hasAmount: boolean;
}

/**
 * Legal-form suffixes of businesses (common practice for en/ms; memory for the others). "SDN BHD" is also matched as
 * OCR misreads it in receipt print, B as 8 and D as O ("SDN 8HD", "SON BHD"): common OCR confusions.
 */
const BUSINESS_SUFFIX =
  /(?:^|[\s(.,])(S[DO0]N\.?\s*[B8]HD|S\/B|S\.?\s?B\.?$|[B8]HD|BERHAD|ENTERPRISE|TRADING|INC|LLC|L\.L\.C|LTD|LIMITED|PLC|CORP|CORPORATION|CO\.|COMPANY|PTY|GMBH|AG|KG|OHG|E\.K|S\.A\.?|S\.A\.S|SAS|SARL|S\.L\.?|S\.R\.L\.?|SRL|S\.P\.A\.?|SPA|SNC|B\.V\.?|BV|N\.V\.?|V\.O\.F|LDA|LTDA|SDN)(?=$|[\s).,])/i;
function cleaned(text: string): string {
  return text.replace(/[^\p{L}0-9&'.,\-/()\s]/gu, ' ').replace(/\s+/g, ' ').trim();
}

/** The name ends at its legal-form suffix: a registration number after it is not part of it. */
function trimAfterSuffix(text: string): string {
  const matches = [...text.matchAll(new RegExp(BUSINESS_SUFFIX.source, 'gi'))];
  const last = matches[matches.length - 1];
  if (!last) return text.replace(/[\s,.(-]+$/, '');
  return text.slice(0, (last.index ?? 0) + last[0].length).replace(/[\s,(-]+$/, '');
}

/** A line that holds little but a legal form ("SDN BHD", "CO. (M) SDN BHD"): the end of a name begun above. */
function onlySuffix(text: string): boolean {
  const rest = text.replace(new RegExp(BUSINESS_SUFFIX.source, 'gi'), ' ').replace(/\([A-Z]\)|[^\p{L}]/gu, '');
  return BUSINESS_SUFFIX.test(text) && rest.length <= 3;
}

const HEADING_WORD_SET = new Set(NOT_A_NAME_WORDS);
const ADDRESS_SET = new Set(ADDRESS_WORDS);
const LONG_HEADING_WORDS = NOT_A_NAME_WORDS.filter((word) => word.length >= 7);

/**
 * A word of an address, phone or heading line. Short words must match exactly: one letter off, a name's own word
 * is too often one ("BORONG" is not "LORONG"); long ones may carry an OCR slip.
 */
function headingWord(keywords: string[]): boolean {
  return keywords.some((word) => HEADING_WORD_SET.has(word) || (word.length >= 7 && hasWord([word], ...LONG_HEADING_WORDS)));
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted.length === 0 ? 0 : sorted[Math.floor(sorted.length / 2)];
}

function looksLikeName(line: VendorLine): boolean {
  const text = cleaned(line.text);
  const letters = (text.match(/\p{L}/gu) ?? []).length;
  const digits = (text.match(/[0-9]/g) ?? []).length;
  if (letters < 3 || digits > letters / 2 || line.hasAmount) return false;
  if (/@|www\.|https?:|\.com\b/i.test(line.text) || findDate(line.text, 'en-GB')) return false;
  if (headingWord(line.keywords) && !BUSINESS_SUFFIX.test(text)) return false;
  // A postcode (four to six digits standing alone) marks an address line.
  if (/(?:^|[\s,])[0-9]{4,6}(?:$|[\s,])/.test(text) && !BUSINESS_SUFFIX.test(text)) return false;
  // A slogan shouts: an exclamation mark, or a sentence of many short words.
  if (/!/.test(line.text) || line.keywords.length > 7) return false;
  return true;
}

/** Below this OCR confidence (measured: 0.1 kept most names whole on real scans) a word is the OCR's guess at a logo, a stamp or handwriting, not print. */
const GUESSED_WORD = 0.1;

/** The line without the words the OCR only guessed at; null when nothing is left. */
function withoutGuesses(line: VendorLine): VendorLine | null {
  const words = line.line.words.filter((word) => word.confidence >= GUESSED_WORD);
  if (words.length === line.line.words.length) return line;
  if (words.length === 0) return null;
  const kept = makeLine(words);
  const text = lineText(kept);
  return { ...line, line: kept, text, keywords: text.split(/\s+/).map(keywordOf).filter((word) => word !== '') };
}

/** A name broken over two lines ends its first with a joining mark or word ("HOME MASTER HARDWARE &" / "ELECTRICAL"). */
const CONTINUES = /(?:[&,+\-]|\bAND|\bUND|\bET|\bY|\bE|\bEN|\bDAN)$/i;

/** The index of the first address or phone line among the top lines, or -1. */
function firstAddressLine(top: VendorLine[]): number {
  return top.findIndex((line) => line.keywords.some((word) => ADDRESS_SET.has(word)) && !BUSINESS_SUFFIX.test(cleaned(line.text)));
}

/**
 * Where the heading above the shop's address ends, when no line there reads as a name (large print and logos are
 * often lost to OCR read at the size of the small print); null when a name was read or no address line is found.
 */
export function lostHeadingBottom(lines: VendorLine[]): number | null {
  const top = lines.slice(0, 10);
  const address = firstAddressLine(top);
  if (address <= 0) return null;
  const named = top.slice(0, address).some((line) => {
    const kept = withoutGuesses(line);
    return kept !== null && kept.confidence >= 0.5 && looksLikeName(kept);
  });
  return named ? null : top[address].line.box.y;
}

export function findVendor(lines: VendorLine[], knownVendors: string[] = []): ReadField<string> {
  const top = lines.slice(0, 10).map((line) => withoutGuesses(line) ?? { ...line, text: '', keywords: [] });
  const heights = lines.flatMap((line) => line.line.words.map((word) => word.box.h));
  const typical = Math.max(1, median(heights));
  // The name is printed above the shop's address and phone: a line below the first of those is rarely the name.
  const firstAddress = firstAddressLine(top);
  let best: { index: number; score: number } | null = null;
  top.forEach((line, index) => {
    if (!looksLikeName(line)) return;
    const height = median(line.line.words.map((word) => word.box.h));
    const prominence = Math.min(2, Math.max(-0.5, height / typical - 1));
    const suffix = BUSINESS_SUFFIX.test(cleaned(line.text)) ? 1.5 : 0;
    const letters = (line.text.match(/\p{L}/gu) ?? []).length;
    // Names are short: a long line near the top is more likely a description or an address without a keyword.
    const length = letters > 45 ? -1 : 0;
    const belowAddress = firstAddress !== -1 && index > firstAddress ? -1.5 : 0;
    // Shops print their names in capitals or title case; a line without a capital is a note or handwriting.
    const noCapital = /\p{Lu}/u.test(line.text) ? 0 : -2;
    const score = 1.5 * prominence + suffix + length + belowAddress + noCapital + 2 * (1 - index / 10) + line.confidence;
    if (!best || score > best.score) best = { index, score };
  });
  if (!best) return { value: null, confidence: 0 };
  const { index } = best as { index: number; score: number };
  let text = cleaned(top[index].text);
  const previous = top[index - 1];
  if (previous && (onlySuffix(text) || CONTINUES.test(cleaned(previous.text))) && looksLikeName(previous) && sameCase(previous.text, text)) text = `${cleaned(previous.text)} ${text}`;
  // A name broken over two lines: "HOME MASTER HARDWARE &" / "ELECTRICAL", or the legal form on the next line.
  const next = top[index + 1];
  const plainName = (line: VendorLine) => looksLikeName(line) && !/[0-9]/.test(line.text) && !headingWord(line.keywords);
  if (next && plainName(next) && !BUSINESS_SUFFIX.test(text) && (CONTINUES.test(text) || (BUSINESS_SUFFIX.test(cleaned(next.text)) && sameCase(text, next.text)))) {
    text = `${text} ${cleaned(next.text)}`;
  }
  text = trimAfterSuffix(text);
  const confidence = Math.round(Math.min(1, top[index].confidence * (index === 0 ? 1 : 0.85)) * 100) / 100;
  const known = closestKnown(text, knownVendors);
  return known ? { value: known, confidence: Math.max(confidence, 0.9) } : { value: text, confidence };
}

/** Two lines printed in the same case (both capitals, or both not): the halves of one name, not a note above it. */
function sameCase(left: string, right: string): boolean {
  const shouts = (text: string) => !/\p{Ll}/u.test(text);
  return shouts(left) === shouts(right);
}

/** A shop of the build whose name the text is close to: OCR slips and a dropped legal form are forgiven. */
function closestKnown(text: string, knownVendors: string[]): string | null {
  const squeeze = (value: string) => value.split(/\s+/).map(keywordOf).join('');
  const read = squeeze(text);
  let best: { name: string; distance: number } | null = null;
  for (const name of knownVendors) {
    const known = squeeze(name);
    const distance = editDistance(read, known) / Math.max(read.length, known.length, 1);
    const prefix = read.length >= 5 && (known.startsWith(read) || read.startsWith(known));
    if ((distance <= 0.2 || prefix) && (!best || distance < best.distance)) best = { name, distance };
  }
  return best ? (best as { name: string; distance: number }).name : null;
}
