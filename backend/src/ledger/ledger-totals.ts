// The ledger's running totals: what the ledger sums from filed receipt lines, kept per system (and per part for the
// overrun factor), so reading the ledger costs the same at 200 lines or 200,000. Database triggers mark a build stale
// (table ledger_stale) on every write that can change a sum: a line of a filed receipt, a receipt's state, a core,
// a part's status. Before a writing request commits, each build its transaction marked is recomputed here from
// receipt_line with the ledger's own filters (FIGURE_FILTER), so the totals are exactly the fresh aggregate.
import type { EntityManager } from '@mikro-orm/postgresql';
import { FIGURE_FILTER, LINE_TOTAL, filedLines } from './figure-lines';

/** Per system, the ledger's sums over filed lines; one row per system that has any. Parameter: the build's id. */
const SYSTEM_SUMS = `
  select l.system_id, l.build_id,
         coalesce(sum(${LINE_TOTAL}) filter (where ${FIGURE_FILTER.spent}), 0)::numeric(19,4) as spent,
         coalesce(sum(${LINE_TOTAL}) filter (where ${FIGURE_FILTER.netCost}), 0)::numeric(19,4) as net_cost,
         coalesce(sum(${LINE_TOTAL}) filter (where ${FIGURE_FILTER.coreDepositsOutstanding}), 0)::numeric(19,4) as cores_outstanding,
         coalesce(sum(${LINE_TOTAL}) filter (where ${FIGURE_FILTER.returnsAwaitingRefund}), 0)::numeric(19,4) as returns_awaiting
    ${filedLines()}
   group by l.system_id, l.build_id`;

/** Per part, what its filed purchase lines cost: the "actual" of the overrun factor. Parameter: the build's id. */
const PART_SUMS = `
  select l.part_id, l.build_id, sum(${LINE_TOTAL})::numeric(19,4) as actual
    from receipt_line l
    join receipt r on r.id = l.receipt_id and r.state = 'filed'
   where l.build_id = ? and l.kind = 'part' and l.part_id is not null
   group by l.part_id, l.build_id`;

/**
 * Recomputes one build's totals inside the caller's transaction. The build's row is locked first, so two transactions
 * recompute one after the other, and each statement after the lock sees every change committed before it: the later
 * one counts the earlier one's lines. Marks are cleared before the sums are read, so a change committed in between
 * leaves its mark for the next recompute rather than being lost.
 */
export async function refreshLedgerTotals(em: EntityManager, buildId: string): Promise<void> {
  await em.execute(`select 1 from build where id = ? for no key update`, [buildId]);
  await em.execute(`delete from ledger_stale where build_id = ?`, [buildId]);
  await em.execute(`delete from ledger_system_total where build_id = ?`, [buildId]);
  await em.execute(
    `insert into ledger_system_total (system_id, build_id, spent, net_cost, cores_outstanding, returns_awaiting) ${SYSTEM_SUMS}`,
    [buildId],
  );
  await em.execute(`delete from ledger_part_total where build_id = ?`, [buildId]);
  await em.execute(`insert into ledger_part_total (part_id, build_id, actual) ${PART_SUMS}`, [buildId]);
}

/** Recomputes every build this transaction marked stale: the last step of a writing request before its commit. */
export async function refreshMarkedLedgerTotals(em: EntityManager): Promise<void> {
  const marked = await em.execute<{ build_id: string }[]>(
    `select distinct build_id from ledger_stale where tx = txid_current_if_assigned() order by build_id`,
  );
  // In id order, so two transactions that marked the same builds lock them in the same order.
  for (const { build_id } of marked) await refreshLedgerTotals(em, build_id);
}

/** Recomputes every build marked stale by anyone (after the migration that made the totals, or a seed). */
export async function refreshAllStaleLedgerTotals(em: EntityManager): Promise<number> {
  const marked = await em.execute<{ build_id: string }[]>(`select distinct build_id from ledger_stale order by build_id`);
  for (const { build_id } of marked) await em.transactional((tx) => refreshLedgerTotals(tx, build_id));
  return marked.length;
}

/**
 * Brings a build's totals up to date before they are read when a writer outside a request (a job, the seed, SQL by
 * hand) left it marked; a request's own writes never do, so this is one indexed look-up on a read.
 */
export async function ensureLedgerTotals(em: EntityManager, buildId: string): Promise<void> {
  const [stale] = await em.execute<{ found: boolean }[]>(`select exists (select 1 from ledger_stale where build_id = ?) as found`, [buildId]);
  if (stale.found) await em.transactional((tx) => refreshLedgerTotals(tx, buildId));
}

export interface StoredAndFresh {
  stored: string[];
  fresh: string[];
}

/**
 * The build's stored totals beside a fresh aggregate of its receipt lines, each row as one line of text with the
 * exact decimals, in the same order: the bench and the tests check the two are equal after a run of changes.
 */
export async function totalsBesideFreshAggregate(em: EntityManager, buildId: string): Promise<StoredAndFresh> {
  const systemRow = `concat_ws(' ', 'system', system_id, spent, net_cost, cores_outstanding, returns_awaiting)`;
  const partRow = `concat_ws(' ', 'part', part_id, actual)`;
  const rows = async (sql: string) => (await em.execute<{ row: string }[]>(sql, [buildId, buildId])).map((r) => r.row);
  return {
    stored: await rows(
      `select ${systemRow} as row from ledger_system_total where build_id = ?
       union all select ${partRow} from ledger_part_total where build_id = ? order by 1`,
    ),
    fresh: await rows(`select ${systemRow} as row from (${SYSTEM_SUMS}) s union all select ${partRow} from (${PART_SUMS}) p order by 1`),
  };
}
