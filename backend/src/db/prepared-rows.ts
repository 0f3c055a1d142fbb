// The reads that run on every build request and every list, as named prepared statements: PostgreSQL parses and
// plans each text once per connection and reuses the plan. `em.execute` writes the values into the text (MikroORM
// formats the query), so PostgreSQL parsed and planned the receipts list anew on every call (`npm run bench`, list
// routes). Like `em.execute`, the query runs in the request's transaction when there is one.
import type { EntityManager, Knex } from '@mikro-orm/postgresql';

/** One statement name per distinct text: a connection keeps each name for one text only. */
const statementNames = new Map<string, string>();

function statementName(sql: string): string {
  let name = statementNames.get(sql);
  if (!name) {
    name = `tallyhood_read_${statementNames.size + 1}`;
    statementNames.set(sql, name);
  }
  return name;
}

/**
 * The rows of `sql` (with `?` for each of `params`) as node-postgres parses them. Only for texts made from constants
 * in code (the values go in `params`), so the number of statements a connection keeps stays small.
 */
export async function preparedRows<Row>(em: EntityManager, sql: string, params: readonly unknown[]): Promise<Row[]> {
  const query = em.getKnex().raw(sql, params as readonly Knex.RawBinding[]).options({ name: statementName(sql) });
  const transaction = em.getTransactionContext();
  if (transaction) query.transacting(transaction);
  const result: { rows: Row[] } = await query;
  return result.rows;
}
