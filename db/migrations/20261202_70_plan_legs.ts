import type { Knex } from 'knex'

// The leg table of each plan, computed once per saved version (in the transaction that saves the
// waypoints or header) and read back instead of recomputed. Kept as the JSON the API sends, so a
// read does not parse and serialise it again. An approved plan's row is never recomputed: what the
// master approved stays what was approved, whatever later engines compute.
export async function up(knex: Knex) {
  await knex.schema.createTable('plan_legs', (t) => {
    t.integer('plan_id').primary().references('plans.id').onDelete('CASCADE')
    t.integer('plan_version').notNullable()
    t.string('engine', 40).notNullable()
    t.text('zone_signature').notNullable()
    t.text('legs_json').notNullable()
    t.text('totals_json').notNullable()
    // speedKn, hours and distanceNm per leg with its zone distances: what fuel is worked out from.
    t.text('fuel_input_json').notNullable()
    t.timestamp('computed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
  })
}

export async function down(knex: Knex) {
  await knex.schema.dropTableIfExists('plan_legs')
}
