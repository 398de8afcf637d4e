// Land checks of a plan's saved track: run, kept with the track they checked (so an out-of-date
// check is never shown as a check of the new track), and acknowledged leg by leg by an editor with
// a note. Every step goes into the plan's history; the master sees the last check when approving.
import type { Knex } from 'knex'
import type { SessionUser } from '#shared/types/auth'
import type { LegMethod } from '#shared/types/geo'
import { isFlaggedLeg, LAND_CHECK_RESULT_CAUTION, type LandCheckAck, type LandCheckAckInput, type LandCheckLeg, type PlanLandCheckInput, type StoredLandCheck } from '#shared/types/landCheck'
import { densifyLeg } from '#shared/utils/track'
import { passageOfLeg } from '#shared/utils/routing/passageLegs'
import { checkLegs, landCrossings, landData } from './land'
import type { LandData } from './land'
import { useSeaGraph } from './routing/graphStore'

/** Densifying step of the land check, nm (what checkLegs uses at most). */
const STEP_NM = 2

interface TrackPoint { lat: number, lon: number, method?: LegMethod | null }

/**
 * The coastline the land check judges by: the sea router's (Natural Earth 1:10m, loaded with its
 * graph), so a route the router suggests, whose ends it places on 1:10m water, is never flagged by
 * the check for crossing the coarser 1:50m coast near a port.
 */
export async function landCheckCoast(): Promise<LandData> {
  return (await useSeaGraph()).land
}

/**
 * The land check of a track, leg by leg, with every stretch over land of the legs that cross it.
 * A leg following a declared passage's fairway (within its corridor) is reported as through that
 * passage instead: the coastline closes canals and narrow straits. The server checks against the
 * router's coastline (landCheckCoast); without one given, the 1:50m land.
 */
export function checkTrackLegs(waypoints: readonly TrackPoint[], clearanceNm: number, land: LandData = landData()): LandCheckLeg[] {
  const legs = waypoints.slice(1).map((to, i) => ({ from: waypoints[i]!, to, method: to.method ?? 'rhumb' }))
  return checkLegs(legs, clearanceNm, STEP_NM, land).map((leg) => {
    const { from, to, method } = legs[leg.index]!
    const passage = passageOfLeg(from, to, method)
    const crossesLand = !passage && leg.crossesLand
    return {
      index: leg.index,
      crossesLand,
      firstLandPoint: crossesLand && leg.firstLandPoint ? { lat: leg.firstLandPoint.lat, lon: leg.firstLandPoint.lon } : null,
      crossings: crossesLand ? landCrossings(densifyLeg(from, to, method, STEP_NM), land) : [],
      closestApproachNm: leg.closestApproachNm,
      closestCoastPoint: leg.closestCoastPoint,
      withinClearance: !passage && leg.withinClearance,
      passage: passage ? { id: passage.id, name: passage.name } : null,
    }
  })
}

/** What identifies a track: the saved positions and leg methods, in order (the same text for the same track). */
export const TRACK_MD5_SQL = `(select md5(coalesce(string_agg(lat::text || ' ' || lon::text || ' ' || method, ';' order by seq), '')) from waypoints where plan_id = :id)`

async function trackMd5(db: Knex | Knex.Transaction, planId: number): Promise<string> {
  const { rows: [row] } = await db.raw(`select ${TRACK_MD5_SQL} as md5`, { id: planId })
  return row.md5 as string
}

function assertNotApproved(status: string) {
  if (status === 'approved')
    throw createError({ statusCode: 409, statusMessage: 'This plan is approved; its land check stays as it was approved (start a revision to check a new track)' })
}

/** Locks the plan row, so no save lands between reading the track and keeping its check. */
async function lockPlan(trx: Knex.Transaction, planId: number): Promise<number> {
  const row = await trx('plans').where({ id: planId }).forUpdate().first('version')
  return row.version as number
}

function summary(legs: LandCheckLeg[], clearanceNm: number): string {
  const flagged = legs.filter(isFlaggedLeg)
  if (!flagged.length) return `Land check: no leg crosses land or passes within ${clearanceNm} nm of the coastline (1:10m).`
  const crossing = flagged.filter(l => l.crossesLand).map(l => l.index + 1)
  const near = flagged.filter(l => !l.crossesLand).map(l => l.index + 1)
  const parts = [
    crossing.length ? `crossing land: leg ${crossing.join(', ')}` : '',
    near.length ? `within ${clearanceNm} nm of land: leg ${near.join(', ')}` : '',
  ].filter(Boolean)
  return `Land check: ${flagged.length} of ${legs.length} legs flagged (${parts.join('; ')}).`
}

/** Checks the plan's saved track and keeps the result; the caller must have seen the current version. */
export async function runPlanLandCheck(user: SessionUser, id: number, input: PlanLandCheckInput): Promise<StoredLandCheck> {
  const land = await landCheckCoast()
  await useDb().transaction(async (trx) => {
    const plan = await findPlan(user, id, trx)
    assertNotApproved(plan.status)
    const version = await lockPlan(trx, id)
    if (version !== input.version)
      throw createError({ statusCode: 409, statusMessage: 'The plan was changed by someone else since you loaded it', data: { currentVersion: version } })
    const waypoints = await loadWaypoints(id, trx)
    if (waypoints.length < 2) throw createError({ statusCode: 409, statusMessage: 'A land check needs at least two saved waypoints' })
    const legs = checkTrackLegs(waypoints, input.clearanceNm, land)
    await trx('land_checks').insert({
      plan_id: id, plan_version: version, track_md5: await trackMd5(trx, id), clearance_nm: input.clearanceNm,
      flagged_legs: legs.filter(isFlaggedLeg).length, legs_json: JSON.stringify(legs), user_id: user.id, user_name: user.name,
    })
    await recordEvent(trx, id, user, 'land_checked', null, null, summary(legs, input.clearanceNm))
  })
  return (await latestLandCheck(useDb(), id))!
}

/** An editor's note on a flagged leg of the plan's last land check, kept with the check and in the history. */
export async function acknowledgeLandCheckLeg(user: SessionUser, id: number, input: LandCheckAckInput): Promise<StoredLandCheck> {
  await useDb().transaction(async (trx) => {
    const plan = await findPlan(user, id, trx)
    assertNotApproved(plan.status)
    await lockPlan(trx, id)
    const check = await trx('land_checks').where({ id: input.checkId, plan_id: id }).first('id', 'track_md5', 'legs_json')
    if (!check) throw createError({ statusCode: 400, statusMessage: 'checkId: no such land check of this plan' })
    const latest = await trx('land_checks').where({ plan_id: id }).max({ id: 'id' }).first()
    if (latest?.id !== check.id)
      throw createError({ statusCode: 409, statusMessage: 'A newer land check of this plan exists; reload the plan' })
    if (check.track_md5 !== await trackMd5(trx, id))
      throw createError({ statusCode: 409, statusMessage: 'The track has changed since this land check; run the check again' })
    const leg = (JSON.parse(check.legs_json) as LandCheckLeg[])[input.legIndex]
    if (!leg) throw createError({ statusCode: 400, statusMessage: 'legIndex: no such leg in this land check' })
    if (!isFlaggedLeg(leg)) throw createError({ statusCode: 400, statusMessage: `legIndex: leg ${input.legIndex + 1} is not flagged by this land check` })
    await trx('land_check_acks').insert({ land_check_id: check.id, leg_index: input.legIndex, note: input.note, user_id: user.id, user_name: user.name })
    const waypoints = await loadWaypoints(id, trx)
    const name = (i: number) => waypoints[i]?.name || `WP ${i + 1}`
    await recordEvent(trx, id, user, 'land_check_acknowledged', null, null, `Leg ${input.legIndex + 1} (${name(input.legIndex)} → ${name(input.legIndex + 1)}): ${input.note}`)
  })
  return (await latestLandCheck(useDb(), id))!
}

/**
 * The plan's last land check with its acknowledgements, or null; `current` compares the track it
 * checked with `md5` (the plan's track now, read with the plan view) or with the stored track.
 */
export async function latestLandCheck(db: Knex | Knex.Transaction, planId: number, md5?: string): Promise<StoredLandCheck | null> {
  const row = await db('land_checks').where({ plan_id: planId }).orderBy('id', 'desc').first()
  if (!row) return null
  const acks = await db('land_check_acks').where({ land_check_id: row.id }).orderBy([{ column: 'created_at' }, { column: 'id' }])
  const acknowledgements: LandCheckAck[] = acks.map(a => ({ legIndex: a.leg_index, note: a.note, userName: a.user_name, createdAt: new Date(a.created_at).toISOString() }))
  return {
    id: row.id,
    planVersion: row.plan_version,
    clearanceNm: Number(row.clearance_nm),
    flaggedLegs: row.flagged_legs,
    checkedBy: row.user_name,
    checkedAt: new Date(row.created_at).toISOString(),
    current: row.track_md5 === (md5 ?? await trackMd5(db, planId)),
    legs: JSON.parse(row.legs_json) as LandCheckLeg[],
    acknowledgements,
    caution: LAND_CHECK_RESULT_CAUTION,
  }
}
