import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'))
    t.string('email', 254).notNullable()
    t.string('name', 80).notNullable()
    t.string('password_hash').notNullable()
    t.string('color', 7).notNullable().defaultTo('#3b6ea5')
    t.string('units', 2).notNullable().defaultTo('si')
    t.timestamps(true, true)
  })
  // E-mail addresses are compared without regard to case.
  await knex.raw('CREATE UNIQUE INDEX users_email_lower_unique ON users (lower(email))')
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('users')
}
