import type { Knex } from 'knex'

// Distance tables built with passages avoided (e.g. a table without Suez gives the Cape distances):
// the passage ids are kept with the table, so a rebuild avoids the same ones. Each pair's source
// (plan, sea route, direct), its passages and its distance inside ECAs live in the matrix jsonb.
export async function up(knex: Knex) {
  await knex.schema.alterTable('distance_tables', (t) => {
    t.jsonb('avoid').notNullable().defaultTo('[]')
  })
}

export async function down(knex: Knex) {
  await knex.schema.alterTable('distance_tables', (t) => {
    t.dropColumn('avoid')
  })
}
