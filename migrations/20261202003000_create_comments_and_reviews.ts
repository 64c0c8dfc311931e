import type { Knex } from 'knex'

// Review of a diagram: comment threads pinned to a node or pipe (by id, so a thread follows its
// node when it moves and outlives it when it is deleted), their comments and attachments, and
// review decisions tied to the diagram revision they were made on.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('comment_threads', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'))
    t.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE')
    t.uuid('diagram_id').notNullable().references('diagrams.id').onDelete('CASCADE')
    t.string('target_kind', 8).notNullable()
    t.string('target_id', 64).notNullable()
    t.uuid('created_by').references('users.id').onDelete('SET NULL')
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.timestamp('resolved_at', { useTz: true })
    t.uuid('resolved_by').references('users.id').onDelete('SET NULL')
    t.index(['diagram_id', 'created_at'])
  })
  await knex.raw(`ALTER TABLE comment_threads ADD CONSTRAINT comment_threads_kind
    CHECK (target_kind IN ('node', 'pipe'))`)
  await knex.schema.createTable('comments', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'))
    t.uuid('thread_id').notNullable().references('comment_threads.id').onDelete('CASCADE')
    t.uuid('author_id').references('users.id').onDelete('SET NULL')
    t.text('body').notNullable()
    t.specificType('mentions', 'uuid[]').notNullable().defaultTo('{}')
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.index(['thread_id', 'created_at'])
  })
  // Attachments live in PostgreSQL (bytea): backed up with everything else and only reachable
  // through the project-guarded route.
  await knex.schema.createTable('comment_attachments', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'))
    t.uuid('comment_id').notNullable().references('comments.id').onDelete('CASCADE')
    t.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE')
    t.string('file_name', 200).notNullable()
    t.string('mime_type', 64).notNullable()
    t.integer('size_bytes').notNullable()
    t.binary('data').notNullable()
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.index(['comment_id'])
  })
  await knex.schema.createTable('review_decisions', (t) => {
    t.bigIncrements('id').primary()
    t.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE')
    t.uuid('diagram_id').notNullable().references('diagrams.id').onDelete('CASCADE')
    t.string('kind', 24).notNullable()
    t.integer('revision').notNullable()
    t.text('note').notNullable().defaultTo('')
    t.uuid('actor_id').references('users.id').onDelete('SET NULL')
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.index(['diagram_id', 'id'])
  })
  await knex.raw(`ALTER TABLE review_decisions ADD CONSTRAINT review_decisions_kind
    CHECK (kind IN ('submitted', 'approved', 'changes_requested'))`)
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('review_decisions')
  await knex.schema.dropTable('comment_attachments')
  await knex.schema.dropTable('comments')
  await knex.schema.dropTable('comment_threads')
}
