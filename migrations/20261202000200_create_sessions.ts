import type { Knex } from 'knex'

// The table connect-pg-simple expects (its own table.sql), created here so it is versioned.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    CREATE TABLE "sessions" (
      "sid" varchar NOT NULL COLLATE "default" PRIMARY KEY,
      "sess" json NOT NULL,
      "expire" timestamp(6) NOT NULL
    )`)
  await knex.raw('CREATE INDEX "sessions_expire_idx" ON "sessions" ("expire")')
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions')
}
