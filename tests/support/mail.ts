// What the SMTP fake (scripts/mail-fake.mjs) kept: one JSON file per message received.
import { existsSync, readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'

export interface Mail { envelopeTo: string[], from: string, subject: string, text: string, html: string | null, messageId: string, headers: Record<string, string> }

/**
 * The messages in `dir` sent for one outbox row (matched by its X-Passagewright-Outbox-Id header and,
 * when given, its Message-ID: test files that rebuild the outbox in another database restart its ids,
 * and their mail lands in the same folder).
 */
export function mailsFor(dir: string, outboxId: number, messageId?: string): Mail[] {
  if (!existsSync(dir)) return []
  return readdirSync(dir).filter(f => f.endsWith('.json')).map(f => JSON.parse(readFileSync(join(dir, f), 'utf8')) as Mail)
    .filter(m => m.headers['x-passagewright-outbox-id'] === String(outboxId) && (messageId === undefined || m.messageId === messageId))
}
