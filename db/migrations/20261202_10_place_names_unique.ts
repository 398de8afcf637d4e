import type { Knex } from 'knex'

// A place's name is unique in its company whatever its case, as the library checks before a
// write; the index makes two writes racing past that check end in one row and a 409, not two.
export async function up(knex: Knex) {
  await knex.raw('create unique index places_company_lower_name_unique on places (company_id, lower(name))')
  await knex.schema.alterTable('places', (t) => { t.dropUnique(['company_id', 'name']) })
}

export async function down(knex: Knex) {
  await knex.schema.alterTable('places', (t) => { t.unique(['company_id', 'name']) })
  await knex.raw('drop index places_company_lower_name_unique')
}
