import type { Knex } from 'knex'

// The passage board pages, sorts and filters a company's plans on the server (GET /api/plans/board).
// One index per sort column led by the company, the id as tie-breaker; a trigram index so the text
// filter (ILIKE '%…%' on the title) need not read every plan of a large fleet.
const SORTED = [
  ['plans_board_departure', 'departure_utc'],
  ['plans_board_arrival', 'arrival_utc'],
  ['plans_board_total', 'total_nm'],
  ['plans_board_title', 'title'],
] as const

export async function up(knex: Knex) {
  for (const [name, column] of SORTED)
    await knex.raw(`create index ${name} on plans (company_id, ${column}, id)`)
  await knex.raw('create index plans_board_vessel on plans (company_id, vessel_id, departure_utc, id)')
  await knex.raw('create index plans_board_status on plans (company_id, status, departure_utc, id)')
  await knex.raw('create extension if not exists pg_trgm')
  await knex.raw('create index plans_board_title_trgm on plans using gin (title gin_trgm_ops)')
}

export async function down(knex: Knex) {
  await knex.raw('drop index if exists plans_board_title_trgm')
  for (const name of ['plans_board_status', 'plans_board_vessel', ...SORTED.map(([n]) => n)])
    await knex.raw(`drop index if exists ${name}`)
}
