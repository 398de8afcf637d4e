// Legs that follow a declared passage: every point of the leg (densified on its own method, rhumb
// or geodesic) lies within the passage's corridor round its fairway. The coarse coastline closes
// canals and narrow straits, so a land check reports such a leg as "through <passage>", not as land.
// Distances to the fairway are measured in a local equirectangular frame (nm), fine over a corridor.
import type { LatLon, LegMethod } from '../../types/geo'
import { normaliseLongitude } from '../position'
import { densifyLeg } from '../track'
import { PASSAGES } from './passages'
import type { Passage } from './passages'

/** Half-width of a fairway's corridor when the passage names none, nm (common practice: a canal or channel with room for a typed track). */
export const DEFAULT_CORRIDOR_NM = 1.5
const STEP_NM = 0.25
const RAD = Math.PI / 180

/** Distance (nm) from a point to a fairway polyline, in the point's local frame. */
export function fairwayDistanceNm(p: LatLon, fairway: readonly (readonly [number, number])[]): number {
  const cos = Math.cos(p.lat * RAD)
  let best = Infinity
  for (let i = 0; i + 1 < fairway.length; i++) {
    const [la1, lo1] = fairway[i]!, [la2, lo2] = fairway[i + 1]!
    const ax = normaliseLongitude(lo1 - p.lon) * cos * 60, ay = (la1 - p.lat) * 60
    const bx = normaliseLongitude(lo2 - p.lon) * cos * 60, by = (la2 - p.lat) * 60
    const vx = bx - ax, vy = by - ay, len2 = vx * vx + vy * vy
    const t = len2 > 0 ? Math.max(0, Math.min(1, -(ax * vx + ay * vy) / len2)) : 0
    best = Math.min(best, Math.hypot(ax + t * vx, ay + t * vy))
  }
  return best
}

/** The passage whose fairway corridor holds the whole leg, if any. */
export function passageOfLeg(from: LatLon, to: LatLon, method: LegMethod): Passage | null {
  let points: LatLon[] | undefined
  for (const p of PASSAGES) {
    if (!p.fairway) continue
    const corridor = p.corridorNm ?? DEFAULT_CORRIDOR_NM
    // Both ends first: most legs are near no fairway at all.
    if (fairwayDistanceNm(from, p.fairway) > corridor || fairwayDistanceNm(to, p.fairway) > corridor) continue
    points ??= densifyLeg(from, to, method, STEP_NM)
    if (points.every(q => fairwayDistanceNm(q, p.fairway!) <= corridor)) return p
  }
  return null
}
