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

/** Landmark distance stored for nodes a landmark does not reach (seaGraph.ts). */
export const UNREACHED_NM = 1e7

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

/**
 * Rings searched for graph nodes an end can see. Offshore the quadtree leaves are up to 2° of
 * latitude (about 120 nm, wider in longitude at high latitudes), so a mid-ocean end may lie some
 * 100 nm from the nearest node; the outer rings reach well past that.
 */
const JOIN_RADII_NM = [8, 20, 40, 80, 160, 320]
const MAX_JOINS = 8
/** Line-of-sight tests an end may spend before giving up (each is cheap offshore, dear along a coast). */
const MAX_SIGHT_TESTS = 64

/** Graph nodes an end sees (clear of land), nearest first, with the cost of the joining leg. */
export function joinEnd(g: SeaGraph, end: RouteEnd, clearanceNm: number, limitLat: number): Seed[] {
  const tried = new Set<number>()
  for (const radius of JOIN_RADII_NM) {
    const near = nodesWithin(g.index, end.lat, end.lon, radius)
      .filter(v => !tried.has(v) && Math.abs(g.lat[v]!) <= limitLat)
      .map(v => ({ v, nm: localNm(end.lat, end.lon, g.lat[v]!, g.lon[v]!) }))
      .filter(c => c.nm <= radius).sort((a, b) => a.nm - b.nm)
    const seeds: Seed[] = []
    for (const { v, nm } of near) {
      if (seeds.length >= MAX_JOINS || tried.size >= MAX_SIGHT_TESTS) break
      tried.add(v)
      if (!legClear(g.sight, end.lat, end.lon, g.lat[v]!, g.lon[v]!, 0, limitLat)) continue
      const c = Math.min(end.clearNm, g.clearNm[v]!)
      seeds.push({ node: v, costNm: nm * (c >= clearanceNm ? 1 : 1 + CLEARANCE_PENALTY * (1 - c / clearanceNm)) })
    }
    if (seeds.length || tried.size >= MAX_SIGHT_TESTS) return seeds
  }
  return []
}

/**
 * An end placed in water no graph node can see from it (a lagoon the coarse coastline closes):
 * moved onto the nearest graph node within MAX_END_MOVE_NM of the position asked for, if any.
 */
export function endOnNearestNode(g: SeaGraph, field: 'from' | 'to', lat: number, lon: number, limitLat: number, usable: (v: number) => boolean = () => true): { end: RouteEnd, seeds: Seed[] } {
  const near = nodesWithin(g.index, lat, lon, MAX_END_MOVE_NM)
    .filter(v => Math.abs(g.lat[v]!) <= limitLat && !g.nodePassage[v] && usable(v))
    .map(v => ({ v, nm: localNm(lat, lon, g.lat[v]!, g.lon[v]!) }))
    .filter(c => c.nm <= MAX_END_MOVE_NM).sort((a, b) => a.nm - b.nm)
  const best = near[0]
  if (!best) throw new EndError(field, `${field} lies more than ${MAX_END_MOVE_NM} nm from navigable water the sea graph reaches`)
  const v = best.v
  return { end: { lat: g.lat[v]!, lon: g.lon[v]!, movedNm: best.nm, clearNm: g.clearNm[v]! }, seeds: [{ node: v, costNm: 0 }] }
}

/** A route end placed on navigable water and joined to the graph: the nodes it sees, else the nearest node within reach. */
export function joinedEnd(g: SeaGraph, field: 'from' | 'to', lat: number, lon: number, clearanceNm: number, limitLat: number): { end: RouteEnd, seeds: Seed[] } {
  const end = placeEnd(g, field, lat, lon)
  const seeds = joinEnd(g, end, clearanceNm, limitLat)
  return seeds.length ? { end, seeds } : endOnNearestNode(g, field, lat, lon, limitLat)
}

/** Whether a node belongs to the graph's main body of water (the one its landmarks lie in), not a lagoon or lake the coastline closes. */
export function onMainWater(g: SeaGraph, v: number): boolean {
  const L = g.landmarks.length
  return L === 0 || g.landmarkNm[v * L]! < UNREACHED_NM
}

/**
 * An end joined only to water the coastline closes off (a sound whose mouth the coarse coastline
 * shuts): moved onto the nearest node of the main body of water within MAX_END_MOVE_NM, if any.
 */
export function rejoinedOnMainWater(g: SeaGraph, field: 'from' | 'to', lat: number, lon: number, joined: { end: RouteEnd, seeds: Seed[] }, limitLat: number): { end: RouteEnd, seeds: Seed[] } | null {
  if (joined.seeds.some(s => onMainWater(g, s.node))) return null
  try { return endOnNearestNode(g, field, lat, lon, limitLat, v => onMainWater(g, v)) }
  catch (e) {
    if (e instanceof EndError) return null
    throw e
  }
}
