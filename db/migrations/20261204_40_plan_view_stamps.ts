import type { Knex } from 'knex'

// What a plan view (GET /api/plans/:id) is made of carries a stamp that PostgreSQL itself moves on
// every change, whoever writes (triggers): `plans.view_stamp` for the plan's own rows (the plan, its
// waypoints, history, stored legs, land checks and their acknowledgements), `companies.view_stamp` for what the
// company's plans share (settings, vessels with their fuel data, places, users' names, zones).
// A server keeps each serialised view beside the two stamps it was built at and serves it again only
// while one small query finds both unchanged (server/utils/planViewCache.ts).
//
// The stamp is a column of the parent row, so a change takes the lock that the plan's (or company's)
// writes take anyway, the parent row's, and no second one that two writers could take in opposite
// orders (a read that stores recomputed legs locks the plan row first, as a save does).

// Tables whose rows belong to one plan, and how a row names its plan.
const PLAN_CHILDREN = [
  ['waypoints', 'plan_id'],
  ['plan_events', 'plan_id'],
  ['plan_legs', 'plan_id'],
  ['land_checks', 'plan_id'],
  ['land_check_acks', '(select lc.plan_id from land_checks lc where lc.id = r.land_check_id)'],
] as const
// Tables whose rows belong to one company, and how a row names its company.
const COMPANY_CHILDREN = [
  ['vessels', 'company_id'],
  ['places', 'company_id'],
  ['users', 'company_id'],
  ['zones', 'company_id'],
  ['vessel_fuel_points', '(select v.company_id from vessels v where v.id = r.vessel_id)'],
  ['vessel_fuel_grades', '(select v.company_id from vessels v where v.id = r.vessel_id)'],
] as const
const PARENTS = ['plans', 'companies'] as const

const OPS = [['insert', ['new_rows']], ['update', ['new_rows', 'old_rows']], ['delete', ['old_rows']]] as const

function idsOf(tables: readonly string[], key: string) {
  return tables.map(t => `select ${key.startsWith('(') ? key : `r.${key}`} from ${t} r`).join(' union ')
}

/** Statement-level triggers (with transition tables): one update of the parents per statement, however many rows (a 5,000-waypoint save). */
async function stampOnChange(knex: Knex, parent: typeof PARENTS[number], table: string, key: string) {
  for (const [op, tables] of OPS) {
    const fn = `view_stamp_${table}_${op}`
    // Rows deleted with their parent (a cascade) find no parent to stamp.
    await knex.raw(`create function ${fn}() returns trigger language plpgsql as $$
      begin
        update ${parent} set view_stamp = nextval('view_stamp_seq') where id in (${idsOf(tables, key)});
        return null;
      end $$`)
    const referencing = tables.map(t => `${t === 'new_rows' ? 'new' : 'old'} table as ${t}`).join(' ')
    await knex.raw(`create trigger ${fn} after ${op} on ${table} referencing ${referencing} for each statement execute function ${fn}()`)
  }
}

export async function up(knex: Knex) {
  await knex.raw('create sequence view_stamp_seq')
  for (const parent of PARENTS) {
    await knex.raw(`alter table ${parent} add column view_stamp bigint not null default nextval('view_stamp_seq')`)
    // Any update of the row itself (status, header, version, settings) moves its stamp.
    await knex.raw(`create function view_stamp_${parent}_touch() returns trigger language plpgsql as $$
      begin new.view_stamp := nextval('view_stamp_seq'); return new; end $$`)
    await knex.raw(`create trigger view_stamp_${parent}_touch before update on ${parent} for each row execute function view_stamp_${parent}_touch()`)
  }
  for (const [table, key] of PLAN_CHILDREN) await stampOnChange(knex, 'plans', table, key)
  for (const [table, key] of COMPANY_CHILDREN) await stampOnChange(knex, 'companies', table, key)
}

export async function down(knex: Knex) {
  for (const [table] of [...PLAN_CHILDREN, ...COMPANY_CHILDREN]) {
    for (const [op] of OPS) {
      await knex.raw(`drop trigger if exists view_stamp_${table}_${op} on ${table}`)
      await knex.raw(`drop function if exists view_stamp_${table}_${op}()`)
    }
  }
  for (const parent of PARENTS) {
    await knex.raw(`drop trigger if exists view_stamp_${parent}_touch on ${parent}`)
    await knex.raw(`drop function if exists view_stamp_${parent}_touch()`)
    await knex.raw(`alter table ${parent} drop column if exists view_stamp`)
  }
  await knex.raw('drop sequence if exists view_stamp_seq')
}
