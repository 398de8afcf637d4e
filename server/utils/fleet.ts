// The fleet view (GET /api/fleet): every vessel of the company on passage — an approved plan whose
// departure has come and which has not arrived (its latest report still has distance to go, or,
// with no report yet, its planned arrival is less than two days past) — with its latest report
// worked out; of several such plans of one vessel, the one with the latest report (or departure).
import type { SessionUser } from '#shared/types/auth'
import type { FleetEntry } from '#shared/types/voyage'

/** Within this of the arrival waypoint a voyage counts as arrived, nm (common practice: pilot boarding ground reached). */
const ARRIVED_NM = 1
/** A voyage without reports is still shown this long past its planned arrival, hours. */
const UNREPORTED_GRACE_H = 48

/** Approved plans whose planned arrival or latest report lies within this many days are looked at. */
const RECENT_DAYS = 30

export async function listFleet(user: SessionUser): Promise<FleetEntry[]> {
  const now = Date.now()
  const db = useDb()
  const since = new Date(now - RECENT_DAYS * 86_400_000)
  const plans: { id: number, vessel_id: number }[] = await db('plans').where({ company_id: user.companyId, status: 'approved' }).where('departure_utc', '<=', new Date(now))
    .where(q => q.where('arrival_utc', '>=', since).orWhereExists(db('voyage_reports').whereRaw('voyage_reports.plan_id = plans.id').where('time_utc', '>=', since)))
    .select('id', 'vessel_id')
  // Per vessel, the voyage under way with the latest news: its latest report, else its departure.
  const best = new Map<number, { entry: FleetEntry, newsMs: number }>()
  for (const { id, vessel_id: vesselId } of plans) {
    const voyage = await getVoyage(user, id)
    const last = voyage.reports.at(-1)
    const underway = last ? last.distanceToGoNm > ARRIVED_NM : Date.parse(voyage.plannedArrivalUtc) + UNREPORTED_GRACE_H * 3_600_000 > now
    if (!underway) continue
    const newsMs = Date.parse(last?.timeUtc ?? voyage.departureUtc)
    if ((best.get(vesselId)?.newsMs ?? -Infinity) >= newsMs) continue
    best.set(vesselId, { newsMs, entry: {
      vesselId, vesselName: voyage.vesselName, planId: id, title: voyage.title, departureUtc: voyage.departureUtc,
      lastReport: last ? { timeUtc: last.timeUtc, lat: last.lat, lon: last.lon, crossTrackNm: last.crossTrackNm, speedMadeGoodKn: last.speedMadeGoodKn } : null,
      distanceToGoNm: last ? last.distanceToGoNm : voyage.totalNm, totalNm: voyage.totalNm,
      etaUtc: last ? (last.etaUtc ?? last.etaPlannedSpeedsUtc) : voyage.plannedArrivalUtc, plannedArrivalUtc: voyage.plannedArrivalUtc,
      delayH: last ? last.delayH : null, flags: last?.flags ?? [],
      track: voyage.legs.length ? [[voyage.legs[0]!.from.lat, voyage.legs[0]!.from.lon], ...voyage.legs.map(l => [l.to.lat, l.to.lon] as [number, number])] : [],
    } })
  }
  return [...best.values()].map(b => b.entry).sort((a, b) => a.vesselName.localeCompare(b.vesselName))
}
