import type { H3Event } from 'h3'

// Failed sign-ins per account and per client address within a sliding window. In memory per
// instance: with N instances an attacker gets at most N times the budget, which still bounds it.
const WINDOW_MS = 15 * 60_000
const SLOW_AFTER = 5
const REFUSE_AFTER = 10
const failures = new Map<string, number[]>()

/** A scrypt hash of a random password, so unknown accounts take as long as known ones. */
export const DUMMY_HASH = '$scrypt$n=16384,r=8,p=1$MJkMjs90sCK9bgUP6Qchew$omzrlavwDihhN5/ObUfCcJRAD2o2lMKph9abeDobB82ERsWJyl6kWLUq3m/roI78wYcwNvv7vT76KSRSQxaa+g'

function keys(event: H3Event, email: string) {
  return [`acct:${email}`, `addr:${getRequestIP(event, { xForwardedFor: false }) ?? 'unknown'}`]
}

function recent(key: string, now: number) {
  const list = (failures.get(key) ?? []).filter(t => now - t < WINDOW_MS)
  failures.set(key, list)
  return list
}

export async function assertLoginAllowed(event: H3Event, email: string) {
  const now = Date.now()
  const worst = Math.max(...keys(event, email).map(k => recent(k, now).length))
  if (worst >= REFUSE_AFTER) {
    setResponseHeader(event, 'retry-after', WINDOW_MS / 1000)
    throw createError({ statusCode: 429, statusMessage: 'Too many failed sign-ins; wait 15 minutes and try again' })
  }
  if (worst >= SLOW_AFTER) await new Promise(r => setTimeout(r, Math.min(4000, 250 * 2 ** (worst - SLOW_AFTER))))
}

export function recordLoginFailure(event: H3Event, email: string) {
  const now = Date.now()
  for (const k of keys(event, email)) recent(k, now).push(now)
}

export function recordLoginSuccess(event: H3Event, email: string) {
  failures.delete(`acct:${email}`)
}
