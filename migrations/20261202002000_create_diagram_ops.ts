import type { Knex } from 'knex'

// Co-editing: every accepted change to a diagram is one row of `diagram_ops` numbered by the
// diagram's revision (see DEVELOPERS.md, "Co-editing"). `diagram_snapshots` keeps the whole
// document every so often (and at creation) so any revision can be rebuilt by replaying the ops
// after the nearest snapshot. `socket_io_attachments` is the table @socket.io/postgres-adapter
// uses for messages too large for NOTIFY.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('diagram_ops', (t) => {
    t.uuid('diagram_id').notNullable().references('diagrams.id').onDelete('CASCADE')
    t.integer('revision').notNullable()
    // Chosen by the client (uuid); a resent op with the same id is answered, never re-applied.
    t.string('client_op_id', 64).notNullable()
    t.uuid('author_id').references('users.id').onDelete('SET NULL')
    // 'edit' (socket op), 'save' (whole-document REST save as a diff) or 'restore'.
    t.string('source', 16).notNullable().defaultTo('edit')
    t.integer('restored_from')
    t.jsonb('op').notNullable()
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.primary(['diagram_id', 'revision'])
    t.unique(['diagram_id', 'client_op_id'])
  })
  await knex.schema.createTable('diagram_snapshots', (t) => {
    t.uuid('diagram_id').notNullable().references('diagrams.id').onDelete('CASCADE')
    t.integer('revision').notNullable()
    t.jsonb('document').notNullable()
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.primary(['diagram_id', 'revision'])
  })
  // Diagrams that exist already get their current state as the first snapshot, and every new
  // diagram (created, duplicated, imported or seeded) gets one as it is inserted.
  await knex.raw(`
    INSERT INTO diagram_snapshots (diagram_id, revision, document)
    SELECT id, revision, document FROM diagrams`)
  await knex.raw(`
    CREATE FUNCTION diagram_first_snapshot() RETURNS trigger AS $$
    BEGIN
      INSERT INTO diagram_snapshots (diagram_id, revision, document)
      VALUES (NEW.id, NEW.revision, NEW.document);
      RETURN NEW;
    END $$ LANGUAGE plpgsql`)
  await knex.raw(`
    CREATE TRIGGER diagrams_first_snapshot AFTER INSERT ON diagrams
    FOR EACH ROW EXECUTE FUNCTION diagram_first_snapshot()`)
  await knex.raw(`
    CREATE TABLE IF NOT EXISTS socket_io_attachments (
      id bigserial UNIQUE,
      created_at timestamptz DEFAULT NOW(),
      payload bytea
    )`)
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('socket_io_attachments')
  await knex.raw('DROP TRIGGER IF EXISTS diagrams_first_snapshot ON diagrams')
  await knex.raw('DROP FUNCTION IF EXISTS diagram_first_snapshot()')
  await knex.schema.dropTable('diagram_snapshots')
  await knex.schema.dropTable('diagram_ops')
}
