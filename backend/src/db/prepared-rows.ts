// The reads that run on every build request and every list, as named prepared statements: PostgreSQL parses and
// plans each text once per connection and reuses the plan. `em.execute` writes the values into the text (MikroORM
// formats the query), so PostgreSQL parsed and planned the receipts list anew on every call (`npm run bench`, list
// routes). The statement goes to node-postgres directly on a connection of the ORM's own pool, or on the request's
// transaction's connection when there is one: knex's query building and events cost more per request than the
// query's own parsing (`npm run bench`, list routes).
import type { EntityManager } from '@mikro-orm/postgresql';
import type pg from 'pg';

interface Statement {
  /** A connection keeps each name for one text only. */
  name: string;
  /** The text with node-postgres's $1, $2 ... for the `?` the caller wrote. */
  text: string;
}

const statements = new Map<string, Statement>();

function statementFor(sql: string): Statement {
  let statement = statements.get(sql);
  if (!statement) {
    let position = 0;
    statement = { name: `tallyhood_read_${statements.size + 1}`, text: sql.replace(/\?/g, () => `$${++position}`) };
    statements.set(sql, statement);
  }
  return statement;
}

/** What the ORM's knex client (or a transaction's) offers for a connection of its pool. */
interface ConnectionSource {
  acquireConnection(): Promise<pg.PoolClient>;
  releaseConnection(connection: pg.PoolClient): Promise<void>;
}

/**
 * The rows of `sql` (with `?` for each of `params`) as node-postgres parses them. Only for texts made from constants
 * in code with no `?` but the placeholders (the values go in `params`), so the number of statements a connection
 * keeps stays small.
 */
export async function preparedRows<Row>(em: EntityManager, sql: string, params: readonly unknown[]): Promise<Row[]> {
  const { name, text } = statementFor(sql);
  const source = ((em.getTransactionContext() ?? em.getKnex()) as unknown as { client: ConnectionSource }).client;
  const connection = await source.acquireConnection();
  try {
    const result = await connection.query<Row & pg.QueryResultRow>({ name, text, values: params as unknown[] });
    return result.rows;
  } finally {
    await source.releaseConnection(connection);
  }
}
