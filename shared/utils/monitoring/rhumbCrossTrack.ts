// Cross-track and along-track distance of a position from a rhumb-line leg on WGS84: the point of the
// rhumb line nearest to the position, where the geodesic to the position meets the line at a right
// angle (the foot-of-perpendicular step of Baselga & Martínez-Llario 2018 applied along the rhumb
// line of Karney 2024). On a parallel the foot lies on the position's meridian and the distance is
// the meridian arc (Snyder, USGS PP 1395, eq. 3-21).
import { G, geod } from '../engine/wgs84'
import type { LatLon } from '../../types/geo'
import { RAD_PER_DEG, WGS84_A } from '../navConstants'
import { normaliseLongitude } from '../position'
import { meridianDistanceM, rhumbInverse, rhumbLine, rhumbLinePosition, type RhumbLine } from '../rhumb'
import { RECTIFYING_RADIUS_M } from '../engine/auxLatitude'
import type { CrossTrackResult } from '../crossTrack'

/** Along-track range in which the extended rhumb line stays clear of the poles, metres. */
function poleSafeRange(line: RhumbLine): [number, number] {
  if (line.calp === 0) return [-Infinity, Infinity]
  const margin = 1 - 1e-9
  const toNorth = (Math.PI / 2 - line.mu1) * RECTIFYING_RADIUS_M / line.calp * margin
  const toSouth = (-Math.PI / 2 - line.mu1) * RECTIFYING_RADIUS_M / line.calp * margin
  return [Math.min(toNorth, toSouth), Math.max(toNorth, toSouth)]
}

/** Along a parallel: foot on the position's meridian, cross-track the meridian arc (Snyder 1987, eq. 3-21). */
function parallelCrossTrack(line: RhumbLine, position: LatLon): CrossTrackResult {
  const dLon = normaliseLongitude(position.lon - line.lon1) * RAD_PER_DEG
  const alongTrackM = line.salp * dLon * line.r1
  const arc = meridianDistanceM(line.lat1, position.lat)
  // Eastbound, north is to port; westbound, north is to starboard.
  const crossTrackM = position.lat === line.lat1 ? 0 : -line.salp * Math.sign(position.lat - line.lat1) * arc
  return { crossTrackM, alongTrackM, foot: { lat: line.lat1, lon: normaliseLongitude(position.lon) }, iterations: 1 }
}

/** Foot of the perpendicular from `position` to the rhumb line from → to; steps b = atan2(sin c · cos Δα, cos c) until below 1 µm. */
export function rhumbCrossTrack(from: LatLon, to: LatLon, position: LatLon): CrossTrackResult {
  const { course, distanceM } = rhumbInverse(from, to)
  if (distanceM === 0) {
    const d = geod.Inverse(from.lat, from.lon, position.lat, position.lon, G.DISTANCE).s12!
    return { crossTrackM: d, alongTrackM: 0, foot: { lat: from.lat, lon: from.lon }, iterations: 0 }
  }
  const line = rhumbLine(from, course)
  if (line.calp === 0) return parallelCrossTrack(line, position)
  const [lo, hi] = poleSafeRange(line)
  let s = 0
  let xt = 0
  let foot: LatLon = { lat: from.lat, lon: from.lon }
  let i = 0
  for (; i < 100; i++) {
    const x = rhumbLinePosition(line, s)
    const inv = geod.Inverse(x.lat, x.lon, position.lat, position.lon, G.DISTANCE | G.AZIMUTH)
    const dAz = (inv.azi1! - course) * RAD_PER_DEG
    const c = inv.s12! / WGS84_A
    const step = WGS84_A * Math.atan2(Math.sin(c) * Math.cos(dAz), Math.cos(c))
    foot = { lat: x.lat, lon: x.lon }
    xt = inv.s12! * (Math.sin(dAz) >= 0 ? 1 : -1)
    if (inv.s12! === 0 || Math.abs(step) < 1e-6) break
    const next = Math.min(hi, Math.max(lo, s + step))
    if (next === s) break
    s = next
  }
  return { crossTrackM: xt, alongTrackM: s, foot, iterations: i + 1 }
}
