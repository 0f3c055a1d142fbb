// The words shops print on a line to say a part is under warranty, as data for warranty-suggestion.ts: lower case.
export const WARRANTY_WORDS = {
  /** The word for the warranty itself, with the short forms printed on narrow slips. */
  warranty: ['warranty', 'wty', 'wrnty', 'warr', 'guarantee'],
  /** A warranty for as long as the buyer owns the part. */
  lifetime: ['lifetime', 'ltd lifetime', 'limited lifetime'],
  /** Units of a length, in months each. Days are left out: a warranty is kept in whole months. */
  units: { mo: 1, mos: 1, mth: 1, mths: 1, month: 1, months: 1, yr: 12, yrs: 12, year: 12, years: 12 } as Record<string, number>,
  /** Printed just before the warranty word, these say there is none. */
  negations: ['no', 'without', 'void'],
};
