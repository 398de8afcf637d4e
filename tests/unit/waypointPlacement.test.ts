import { describe, expect, it } from 'vitest'
import { NEXT_WAYPOINT_STEP_NM, newWaypointPosition } from '../../shared/utils/waypointPlacement'
import { geodesicInverse } from '../../shared/utils/geodesic'

const YOKOHAMA = { lat: 35.44, lon: 139.64 }
const NOJIMA = { lat: 34.85, lon: 139.95 }
const FUCA = { lat: 48.495, lon: -124.8 }

describe('where a new waypoint row starts', () => {
  it('starts an empty list at the departure place, else where the chart looks, never at 0°N 0°E by default', () => {
    expect(newWaypointPosition([], 0, { departure: YOKOHAMA })).toMatchObject({ ...YOKOHAMA, name: 'departure' })
    expect(newWaypointPosition([], 0, { viewCentre: { lat: 20, lon: -150 } })).toEqual({ lat: 20, lon: -150 })
  })

  it('goes halfway along the geodesic between its neighbours', () => {
    const p = newWaypointPosition([NOJIMA, FUCA], 1)
    const a = geodesicInverse(NOJIMA, p).distanceM
    const b = geodesicInverse(p, FUCA).distanceM
    expect(Math.abs(a - b)).toBeLessThan(1e-3)
  })

  it('after a lone departure, goes to the arrival place when the plan has one', () => {
    expect(newWaypointPosition([YOKOHAMA], 1, { arrival: FUCA })).toMatchObject({ ...FUCA, name: 'arrival' })
  })

  it(`goes ${NEXT_WAYPOINT_STEP_NM} nm on along the last leg's final course after the last waypoint`, () => {
    const p = newWaypointPosition([YOKOHAMA, NOJIMA], 2)
    expect(geodesicInverse(NOJIMA, p).distanceM / 1852).toBeCloseTo(NEXT_WAYPOINT_STEP_NM, 6)
    // Continuing the same course: the new leg starts on the old leg's final course (a straight continuation).
    const last = geodesicInverse(YOKOHAMA, NOJIMA).finalCourse
    expect(geodesicInverse(NOJIMA, p).initialCourse).toBeCloseTo(last, 6)
  })

  it('goes a step back along the first leg when inserted before the first waypoint', () => {
    const p = newWaypointPosition([NOJIMA, FUCA], 0)
    expect(geodesicInverse(p, NOJIMA).distanceM / 1852).toBeCloseTo(NEXT_WAYPOINT_STEP_NM, 6)
  })
})
