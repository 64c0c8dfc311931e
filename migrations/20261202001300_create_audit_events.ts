import type { Knex } from 'knex'

// Append-only log of who did what, when. Other features add rows through recordAudit();
// `details` holds the action's own facts (role before and after, e-mail invited, …).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audit_events', (t) => {
    t.bigIncrements('id').primary()
    t.uuid('actor_id').references('users.id').onDelete('SET NULL')
    t.uuid('project_id').references('projects.id').onDelete('CASCADE')
    t.uuid('organisation_id').references('organisations.id').onDelete('CASCADE')
    t.string('action', 64).notNullable()
    t.jsonb('details').notNullable().defaultTo('{}')
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.index(['project_id', 'created_at'])
    t.index(['organisation_id', 'created_at'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_events')
}
