import type { Knex } from 'knex'

// A vessel's measured fuel consumption: tonnes per day at steady speeds, the data the
// t/day = c·V^k fit is drawn from. One consumption per speed.
export async function up(knex: Knex) {
  await knex.schema.createTable('vessel_fuel_points', (t) => {
    t.increments('id')
    t.integer('vessel_id').notNullable().references('vessels.id').onDelete('CASCADE')
    t.decimal('speed_kn', 5, 2).notNullable()
    t.decimal('tonnes_per_day', 7, 2).notNullable()
    t.unique(['vessel_id', 'speed_kn'])
    t.check('speed_kn > 0', [], 'vessel_fuel_points_speed_check')
    t.check('tonnes_per_day > 0', [], 'vessel_fuel_points_tonnes_check')
  })
}

export async function down(knex: Knex) {
  await knex.schema.dropTableIfExists('vessel_fuel_points')
}
