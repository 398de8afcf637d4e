import type { Knex } from 'knex'

// Land checks of a plan's saved track, kept so the master sees at approval what was checked, and
// the planner's acknowledgements of flagged legs (each with its note). A check belongs to the track
// it was run on (track_md5 of the waypoints' positions and methods): once the track changes it is
// shown as out of date, never as a check of the new track.
export async function up(knex: Knex) {
  await knex.schema.createTable('land_checks', (t) => {
    t.increments('id')
    t.integer('plan_id').notNullable().references('plans.id').onDelete('CASCADE')
    t.integer('plan_version').notNullable()
    t.string('track_md5', 32).notNullable()
    t.double('clearance_nm').notNullable()
    t.integer('flagged_legs').notNullable()
    // The legs as the API sends them (LandCheckLeg[]).
    t.text('legs_json').notNullable()
    t.integer('user_id').references('users.id').onDelete('SET NULL')
    t.string('user_name', 120).notNullable()
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.index(['plan_id', 'id'])
  })
  await knex.schema.createTable('land_check_acks', (t) => {
    t.increments('id')
    t.integer('land_check_id').notNullable().references('land_checks.id').onDelete('CASCADE')
    t.integer('leg_index').notNullable()
    t.text('note').notNullable()
    t.integer('user_id').references('users.id').onDelete('SET NULL')
    t.string('user_name', 120).notNullable()
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.index(['land_check_id', 'leg_index'])
  })
}

export async function down(knex: Knex) {
  await knex.schema.dropTableIfExists('land_check_acks')
  await knex.schema.dropTableIfExists('land_checks')
}
