export const outboxStates = ['queued', 'sending', 'sent', 'failed'] as const
export type OutboxState = typeof outboxStates[number]

export interface OutboxRecipient { name: string, email: string }

/** One crew brief in the outbox, as the outbox page lists it. */
export interface OutboxMessageSummary {
  id: number
  planId: number | null
  planTitle: string | null
  vesselName: string | null
  subject: string
  state: OutboxState
  recipientCount: number
  attempts: number
  lastError: string | null
  messageId: string
  queuedByName: string | null
  createdAt: string
  sentAt: string | null
}
