import type { Knex } from 'knex'

// The fuel grades a vessel burns outside and inside emission control areas (MARPOL Annex VI
// reg. 14.4: at most 0.10 % sulphur inside an ECA); a vessel without a row burns VLSFO and MGO.
// Prices per tonne live in company settings.
export async function up(knex: Knex) {
  await knex.schema.createTable('vessel_fuel_grades', (t) => {
    t.integer('vessel_id').primary().references('vessels.id').onDelete('CASCADE')
    t.string('outside', 24).notNullable()
    t.string('inside_eca', 24).notNullable()
  })
}

export async function down(knex: Knex) {
  await knex.schema.dropTableIfExists('vessel_fuel_grades')
}
