import type { Knex } from 'knex'

// A design firm owns projects; its admins manage who belongs to it. Existing projects are given
// to one organisation per creator so the foreign key can be NOT NULL from the start.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('organisations', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'))
    t.string('name', 120).notNullable()
    t.uuid('created_by').references('users.id').onDelete('SET NULL')
    t.timestamps(true, true)
  })
  await knex.schema.createTable('organisation_members', (t) => {
    t.uuid('organisation_id').notNullable().references('organisations.id').onDelete('CASCADE')
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE')
    t.string('role', 16).notNullable()
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.primary(['organisation_id', 'user_id'])
    t.index(['user_id'])
  })
  await knex.raw(
    `ALTER TABLE organisation_members ADD CONSTRAINT organisation_members_role_check
     CHECK (role IN ('admin', 'member'))`,
  )
  await knex.schema.alterTable('projects', (t) => {
    t.uuid('organisation_id').references('organisations.id').onDelete('CASCADE')
    t.index(['organisation_id'])
  })

  // Backfill: every user gets a personal organisation; projects go to their creator's (or, for a
  // project whose creator is gone, its first owner's) organisation; members join it.
  await knex.raw(`
    INSERT INTO organisations (name, created_by)
    SELECT u.name || '''s practice', u.id FROM users u`)
  await knex.raw(`
    INSERT INTO organisation_members (organisation_id, user_id, role)
    SELECT o.id, o.created_by, 'admin' FROM organisations o`)
  await knex.raw(`
    UPDATE projects p SET organisation_id = o.id
    FROM organisations o
    WHERE o.created_by = COALESCE(p.created_by, (
      SELECT m.user_id FROM project_members m
      WHERE m.project_id = p.id AND m.role = 'owner' ORDER BY m.created_at LIMIT 1))`)
  await knex.raw('DELETE FROM projects WHERE organisation_id IS NULL')
  await knex.raw(`
    INSERT INTO organisation_members (organisation_id, user_id, role)
    SELECT DISTINCT p.organisation_id, m.user_id, 'member'
    FROM project_members m JOIN projects p ON p.id = m.project_id
    ON CONFLICT DO NOTHING`)
  await knex.raw('ALTER TABLE projects ALTER COLUMN organisation_id SET NOT NULL')
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('projects', (t) => t.dropColumn('organisation_id'))
  await knex.schema.dropTable('organisation_members')
  await knex.schema.dropTable('organisations')
}
