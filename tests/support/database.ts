// A scratch database of its own for a test file that must see the whole database unchanged
// (the fuzz test) or must not disturb others: created fresh, migrated and seeded with the demo.
import knex from 'knex'
import { knexConfig } from '../../db/knexfile'

export async function createScratchDatabase(name: string): Promise<string> {
  const base = new URL(process.env.NUXT_DATABASE_URL!)
  const admin = knex({ client: 'pg', connection: { ...connectionOf(base), database: 'postgres' } })
  await admin.raw(`drop database if exists ?? with (force)`, [name])
  await admin.raw(`create database ??`, [name])
  await admin.destroy()
  const url = new URL(base.href)
  url.pathname = `/${name}`
  const db = knex(knexConfig(url.href))
  await db.migrate.latest()
  await db.seed.run()
  await db.destroy()
  return url.href
}

function connectionOf(url: URL) {
  return { host: url.hostname, port: Number(url.port || 5432), user: decodeURIComponent(url.username || 'postgres'), password: decodeURIComponent(url.password) || undefined }
}

/** Row count and an order-independent checksum of every table in the public schema. */
export async function tableFingerprints(databaseUrl: string): Promise<Record<string, string>> {
  const db = knex({ client: 'pg', connection: databaseUrl })
  try {
    const tables = (await db.raw(`select tablename from pg_tables where schemaname = 'public' order by 1`)).rows.map((r: any) => r.tablename as string)
    const out: Record<string, string> = {}
    for (const t of tables) {
      // Rows without `view_stamp`: a change counter the triggers move on every write (migration 20261204_40) and its migration sets afresh.
      const { rows } = await db.raw(`select count(*)::text as n, coalesce(md5(string_agg(md5(r), '' order by md5(r))), '') as sum
        from (select (to_jsonb(x) - 'view_stamp')::text as r from ?? x) rows`, [t])
      out[t] = `${rows[0].n}:${rows[0].sum}`
    }
    return out
  }
  finally { await db.destroy() }
}

/**
 * A user of the named company with the demo password (its hash copied from a demo user of that
 * company), for tests that need a role the demo data does not give that company.
 */
export async function addCompanyUser(companyName: string, role: string, email: string): Promise<void> {
  const db = knex({ client: 'pg', connection: process.env.NUXT_DATABASE_URL! })
  try {
    const company = await db('companies').where({ name: companyName }).first('id')
    const hash = await db('users').where({ company_id: company.id }).first('password_hash')
    await db('users').insert({ company_id: company.id, email, name: `Test ${role}`, role, password_hash: hash.password_hash }).onConflict('email').ignore()
  }
  finally { await db.destroy() }
}
