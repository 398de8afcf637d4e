import type { H3Event } from 'h3'

// Unsealing the session cookie (key derivation, HMAC and AES through WebCrypto) is the largest fixed
// cost of a signed-in request. What a sealed cookie holds depends on its text alone, so an instance
// remembers it, keyed by the whole sealed text: a forged or altered cookie never matches and is
// unsealed (and refused) as before. Expiry is checked here as h3 checks it; revocation is checked
// after, by session id, as for any session.
interface Unsealed { id: string, createdAt: number, data: Record<string, unknown> }
const MAX_ENTRIES = 10_000
const unsealed = new Map<string, Unsealed>()

const maxAgeMs = () => Number(useRuntimeConfig().session?.maxAge ?? 0) * 1000

/** Puts the session a sealed cookie is known to hold where h3 looks first; false when not known or expired. */
export function restoreSession(event: H3Event, name: string, sealed: string): boolean {
  const hit = unsealed.get(sealed)
  if (!hit) return false
  if (maxAgeMs() && Date.now() - hit.createdAt > maxAgeMs()) {
    unsealed.delete(sealed)
    return false
  }
  event.context.sessions ??= Object.create(null)
  // A copy, so a route that changes its session never changes what the next request restores.
  event.context.sessions![name] = structuredClone(hit)
  return true
}

/** Remembers what h3 unsealed from `sealed` for this request (before any route changed it). */
export function rememberSession(event: H3Event, name: string, sealed: string) {
  const session = event.context.sessions?.[name] as Unsealed | undefined
  if (!session?.id || !session.data?.user || unsealed.has(sealed)) return
  if (unsealed.size >= MAX_ENTRIES) unsealed.delete(unsealed.keys().next().value!)
  unsealed.set(sealed, structuredClone({ id: session.id, createdAt: session.createdAt, data: session.data }))
}
