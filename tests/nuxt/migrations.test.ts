// Migrations down and up again on a database full of demo data: every table a step does not own
// keeps every row (count and checksum), and the schema comes back whole.
import knex from 'knex'
import { describe, expect, it } from 'vitest'
import { knexConfig } from '../../db/knexfile'
import { createScratchDatabase, tableFingerprints } from '../support/database'

const BOOKKEEPING = new Set(['knex_migrations', 'knex_migrations_lock'])
const withoutBookkeeping = (f: Record<string, string>) => Object.fromEntries(Object.entries(f).filter(([t]) => !BOOKKEEPING.has(t)))

describe('migrations on a database with data', () => {
  it('rolls each step back and forward again without losing the rows of the tables it does not own', async () => {
    const url = await createScratchDatabase('passagewright_migrations')
    const db = knex(knexConfig(url))
    try {
      const [, pending] = await db.migrate.list()
      expect(pending).toEqual([])
      const [completed] = await db.migrate.list()
      const original = withoutBookkeeping(await tableFingerprints(url))
      expect(Number(original.waypoints!.split(':')[0])).toBeGreaterThan(10)

      for (let step = completed.length; step > 1; step--) {
        const before = withoutBookkeeping(await tableFingerprints(url))
        await db.migrate.down()
        const during = withoutBookkeeping(await tableFingerprints(url))
        await db.migrate.up()
        const after = withoutBookkeeping(await tableFingerprints(url))
        const kept = Object.keys(during)
        for (const table of kept) expect(after[table], `${table} after step ${step}`).toBe(before[table])
        expect(Object.keys(after).sort()).toEqual(Object.keys(before).sort())
      }
      const [, stillPending] = await db.migrate.list()
      expect(stillPending).toEqual([])
    }
    finally { await db.destroy() }
  })
})
