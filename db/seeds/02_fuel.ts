// Demo fuel data (invented): consumption roughly c·V³ with a little measurement noise,
// the kind of table a chief engineer keeps from noon reports.
import type { Knex } from 'knex'

const demoFuel: Record<string, [number, number][]> = {
  'Kestrel Dawn': [[11, 17.1], [12, 22.4], [13, 28.1], [14, 35.6], [15, 43.0], [16, 52.8]],
  'Bight Voyager': [[10, 13.2], [11.5, 19.6], [13, 27.9], [14, 35.1]],
  'Kestrel Meridian': [[12, 24.9], [13.5, 34.2], [15, 48.1], [16.5, 62.7], [17.5, 76.0]],
  'Larkspur Tern': [[10, 12.1], [12, 20.7], [13.5, 29.8]],
}

export async function seed(knex: Knex) {
  await knex('vessel_fuel_points').delete()
  const vessels = await knex('vessels').select('id', 'name')
  const rows = vessels.flatMap(v => (demoFuel[v.name] ?? []).map(([speed, tonnes]) => ({ vessel_id: v.id, speed_kn: speed, tonnes_per_day: tonnes })))
  if (rows.length) await knex('vessel_fuel_points').insert(rows)
}
