import type { Knex } from 'knex'

// Only the sha256 of an invitation token is stored: a leaked table cannot be used to join.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invitations', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'))
    t.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE')
    t.string('email', 254).notNullable()
    t.string('role', 16).notNullable()
    t.string('token_hash', 64).notNullable().unique()
    t.uuid('invited_by').references('users.id').onDelete('SET NULL')
    t.timestamp('expires_at', { useTz: true }).notNullable()
    t.timestamp('accepted_at', { useTz: true })
    t.uuid('accepted_by').references('users.id').onDelete('SET NULL')
    t.timestamp('revoked_at', { useTz: true })
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.index(['project_id'])
  })
  await knex.raw(
    `ALTER TABLE invitations ADD CONSTRAINT invitations_role_check
     CHECK (role IN ('owner', 'editor', 'reviewer', 'viewer'))`,
  )
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invitations')
}
