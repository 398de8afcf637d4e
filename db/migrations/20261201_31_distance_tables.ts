import type { Knex } from 'knex'

// Distance tables (capability 9). The whole matrix lives in one jsonb column of the table row:
// 300 places make 44,850 pairs, and one row write per build (plus small progress updates) is
// far cheaper than 44,850 cell rows, and a table is only ever read or exported whole.
// `places` keeps a snapshot (id, name, lat, lon) so a saved table still reads after a place
// is renamed or removed; a rebuild takes the places' current positions.
// `generation` goes up with every (re)build: a worker writes only while its generation is
// still the row's, so a superseded job can never overwrite a newer build.
export async function up(knex: Knex) {
  await knex.schema.createTable('distance_tables', (t) => {
    t.increments('id')
    t.integer('company_id').notNullable().references('companies.id').onDelete('CASCADE')
    t.string('name', 120).notNullable()
    t.jsonb('places').notNullable()
    t.double('radius_nm').notNullable()
    t.string('status', 12).notNullable().defaultTo('building')
    t.double('progress').notNullable().defaultTo(0)
    t.integer('generation').notNullable().defaultTo(1)
    t.jsonb('matrix')
    t.text('error')
    t.timestamp('built_at', { useTz: true })
    t.integer('created_by').references('users.id').onDelete('SET NULL')
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.check(`status in ('building','ready','failed')`, [], 'distance_tables_status_check')
    t.check('progress >= 0 and progress <= 1', [], 'distance_tables_progress_check')
    t.check('radius_nm > 0', [], 'distance_tables_radius_check')
    t.index(['company_id', 'created_at'])
  })
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('distance_tables')
}
