// Demo bunker prices per tonne (invented figures of a plausible size) and one vessel that burns
// LSMGO in ECAs, so the fuel split shows a grade of its own.
import type { Knex } from 'knex'

const prices = [{ grade: 'VLSFO', pricePerTonne: 585 }, { grade: 'MGO', pricePerTonne: 780 }, { grade: 'LSMGO', pricePerTonne: 805 }, { grade: 'HFO', pricePerTonne: 455 }]

export async function seed(knex: Knex) {
  await knex('companies').update({ settings: knex.raw(`settings || ?::jsonb`, [JSON.stringify({ currency: 'USD', fuelPrices: prices })]) })
  await knex('vessel_fuel_grades').delete()
  const meridian = await knex('vessels').where({ name: 'Kestrel Meridian' }).first('id')
  if (meridian) await knex('vessel_fuel_grades').insert({ vessel_id: meridian.id, outside: 'VLSFO', inside_eca: 'LSMGO' })
}
