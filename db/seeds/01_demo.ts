// Demo data: invented companies, vessels and people; places are real ports and approaches
// (coordinates from public charts and port information, rounded to 0.01′–0.1′).
import type { Knex } from 'knex'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { computeLegTable } from '../../shared/utils/legTable'
import { demoPlaces, demoPlans } from './demoData'

const DEMO_PASSWORD = 'passage-demo'

export async function seed(knex: Knex) {
  const hasher = new Hash(new Scrypt({}))
  const passwordHash = await hasher.make(DEMO_PASSWORD)
  await knex.raw('truncate companies, users, vessels, crew_members, places, plans, waypoints, plan_events, outbox_messages restart identity cascade')

  const [kestrel] = await knex('companies').insert({ name: 'Kestrel Bight Shipping' }).returning('id')
  const [larkspur] = await knex('companies').insert({ name: 'Larkspur Reach Carriers' }).returning('id')
  const kb = kestrel.id as number
  const lr = larkspur.id as number

  const users = await knex('users').insert([
    { company_id: kb, email: 'admin@kestrel-bight.example', name: 'Ines Calloway', role: 'admin' },
    { company_id: kb, email: 'planner@kestrel-bight.example', name: 'Tomas Verhoeven', role: 'planner' },
    { company_id: kb, email: 'master@kestrel-bight.example', name: 'Capt. Mirela Oduya', role: 'master' },
    { company_id: kb, email: 'relief.master@kestrel-bight.example', name: 'Capt. Anders Pellew', role: 'master' },
    { company_id: kb, email: 'shore@kestrel-bight.example', name: 'Ruth Abernathy', role: 'shore' },
    { company_id: lr, email: 'planner@larkspur-reach.example', name: 'Kofi Marchetti', role: 'planner' },
    { company_id: lr, email: 'master@larkspur-reach.example', name: 'Capt. Hana Lindqvist', role: 'master' },
  ].map(u => ({ ...u, password_hash: passwordHash }))).returning(['id', 'email'])
  const userId = (email: string) => users.find(u => u.email === email)!.id as number

  const vessels = await knex('vessels').insert([
    { company_id: kb, name: 'Kestrel Dawn', imo_number: '9381201', call_sign: 'V7KD4', service_speed_kn: 14.5, master_user_id: userId('master@kestrel-bight.example') },
    { company_id: kb, name: 'Bight Voyager', imo_number: '9417335', call_sign: 'V7BV9', service_speed_kn: 13.0, master_user_id: userId('relief.master@kestrel-bight.example') },
    { company_id: kb, name: 'Kestrel Meridian', imo_number: '9274563', call_sign: 'V7KM2', service_speed_kn: 15.0, master_user_id: userId('master@kestrel-bight.example') },
    { company_id: lr, name: 'Larkspur Tern', imo_number: '9603180', call_sign: 'ZDLT7', service_speed_kn: 12.5, master_user_id: userId('master@larkspur-reach.example') },
  ]).returning(['id', 'name'])
  const vesselId = (name: string) => vessels.find(v => v.name === name)!.id as number

  const crew: [string, string, string][] = [
    ['Kestrel Dawn', 'Capt. Mirela Oduya', 'Master'], ['Kestrel Dawn', 'Jonah Whitcombe', 'Chief Officer'],
    ['Kestrel Dawn', 'Priya Santhanam', 'Second Officer'], ['Kestrel Dawn', 'Lukas Brandvold', 'Third Officer'],
    ['Kestrel Dawn', 'Efosa Ighodaro', 'Chief Engineer'],
    ['Bight Voyager', 'Capt. Anders Pellew', 'Master'], ['Bight Voyager', 'Marisol Quintero', 'Chief Officer'],
    ['Bight Voyager', 'Dmitri Okonkwo', 'Second Officer'],
    ['Kestrel Meridian', 'Capt. Mirela Oduya', 'Master'], ['Kestrel Meridian', 'Aiko Fairbairn', 'Chief Officer'],
    ['Kestrel Meridian', 'Samuel Achterberg', 'Second Officer'],
    ['Larkspur Tern', 'Capt. Hana Lindqvist', 'Master'], ['Larkspur Tern', 'Oren Castellanos', 'Chief Officer'],
  ]
  await knex('crew_members').insert(crew.map(([vessel, name, rank]) => ({
    vessel_id: vesselId(vessel), name, rank,
    email: `${name.replace(/^Capt\. /, '').toLowerCase().replace(/[^a-z]+/g, '.')}@${vessel.toLowerCase().replace(/ /g, '-')}.example.com`,
  })))

  const places = await knex('places').insert(demoPlaces.map(p => ({ ...p, company_id: kb }))).returning(['id', 'name'])
  await knex('places').insert(demoPlaces.slice(0, 8).map(p => ({ ...p, company_id: lr })))
  const placeId = (name: string) => places.find(p => p.name === name)?.id as number | undefined

  for (const plan of demoPlans) {
    const company = plan.company === 'larkspur' ? lr : kb
    const { totals } = computeLegTable(plan.waypoints.map(([name, lat, lon, method]) => ({ name, lat, lon, method })), plan.departureUtc, plan.speedKn)
    const [row] = await knex('plans').insert({
      company_id: company, vessel_id: vesselId(plan.vessel), title: plan.title, departure_utc: plan.departureUtc,
      speed_kn: plan.speedKn, limit_lat: plan.limitLat ?? null, status: plan.status,
      departure_place_id: company === kb ? placeId(plan.from) ?? null : null,
      arrival_place_id: company === kb ? placeId(plan.to) ?? null : null,
      created_by: userId(plan.createdBy),
      approved_by: plan.status === 'approved' ? userId('master@kestrel-bight.example') : null,
      approved_at: plan.status === 'approved' ? '2026-11-20T08:30:00Z' : null,
      total_nm: totals.distanceNm, arrival_utc: totals.etaUtc,
    }).returning('id')
    await knex('waypoints').insert(plan.waypoints.map(([name, lat, lon, method], seq) => ({ plan_id: row.id, seq, name, lat, lon, method })))
    for (const e of plan.events ?? [])
      await knex('plan_events').insert({ plan_id: row.id, user_id: userId(e.by), user_name: e.name, role: e.role, kind: e.kind, from_status: e.from, to_status: e.to, remarks: e.remarks ?? null, created_at: e.at })
  }
}
