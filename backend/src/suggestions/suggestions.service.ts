// Suggests where each line of a receipt goes (a part, which implies its system, or only a system), best first, with
// the reason in words. Four sources, one query each for the whole receipt, never one per line: the part number on
// the bill of materials, what this build did with such a line before, parts with a similar description (pg_trgm),
// and failing those a system named by a trade word. suggestion-scores.ts holds the scale.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { LineSuggestionDto, ReceiptSuggestionsDto } from '../../../shared/api/suggestions';
import { ACCEPT_ALL_THRESHOLD } from '../../../shared/api/suggestions';
import type { Build } from '../builds/build.entity';
import { NEEDS_SYSTEM } from '../receipts/receipt-filing';
import { ReceiptLine } from '../receipts/receipt-line.entity';
import type { Receipt } from '../receipts/receipt.entity';
import { VehicleSystem } from '../systems/vehicle-system.entity';
import { partNumberKey, partNumberKeySql } from '../../../shared/part-number-key';
import { descriptionScore, HISTORY_SIMILARITY, historyScore, partNumberScore, roundScore, tradeWordScore } from './suggestion-scores';
import { systemIsOfKind, tradeWordMatches } from './trade-word-match';

/** The client shows a few; more would be noise. */
export const MAX_SUGGESTIONS_PER_LINE = 5;

/** What a suggestion is made from: a line as read. The line itself is never its own history. */
export interface LineToSuggest {
  id: string;
  description: string;
  partNumber: string;
}

interface TargetRow {
  line_id: string;
  part_id: string | null;
  part_name: string | null;
  system_id: string;
  system_name: string;
  similarity: number;
}

// The receipt's lines travel as one JSON parameter and become a table in each query.
const WANTED = `json_to_recordset(?::json) as w(line_id uuid, description text, key text)`;

const BY_PART_NUMBER = `
  select w.line_id, p.id as part_id, p.description as part_name, p.part_number, s.id as system_id, s.name as system_name,
         similarity(w.description, p.description) as similarity
    from ${WANTED}
    join part p on p.build_id = ? and ${partNumberKeySql('p.part_number')} = w.key
    join vehicle_system s on s.id = p.system_id and s.archived_at is null
   where w.key <> ''`;

// The same shop's same part number, or a close description, assigned earlier on this build (any receipt, any state:
// a correction counts from the moment it is made). A line on a part suggests the part, and so the part's system.
// The two ways to be alike are two arms, so each finds its lines through its own index (an OR of both scanned every
// line of the build). Of the earlier lines alike in the same ways and going to one place, the closest and then the
// latest is kept: the score rises with the similarity alone once the part number and shop are the same.
const FROM_HISTORY = `
  with w as (select * from ${WANTED}),
  earlier as (
    select w.line_id, h.id from w join receipt_line h on h.build_id = ? and w.key <> '' and ${partNumberKeySql('h.part_number')} = w.key
    union
    select w.line_id, h.id from w join receipt_line h on h.build_id = ? and h.description % w.description
     where similarity(w.description, h.description) >= ${HISTORY_SIMILARITY}
  )
  select distinct on (line_id, part_id, system_id, same_part_number, same_shop) * from (
    select w.line_id, p.id as part_id, p.description as part_name, s.id as system_id, s.name as system_name,
           similarity(w.description, h.description) as similarity,
           (w.key <> '' and ${partNumberKeySql('h.part_number')} = w.key) as same_part_number,
           (r.vendor_id is not null and r.vendor_id is not distinct from ?::uuid) as same_shop,
           r.purchase_date::text as purchase_date, r.created_at, v.name as shop
      from earlier e
      join w on w.line_id = e.line_id
      join receipt_line h on h.id = e.id and h.id <> e.line_id and h.system_id is not null
      join receipt r on r.id = h.receipt_id
      left join vendor v on v.id = r.vendor_id
      left join part p on p.id = h.part_id
      join vehicle_system s on s.id = coalesce(p.system_id, h.system_id) and s.archived_at is null
  ) alike
   order by line_id, part_id, system_id, same_part_number, same_shop, similarity desc, purchase_date desc nulls last, created_at desc`;

// A short slip line ("Front brake pads") is often a piece of a longer part name ("Brake pads, front, street compound"):
// word_similarity finds it inside; the plain similarity keeps a one-word line from matching every part that has the word.
// Only the few best of each line leave the database.
const BY_DESCRIPTION = `
  select * from (
    select *, row_number() over (partition by line_id order by similarity desc, part_name) as place from (
      select w.line_id, p.id as part_id, p.description as part_name, s.id as system_id, s.name as system_name,
             (similarity(w.description, p.description) + word_similarity(w.description, p.description)) / 2 as similarity
        from ${WANTED}
        join part p on p.build_id = ? and (p.description % w.description or w.description <% p.description)
        join vehicle_system s on s.id = p.system_id and s.archived_at is null
    ) found
     where similarity >= 0.3
  ) ranked
   where place <= ${MAX_SUGGESTIONS_PER_LINE}`;

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "12 Mar 2026", from a calendar date or a timestamp. */
function dayOf(date: string | Date): string {
  const iso = typeof date === 'string' ? date.slice(0, 10) : date.toISOString().slice(0, 10);
  const [year, month, day] = iso.split('-');
  return `${Number(day)} ${MONTHS[Number(month) - 1]} ${year}`;
}

class LineCandidates {
  private readonly byTarget = new Map<string, LineSuggestionDto>();

  /** Keeps the best suggestion per target: a part, or a system without a part. */
  offer(suggestion: LineSuggestionDto): void {
    const key = suggestion.partId ?? `system:${suggestion.systemId}`;
    const held = this.byTarget.get(key);
    if (!held || held.score < suggestion.score) this.byTarget.set(key, suggestion);
  }

  has(systemId: string): boolean {
    return [...this.byTarget.values()].some((suggestion) => suggestion.systemId === systemId);
  }

  best(): LineSuggestionDto[] {
    return [...this.byTarget.values()]
      .map((suggestion) => ({ ...suggestion, score: roundScore(suggestion.score) }))
      .sort((a, b) => b.score - a.score || (a.partName ?? a.systemName).localeCompare(b.partName ?? b.systemName))
      .slice(0, MAX_SUGGESTIONS_PER_LINE);
  }
}

/** Suggestions for each line, best first (at most MAX_SUGGESTIONS_PER_LINE), keyed by line id. */
export async function suggestForLines(em: EntityManager, build: Build, shopId: string | null, lines: LineToSuggest[]): Promise<Map<string, LineSuggestionDto[]>> {
  const candidates = new Map(lines.map((line) => [line.id, new LineCandidates()]));
  if (lines.length === 0) return new Map();
  const wanted = JSON.stringify(lines.map((line) => ({ line_id: line.id, description: line.description, key: partNumberKey(line.partNumber) })));
  const target = (row: TargetRow) => ({ partId: row.part_id, partName: row.part_name, systemId: row.system_id, systemName: row.system_name });

  const byPartNumber = await em.execute<(TargetRow & { part_number: string })[]>(BY_PART_NUMBER, [wanted, build.id]);
  for (const row of byPartNumber) {
    candidates.get(row.line_id)!.offer({
      ...target(row),
      score: partNumberScore(row.similarity),
      source: 'part-number',
      reason: `part number ${row.part_number} is on the bill of materials as ${row.part_name}`,
    });
  }

  type HistoryRow = TargetRow & { same_part_number: boolean; same_shop: boolean; purchase_date: string | null; created_at: Date; shop: string | null };
  const fromHistory = await em.execute<HistoryRow[]>(FROM_HISTORY, [wanted, build.id, build.id, shopId]);
  for (const row of fromHistory) {
    const receipt = `the ${dayOf(row.purchase_date ?? row.created_at)} receipt${row.shop ? ` from ${row.shop}` : ''}`;
    candidates.get(row.line_id)!.offer({
      ...target(row),
      score: historyScore(row.similarity, row.same_part_number, row.same_shop),
      source: 'history',
      reason: `went to ${row.part_name ?? row.system_name} on ${receipt}`,
    });
  }

  const byDescription = await em.execute<TargetRow[]>(BY_DESCRIPTION, [wanted, build.id]);
  for (const row of byDescription) {
    candidates.get(row.line_id)!.offer({
      ...target(row),
      score: descriptionScore(row.similarity),
      source: 'similar-description',
      reason: `description is close to ${row.part_name}`,
    });
  }

  // Trade words add only systems the better sources did not already name for the line.
  const systems = await em.find(VehicleSystem, { build, archivedAt: null }, { orderBy: { sortOrder: 'asc', createdAt: 'asc' } });
  for (const line of lines) {
    const found = candidates.get(line.id)!;
    for (const match of tradeWordMatches(line.description)) {
      for (const system of systems.filter((s) => systemIsOfKind(s.name, match.vocabulary) && !found.has(s.id))) {
        found.offer({
          partId: null,
          partName: null,
          systemId: system.id,
          systemName: system.name,
          score: tradeWordScore(match.weight),
          source: 'trade-word',
          reason: `‘${match.word}’ is a ${match.vocabulary.kind} word`,
        });
      }
    }
  }
  return new Map([...candidates].map(([lineId, found]) => [lineId, found.best()]));
}

/** Whether a line of this kind is put on a part or a system before filing (fees and discounts are spread instead). */
export function takesAssignment(line: Pick<ReceiptLine, 'kind'>): boolean {
  return NEEDS_SYSTEM.has(line.kind);
}

/** Suggestions for every line of the receipt that takes an assignment, assigned already or not (the others are alternatives). */
export async function receiptSuggestions(em: EntityManager, receipt: Receipt): Promise<ReceiptSuggestionsDto> {
  const lines = (await em.find(ReceiptLine, { receipt }, { orderBy: { position: 'asc' } })).filter(takesAssignment);
  const suggestions = await suggestForLines(em, receipt.build, receipt.vendor?.id ?? null, lines);
  return { threshold: ACCEPT_ALL_THRESHOLD, lines: lines.map((line) => ({ lineId: line.id, suggestions: suggestions.get(line.id) ?? [] })) };
}
