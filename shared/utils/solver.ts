// One call per geodesy question, as the API and the quick solver ask them.
import type { LatLon, LegMethod } from '../types/geo'
import { geodesicDirect, geodesicInverse } from './geodesic'
import { rhumbDirect, rhumbInverse } from './rhumb'
import { greatEllipseInverse } from './greatEllipse'

export interface InverseAllMethods {
  geodesic: { distanceM: number, distanceNm: number, initialCourse: number, finalCourse: number }
  rhumb: { distanceM: number, distanceNm: number, course: number }
  greatEllipse: { distanceM: number, distanceNm: number, initialCourse: number, finalCourse: number }
}

export interface DirectSolution { to: LatLon, finalCourse: number }

/** Geodesic (Karney 2013), rhumb line (Karney 2024) and great ellipse between two positions. */
export function inverseAllMethods(from: LatLon, to: LatLon): InverseAllMethods {
  const g = geodesicInverse(from, to)
  const r = rhumbInverse(from, to)
  const e = greatEllipseInverse(from, to)
  return {
    geodesic: { distanceM: g.distanceM, distanceNm: g.distanceNm, initialCourse: g.initialCourse, finalCourse: g.finalCourse },
    rhumb: { distanceM: r.distanceM, distanceNm: r.distanceNm, course: r.course },
    greatEllipse: { distanceM: e.distanceM, distanceNm: e.distanceNm, initialCourse: e.initialCourse, finalCourse: e.finalCourse },
  }
}

/** Position after a course and distance by geodesic or rhumb line; throws RhumbPoleError over a pole. */
export function directByMethod(from: LatLon, course: number, distanceM: number, method: LegMethod): DirectSolution {
  if (method === 'geodesic') {
    const g = geodesicDirect(from, course, distanceM)
    return { to: { lat: g.lat, lon: g.lon }, finalCourse: g.finalCourse }
  }
  const r = rhumbDirect(from, course, distanceM)
  return { to: { lat: r.lat, lon: r.lon }, finalCourse: r.course }
}

