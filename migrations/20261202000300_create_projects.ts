import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('projects', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'))
    t.string('name', 120).notNullable()
    t.text('description').notNullable().defaultTo('')
    t.string('units', 2).notNullable().defaultTo('si')
    t.uuid('created_by').references('users.id').onDelete('SET NULL')
    t.timestamps(true, true)
  })
  await knex.schema.createTable('project_members', (t) => {
    t.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE')
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE')
    t.string('role', 16).notNullable()
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.primary(['project_id', 'user_id'])
    t.index(['user_id'])
  })
  await knex.raw(
    `ALTER TABLE project_members ADD CONSTRAINT project_members_role_check
     CHECK (role IN ('owner', 'editor', 'reviewer', 'viewer'))`,
  )
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('project_members')
  await knex.schema.dropTable('projects')
}
