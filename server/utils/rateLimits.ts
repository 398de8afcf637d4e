// Counters shared by every instance, kept in PostgreSQL (rate-limiter-flexible's PostgreSQL store,
// table `rate_limits`): failed sign-ins per account and per address, crew briefs per plan. Each
// counter is a fixed window from its first point; rows whose window ended an hour ago are deleted
// every five minutes, so the table holds only what is being counted.
import { createHash } from 'node:crypto'
import { RateLimiterPostgres, type RateLimiterRes } from 'rate-limiter-flexible'

export const RATE_LIMIT_TABLE = 'rate_limits'

const limiters = new Map<string, RateLimiterPostgres>()

/** A counter of `points` per `durationS` seconds under `prefix`, created once per process. */
export function rateLimiter(prefix: string, points: number, durationS: number): RateLimiterPostgres {
  let limiter = limiters.get(prefix)
  if (!limiter) {
    limiter = new RateLimiterPostgres({ storeClient: useDb(), storeType: 'knex', tableName: RATE_LIMIT_TABLE, tableCreated: true, keyPrefix: prefix, points, duration: durationS })
    limiters.set(prefix, limiter)
  }
  return limiter
}

/** Keys of any length and content (e-mail addresses) as a fixed-length digest: the key column is varchar(255). */
export function limitKey(value: string | number): string {
  return createHash('sha256').update(String(value)).digest('base64url')
}

/** rate-limiter-flexible rejects with its result (not an Error) when the points are used up. */
export function isLimitReached(error: unknown): error is RateLimiterRes {
  return !!error && typeof error === 'object' && 'msBeforeNext' in error && !(error instanceof Error)
}
