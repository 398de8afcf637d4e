// Where a new waypoint row starts, so that it never appears at 00°00′N 000°00′E (common practice:
// a new point goes between its neighbours, or one step on from the last along the track).
import type { LatLon } from '../types/geo'
import { geodesicDirect, geodesicInverse, geodesicPointAt } from './geodesic'
import { NM_M } from './navConstants'

/** How far beyond the last waypoint a new one is put, along the last leg's final course. */
export const NEXT_WAYPOINT_STEP_NM = 60

export interface PlacementHints {
  /** The plan's departure place, used when the list is empty. */
  departure?: LatLon | null
  /** The plan's arrival place, used after a lone first waypoint. */
  arrival?: LatLon | null
  /** Where the chart is looking, when nothing else is known. */
  viewCentre?: LatLon | null
}

const same = (a: LatLon, b: LatLon) => geodesicInverse(a, b).distanceM < 1

/** Position for a waypoint inserted at index `at` (0…length) of `list` (Karney geodesics via the engine). */
export function newWaypointPosition(list: readonly LatLon[], at: number, hints: PlacementHints = {}): LatLon & { name?: 'arrival' | 'departure' } {
  const before = list[at - 1]
  const after = list[at]
  if (before && after) return geodesicPointAt(before, after, geodesicInverse(before, after).distanceM / 2)
  if (!before && !after) {
    if (hints.departure) return { ...hints.departure, name: 'departure' }
    return hints.viewCentre ?? { lat: 0, lon: 0 }
  }
  if (!before) {
    // Before the first: one step back along the first leg, or a step west of a lone waypoint.
    const next = list[at + 1]
    const course = next ? (geodesicInverse(after!, next).initialCourse + 180) % 360 : 270
    const p = geodesicDirect(after!, course, NEXT_WAYPOINT_STEP_NM * NM_M)
    return { lat: p.lat, lon: p.lon }
  }
  const previous = list[at - 2]
  if (!previous) {
    if (hints.arrival && !same(hints.arrival, before)) return { ...hints.arrival, name: 'arrival' }
    const p = geodesicDirect(before, 90, NEXT_WAYPOINT_STEP_NM * NM_M)
    return { lat: p.lat, lon: p.lon }
  }
  const p = geodesicDirect(before, geodesicInverse(previous, before).finalCourse, NEXT_WAYPOINT_STEP_NM * NM_M)
  return { lat: p.lat, lon: p.lon }
}
