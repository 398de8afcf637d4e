import type { Knex } from 'knex'
import type { SessionUser } from '#shared/types/auth'
import type { FuelPoint } from '#shared/types/fuel'
import type { CrewMember, VesselDetail, VesselFuelGrades, VesselUpdateInput } from '#shared/types/vessel'
import { fitFuelCurve } from '#shared/utils/fuel'
import { DEFAULT_FUEL_GRADES } from '#shared/utils/zones/fuelSplit'

export async function listVessels(user: SessionUser) {
  const rows = await useDb()('vessels').leftJoin('users', 'users.id', 'vessels.master_user_id')
    .where('vessels.company_id', user.companyId).orderBy('vessels.name')
    .select('vessels.id', 'vessels.name', 'vessels.imo_number as imoNumber', 'vessels.call_sign as callSign',
      'vessels.service_speed_kn as serviceSpeedKn', 'vessels.master_user_id as masterUserId', 'users.name as masterName')
  return rows.map(r => ({ ...r, serviceSpeedKn: Number(r.serviceSpeedKn) }))
}

/** The vessel in the user's company, or 404. */
async function findVessel(user: SessionUser, id: number, db: Knex | Knex.Transaction = useDb()) {
  const row = await db('vessels').where({ id, company_id: user.companyId }).first('id')
  if (!row) notFound('Vessel')
}

/** Measured consumption, slowest first. */
export async function loadFuelPoints(vesselId: number, db: Knex | Knex.Transaction = useDb()): Promise<FuelPoint[]> {
  const rows = await db('vessel_fuel_points').where({ vessel_id: vesselId }).orderBy('speed_kn')
  return rows.map(r => ({ speedKn: Number(r.speed_kn), tonnesPerDay: Number(r.tonnes_per_day) }))
}

export async function getVessel(user: SessionUser, id: number): Promise<VesselDetail> {
  const db = useDb()
  const row = await db('vessels').leftJoin('users', 'users.id', 'vessels.master_user_id')
    .where({ 'vessels.id': id, 'vessels.company_id': user.companyId })
    .first('vessels.id', 'vessels.name', 'vessels.imo_number as imoNumber', 'vessels.call_sign as callSign',
      'vessels.service_speed_kn as serviceSpeedKn', 'vessels.master_user_id as masterUserId', 'users.name as masterName')
  if (!row) notFound('Vessel')
  const crew = await db('crew_members').where({ vessel_id: id }).orderBy('id').select('id', 'name', 'rank', 'email')
  const fuelPoints = await loadFuelPoints(id)
  const masters = await db('users').where({ company_id: user.companyId, role: 'master' }).orderBy('name').select('id', 'name')
  const grades = await db('vessel_fuel_grades').where({ vessel_id: id }).first('outside', 'inside_eca as insideEca')
  const fuelGrades = grades ? { outside: grades.outside, insideEca: grades.insideEca, stored: true } : { ...DEFAULT_FUEL_GRADES, stored: false }
  return { ...row, serviceSpeedKn: Number(row.serviceSpeedKn), crew, fuelPoints, fuelCurve: fuelPoints.length >= 2 ? fitFuelCurve(fuelPoints) : null, fuelGrades, masters }
}

export async function updateVessel(user: SessionUser, id: number, input: VesselUpdateInput) {
  await useDb().transaction(async (trx) => {
    await findVessel(user, id, trx)
    if (input.masterUserId !== null) {
      const master = await trx('users').where({ id: input.masterUserId, company_id: user.companyId, role: 'master' }).first('id')
      if (!master) throw createError({ statusCode: 400, statusMessage: 'masterUserId: not a master of your company' })
    }
    const clash = await trx('vessels').where('imo_number', input.imoNumber).whereNot('id', id).first('id')
    if (clash) throw createError({ statusCode: 409, statusMessage: `imoNumber: IMO ${input.imoNumber} belongs to another vessel` })
    await trx('vessels').where({ id }).update({
      name: input.name, imo_number: input.imoNumber, call_sign: input.callSign, service_speed_kn: input.serviceSpeedKn, master_user_id: input.masterUserId,
    })
  })
  return getVessel(user, id)
}

/** Replaces the whole crew list (the crew brief goes to these addresses). */
export async function replaceCrew(user: SessionUser, id: number, crew: CrewMember[]) {
  await useDb().transaction(async (trx) => {
    await findVessel(user, id, trx)
    await trx('crew_members').where({ vessel_id: id }).delete()
    if (crew.length) await trx('crew_members').insert(crew.map(c => ({ vessel_id: id, name: c.name, rank: c.rank, email: c.email })))
  })
  return getVessel(user, id)
}

/** Replaces the measured fuel points (already validated: two or more, positive, one per speed). */
export async function replaceFuelPoints(user: SessionUser, id: number, points: FuelPoint[]) {
  await useDb().transaction(async (trx) => {
    await findVessel(user, id, trx)
    await trx('vessel_fuel_points').where({ vessel_id: id }).delete()
    await trx('vessel_fuel_points').insert(points.map(p => ({ vessel_id: id, speed_kn: p.speedKn, tonnes_per_day: p.tonnesPerDay })))
  })
  return getVessel(user, id)
}

/** Sets the grades the vessel burns outside and inside ECAs (the plan's fuel split by grade reads them). */
export async function setFuelGrades(user: SessionUser, id: number, grades: VesselFuelGrades) {
  await useDb().transaction(async (trx) => {
    await findVessel(user, id, trx)
    await trx('vessel_fuel_grades').insert({ vessel_id: id, outside: grades.outside, inside_eca: grades.insideEca }).onConflict('vessel_id').merge()
  })
  return getVessel(user, id)
}
