// The ends of a sea route: a position the routing coastline puts ashore is moved to the nearest
// water (refused beyond MAX_END_MOVE_NM), then joined to the graph nodes it can see.
import { MAX_END_MOVE_NM } from '#shared/types/routing'
import { normaliseLongitude } from '#shared/utils/position'
import { nearestCoast, pointOnEdge } from '../land'
import { coastDistanceNm, isRoutingLand } from './coast'
import { localNm, nodesWithin } from './graphBuild'
import { CLEARANCE_PENALTY } from './search'
import type { Seed } from './search'
import type { SeaGraph } from './seaGraph'
import { legClear } from './visibility'

export interface RouteEnd { lat: number, lon: number, movedNm: number, clearNm: number }

export class EndError extends Error {
  constructor(readonly field: 'from' | 'to', message: string) { super(message) }
}

const OFFSHORE_STEPS_NM = [0.05, 0.15, 0.4, 1]

/** Where a position meets navigable water: itself when afloat, else just off the nearest coast. */
export function placeEnd(g: SeaGraph, field: 'from' | 'to', lat: number, lon: number): RouteEnd {
  const at = { lat, lon: normaliseLongitude(lon) }
  if (!isRoutingLand(g.land, at.lat, at.lon)) return { ...at, movedNm: 0, clearNm: coastDistanceNm(g.land, at.lat, at.lon, 50).nm }
  const near = nearestCoast(g.land, at, -1, MAX_END_MOVE_NM / 60 + 0.05)
  if (near.edge < 0) throw new EndError(field, `${field} lies more than ${MAX_END_MOVE_NM} nm from navigable water`)
  const coast = pointOnEdge(g.land, near)
  const e = near.edge, d = g.land.edges
  const cos = Math.cos((coast.lat * Math.PI) / 180)
  // Step off the coast along the edge's normal, on whichever side is water.
  const ex = (d[4 * e + 2]! - d[4 * e]!) * cos, ey = d[4 * e + 3]! - d[4 * e + 1]!
  const len = Math.hypot(ex, ey) || 1
  for (const step of OFFSHORE_STEPS_NM) {
    for (const side of [1, -1]) {
      const p = { lat: coast.lat + (side * ex / len) * (step / 60), lon: normaliseLongitude(coast.lon - (side * ey / len) * (step / 60) / cos) }
      if (isRoutingLand(g.land, p.lat, p.lon)) continue
      const movedNm = localNm(at.lat, at.lon, p.lat, p.lon)
      if (movedNm > MAX_END_MOVE_NM) break
      return { ...p, movedNm, clearNm: coastDistanceNm(g.land, p.lat, p.lon, 50).nm }
    }
  }
  throw new EndError(field, `${field} lies more than ${MAX_END_MOVE_NM} nm from navigable water`)
}

const JOIN_RADII_NM = [8, 20, 40]
const MAX_JOINS = 8

/** Graph nodes an end sees (clear of land), nearest first, with the cost of the joining leg. */
export function joinEnd(g: SeaGraph, end: RouteEnd, clearanceNm: number, limitLat: number): Seed[] {
  for (const radius of JOIN_RADII_NM) {
    const near = nodesWithin(g.index, end.lat, end.lon, radius)
      .filter(v => Math.abs(g.lat[v]!) <= limitLat)
      .map(v => ({ v, nm: localNm(end.lat, end.lon, g.lat[v]!, g.lon[v]!) }))
      .filter(c => c.nm <= radius).sort((a, b) => a.nm - b.nm)
    const seeds: Seed[] = []
    for (const { v, nm } of near) {
      if (seeds.length >= MAX_JOINS) break
      if (!legClear(g.sight, end.lat, end.lon, g.lat[v]!, g.lon[v]!, 0, limitLat)) continue
      const c = Math.min(end.clearNm, g.clearNm[v]!)
      seeds.push({ node: v, costNm: nm * (c >= clearanceNm ? 1 : 1 + CLEARANCE_PENALTY * (1 - c / clearanceNm)) })
    }
    if (seeds.length) return seeds
  }
  return []
}
