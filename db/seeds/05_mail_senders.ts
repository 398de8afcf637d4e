// Each demo company sends its crew briefs from its own address (company settings, `mailFrom`).
import type { Knex } from 'knex'

const SENDERS: Record<string, string> = {
  'Kestrel Bight Shipping': 'Kestrel Bight Shipping <passages@kestrel-bight.example>',
  'Larkspur Reach Carriers': 'Larkspur Reach Carriers <voyages@larkspur-reach.example>',
}

export async function seed(knex: Knex) {
  for (const [name, mailFrom] of Object.entries(SENDERS))
    await knex('companies').where({ name }).update({ settings: knex.raw(`settings || ?::jsonb`, [JSON.stringify({ mailFrom })]) })
}
