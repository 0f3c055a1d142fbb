// Finds the shop's name: the most prominent text near the top (tallest print, first lines), a business suffix as
// a strong signal, and never a slogan, an address, a phone number, a tax id or a date. A shop the build already
// knows wins when the text is close to its name.
import type { ReadField } from '../../../../shared/api/receipt-reading';
import { findDate } from './dates';
import { editDistance, hasWord, keywordOf } from './label-words';
import type { TextLine } from './text-lines';

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
/** Words of addresses, phones, tax ids and receipt headings: such a line is not the shop's name (common practice / memory). */
const NOT_A_NAME_WORDS = [
  'JALAN', 'JLN', 'LORONG', 'TAMAN', 'LOT', 'ROAD', 'STREET', 'AVENUE', 'LANE', 'DRIVE', 'SUITE', 'FLOOR', 'BLOCK', 'UNIT', 'STRASSE', 'STR', 'PLATZ', 'RUE', 'AVENIDA', 'CALLE', 'PLAZA', 'VIA', 'VIALE', 'PIAZZA', 'STRAAT', 'PLEIN', 'RUA', 'TRAVESSA',
  'TEL', 'TELEPHONE', 'PHONE', 'FAX', 'HP', 'TELEFON', 'TELEFONO', 'TELEFOON',
  'GST', 'VAT', 'REG', 'ABN', 'SIRET', 'SIREN', 'NIF', 'CIF', 'IVA', 'BTW', 'KVK', 'UID', 'USTID', 'STEUERNUMMER', 'TIN', 'NPWP', 'ROC', 'SST',
  'RECEIPT', 'INVOICE', 'TAX', 'SIMPLIFIED', 'CASH', 'BILL', 'QUITTUNG', 'BELEG', 'RECHNUNG', 'KASSENBON', 'TICKET', 'FACTURE', 'FACTURA', 'RECIBO', 'SCONTRINO', 'FATTURA', 'BON', 'KASSABON', 'FACTUUR', 'FATURA', 'RESIT',
  'WELCOME', 'THANK', 'THANKS', 'WILLKOMMEN', 'BIENVENUE', 'BIENVENIDO', 'BENVENUTO', 'WELKOM', 'BEM', 'SELAMAT', 'DATE', 'TIME', 'CASHIER', 'COPY', 'DUPLICATE', 'ORDER', 'TABLE',
];

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
  if (hasWord(line.keywords, ...NOT_A_NAME_WORDS) && !BUSINESS_SUFFIX.test(text)) return false;
  // A postcode (four to six digits standing alone) marks an address line.
  if (/(?:^|[\s,])[0-9]{4,6}(?:$|[\s,])/.test(text) && !BUSINESS_SUFFIX.test(text)) return false;
  // A slogan shouts: an exclamation mark, or a sentence of many short words.
  if (/!/.test(line.text) || line.keywords.length > 7) return false;
  return true;
}

export function findVendor(lines: VendorLine[], knownVendors: string[] = []): ReadField<string> {
  const top = lines.slice(0, 10);
  const heights = lines.flatMap((line) => line.line.words.map((word) => word.box.h));
  const typical = Math.max(1, median(heights));
  let best: { index: number; score: number } | null = null;
  top.forEach((line, index) => {
    if (!looksLikeName(line)) return;
    const height = median(line.line.words.map((word) => word.box.h));
    const prominence = Math.min(2, Math.max(-0.5, height / typical - 1));
    const suffix = BUSINESS_SUFFIX.test(cleaned(line.text)) ? 1.5 : 0;
    const letters = (line.text.match(/\p{L}/gu) ?? []).length;
    // Names are short: a long line near the top is more likely a description or an address without a keyword.
    const length = letters > 45 ? -1 : 0;
    const score = 1.5 * prominence + suffix + length + 2 * (1 - index / 10) + line.confidence;
    if (!best || score > best.score) best = { index, score };
  });
  if (!best) return { value: null, confidence: 0 };
  const { index } = best as { index: number; score: number };
  let text = cleaned(top[index].text);
  const previous = top[index - 1];
  if (previous && onlySuffix(text) && looksLikeName(previous)) text = `${cleaned(previous.text)} ${text}`;
  // A name broken over two lines: "HOME MASTER HARDWARE &" / "ELECTRICAL", or the legal form on the next line.
  const next = top[index + 1];
  const plainName = (line: VendorLine) => looksLikeName(line) && !/[0-9]/.test(line.text) && !hasWord(line.keywords, ...NOT_A_NAME_WORDS);
  if (next && plainName(next) && !BUSINESS_SUFFIX.test(text) && (/[&,-]$/.test(text) || BUSINESS_SUFFIX.test(cleaned(next.text)))) {
    text = `${text} ${cleaned(next.text)}`;
  }
  text = trimAfterSuffix(text);
  const confidence = Math.round(Math.min(1, top[index].confidence * (index === 0 ? 1 : 0.85)) * 100) / 100;
  const known = closestKnown(text, knownVendors);
  return known ? { value: known, confidence: Math.max(confidence, 0.9) } : { value: text, confidence };
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
