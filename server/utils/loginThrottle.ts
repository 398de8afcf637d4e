import type { H3Event } from 'h3'

// Failed sign-ins per account and per client address within a sliding window. In memory per
// instance: with N instances an attacker gets at most N times the budget, which still bounds it.
const WINDOW_MS = 15 * 60_000
// An office shares one address, so the address budget is wider than an account's.
const LIMITS = { acct: { slowAfter: 5, refuseAfter: 10 }, addr: { slowAfter: 20, refuseAfter: 50 } }
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
  const [acct, addr] = keys(event, email).map(k => recent(k, now).length) as [number, number]
  if (acct >= LIMITS.acct.refuseAfter || addr >= LIMITS.addr.refuseAfter) {
    setResponseHeader(event, 'retry-after', WINDOW_MS / 1000)
    throw createError({ statusCode: 429, statusMessage: 'Too many failed sign-ins; wait 15 minutes and try again' })
  }
  const over = Math.max(acct - LIMITS.acct.slowAfter, addr - LIMITS.addr.slowAfter)
  if (over >= 0) {
    const delayMs = Math.min(2000, 200 * 2 ** over)
    setResponseHeader(event, 'x-signin-delay-ms', delayMs)
    await new Promise(r => setTimeout(r, delayMs))
  }
}

export function recordLoginFailure(event: H3Event, email: string) {
  const now = Date.now()
  for (const k of keys(event, email)) recent(k, now).push(now)
}

export function recordLoginSuccess(event: H3Event, email: string) {
  failures.delete(`acct:${email}`)
}
