// A part's warranty: a length in whole months, or lifetime as the trade prints it; and the day it ends.
import { addMonths } from './api/dates';

/** Whole months, or 'lifetime'; null when the part has none. */
export type Warranty = number | 'lifetime' | null;

/** A hundred years: far past any printed warranty, so a longer one is a typing slip. */
export const MAX_WARRANTY_MONTHS = 1200;

/** The last day under warranty: start + months (month ends clamped); none for lifetime, none without a start. */
export function warrantyEnds(warranty: Warranty, start: string | null): string | null {
  if (typeof warranty !== 'number' || !start) return null;
  return addMonths(start, warranty);
}
