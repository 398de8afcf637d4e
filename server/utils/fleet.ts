// The fleet view (GET /api/fleet): every vessel of the company on passage — an approved plan whose
// departure has come and which has not arrived (its latest report still has distance to go, or,
// with no report yet, its planned arrival is ahead) — with its latest report worked out.
import type { SessionUser } from '#shared/types/auth'
import type { FleetEntry } from '#shared/types/voyage'

/** Within this of the arrival waypoint a voyage counts as arrived, nm (common practice: pilot boarding ground reached). */
const ARRIVED_NM = 1
/** A voyage without reports is still shown this long past its planned arrival, hours. */
const UNREPORTED_GRACE_H = 48

export async function listFleet(user: SessionUser): Promise<FleetEntry[]> {
  const now = Date.now()
  const plans = await useDb()('plans').where({ company_id: user.companyId, status: 'approved' }).where('departure_utc', '<=', new Date(now))
    .orderBy('departure_utc', 'desc').select('id', 'vessel_id')
  const entries: FleetEntry[] = []
  const seen = new Set<number>()
  for (const { id, vessel_id: vesselId } of plans) {
    if (seen.has(vesselId)) continue // the latest departure of each vessel
    const voyage = await getVoyage(user, id)
    const last = voyage.reports.at(-1)
    const underway = last ? last.distanceToGoNm > ARRIVED_NM : Date.parse(voyage.plannedArrivalUtc) + UNREPORTED_GRACE_H * 3_600_000 > now
    if (!underway) continue
    seen.add(vesselId)
    entries.push({
      vesselId, vesselName: voyage.vesselName, planId: id, title: voyage.title, departureUtc: voyage.departureUtc,
      lastReport: last ? { timeUtc: last.timeUtc, lat: last.lat, lon: last.lon, crossTrackNm: last.crossTrackNm, speedMadeGoodKn: last.speedMadeGoodKn } : null,
      distanceToGoNm: last ? last.distanceToGoNm : voyage.totalNm, totalNm: voyage.totalNm,
      etaUtc: last ? (last.etaUtc ?? last.etaPlannedSpeedsUtc) : voyage.plannedArrivalUtc, plannedArrivalUtc: voyage.plannedArrivalUtc,
      delayH: last ? last.delayH : null, flags: last?.flags ?? [],
      track: voyage.legs.length ? [[voyage.legs[0]!.from.lat, voyage.legs[0]!.from.lon], ...voyage.legs.map(l => [l.to.lat, l.to.lon] as [number, number])] : [],
    })
  }
  return entries.sort((a, b) => a.vesselName.localeCompare(b.vesselName))
}
