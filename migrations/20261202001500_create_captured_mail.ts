import type { Knex } from 'knex'

// Messages received by the local fake SMTP server, kept in PostgreSQL so every server process
// (and the dev mailbox page) sees them. Never used when a real SMTP provider is configured.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('captured_mail', (t) => {
    t.bigIncrements('id').primary()
    t.string('mail_from', 254).notNullable().defaultTo('')
    t.specificType('recipients', 'text[]').notNullable()
    t.text('subject').notNullable().defaultTo('')
    t.text('text').notNullable().defaultTo('')
    t.text('html').notNullable().defaultTo('')
    t.text('raw').notNullable()
    t.timestamp('received_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.index(['received_at'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('captured_mail')
}
