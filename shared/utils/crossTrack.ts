// Cross-track and along-track distance of a position from a geodesic leg: the foot of the
// perpendicular geodesic found by iteration (Baselga & Martínez-Llario, "Intersection and point-to-line
// solutions for geodesics on the ellipsoid", Stud. Geophys. Geod. 62, 2018; spherical step as in
// Karney, "Geodesics on an ellipsoid of revolution", 2011, §8).
import { G, geod } from './engine/wgs84'
import type { LatLon } from '../types/geo'
import { RAD_PER_DEG, WGS84_A } from './navConstants'

export interface CrossTrackResult {
  /** Distance from the track, metres; positive to starboard (right of the track). */
  crossTrackM: number
  /** Distance from the start of the leg to the foot of the perpendicular, metres (negative: behind the start). */
  alongTrackM: number
  foot: LatLon
  iterations: number
}

/** Foot of the perpendicular from `position` to the geodesic from → to; steps b = atan2(sin c · cos Δα, cos c) until below 1 µm. */
export function crossTrack(from: LatLon, to: LatLon, position: LatLon): CrossTrackResult {
  const line = geod.InverseLine(from.lat, from.lon, to.lat, to.lon, G.LATITUDE | G.LONGITUDE | G.AZIMUTH | G.DISTANCE_IN)
  if (line.s13 === 0) {
    // A leg without length has no direction: the distance from its start, unsigned.
    const d = geod.Inverse(from.lat, from.lon, position.lat, position.lon, G.DISTANCE).s12!
    return { crossTrackM: d, alongTrackM: 0, foot: { lat: from.lat, lon: from.lon }, iterations: 0 }
  }
  let s = 0
  let xt = 0
  let foot: LatLon = { lat: from.lat, lon: from.lon }
  let i = 0
  for (; i < 50; i++) {
    const x = line.Position(s, G.LATITUDE | G.LONGITUDE | G.AZIMUTH)
    const inv = geod.Inverse(x.lat2!, x.lon2!, position.lat, position.lon, G.DISTANCE | G.AZIMUTH)
    const dAz = (inv.azi1! - x.azi2!) * RAD_PER_DEG
    const c = inv.s12! / WGS84_A
    const step = WGS84_A * Math.atan2(Math.sin(c) * Math.cos(dAz), Math.cos(c))
    foot = { lat: x.lat2!, lon: x.lon2! }
    xt = inv.s12! * (Math.sin(dAz) >= 0 ? 1 : -1)
    if (inv.s12! === 0) break
    s += step
    if (Math.abs(step) < 1e-6) break
  }
  return { crossTrackM: xt, alongTrackM: s, foot, iterations: i + 1 }
}
