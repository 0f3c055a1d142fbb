// Chooses a receipt's summary figures by its own arithmetic rather than by position: every figure printed beside
// a summary word is a candidate, and the total is the one the most independent facts agree on (subtotal + tax
// (+ shipping − discount) = total; tendered − change = total; total + rounding adjustment = rounded total; the
// lines add up). Each fact that held is kept in words, so the person checking sees why a figure was taken.
// A figure printed nowhere, made only by the slip's arithmetic (cash minus change, subtotal plus tax), is taken only
// when a second, independent fact agrees with it: one misread figure in its sum would otherwise outvote a total that
// was read right.
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

/**
 * A total whose last decimal OCR lost or garbled ("NET TOTAL 174.9", "TOTAL 343.9%"): the figure printed lies from
 * `from` up to, not including, `from` plus ten of the currency's smallest units (`step`).
 */
export interface UnclearTotal {
  from: Decimal;
  step: Decimal;
  index: number;
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
  /** The total is printed nowhere and only its own arithmetic made it: the person must check it. */
  unconfirmed: boolean;
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
  /** Printed on the slip (beside a word, alone in the summary block, or as the amount tendered). */
  printed: boolean;
  /** For a figure printed nowhere: the subtotals whose arithmetic made it (the lines adding up to one is no news). */
  madeFrom: Decimal[];
  /** Facts that each rest on figures of their own: what a figure printed nowhere needs two of. */
  independent: number;
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

export interface TaxTable {
  rows: TaxTableRow[];
  /** The table's own total row (the sums of its rates), read apart from the rows. */
  total: TaxTableRow | null;
  /** The receipt line of that total row, when its last amount is the tax rather than a gross. */
  totalIndex: number | null;
}

/**
 * Cash-rounding rows as OCR and shops leave them: a figure beside a rounding word that is about the size of the total
 * above it is the rounded total itself ("ROUNDING 45.35" under "TOTAL 45.34"), not an adjustment; and a figure whose
 * word was lost, printed between two totals, less than one unit and exactly their difference, is the adjustment
 * ("TOTAL 10.02", "0.02", "TOTAL 10.00").
 */
export function readRoundingRows(entries: SummaryEntry[]): SummaryEntry[] {
  const sums = entries.filter((entry) => entry.role === 'total' || entry.role === 'final_total' || entry.role === 'subtotal');
  return entries.map((entry) => {
    const above = sums.filter((sum) => sum.index < entry.index);
    const below = sums.filter((sum) => sum.index > entry.index);
    if (entry.role === 'rounding' && above.some((sum) => sum.value.isPositive() && entry.value.abs().times(2).greaterThan(sum.value))) return { ...entry, role: 'total' };
    // Cash is rounded to a fraction of the currency's unit (5 sen, 5 or 10 cents, half a krona): a gap of a whole unit or
    // more between two sums is something else, a tax row between a gross and a net.
    const adjustment = !entry.value.isZero() && entry.value.abs().lessThan(1);
    const between = (first: SummaryEntry, last: SummaryEntry) => adjustment && (first.value.plus(entry.value).equals(last.value) || first.value.minus(entry.value).equals(last.value));
    if (entry.role === 'unlabelled' && above.some((first) => below.some((last) => between(first, last)))) return { ...entry, role: 'rounding' };
    return entry;
  });
}

export function chooseFigures(printed: SummaryEntry[], lineSum: Decimal | null, taxTable: TaxTable = { rows: [], total: null, totalIndex: null }, unclearTotals: UnclearTotal[] = []): ChosenFigures {
  const entries = readRoundingRows(printed);
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
  const candidate = (value: Decimal, index: number | null, printed = true): Candidate => {
    let found = candidates.get(key(value));
    if (!found) {
      found = { value, score: 0, facts: [], index, rounding: null, parts: {}, printed, madeFrom: [], independent: 0 };
      candidates.set(key(value), found);
    }
    found.printed ||= printed;
    if (index !== null && (found.index === null || index > found.index)) found.index = index;
    return found;
  };
  /** A fact that only repeats one already counted (the same sum in other words) is neither listed nor weighed. */
  const addFact = (target: Candidate | undefined, weight: number, fact: string, independent = true) => {
    if (!target || target.facts.includes(fact) || !independent) return;
    target.facts.push(fact);
    target.score += weight;
    target.independent += 1;
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
        // With the rounded line lost, the total plus the adjustment as printed is still the amount paid: it outweighs
        // the unrounded total's word alone, but rests on that printed total only, so it is no independent fact.
        if (printed) addFact(target, 3, 'the total plus the rounding adjustment gives it');
        else addFact(target, 2.5, 'it is printed as a total before its rounding adjustment');
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
      if (net.isPositive()) addFact(candidate(net, null, false), 3, 'the amount tendered minus the change matches it');
    }
  }
  // Only figures printed or made by the slip's own arithmetic are candidates; the checks below only confirm them.
  if (candidates.size === 0) {
    for (const subtotal of subtotals) candidate(subtotal, null);
  }
  if (positiveChanges.length === 0) {
    // A change printed as nothing says the amount tendered was the total to the cent, as surely as any change does.
    const noChange = changes.length > 0;
    for (const paid of tendered) addFact(candidates.get(key(paid)), noChange ? 3 : 1, noChange ? 'the amount tendered minus the change matches it' : 'the amount paid matches it');
  }
  const optional = (values: Decimal[]) => [null, ...values];
  const chargesOf = (combination: { tax: Decimal | null; shipping: Decimal | null; service: Decimal | null; rounding: Decimal | null }) =>
    [combination.tax, combination.shipping, combination.service, combination.rounding].filter((value): value is Decimal => value !== null && !value.isZero());
  const combinations: Array<{ tax: Decimal | null; shipping: Decimal | null; service: Decimal | null; discount: Decimal | null; rounding: Decimal | null }> = [];
  for (const tax of optional(taxes)) {
    for (const shipping of optional(shippings)) {
      for (const service of optional(services)) {
        for (const discount of optional(discounts)) {
          // The sign of an adjustment is often lost to OCR ("ROUNDING 0.01" for -0.01): both are tried.
          for (const rounding of optional(distinct([...roundings, ...roundings.map((value) => value.negated())]))) combinations.push({ tax, shipping, service, discount, rounding });
        }
      }
    }
  }
  // The subtotal's own arithmetic (subtotal plus tax, less a discount) makes candidates as well, for a total whose
  // figures OCR misread: printed nowhere, each needs a second fact to be taken.
  for (const subtotal of subtotals) {
    for (const combination of combinations) {
      const charges = chargesOf(combination);
      if (charges.length === 0 && (combination.discount === null || combination.discount.isZero())) continue;
      const computed = sum([subtotal, ...charges]).minus(combination.discount ?? zero);
      if (!computed.isPositive()) continue;
      const made = candidate(computed, null, false);
      if (!made.printed) made.madeFrom.push(subtotal);
    }
  }
  for (const target of candidates.values()) {
    for (const subtotal of subtotals) {
      for (const { tax, shipping, service, discount, rounding } of combinations) {
        const charges = chargesOf({ tax, shipping, service, rounding });
        if (charges.length === 0 && (discount === null || discount.isZero())) {
          if (subtotal.equals(target.value) && !target.value.isZero()) addFact(target, 1, 'the subtotal matches it');
          continue;
        }
        const computed = sum([subtotal, ...charges]).minus(discount ?? zero);
        if (!computed.equals(target.value)) continue;
        const words = ['the subtotal', tax ? 'plus tax' : '', service ? 'plus the service charge' : '', shipping ? 'plus shipping' : '', discount && !discount.isZero() ? 'minus the discount' : '', rounding ? 'plus the rounding adjustment' : '']
          .filter(Boolean)
          .join(' ');
        // The more of the printed charges a sum accounts for, the better it explains the slip (a tie-breaker only).
        // Every such sum rests on the same printed subtotal: together they are one independent fact.
        addFact(target, 3 + 0.1 * charges.length, `${words} matches it`, !target.facts.some((fact) => fact.startsWith('the subtotal')));
        target.parts = { subtotal, tax: tax ?? undefined, shipping: shipping ?? undefined, discount: discount ?? undefined, service: service ?? undefined };
        if (rounding) target.rounding = rounding;
      }
    }
    if (lineSum !== null && !lineSum.isZero()) {
      for (const { tax, shipping, service, discount, rounding } of combinations) {
        const charges = chargesOf({ tax, shipping, service, rounding });
        if (!sum([lineSum, ...charges]).minus(discount ?? zero).equals(target.value)) continue;
        // Lines that add up to the very subtotal a figure was made from repeat that sum: they confirm the subtotal only.
        const repeats = target.madeFrom.some((subtotal) => subtotal.equals(lineSum));
        addFact(target, 2, charges.length > 0 || discount ? 'the lines and charges add up to it' : 'the lines add up to it', !repeats);
        if (target.parts.subtotal === undefined) target.parts = { tax: tax ?? undefined, shipping: shipping ?? undefined, discount: discount ?? undefined, service: service ?? undefined };
        if (rounding) target.rounding = rounding;
        break;
      }
    }
  }

  // A tax table: the nets of its rates plus their taxes give the gross, the total (before any cash rounding). Its rows
  // and its own total row are two readings of the same sums: either agreeing is the fact.
  const grosses = distinct([...(taxTable.rows.length > 0 ? [sum(taxTable.rows.map((row) => row.net.plus(row.tax)))] : []), ...(taxTable.total ? [taxTable.total.net.plus(taxTable.total.tax)] : [])]);
  for (const gross of grosses) {
    for (const target of candidates.values()) {
      if (gross.equals(target.value) || (target.rounding && gross.plus(target.rounding).equals(target.value))) addFact(target, 1.5, 'net plus tax in the tax table gives it');
    }
  }

  // A total word beside an amount whose last decimal OCR lost or garbled: a figure the slip's arithmetic gives within
  // that range is the one printed there after all.
  for (const unclear of unclearTotals.filter((entry) => entry.index < paymentStart)) {
    const end = unclear.from.plus(unclear.step.times(10));
    for (const target of candidates.values()) {
      if (target.value.lessThan(unclear.from) || !target.value.lessThan(end)) continue;
      addFact(target, 2, 'it is printed beside a total word, its last digit unclear');
      target.printed = true;
      if (target.index === null || unclear.index > target.index) target.index = unclear.index;
    }
  }

  // A figure printed nowhere stands on its own arithmetic alone until an independent fact agrees: until then any
  // figure printed beside a total word wins over it.
  const alone = (found: Candidate) => !found.printed && found.independent < 2;
  // A quarter of its weight keeps such sums in their order (the one using more of the printed charges first).
  for (const found of candidates.values()) if (alone(found)) found.score /= 4;
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
  const totalConfidence = alone(best) ? 0.5 : agreed > 0 ? Math.max(printedConfidence, 0.95) : best.index === null ? Math.min(printedConfidence, 0.5) : printedConfidence;
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
    unconfirmed: alone(best),
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
    unconfirmed: false,
  };
}
