import type { Knex } from 'knex'

// When a worker claimed a message for sending: a row left in 'sending' long after this
// (the worker died mid-send) is handed back to the queue by the outbox sweep.
export async function up(knex: Knex) {
  await knex.schema.alterTable('outbox_messages', (t) => {
    t.timestamp('claimed_at', { useTz: true })
    t.index(['state', 'claimed_at'], 'outbox_state_claimed_idx')
  })
}

export async function down(knex: Knex) {
  await knex.schema.alterTable('outbox_messages', (t) => {
    t.dropIndex(['state', 'claimed_at'], 'outbox_state_claimed_idx')
    t.dropColumn('claimed_at')
  })
}
