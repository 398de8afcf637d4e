import type { Knex } from 'knex'
import { readdirSync } from 'node:fs'
import { fileURLToPath } from 'node:url'

const here = fileURLToPath(new URL('.', import.meta.url))

// Migrations and seeds are TypeScript; they are loaded through the running module loader
// (jiti in scripts, Vite in tests) rather than Knex's own require.
interface Loaded { name: string, load: () => Promise<any> }
function listModules(folder: string): Loaded[] {
  return readdirSync(`${here}${folder}`).filter(f => /^\d.*\.ts$/.test(f)).sort()
    .map(name => ({ name, load: () => import(`${here}${folder}/${name}`) }))
}

const migrationSource: Knex.MigrationSource<Loaded> = {
  getMigrations: async () => listModules('migrations'),
  getMigrationName: m => m.name,
  getMigration: m => m.load(),
}

const seedSource: Knex.SeedSource<Loaded> = {
  getSeeds: async () => listModules('seeds'),
  getSeed: m => m.load(),
}

export function knexConfig(connection: string): Knex.Config {
  return {
    client: 'pg',
    connection,
    pool: { min: 0, max: 5 },
    migrations: { migrationSource, tableName: 'knex_migrations' },
    seeds: { seedSource },
  }
}
