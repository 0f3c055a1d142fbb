// The scale of a suggestion's score (0..1). Each source has a band of its own, so the sources rank in a fixed order
// (what the person chose before for the same shop and part number, then the part number on the bill of materials,
// then other history, then a similar description, then a trade word); inside a band the similarity of the
// descriptions (pg_trgm, 0..1) ranks. A correction is remembered: when the person put a line with a part number from
// a shop on another place than the bill of materials' part of that number, the next line with that shop and number
// goes there first. "Accept all" takes a top suggestion at ACCEPT_ALL_THRESHOLD (0.6) or above: every part-number and
// history suggestion, a description match only when it is close (similarity 0.75 or more), a trade word never.
//
// | source              | band        | score                                                                    |
// |---------------------|-------------|--------------------------------------------------------------------------|
// | history, remembered | 0.99 – 1.00 | 0.99 + 0.01 × similarity(line, earlier line): same shop, same part number  |
// | part-number         | 0.90 – 0.98 | 0.90 + 0.08 × similarity(line, part name)                                 |
// | history, other      | 0.70 – 0.85 | 0.70 + 0.20 × (0.35 × similarity(line, earlier line)                      |
// |                     |             |               + 0.40 if the same part number, or + 0.20 if the same shop) |
// | similar-description | 0.42 – 0.70 | 0.30 + 0.40 × similarity(line, part name), similarity at least 0.3        |
// | trade-word          | 0.30 – 0.40 | 0.25 + 0.05 × the trade words found (a phrase counts its words), at most 3 |

/** An earlier line counts as "close" from this description similarity on (pg_trgm's similarity()). */
export const HISTORY_SIMILARITY = 0.5;

export function partNumberScore(similarity: number): number {
  return 0.9 + 0.08 * clamp(similarity);
}

export function historyScore(similarity: number, samePartNumber: boolean, sameShop: boolean): number {
  if (samePartNumber && sameShop) return 0.99 + 0.01 * clamp(similarity);
  return 0.7 + 0.2 * (0.35 * clamp(similarity) + (samePartNumber ? 0.4 : 0) + (sameShop ? 0.2 : 0));
}

export function descriptionScore(similarity: number): number {
  return 0.3 + 0.4 * clamp(similarity);
}

export function tradeWordScore(weight: number): number {
  return 0.25 + 0.05 * Math.min(weight, 3);
}

function clamp(similarity: number): number {
  return Math.min(1, Math.max(0, similarity));
}

/** Scores travel rounded to three places: enough to rank, short to read. */
export function roundScore(score: number): number {
  return Math.round(score * 1000) / 1000;
}
