// Smoothing a graph path into legs as long as the clearance allows (greedy string pulling with a
// galloping search for the farthest point each anchor sees): a shortcut is taken only when its
// geodesic keeps at least the clearance the path already had there (never more than asked for),
// stays under the limiting latitude, crosses no avoided passage or blocked area and costs no more
// inside weighted areas. Fairway points are kept as they are.
import { normaliseLongitude } from '#shared/utils/position'
import type { PreparedAreas } from './areas'
import { legClear } from './visibility'
import type { Sight } from './visibility'

export interface PathPoint { lat: number, lon: number, fixed: boolean }

export interface SmoothRules {
  sight: Sight
  clearanceNm: number
  limitLat: number
  /** Clearance of the path's segment i → i + 1, nm. */
  segmentClearNm: number[]
  /** Whether a planar chord crosses an avoided passage's gate. */
  crossesAvoided: (lat1: number, lon1: number, lat2: number, lon2: number) => boolean
  areas: PreparedAreas
}

/** Clearance tolerance: a shortcut may come this much closer than the path it replaces. */
const TOLERANCE_NM = 0.5
const AREA_STEP_NM = 5

function weightedNm(a: PathPoint, b: PathPoint, areas: PreparedAreas): number {
  const dLon = normaliseLongitude(b.lon - a.lon)
  const nm = Math.hypot((b.lat - a.lat) * 60, dLon * 60 * Math.cos(((a.lat + b.lat) / 2) * Math.PI / 180))
  const n = Math.max(1, Math.ceil(nm / AREA_STEP_NM))
  let sum = 0
  for (let i = 0; i < n; i++) {
    const t = (i + 0.5) / n
    sum += areas.factorAt(a.lat + t * (b.lat - a.lat), a.lon + t * dLon)
  }
  return (nm * sum) / n
}

export function smoothPath(points: PathPoint[], rules: SmoothRules): number[] {
  const last = points.length - 1
  const minClear = (i: number, j: number) => {
    let c = rules.clearanceNm
    for (let k = i; k < j; k++) if (rules.segmentClearNm[k]! < c) c = rules.segmentClearNm[k]!
    return c
  }
  const sees = (i: number, j: number) => {
    const a = points[i]!, b = points[j]!
    if (rules.crossesAvoided(a.lat, a.lon, b.lat, b.lon)) return false
    if (rules.areas.any) {
      if (rules.areas.cutsBlocked(a.lat, a.lon, b.lat, b.lon)) return false
      let path = 0
      for (let k = i; k < j; k++) path += weightedNm(points[k]!, points[k + 1]!, rules.areas)
      if (weightedNm(a, b, rules.areas) > path * 1.0001 + 0.01) return false
    }
    return legClear(rules.sight, a.lat, a.lon, b.lat, b.lon, Math.max(0, minClear(i, j) - TOLERANCE_NM), rules.limitLat)
  }
  const kept = [0]
  let i = 0
  while (i < last) {
    let stop = i + 1
    while (stop < last && !points[stop]!.fixed) stop++
    if (points[i]!.fixed && points[i + 1]!.fixed) { kept.push(i + 1); i++; continue }
    // Gallop: the farthest j ≤ stop this anchor sees, probing i+2, i+4, i+8, … then bisecting.
    let good = i + 1, step = 1
    while (good < stop) {
      const probe = Math.min(stop, good + step)
      if (!sees(i, probe)) {
        let lo = good, hi = probe
        while (hi - lo > 1) {
          const mid = (lo + hi) >> 1
          if (sees(i, mid)) lo = mid
          else hi = mid
        }
        good = lo
        break
      }
      good = probe
      step *= 2
    }
    kept.push(good)
    i = good
  }
  return kept
}
