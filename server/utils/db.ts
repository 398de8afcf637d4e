import knex, { type Knex } from 'knex'

let instance: Knex | undefined

/** One lazily created Knex instance per server process. */
export function useDb(): Knex {
  if (!instance) {
    const url = useRuntimeConfig().databaseUrl || process.env.NUXT_DATABASE_URL
    if (!url) throw createError({ statusCode: 503, statusMessage: 'Database not configured' })
    instance = knex({
      client: 'pg',
      connection: { connectionString: url, connectionTimeoutMillis: 3000 },
      pool: { min: 0, max: 10, acquireTimeoutMillis: 10_000 },
    })
  }
  return instance
}

const UNAVAILABLE_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', '57P01', '57P02', '57P03', '53300', '08000', '08001', '08003', '08006'])

/** True when an error means PostgreSQL could not be reached, not that a query was wrong. */
export function isDatabaseUnavailable(error: unknown): boolean {
  for (let e: any = error, depth = 0; e && depth < 5; e = e.cause, depth++) {
    if (UNAVAILABLE_CODES.has(e.code)) return true
    if (typeof e.message === 'string' && /Knex: Timeout acquiring a connection|Connection terminated|timeout expired/i.test(e.message)) return true
  }
  return false
}
