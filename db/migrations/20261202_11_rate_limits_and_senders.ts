import type { Knex } from 'knex'

// Counters every instance shares (failed sign-ins, crew briefs per plan), in the shape
// rate-limiter-flexible's PostgreSQL store reads and writes; and the sender each crew brief was
// queued with, the company's own address from its settings.
export async function up(knex: Knex) {
  await knex.schema.createTable('rate_limits', (t) => {
    t.string('key', 255).primary()
    t.integer('points').notNullable().defaultTo(0)
    t.bigInteger('expire') // epoch milliseconds when the window ends
    t.index('expire')
  })
  await knex.schema.alterTable('outbox_messages', (t) => { t.string('mail_from', 320) })
}

export async function down(knex: Knex) {
  await knex.schema.alterTable('outbox_messages', (t) => { t.dropColumn('mail_from') })
  await knex.schema.dropTableIfExists('rate_limits')
}
