// Database commands for the start and test scripts: migrate, rollback (all), seed, seed-if-empty.
import knex from 'knex'
import { knexConfig } from '../db/knexfile'

const url = process.env.NUXT_DATABASE_URL
if (!url) throw new Error('NUXT_DATABASE_URL is not set')
const db = knex(knexConfig(url))
const command = process.argv[2]

try {
  if (command === 'migrate') {
    const [, done] = await db.migrate.latest()
    console.log(done.length ? `migrations applied: ${done.join(', ')}` : 'database schema is current')
  }
  else if (command === 'rollback') {
    await db.migrate.rollback(undefined, true)
    console.log('all migrations rolled back')
  }
  else if (command === 'seed' || command === 'seed-if-empty') {
    const { count } = (await db('companies').count({ count: '*' }).first()) as { count: string }
    if (command === 'seed' || Number(count) === 0) {
      await db.seed.run()
      console.log('demo data seeded')
    }
    else console.log('demo data already present')
  }
  else throw new Error(`unknown command ${command}`)
}
finally {
  await db.destroy()
}
