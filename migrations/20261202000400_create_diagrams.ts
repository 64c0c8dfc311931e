import type { Knex } from 'knex'

// A diagram is one JSONB document (interchange format v1, validated by shared/document/model.ts)
// with a revision number that every accepted save increments. See DEVELOPERS.md, "Storage".
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('diagrams', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'))
    t.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE')
    t.string('name', 120).notNullable()
    t.jsonb('document').notNullable()
    t.integer('revision').notNullable().defaultTo(0)
    t.uuid('created_by').references('users.id').onDelete('SET NULL')
    t.uuid('updated_by').references('users.id').onDelete('SET NULL')
    t.timestamps(true, true)
    t.index(['project_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('diagrams')
}
