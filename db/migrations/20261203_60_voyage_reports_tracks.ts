import type { Knex } from 'knex'

// Track logs imported on a voyage, kept for the chart: one row per import, its fixes as JSON text
// ([epoch ms, lat, lon] per fix, in time order). The position reports made from a log are rows of
// voyage_reports (source 'import'); deleting those leaves the track.
export async function up(knex: Knex) {
  await knex.schema.createTable('voyage_tracks', (t) => {
    t.increments('id')
    t.integer('plan_id').notNullable().references('plans.id').onDelete('CASCADE')
    t.string('format', 8).notNullable()
    t.integer('point_count').notNullable()
    t.timestamp('first_utc', { useTz: true }).notNullable()
    t.timestamp('last_utc', { useTz: true }).notNullable()
    t.text('points_json').notNullable()
    t.integer('created_by').references('users.id').onDelete('SET NULL')
    t.string('created_by_name', 120).notNullable()
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.index(['plan_id', 'first_utc'])
    t.check(`format in ('nmea', 'csv')`, [], 'voyage_tracks_format_check')
  })
}

export async function down(knex: Knex) {
  await knex.schema.dropTableIfExists('voyage_tracks')
}
