// Revoked session ids, shared through PostgreSQL. A short-lived per-instance cache keeps the
// per-request cost down; a revocation made on this instance takes effect here at once.
const NEGATIVE_TTL_MS = 2000
const known = new Map<string, { revoked: boolean, at: number }>()

export async function revokeSession(sessionId: string) {
  await useDb()('revoked_sessions').insert({ session_id: sessionId }).onConflict('session_id').ignore()
  known.set(sessionId, { revoked: true, at: Date.now() })
}

export async function isSessionRevoked(sessionId: string): Promise<boolean> {
  const hit = known.get(sessionId)
  if (hit && (hit.revoked || Date.now() - hit.at < NEGATIVE_TTL_MS)) return hit.revoked
  const row = await useDb()('revoked_sessions').where({ session_id: sessionId }).first('session_id')
  if (known.size > 10_000) known.clear()
  known.set(sessionId, { revoked: !!row, at: Date.now() })
  return !!row
}
