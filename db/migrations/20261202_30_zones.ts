import type { Knex } from 'knex'

// Zones (capability 12): a company's emission control areas, no-go, risk and own areas. The
// geometry is GeoJSON MultiPolygon coordinates ([lon, lat], edges are geodesics), validated
// before it is stored; validity dates are whole UTC days, open when null.
export async function up(knex: Knex) {
  await knex.schema.createTable('zones', (t) => {
    t.increments('id')
    t.integer('company_id').notNullable().references('companies.id').onDelete('CASCADE')
    t.string('kind', 12).notNullable()
    t.string('name', 120).notNullable()
    t.string('source', 500)
    t.boolean('approximate').notNullable().defaultTo(false)
    t.date('valid_from')
    t.date('valid_to')
    t.jsonb('geometry').notNullable()
    t.integer('vertex_count').notNullable()
    t.integer('created_by').references('users.id').onDelete('SET NULL')
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now())
    t.check(`kind in ('eca','no-go','risk','custom')`, [], 'zones_kind_check')
    t.check('valid_to is null or valid_from is null or valid_to >= valid_from', [], 'zones_validity_check')
    t.index(['company_id'])
  })
  await knex.raw('create unique index zones_company_name_unique on zones (company_id, lower(name))')
}

export async function down(knex: Knex) {
  await knex.schema.dropTableIfExists('zones')
}
