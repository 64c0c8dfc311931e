import type { Knex } from 'knex'

// E-mail notification choices, on by default; later features mail only users who opted in.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.boolean('notify_mentions').notNullable().defaultTo(true)
    t.boolean('notify_reviews').notNullable().defaultTo(true)
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('notify_mentions')
    t.dropColumn('notify_reviews')
  })
}
