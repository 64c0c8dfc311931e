/**
 * Named statements on the Knex pool's own connections. PostgreSQL parses and plans a named
 * statement once per connection and reuses the plan; for the op path's one-statement commit,
 * whose CTEs take about as long to parse and plan as to run, that took a third off each commit.
 * Knex's query builder sends unnamed statements, so the hot path borrows a pooled connection and
 * calls the driver directly.
 */
import type pg from 'pg'
import type { Db } from './knex.ts'

/** The Knex client's connection pool, as it is typed inside Knex. */
interface PooledClient {
  acquireConnection(): Promise<pg.Client>
  releaseConnection(connection: pg.Client): Promise<unknown>
}

/**
 * Runs `text` ($1, $2 … placeholders) as the named statement `name` on a connection of `db`.
 * @example
 * const { rows } = await preparedQuery(db, 'diagram-revision', 'SELECT revision FROM diagrams WHERE id = $1', [id])
 */
export async function preparedQuery<Row extends pg.QueryResultRow>(
  db: Db,
  name: string,
  text: string,
  values: unknown[],
): Promise<pg.QueryResult<Row>> {
  const client = db.client as PooledClient
  const connection = await client.acquireConnection()
  try {
    return await connection.query<Row>({ name, text, values })
  } finally {
    await client.releaseConnection(connection)
  }
}
