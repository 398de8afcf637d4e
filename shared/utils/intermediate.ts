// Intermediate waypoints on a geodesic leg: where it crosses meridians at multiples of N°, or every
// N nm (common practice); the geodesic by geographiclib-geodesic (Karney 2013), meridian crossings by
// Newton's method with dλ/ds = sin α / (ν cos φ) (Karney 2013, eq. 4 and §2).
import { G, geod } from './engine/wgs84'
import type { LatLon } from '../types/geo'
import { DEG_PER_RAD, NM_M, RAD_PER_DEG, WGS84_A, WGS84_E2 } from './navConstants'
import { normaliseLongitude } from './position'

const MASK = G.LATITUDE | G.LONGITUDE | G.AZIMUTH | G.LONG_UNROLL

type Line = ReturnType<typeof geod.InverseLine>

/** Distance along the line where its unrolled longitude equals target (Newton's method). */
function solveLongitude(line: Line, target: number, guess: number): { s: number, point: LatLon } {
  let s = guess
  let p = line.Position(s, MASK)
  for (let i = 0; i < 30; i++) {
    const phi = p.lat2! * RAD_PER_DEG
    const nuCos = WGS84_A * Math.cos(phi) / Math.sqrt(1 - WGS84_E2 * Math.sin(phi) ** 2)
    const dLonDs = Math.sin(p.azi2! * RAD_PER_DEG) / nuCos * DEG_PER_RAD
    const ds = (target - p.lon2!) / dLonDs
    s = Math.min(line.s13, Math.max(0, s + ds))
    p = line.Position(s, MASK)
    if (Math.abs(ds) < 1e-7) break
  }
  return { s, point: { lat: p.lat2!, lon: normaliseLongitude(target) } }
}

/** Intermediate points (ends excluded) where the geodesic from → to crosses meridians at multiples of everyDeg. */
export function intermediateAtMeridians(from: LatLon, to: LatLon, everyDeg: number): LatLon[] {
  if (!(everyDeg > 0 && everyDeg <= 180)) throw new RangeError('meridian interval must be between 0° and 180°')
  const line = geod.InverseLine(from.lat, from.lon, to.lat, to.lon, MASK | G.DISTANCE_IN)
  if (Math.abs(line.salp1 * Math.cos(from.lat * RAD_PER_DEG)) < 1e-12) return [] // meridional: one longitude
  const end = line.Position(line.s13, MASK).lon2!
  const lo = Math.min(from.lon, end)
  const hi = Math.max(from.lon, end)
  const out: LatLon[] = []
  const dir = end >= from.lon ? 1 : -1
  const first = dir > 0 ? Math.floor(lo / everyDeg) + 1 : Math.ceil(hi / everyDeg) - 1
  for (let k = first; dir > 0 ? k * everyDeg < hi : k * everyDeg > lo; k += dir) {
    const target = k * everyDeg
    if (Math.abs(target - from.lon) < 1e-9 || Math.abs(target - end) < 1e-9) continue
    const guess = line.s13 * (target - from.lon) / (end - from.lon)
    out.push(solveLongitude(line, target, guess).point)
  }
  return out
}

/** Intermediate points (ends excluded) every everyNm along the geodesic from → to. */
export function intermediateEveryNm(from: LatLon, to: LatLon, everyNm: number): LatLon[] {
  if (!(everyNm > 0)) throw new RangeError('interval must be greater than 0 nm')
  const line = geod.InverseLine(from.lat, from.lon, to.lat, to.lon, G.LATITUDE | G.LONGITUDE | G.DISTANCE_IN)
  const out: LatLon[] = []
  const step = everyNm * NM_M
  if (line.s13 / step > 100_000) throw new RangeError('interval too small for this leg')
  for (let s = step; s < line.s13 - 1; s += step) {
    const p = line.Position(s, G.LATITUDE | G.LONGITUDE)
    out.push({ lat: p.lat2!, lon: p.lon2! })
  }
  return out
}
