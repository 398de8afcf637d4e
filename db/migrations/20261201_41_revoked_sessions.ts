import type { Knex } from 'knex'

// Sessions are sealed cookies; signing out records the session id here so a copied cookie
// stops working on every instance.
export async function up(knex: Knex) {
  await knex.schema.createTable('revoked_sessions', (t) => {
    t.string('session_id', 64).primary()
    t.timestamp('revoked_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
  })
}

export async function down(knex: Knex) {
  await knex.schema.dropTableIfExists('revoked_sessions')
}
