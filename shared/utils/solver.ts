// One call per geodesy question, as the API and the quick solver ask them.
import type { LatLon, LegMethod } from '../types/geo'
import { geodesicDirect, geodesicInverse, geodesicVertex, type GeodesicVertex } from './geodesic'
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


export type SolverVertexAnswer =
  | { kind: 'same' }
  | { kind: 'equator' }
  | { kind: 'vertex', vertex: GeodesicVertex }

const EQUATOR_EPS_DEG = 1e-9

/**
 * The vertex question as a navigator asks it (Clairaut's relation, via geodesicVertex): two identical
 * positions have no track; a geodesic along the equator (course 090°/270° at 0°) has every point at the
 * same latitude, so no vertex; otherwise the highest latitude of the great-circle-like line.
 */
export function solverVertex(from: LatLon, to: LatLon): SolverVertexAnswer {
  const g = geodesicInverse(from, to)
  if (g.distanceM < 1e-3) return { kind: 'same' }
  const alongEquator = Math.abs(from.lat) < EQUATOR_EPS_DEG && Math.abs(to.lat) < EQUATOR_EPS_DEG
    && Math.abs(Math.abs(g.initialCourse - 180) - 90) < 1e-6
  if (alongEquator) return { kind: 'equator' }
  return { kind: 'vertex', vertex: geodesicVertex(from, to) }
}
