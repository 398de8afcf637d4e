// A sea route between two positions: ends placed on navigable water and joined to the graph, A*
// over the graph under the clearance, limiting latitude, avoided passages and areas, then the path
// smoothed into geodesic legs. distanceNm is the sum of Karney geodesics between the waypoints.
import { G, geod } from '#shared/utils/engine/wgs84'
import { normaliseLongitude } from '#shared/utils/position'
import {
  DEFAULT_ROUTE_CLEARANCE_NM, DEFAULT_ROUTE_LIMIT_LAT,
  type RouteWaypoint, type SeaRouteOptions, type SeaRouteResult,
} from '#shared/types/routing'
import { PASSAGES } from '#shared/utils/routing/passages'
import type { LatLon } from '#shared/types/geo'
import { prepareAreas } from './areas'
import type { PreparedAreas } from './areas'
import { coastDistanceNm } from './coast'
import { EndError, joinedEnd, rejoinedOnMainWater } from './ends'
import type { RouteEnd } from './ends'
import { aStar } from './search'
import type { CostModel, Seed } from './search'
import type { SeaGraph } from './seaGraph'
import { smoothPath } from './smooth'
import type { PathPoint } from './smooth'
import { legClear, rasterLowerBoundNm } from './visibility'

export class NoRouteError extends Error {}

export interface RouteQuery {
  clearanceNm: number
  limitLat: number
  avoid: Set<number>
  areas: PreparedAreas
  model: CostModel
  crossesAvoided: (lat1: number, lon1: number, lat2: number, lon2: number) => boolean
  release: () => void
}

function gateCrossed(p: number, lat1: number, lon1: number, lat2: number, lon2: number): boolean {
  const [[la1, lo1], [la2, lo2]] = PASSAGES[p]!.gate
  const x2 = lon1 + normaliseLongitude(lon2 - lon1)
  const o = (ax: number, ay: number, bx: number, by: number, cx: number, cy: number) => (bx - ax) * (cy - ay) - (by - ay) * (cx - ax)
  return (o(lo1, la1, lo2, la2, lon1, lat1) > 0) !== (o(lo1, la1, lo2, la2, x2, lat2) > 0)
    && (o(lon1, lat1, x2, lat2, lo1, la1) > 0) !== (o(lon1, lat1, x2, lat2, lo2, la2) > 0)
}

const blockedByGraph = new WeakMap<SeaGraph, Uint8Array>()

/** The cost model of one query; call release() when done (the blocked-edge flags are shared per graph). */
export function prepareQuery(g: SeaGraph, opts: SeaRouteOptions): RouteQuery {
  const clearanceNm = opts.clearanceNm ?? DEFAULT_ROUTE_CLEARANCE_NM
  const limitLat = opts.limitLat ?? DEFAULT_ROUTE_LIMIT_LAT
  const avoid = new Set((opts.avoid ?? []).map(id => PASSAGES.findIndex(p => p.id === id)).filter(i => i >= 0))
  const areas = prepareAreas(g, opts.areas)
  let blocked = blockedByGraph.get(g)
  if (!blocked) { blocked = new Uint8Array(g.targets.length); blockedByGraph.set(g, blocked) }
  const marked: number[] = []
  const mark = (k: number) => { if (!blocked![k]) { blocked![k] = 1; marked.push(k) } }
  for (const p of avoid) for (const k of g.gateEdges[p]!) mark(k)
  if (avoid.size) {
    for (let k = 0; k < g.passage.length; k++) if (g.passage[k] && avoid.has(g.passage[k]! - 1)) mark(k)
    // An avoided passage's fairway nodes are left out altogether: no edge into or out of them.
    for (let u = 0; u < g.nodeCount; u++) {
      if (!g.nodePassage[u] || !avoid.has(g.nodePassage[u]! - 1)) continue
      for (let k = g.offsets[u]!; k < g.offsets[u + 1]!; k++) {
        mark(k)
        const back = edgeBetween(g, g.targets[k]!, u)
        if (back >= 0) mark(back)
      }
    }
  }
  for (const k of areas.blockedEdges) mark(k)
  const crossesAvoided = (lat1: number, lon1: number, lat2: number, lon2: number) => {
    for (const p of avoid) if (gateCrossed(p, lat1, lon1, lat2, lon2)) return true
    return false
  }
  return {
    clearanceNm, limitLat, avoid, areas, crossesAvoided,
    model: { clearanceNm: Math.max(clearanceNm, 0.01), limitLat, blockedEdge: marked.length ? blocked : undefined, nodeFactor: areas.nodeFactor },
    release: () => { for (const k of marked) blocked![k] = 0 },
  }
}

function edgeBetween(g: SeaGraph, u: number, v: number): number {
  for (let k = g.offsets[u]!; k < g.offsets[u + 1]!; k++) if (g.targets[k] === v) return k
  return -1
}

export function karneyNm(a: LatLon, b: LatLon): number {
  return geod.Inverse(a.lat, a.lon, b.lat, b.lon, G.DISTANCE).s12! / 1852
}

/** Closest approach (nm) of the legs to the coastline, legs inside a passage's fairway left out; exact where the raster cannot rule land out. */
function minClearance(g: SeaGraph, pts: RouteWaypoint[], capNm: number): number {
  let best = capNm
  for (let i = 0; i + 1 < pts.length; i++) {
    const a = pts[i]!, b = pts[i + 1]!
    if (a.passageId && a.passageId === b.passageId) continue
    const line = geod.InverseLine(a.lat, a.lon, b.lat, b.lon, G.LATITUDE | G.LONGITUDE | G.DISTANCE_IN)
    const n = Math.max(1, Math.ceil(line.s13 / 1852))
    let hint = -1
    for (let k = 0; k <= n; k++) {
      const p = k === 0 ? { lat2: a.lat, lon2: a.lon } : k === n ? { lat2: b.lat, lon2: b.lon } : line.Position((line.s13 * k) / n, G.LATITUDE | G.LONGITUDE)
      if (rasterLowerBoundNm(g.raster, p.lat2!, p.lon2!) >= best) continue
      const c = coastDistanceNm(g.land, p.lat2!, p.lon2!, best, hint)
      hint = c.edge
      if (c.nm < best) best = c.nm
    }
  }
  return best
}

function viaOf(pts: RouteWaypoint[]): { id: string, name: string }[] {
  // Where along the route (leg index + fraction) each passage is first met: its first fairway waypoint, or its gate crossed.
  const metAt = new Map<number, number>()
  const meet = (pi: number, at: number) => { if (!(metAt.get(pi)! <= at)) metAt.set(pi, at) }
  pts.forEach((w, i) => { if (w.passageId) meet(PASSAGES.findIndex(p => p.id === w.passageId), i) })
  for (let i = 0; i + 1 < pts.length; i++) {
    const a = pts[i]!, b = pts[i + 1]!
    const line = geod.InverseLine(a.lat, a.lon, b.lat, b.lon, G.LATITUDE | G.LONGITUDE | G.DISTANCE_IN)
    const n = Math.max(1, Math.ceil(line.s13 / 1852 / 20))
    let prev = { lat: a.lat, lon: a.lon }
    for (let k = 1; k <= n; k++) {
      const p = k === n ? { lat: b.lat, lon: b.lon } : (({ lat2, lon2 }) => ({ lat: lat2!, lon: lon2! }))(line.Position((line.s13 * k) / n, G.LATITUDE | G.LONGITUDE))
      PASSAGES.forEach((_, pi) => { if (gateCrossed(pi, prev.lat, prev.lon, p.lat, p.lon)) meet(pi, i + (k - 0.5) / n) })
      prev = p
    }
  }
  // In the order the route meets them.
  return [...metAt.entries()].sort((x, y) => x[1] - y[1]).map(([pi]) => ({ id: PASSAGES[pi]!.id, name: PASSAGES[pi]!.name }))
}

/** How far beside a declared passage's fairway an end may lie and still join it at its nearest point, nm. */
const FAIRWAY_FOOT_NM = 6

/** Where an end beside a fairway meets it: the foot on the nearest fairway leg, and seeds to both ends of that leg through it. */
export interface FairwayFoot { lat: number, lon: number, passage: number, seeds: Seed[] }

const fairwayStart = new WeakMap<SeaGraph, Map<number, number>>()

/** The nearest point of a fairway leg within FAIRWAY_FOOT_NM of the end, in sight of it, off avoided passages; null when none. */
export function fairwayFoot(g: SeaGraph, q: RouteQuery, end: RouteEnd): FairwayFoot | null {
  let starts = fairwayStart.get(g)
  if (!starts) {
    starts = new Map()
    for (let v = 0; v < g.nodeCount; v++) if (g.nodePassage[v] && !starts.has(g.nodePassage[v]!)) starts.set(g.nodePassage[v]!, v)
    fairwayStart.set(g, starts)
  }
  const k = Math.cos((end.lat * Math.PI) / 180)
  let best: { nm: number, lat: number, lon: number, pi: number, a: number, b: number } | null = null
  PASSAGES.forEach((p, pi) => {
    if (!p.fairway || q.avoid.has(pi) || !starts.has(pi + 1)) return
    const first = starts.get(pi + 1)!
    for (let s = 0; s + 1 < p.fairway.length; s++) {
      const [la1, lo1] = p.fairway[s]!, [la2, lo2] = p.fairway[s + 1]!
      const ax = normaliseLongitude(lo1 - end.lon) * k, ay = la1 - end.lat
      const bx = normaliseLongitude(lo2 - end.lon) * k, by = la2 - end.lat
      const dx = bx - ax, dy = by - ay
      const t = Math.max(0, Math.min(1, -(ax * dx + ay * dy) / (dx * dx + dy * dy || 1)))
      const fx = ax + t * dx, fy = ay + t * dy
      const nm = Math.hypot(fx, fy) * 60
      if (t > 0 && t < 1 && nm <= FAIRWAY_FOOT_NM && (!best || nm < best.nm)) {
        best = { nm, lat: end.lat + fy, lon: normaliseLongitude(end.lon + fx / k), pi, a: first + s, b: first + s + 1 }
      }
    }
  })
  const f = best as { nm: number, lat: number, lon: number, pi: number, a: number, b: number } | null
  if (!f || !legClear(g.sight, end.lat, end.lon, f.lat, f.lon, 0, q.limitLat)) return null
  const along = (v: number) => karneyNm(f, { lat: g.lat[v]!, lon: g.lon[v]! })
  return { lat: f.lat, lon: f.lon, passage: f.pi + 1, seeds: [{ node: f.a, costNm: f.nm + along(f.a) }, { node: f.b, costNm: f.nm + along(f.b) }] }
}

function legsNm(w: RouteWaypoint[]): number {
  let nm = 0
  for (let i = 0; i + 1 < w.length; i++) nm += karneyNm(w[i]!, w[i + 1]!)
  return nm
}

/** The foot to insert beside an end when the path joins the graph through it (its seed is the cheapest for the path's node). */
function footUsed(foot: FairwayFoot | null, seeds: Seed[], node: number): FairwayFoot | null {
  if (!foot) return null
  const viaFoot = foot.seeds.find(s => s.node === node)
  if (!viaFoot) return null
  return seeds.every(s => s.node !== node || s.costNm >= viaFoot.costNm) ? foot : null
}

/** The waypoints of a route through the graph path between two placed ends (by a fairway's foot beside an end, where given). */
export function routeThrough(g: SeaGraph, q: RouteQuery, from: RouteEnd, to: RouteEnd, nodes: number[], feet: { from?: FairwayFoot | null, to?: FairwayFoot | null } = {}): RouteWaypoint[] {
  const footPoint = (f: FairwayFoot) => ({ lat: f.lat, lon: f.lon, fixed: true, passage: f.passage })
  const points: (PathPoint & { passage: number })[] = [
    { lat: from.lat, lon: from.lon, fixed: false, passage: 0 },
    ...(feet.from ? [footPoint(feet.from)] : []),
    ...nodes.map(v => ({ lat: g.lat[v]!, lon: g.lon[v]!, fixed: g.nodePassage[v]! > 0, passage: g.nodePassage[v]! })),
    ...(feet.to ? [footPoint(feet.to)] : []),
    { lat: to.lat, lon: to.lon, fixed: false, passage: 0 },
  ]
  const segmentClearNm: number[] = []
  segmentClearNm.push(Math.min(from.clearNm, g.clearNm[nodes[0]!]!))
  if (feet.from) segmentClearNm.push(0)
  for (let i = 0; i + 1 < nodes.length; i++) segmentClearNm.push(g.edgeClearNm[edgeBetween(g, nodes[i]!, nodes[i + 1]!)] ?? 0)
  if (feet.to) segmentClearNm.push(0)
  segmentClearNm.push(Math.min(to.clearNm, g.clearNm[nodes[nodes.length - 1]!]!))
  const kept = smoothPath(points, { sight: g.sight, clearanceNm: q.clearanceNm, limitLat: q.limitLat, segmentClearNm, crossesAvoided: q.crossesAvoided, areas: q.areas })
  const counters = new Map<number, number>()
  let n = 0
  return kept.map((i, k) => {
    const p = points[i]!
    let name: string
    if (k === 0) name = 'Departure'
    else if (k === kept.length - 1) name = 'Arrival'
    else if (p.passage) {
      const c = (counters.get(p.passage) ?? 0) + 1
      counters.set(p.passage, c)
      name = `${PASSAGES[p.passage - 1]!.name} ${c}`
    }
    else name = `SR ${String(++n).padStart(2, '0')}`
    const w: RouteWaypoint = { name, lat: p.lat, lon: normaliseLongitude(p.lon), method: 'geodesic' }
    if (p.passage) w.passageId = PASSAGES[p.passage - 1]!.id
    return w
  })
}

/** The answer for a list of waypoints (distances by Karney's geodesics). */
export function describeRoute(g: SeaGraph, q: RouteQuery, waypoints: RouteWaypoint[], moved: SeaRouteResult['moved']): SeaRouteResult {
  let distanceNm = 0
  for (let i = 0; i + 1 < waypoints.length; i++) distanceNm += karneyNm(waypoints[i]!, waypoints[i + 1]!)
  return {
    distanceNm, distanceM: distanceNm * 1852, geodesicNm: karneyNm(waypoints[0]!, waypoints[waypoints.length - 1]!),
    via: viaOf(waypoints), waypoints, moved, minClearanceNm: minClearance(g, waypoints, 50),
    clearanceNm: q.clearanceNm, limitLat: q.limitLat,
  }
}

export function seaRoute(g: SeaGraph, fromPos: LatLon, toPos: LatLon, opts: SeaRouteOptions = {}): SeaRouteResult {
  const q = prepareQuery(g, opts)
  try {
    for (const [field, p] of [['from', fromPos], ['to', toPos]] as const) {
      if (Math.abs(p.lat) > q.limitLat) throw new EndError(field, `${field} lies beyond the limiting latitude ${q.limitLat}°`)
    }
    let a = joinedEnd(g, 'from', fromPos.lat, fromPos.lon, q.clearanceNm, q.limitLat)
    let b = joinedEnd(g, 'to', toPos.lat, toPos.lon, q.clearanceNm, q.limitLat)
    let path = aStar(g, a.seeds, b.seeds, b.end, q.model)
    if (!path) {
      // An end in water the coarse coastline closes off is moved onto the main body of water nearby.
      const a2 = rejoinedOnMainWater(g, 'from', fromPos.lat, fromPos.lon, a, q.limitLat)
      const b2 = rejoinedOnMainWater(g, 'to', toPos.lat, toPos.lon, b, q.limitLat)
      if (a2 || b2) {
        a = a2 ?? a; b = b2 ?? b
        path = aStar(g, a.seeds, b.seeds, b.end, q.model)
      }
    }
    if (!path) throw new NoRouteError('No sea route joins from and to under these settings')
    const moved: SeaRouteResult['moved'] = {}
    if (a.end.movedNm > 0) moved.from = a.end.movedNm
    if (b.end.movedNm > 0) moved.to = b.end.movedNm
    // An end beside a fairway joins it at its nearest point, not at a fairway point behind it.
    const fa = fairwayFoot(g, q, a.end), fb = fairwayFoot(g, q, b.end)
    if (fa || fb) {
      const viaFeet = aStar(g, [...a.seeds, ...(fa?.seeds ?? [])], [...b.seeds, ...(fb?.seeds ?? [])], b.end, q.model)
      if (viaFeet) {
        const feet = { from: footUsed(fa, a.seeds, viaFeet.nodes[0]!), to: footUsed(fb, b.seeds, viaFeet.nodes.at(-1)!) }
        if (feet.from || feet.to) {
          // The shorter of the two once smoothed: the fairway costs no clearance penalty, so its path may cost less and sail further.
          const plain = routeThrough(g, q, a.end, b.end, path.nodes), byFoot = routeThrough(g, q, a.end, b.end, viaFeet.nodes, feet)
          return describeRoute(g, q, legsNm(byFoot) < legsNm(plain) ? byFoot : plain, moved)
        }
      }
    }
    return describeRoute(g, q, routeThrough(g, q, a.end, b.end, path.nodes), moved)
  }
  finally { q.release() }
}
