// Distance-table arithmetic (capability 9): approved plans matched to places by their end
// points, else the direct geodesic (Karney, "Algorithms for geodesics", J. Geodesy 87, 2013).
import { G, geod } from './engine/wgs84'
import type { TablePlace, TablePlan } from '../types/distanceTable'
import { NM_M } from './navConstants'
import type { LatLon, LegMethod } from '../types/geo'
import { legZoneDistances } from './zones/legZones'
import type { LegEndState } from './zones/legZones'
import type { PreparedZones } from './zones/prepare'

// A degree of latitude is never shorter than 59.7 nm on WGS84 (at the equator): a cheap lower bound.
const MIN_NM_PER_DEG_LAT = 59.6

/** Position of pair (i, j), i < j, in the upper-triangle layout of n places. */
export function pairIndex(i: number, j: number, n: number): number {
  if (i > j) [i, j] = [j, i]
  return i * n - (i * (i + 1)) / 2 + (j - i - 1)
}

export function pairCount(n: number): number {
  return (n * (n - 1)) / 2
}

/** Geodesic distance in nm, distance only (Karney 2013, §4). */
export function geodesicDistanceNm(lat1: number, lon1: number, lat2: number, lon2: number): number {
  return geod.Inverse(lat1, lon1, lat2, lon2, G.DISTANCE).s12! / NM_M
}

/** Indexes of the places within radiusNm of a point; the latitude bound spares most geodesic solutions. */
function placesNear(places: readonly TablePlace[], p: { lat: number, lon: number }, radiusNm: number): number[] {
  const out: number[] = []
  const maxDLat = radiusNm / MIN_NM_PER_DEG_LAT
  for (let i = 0; i < places.length; i++) {
    const q = places[i]!
    if (Math.abs(q.lat - p.lat) > maxDLat) continue
    if (geodesicDistanceNm(q.lat, q.lon, p.lat, p.lon) <= radiusNm) out.push(i)
  }
  return out
}

export interface PlanChoice { distanceNm: Float64Array, planId: Int32Array }

/**
 * For every pair, the shortest approved plan that starts within radiusNm of one place and ends
 * within radiusNm of the other (either direction); planId 0 where none does.
 * Work is plans × places for the end points, plus only the pairs a plan actually serves.
 */
export function choosePlans(places: readonly TablePlace[], plans: readonly TablePlan[], radiusNm: number): PlanChoice {
  const n = places.length
  const distanceNm = new Float64Array(pairCount(n)).fill(Infinity)
  const planId = new Int32Array(pairCount(n))
  for (const plan of plans) {
    const starts = placesNear(places, plan.start, radiusNm)
    if (!starts.length) continue
    const ends = placesNear(places, plan.end, radiusNm)
    for (const a of starts) {
      for (const b of ends) {
        if (a === b) continue
        const k = pairIndex(a, b, n)
        if (plan.distanceNm < distanceNm[k]!) { distanceNm[k] = plan.distanceNm; planId[k] = plan.id }
      }
    }
  }
  return { distanceNm, planId }
}

/** Fills rows [fromRow, toRow) of the upper triangle: the plan's distance where one was chosen, else the geodesic. */
export function fillRows(places: readonly TablePlace[], choice: PlanChoice, out: Float64Array, fromRow: number, toRow: number): void {
  const n = places.length
  for (let i = fromRow; i < toRow; i++) {
    const a = places[i]!
    let k = pairIndex(i, i + 1, n)
    for (let j = i + 1; j < n; j++, k++) {
      const b = places[j]!
      out[k] = choice.planId[k] ? choice.distanceNm[k]! : geodesicDistanceNm(a.lat, a.lon, b.lat, b.lon)
    }
  }
}

/** Rows to compute so each chunk holds about `pairs` pairs (rows get shorter down the triangle). */
export function rowChunks(n: number, pairs: number): [number, number][] {
  const chunks: [number, number][] = []
  let start = 0, count = 0
  for (let i = 0; i < n - 1; i++) {
    count += n - 1 - i
    if (count >= pairs || i === n - 2) { chunks.push([start, i + 1]); start = i + 1; count = 0 }
  }
  return chunks
}

/** The whole distance part of a table in one go (no land check): what the benchmark times. */
export function computeDistances(places: readonly TablePlace[], plans: readonly TablePlan[], radiusNm: number) {
  const choice = choosePlans(places, plans, radiusNm)
  const distanceNm = new Float64Array(pairCount(places.length))
  fillRows(places, choice, distanceNm, 0, places.length)
  return { choice, distanceNm }
}

/** Distance inside ECAs in force at `atMs` along legs joining the points, each by the method of the leg arriving at its end (as in the leg table). */
export function ecaAlongNm(prepared: PreparedZones, points: readonly (LatLon & { method: LegMethod })[], atMs: number): number {
  if (!prepared.zoneIndex) return 0
  let sum = 0
  let prev: LegEndState | undefined
  for (let i = 0; i + 1 < points.length; i++) {
    const end: LegEndState = new Map()
    for (const z of legZoneDistances(prepared, { from: points[i]!, to: points[i + 1]!, method: points[i + 1]!.method, startMs: atMs, endMs: atMs }, prev, end)) {
      if (z.kind === 'eca') sum += z.distanceNm
    }
    prev = end
  }
  return sum
}
