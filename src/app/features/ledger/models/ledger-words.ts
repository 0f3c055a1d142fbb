// The ledger's figures in words, and the overrun factor explained, shared by the totals, the table and the lines panel.
import type { LedgerLineFigure } from '../../../../../shared/api/ledger';
import { FIGURE_WORDS } from '../../../../../shared/build-figures';
import { roundHalfUp, toDecimal, toWire } from '../../../../../shared/money';

/** The names of the figures made of receipt lines, from the one money model. */
export const FIGURE_LABELS: Record<LedgerLineFigure, string> = {
  netCost: FIGURE_WORDS.netCost.label,
  spent: FIGURE_WORDS.spent.label,
  coreDepositsOutstanding: FIGURE_WORDS.coreDepositsOutstanding.label,
  returnsAwaitingRefund: FIGURE_WORDS.returnsAwaitingRefund.label,
};

/** What opening a figure asks for: the lines behind it, narrowed as the figure was. */
export interface LinesRequest {
  figure: LedgerLineFigure;
  systemId?: string;
  vendorId?: string;
  period?: string;
  /** The panel's heading, such as "Net cost of Engine". */
  title: string;
}

/** Positive variance is budget left over; the word (and an icon) carries the meaning, the colour only repeats it. */
export function varianceWords(variance: string): { under: boolean; words: string } {
  const value = toDecimal(variance);
  return { under: !value.isNegative(), words: value.isNegative() ? 'over budget' : 'under budget' };
}

export function absolute(amount: string): string {
  return toWire(toDecimal(amount).abs());
}

/** The adjusted forecast's factor in one sentence a person can follow. */
export function overrunExplanation(factor: string, sample: number, minimumSample: number): string {
  const ratio = toDecimal(factor);
  if (sample < minimumSample) {
    const parts = sample === 1 ? 'part has' : 'parts have';
    return `Same as the forecast until ${minimumSample} bought parts have both an estimate and a cost (${sample} ${parts} so far).`;
  }
  const percent = toWire(roundHalfUp(ratio.minus(1).abs().times(100), 1));
  if (ratio.equals(1)) return `The ${sample} parts bought so far cost what was estimated, so the parts still to buy keep their estimates.`;
  const direction = ratio.greaterThan(1) ? 'more' : 'less';
  return `The ${sample} parts bought so far cost ${percent}% ${direction} than estimated, so the estimates of the parts still to buy are multiplied by ${factor}.`;
}
