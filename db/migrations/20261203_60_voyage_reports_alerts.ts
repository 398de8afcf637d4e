import type { Knex } from 'knex'

// Which voyage flags are raised on a plan: one row per plan and flag. A flag raised on the latest
// report sends one alert to the shore (the outbox message is kept); it stays raised, sending nothing
// more, until a later report clears it.
export async function up(knex: Knex) {
  await knex.schema.createTable('voyage_alerts', (t) => {
    t.integer('plan_id').notNullable().references('plans.id').onDelete('CASCADE')
    t.string('flag', 16).notNullable()
    t.boolean('active').notNullable()
    t.integer('report_id').references('voyage_reports.id').onDelete('SET NULL')
    t.integer('outbox_message_id').references('outbox_messages.id').onDelete('SET NULL')
    t.integer('times_raised').notNullable().defaultTo(1)
    t.timestamp('raised_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.timestamp('cleared_at', { useTz: true })
    t.primary(['plan_id', 'flag'])
    t.check(`flag in ('off-track', 'late', 'fuel')`, [], 'voyage_alerts_flag_check')
  })
}

export async function down(knex: Knex) {
  await knex.schema.dropTableIfExists('voyage_alerts')
}
