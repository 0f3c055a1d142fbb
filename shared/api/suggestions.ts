// What the reader proposes for each read line of a receipt: a part (which implies its system) or only a system,
// best first, each with the reason in words. One tap accepts one; one button accepts every top suggestion at or
// above the threshold.
import { z } from 'zod';

export const SUGGESTION_SOURCES = ['part-number', 'history', 'similar-description', 'trade-word'] as const;
export type SuggestionSource = (typeof SUGGESTION_SOURCES)[number];

/** Top suggestions scoring at least this are taken by "accept all". */
export const ACCEPT_ALL_THRESHOLD = 0.6;

export interface LineSuggestionDto {
  /** Null when only a system is proposed (no part fits). */
  partId: string | null;
  partName: string | null;
  systemId: string;
  systemName: string;
  /** 0..1, best first. */
  score: number;
  source: SuggestionSource;
  /** Why, in words: "part number 44-120 is on the bill of materials". */
  reason: string;
}

export interface LineSuggestionsDto {
  lineId: string;
  suggestions: LineSuggestionDto[];
}

export interface ReceiptSuggestionsDto {
  threshold: number;
  lines: LineSuggestionsDto[];
}

const uuid = z.uuid({ error: 'Choose an existing line.' });

/** Accept the top suggestion of the named lines (every unassigned line when absent) that reaches the threshold. */
export const acceptSuggestionsRequest = z.object({ lineIds: z.array(uuid).max(500).optional() }).strict();
export type AcceptSuggestionsRequest = z.input<typeof acceptSuggestionsRequest>;
