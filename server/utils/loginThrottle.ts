import type { H3Event } from 'h3'

// Failed sign-ins per account and per client address within 15 minutes, counted in PostgreSQL
// (server/utils/rateLimits.ts) so that every instance behind a load balancer sees the same counts.
// An attempt is counted before the password is checked, so parallel guesses cannot all slip in
// under the limit; a success takes its count back (and clears the account's failures).
const WINDOW_S = 15 * 60
// An office shares one address, so the address budget is wider than an account's.
const LIMITS = { acct: { slowAfter: 5, refuseAfter: 10 }, addr: { slowAfter: 20, refuseAfter: 50 } }

/** A scrypt hash of a random password, so unknown accounts take as long as known ones. */
export const DUMMY_HASH = '$scrypt$n=16384,r=8,p=1$MJkMjs90sCK9bgUP6Qchew$omzrlavwDihhN5/ObUfCcJRAD2o2lMKph9abeDobB82ERsWJyl6kWLUq3m/roI78wYcwNvv7vT76KSRSQxaa+g'

const accounts = () => rateLimiter('signin-acct', LIMITS.acct.refuseAfter, WINDOW_S)
const addresses = () => rateLimiter('signin-addr', LIMITS.addr.refuseAfter, WINDOW_S)

function keys(event: H3Event, email: string) {
  return { acct: limitKey(email), addr: limitKey(getRequestIP(event, { xForwardedFor: false }) ?? 'unknown') }
}

/**
 * Counts the attempt, then refuses it (429) when the account or the address is over its limit,
 * or slows it down when it is over the point where a person would have stopped guessing.
 */
export async function assertLoginAllowed(event: H3Event, email: string) {
  const k = keys(event, email)
  const [acct, addr] = await Promise.all([accounts().penalty(k.acct, 1), addresses().penalty(k.addr, 1)])
  if (acct.consumedPoints > LIMITS.acct.refuseAfter || addr.consumedPoints > LIMITS.addr.refuseAfter) {
    setResponseHeader(event, 'retry-after', Math.ceil(Math.max(acct.msBeforeNext, addr.msBeforeNext, 1000) / 1000))
    throw createError({ statusCode: 429, statusMessage: 'Too many failed sign-ins; wait 15 minutes and try again' })
  }
  // Failures before this attempt, beyond the point where slowing starts.
  const over = Math.max(acct.consumedPoints - 1 - LIMITS.acct.slowAfter, addr.consumedPoints - 1 - LIMITS.addr.slowAfter)
  if (over >= 0) {
    const delayMs = Math.min(2000, 200 * 2 ** over)
    setResponseHeader(event, 'x-signin-delay-ms', delayMs)
    await new Promise(r => setTimeout(r, delayMs))
  }
}

/** A success takes back the address's count of this attempt and clears the account's failures; a failure keeps both. */
export async function recordLoginSuccess(event: H3Event, email: string) {
  const k = keys(event, email)
  await Promise.all([accounts().delete(k.acct), addresses().reward(k.addr, 1)])
}
