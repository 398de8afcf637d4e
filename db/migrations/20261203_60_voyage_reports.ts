import type { Knex } from 'knex'

// Position reports on an approved plan (the voyage): entered on board by the planner or the
// vessel's master, or made from an imported track log. Only the fix and what was entered is stored;
// everything worked out against the plan (leg, cross-track, ETA, flags) is computed on reading.
export async function up(knex: Knex) {
  await knex.schema.createTable('voyage_reports', (t) => {
    t.increments('id')
    t.integer('plan_id').notNullable().references('plans.id').onDelete('CASCADE')
    t.timestamp('time_utc', { useTz: true }).notNullable()
    t.double('lat').notNullable()
    t.double('lon').notNullable()
    t.decimal('fuel_rob_t', 9, 2)
    t.decimal('speed_kn', 5, 2)
    t.string('remarks', 500)
    t.string('source', 8).notNullable().defaultTo('manual')
    t.integer('created_by').references('users.id').onDelete('SET NULL')
    t.string('created_by_name', 120).notNullable()
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.unique(['plan_id', 'time_utc'])
    t.check('lat between -90 and 90', [], 'voyage_reports_lat_check')
    t.check('lon between -180 and 180', [], 'voyage_reports_lon_check')
    t.check(`source in ('manual', 'import')`, [], 'voyage_reports_source_check')
    t.check('fuel_rob_t is null or fuel_rob_t >= 0', [], 'voyage_reports_fuel_check')
    t.check('speed_kn is null or speed_kn >= 0', [], 'voyage_reports_speed_check')
  })
}

export async function down(knex: Knex) {
  await knex.schema.dropTableIfExists('voyage_reports')
}
