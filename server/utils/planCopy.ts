// A new draft from an earlier plan of the company: the same track, or the return passage.
import type { SessionUser } from '#shared/types/auth'
import type { PlanCopyInput } from '#shared/types/plan'
import { reverseRows } from '#shared/utils/waypointRows'

/**
 * Copies plan `id` (any state) as a new draft of the same vessel. The return passage sails the track the
 * other way (each leg keeps its method, speed and limits), swaps the ports and leaves at the plan's ETA.
 */
export async function copyPlan(user: SessionUser, id: number, input: PlanCopyInput) {
  const source = await findPlan(user, id)
  const waypoints = await loadWaypoints(id)
  const reversed = input.reversed
  const title = input.title ?? `${source.title} (${reversed ? 'return' : 'copy'})`.slice(0, 160)
  const departureUtc = input.departureUtc ?? (reversed && source.arrivalUtc ? source.arrivalUtc : source.departureUtc)
  return createPlan(user, {
    vesselId: source.vesselId, title, departureUtc, speedKn: source.speedKn, limitLat: source.limitLat,
    departurePlaceId: reversed ? source.arrivalPlaceId : source.departurePlaceId,
    arrivalPlaceId: reversed ? source.departurePlaceId : source.arrivalPlaceId,
  }, reversed ? reverseRows(waypoints, [0, waypoints.length - 1]).list : waypoints, `${reversed ? 'Return passage' : 'Copy'} of plan ${id} (${source.title}, revision ${source.revision})`)
}
