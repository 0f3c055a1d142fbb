// Chooses a receipt's summary figures by its own arithmetic rather than by position: every figure printed beside
// a summary word is a candidate, and the total is the one the most independent facts agree on (subtotal + tax
// (+ shipping − discount) = total; tendered − change = total; total + rounding adjustment = rounded total; the
// lines add up). Each fact that held is kept in words, so the person checking sees why a figure was taken.
import { Decimal, sum } from '../../../../shared/money';
import type { SummaryRole } from './summary-words';

export interface SummaryEntry {
  /** "unlabelled": a figure in the summary block with no word beside it, chosen only when arithmetic agrees. */
  role: SummaryRole | 'unlabelled';
  value: Decimal;
  /** Index of the line in the receipt, top to bottom. */
  index: number;
  confidence: number;
}

export interface Figure {
  value: Decimal;
  confidence: number;
}

export interface ChosenFigures {
  total: Figure | null;
  subtotal: Figure | null;
  tax: Figure | null;
  shipping: Figure | null;
  discount: Figure | null;
  /** A cash-rounding adjustment the chosen total includes, signed; kept as its own line. */
  rounding: Decimal | null;
  /** A service charge the chosen total includes; kept as its own line. */
  service: Decimal | null;
  /** Index of the line the total was printed on, when it was printed. */
  totalIndex: number | null;
  /** The facts that agreed on the total, in words. */
  agreements: string[];
}

interface Candidate {
  value: Decimal;
  score: number;
  facts: string[];
  index: number | null;
  /** Set when the total plus a rounding adjustment made this figure. */
  rounding: Decimal | null;
  /** The parts of an arithmetic fact that held, to report those figures with the total. */
  parts: { subtotal?: Decimal; tax?: Decimal; shipping?: Decimal; discount?: Decimal; service?: Decimal };
}

const zero = new Decimal(0);
const key = (value: Decimal) => value.toFixed();

/** Distinct values, first printed first. */
function distinct(values: Decimal[]): Decimal[] {
  const seen = new Map<string, Decimal>();
  for (const value of values) if (!seen.has(key(value))) seen.set(key(value), value);
  return [...seen.values()];
}

/** A row of a tax table printed under the total: the net amount of one rate and its tax. */
export interface TaxTableRow {
  net: Decimal;
  tax: Decimal;
}

export function chooseFigures(entries: SummaryEntry[], lineSum: Decimal | null, taxTable: TaxTableRow[] = []): ChosenFigures {
  const ofRole = (...roles: SummaryEntry['role'][]) => entries.filter((entry) => roles.includes(entry.role));
  const firstTotal = ofRole('total', 'final_total')[0];
  // Below the payment block come tax tables, card slips and loyalty lines: their "totals" are not the receipt's.
  const paymentStart = firstTotal ? (ofRole('tendered', 'change').find((entry) => entry.index > firstTotal.index)?.index ?? Infinity) : Infinity;
  const above = (entry: SummaryEntry) => entry.index < paymentStart;
  const totals = ofRole('total', 'final_total').filter(above);
  const subtotals = distinct(ofRole('subtotal').filter(above).map((entry) => entry.value));
  const taxEntries = ofRole('tax').filter(above);
  const taxLines = taxEntries.length > 0 ? taxEntries : ofRole('tax');
  const taxes = distinct(taxLines.map((entry) => entry.value));
  // Several tax lines (state and county, two VAT rates) add up; their sum is a candidate as well.
  if (taxLines.length > 1) taxes.push(sum(taxLines.map((entry) => entry.value)));
  const shippings = distinct(ofRole('shipping').filter(above).map((entry) => entry.value));
  const discounts = distinct(ofRole('discount').filter(above).map((entry) => entry.value.abs()));
  const services = distinct(ofRole('service').filter(above).map((entry) => entry.value)).filter((value) => !value.isZero());
  const roundingEntries = ofRole('rounding').filter((entry) => !entry.value.isZero());
  const roundings = distinct(roundingEntries.map((entry) => entry.value));
  const tendered = distinct(ofRole('tendered').map((entry) => entry.value));
  const changes = distinct(ofRole('change').map((entry) => entry.value.abs()));

  const candidates = new Map<string, Candidate>();
  const candidate = (value: Decimal, index: number | null): Candidate => {
    let found = candidates.get(key(value));
    if (!found) {
      found = { value, score: 0, facts: [], index, rounding: null, parts: {} };
      candidates.set(key(value), found);
    }
    if (index !== null && (found.index === null || index > found.index)) found.index = index;
    return found;
  };
  const addFact = (target: Candidate | undefined, weight: number, fact: string) => {
    if (!target || target.facts.includes(fact)) return;
    target.score += weight;
    target.facts.push(fact);
  };

  for (const entry of totals) {
    const target = candidate(entry.value, entry.index);
    addFact(target, entry.role === 'final_total' ? 3 : 2, entry.role === 'final_total' ? 'it is printed as the amount to pay' : 'it is printed beside a total word');
  }
  // Figures printed without a word in the summary block (a label lost to OCR) are candidates with no score.
  for (const entry of ofRole('unlabelled').filter(above)) candidate(entry.value, entry.index);
  for (const paid of tendered) candidate(paid, null);
  // Cash rounding: the slip prints the total, then the adjustment, then the rounded amount paid. A printed or paid
  // rounded amount confirms it; the sign of the adjustment is often lost to OCR, so both directions are tried.
  for (const roundingEntry of roundingEntries) {
    for (const entry of totals.filter((total) => total.index < roundingEntry.index)) {
      for (const rounding of [roundingEntry.value, roundingEntry.value.negated()]) {
        const rounded = entry.value.plus(rounding);
        const printed = candidates.get(key(rounded));
        if (rounded.isNegative() || (!printed && rounding !== roundingEntry.value)) continue;
        const target = printed ?? candidate(rounded, null);
        addFact(target, printed ? 3 : 2, 'the total plus the rounding adjustment gives it');
        target.rounding = rounding;
        const unrounded = candidates.get(key(entry.value));
        if (unrounded && unrounded !== target && printed) unrounded.score -= 3;
      }
    }
  }
  const positiveChanges = changes.filter((change) => !change.isZero());
  for (const paid of tendered) {
    for (const change of positiveChanges) {
      const net = paid.minus(change);
      if (net.isPositive()) addFact(candidate(net, null), 3, 'the amount tendered minus the change matches it');
    }
  }
  // Only figures printed or made by the slip's own arithmetic are candidates; the checks below only confirm them.
  if (candidates.size === 0) {
    for (const subtotal of subtotals) candidate(subtotal, null);
  }
  if (positiveChanges.length === 0) {
    for (const paid of tendered) addFact(candidates.get(key(paid)), 1, 'the amount paid matches it');
  }
  const optional = (values: Decimal[]) => [null, ...values];
  const combinations: Array<{ tax: Decimal | null; shipping: Decimal | null; service: Decimal | null; discount: Decimal | null; rounding: Decimal | null }> = [];
  for (const tax of optional(taxes)) {
    for (const shipping of optional(shippings)) {
      for (const service of optional(services)) {
        for (const discount of optional(discounts)) {
          for (const rounding of optional(roundings)) combinations.push({ tax, shipping, service, discount, rounding });
        }
      }
    }
  }
  for (const target of candidates.values()) {
    for (const subtotal of subtotals) {
      for (const { tax, shipping, service, discount, rounding } of combinations) {
        const charges = [tax, shipping, service, rounding].filter((value): value is Decimal => value !== null && !value.isZero());
        if (charges.length === 0 && (discount === null || discount.isZero())) {
          if (subtotal.equals(target.value) && !target.value.isZero()) addFact(target, 1, 'the subtotal matches it');
          continue;
        }
        const computed = sum([subtotal, ...charges]).minus(discount ?? zero);
        if (!computed.equals(target.value)) continue;
        const words = ['the subtotal', tax ? 'plus tax' : '', service ? 'plus the service charge' : '', shipping ? 'plus shipping' : '', discount && !discount.isZero() ? 'minus the discount' : '', rounding ? 'plus the rounding adjustment' : '']
          .filter(Boolean)
          .join(' ');
        addFact(target, 3, `${words} matches it`);
        target.parts = { subtotal, tax: tax ?? undefined, shipping: shipping ?? undefined, discount: discount ?? undefined, service: service ?? undefined };
        if (rounding) target.rounding = rounding;
      }
    }
    if (lineSum !== null && !lineSum.isZero()) {
      for (const { tax, shipping, service, discount, rounding } of combinations) {
        const charges = [tax, shipping, service, rounding].filter((value): value is Decimal => value !== null && !value.isZero());
        if (!sum([lineSum, ...charges]).minus(discount ?? zero).equals(target.value)) continue;
        addFact(target, 2, charges.length > 0 || discount ? 'the lines and charges add up to it' : 'the lines add up to it');
        if (target.parts.subtotal === undefined) target.parts = { tax: tax ?? undefined, shipping: shipping ?? undefined, discount: discount ?? undefined, service: service ?? undefined };
        if (rounding) target.rounding = rounding;
        break;
      }
    }
  }

  // A tax table: the nets of its rates plus their taxes give the gross, the total (before any cash rounding).
  if (taxTable.length > 0) {
    const gross = sum(taxTable.map((row) => row.net.plus(row.tax)));
    for (const target of candidates.values()) {
      if (gross.equals(target.value) || (target.rounding && gross.plus(target.rounding).equals(target.value))) addFact(target, 1.5, 'net plus tax in the tax table gives it');
    }
  }

  const ranked = [...candidates.values()].filter((found) => !found.value.isZero());
  ranked.sort((a, b) => b.score - a.score || (b.index ?? -1) - (a.index ?? -1));
  const best = ranked[0];
  if (!best || best.score <= 0) return emptyFigures(subtotals, taxLines, shippings, discounts, entries);

  const confidenceOf = (value: Decimal | undefined, roles: SummaryEntry['role'][]) => {
    if (value === undefined) return 0;
    const printed = entries.find((entry) => roles.includes(entry.role) && entry.value.equals(value));
    return printed?.confidence ?? 0.8;
  };
  // Facts beyond the printed word make a total sure; a total word alone is what the OCR read, no more.
  const agreed = best.facts.filter((fact) => !fact.startsWith('it is printed')).length;
  const printedConfidence = confidenceOf(best.value, ['total', 'final_total', 'unlabelled', 'tendered']);
  const totalConfidence = agreed > 0 ? Math.max(printedConfidence, 0.95) : best.index === null ? Math.min(printedConfidence, 0.5) : printedConfidence;
  const pick = (chosen: Decimal | undefined, fallback: Decimal | undefined, roles: SummaryEntry['role'][]): Figure | null => {
    const value = chosen ?? fallback;
    if (value === undefined) return null;
    return { value, confidence: chosen !== undefined ? 0.95 : confidenceOf(value, roles) };
  };
  return {
    total: { value: best.value, confidence: totalConfidence },
    subtotal: pick(best.parts.subtotal, subtotals[0], ['subtotal']),
    tax: pick(best.parts.tax, taxLines.length > 0 ? sum(taxLines.map((entry) => entry.value)) : undefined, ['tax']),
    shipping: pick(best.parts.shipping, shippings[0], ['shipping']),
    discount: pick(best.parts.discount, discounts[0], ['discount']),
    rounding: best.rounding,
    service: best.parts.service ?? null,
    totalIndex: best.index,
    agreements: best.facts,
  };
}

function emptyFigures(subtotals: Decimal[], taxes: SummaryEntry[], shippings: Decimal[], discounts: Decimal[], entries: SummaryEntry[]): ChosenFigures {
  const figure = (value: Decimal | undefined, role: SummaryRole): Figure | null => {
    if (value === undefined) return null;
    return { value, confidence: entries.find((entry) => entry.role === role && entry.value.equals(value))?.confidence ?? 0.5 };
  };
  return {
    total: null,
    subtotal: figure(subtotals[0], 'subtotal'),
    tax: taxes.length > 0 ? figure(sum(taxes.map((entry) => entry.value)), 'tax') : null,
    shipping: figure(shippings[0], 'shipping'),
    discount: figure(discounts[0], 'discount'),
    rounding: null,
    service: null,
    totalIndex: null,
    agreements: [],
  };
}
