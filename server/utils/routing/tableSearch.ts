// Sea distances for distance tables: one Dijkstra per origin over the navigable graph costed once
// for the table (tableGraph.ts), run until every later place's joining nodes are settled, instead
// of one A* per pair. Each pair's graph path is then pulled straight into geodesic legs by the
// router's own smoothing (smoothPath, the rules of a single sea route), window by window: the path
// is cut at nodes chosen by their number alone, so a stretch of water between two cut nodes is
// smoothed once for the whole table and reused by every pair whose path runs through it. The passages come from the path's fairway nodes and the gates its edges cut, in the order
// the route meets them.
import type { SeaRouteOptions } from '#shared/types/routing'
import { PASSAGES } from '#shared/utils/routing/passages'
import type { LatLon } from '#shared/types/geo'
import { normaliseLongitude } from '#shared/utils/position'
import { EndError, joinedEnd, rejoinedOnMainWater } from './ends'
import type { RouteEnd } from './ends'
import type { Seed } from './search'
import { tableGraph } from './tableGraph'
import type { FlatSeeds, TableGraph } from './tableGraph'
import { RowSearches } from './tableWorkers'
import type { RowRequest } from './tableWorkers'
import { karneyNm, prepareQuery } from './seaRoute'
import type { RouteQuery } from './seaRoute'
import type { SeaGraph } from './seaGraph'
import { smoothPath } from './smooth'
import { legClear } from './visibility'
import type { PathPoint } from './smooth'

/**
 * The path is cut into smoothing windows at the nodes `isCut` picks (about one node in 16 of those
 * near the coast, chosen by the node's number alone, at least MIN_GAP nodes apart and from either end), so the same stretch of
 * water is cut at the same nodes whichever origin's tree it lies in, and its window is smoothed once
 * for the whole table. Against smoothing the whole path at once (routeThrough), windows of about 16
 * nodes lengthen a route by well under 0.5 % (tests/unit/seaTable.test.ts); the graph path itself is
 * 1–2 % longer than either.
 */
const MIN_GAP = 6
export function isCut(v: number): boolean {
  return Math.imul(v + 1, 0x9E3779B1) >>> 28 === 0
}
/**
 * Offshore the cells are up to 2° wide, and a cut at such a node could pull a route some tens of nm
 * off its line: a cut point this far from the coast where the route turns by more than
 * CUT_TURN_DEG is dropped afterwards when the leg past it is clear.
 */
const OFFSHORE_CUT_NM = 15
const CUT_TURN_DEG = 3

export interface TableWaypoint extends LatLon { method: 'geodesic' }

/** One pair's sea route as a table keeps it. */
export interface TableSeaRoute {
  distanceNm: number
  /** Passage ids in the order the route meets them. */
  via: string[]
  /** From the origin's end (moved onto navigable water if need be) to the destination's. */
  waypoints: TableWaypoint[]
}

/** A smoothed window: the waypoints after its first point up to its last, their length and passages. */
interface Window { waypoints: TableWaypoint[], nm: number, via: number[] }

const gatePassages = new WeakMap<SeaGraph, Map<number, number[]>>()

/** Directed edge id → passages whose gate it cuts, once per graph. */
function gatesOf(g: SeaGraph): Map<number, number[]> {
  let m = gatePassages.get(g)
  if (!m) {
    m = new Map()
    g.gateEdges.forEach((edges, p) => {
      for (const k of edges) m!.set(k, [...(m!.get(k) ?? []), p])
    })
    gatePassages.set(g, m)
  }
  return m
}

function edgeBetween(g: SeaGraph, u: number, v: number): number {
  for (let k = g.offsets[u]!; k < g.offsets[u + 1]!; k++) if (g.targets[k] === v) return k
  return -1
}

/** Passages (indexes) a graph path uses, in order: fairway nodes and gate-cutting edges. */
function pathPassages(g: SeaGraph, nodes: readonly number[]): number[] {
  const gates = gatesOf(g)
  const seen = new Set<number>()
  const out: number[] = []
  const meet = (p: number) => { if (!seen.has(p)) { seen.add(p); out.push(p) } }
  for (let i = 0; i < nodes.length; i++) {
    const u = nodes[i]!
    if (g.nodePassage[u]) meet(g.nodePassage[u]! - 1)
    if (i + 1 < nodes.length) {
      const k = edgeBetween(g, u, nodes[i + 1]!)
      for (const p of gates.get(k) ?? []) meet(p)
    }
  }
  return out
}

const lastCosted = new WeakMap<SeaGraph, { key: string, tg: TableGraph }>()

/** The table graph of a query; the last one without areas is kept for the next table of the same settings. */
function costedGraph(g: SeaGraph, q: RouteQuery): TableGraph {
  const plain = !q.areas.any && !q.areas.blockedEdges.length && !q.model.nodeFactor
  const key = JSON.stringify([q.clearanceNm, q.limitLat, [...q.avoid].sort()])
  const hit = lastCosted.get(g)
  if (plain && hit?.key === key) return hit.tg
  const tg = tableGraph(g, q.model)
  if (plain) lastCosted.set(g, { key, tg })
  return tg
}

/** Planar turn (degrees) of a route at b, on the local frame of b. */
function turnDeg(a: LatLon, b: LatLon, c: LatLon): number {
  const k = Math.cos((b.lat * Math.PI) / 180)
  const b1 = Math.atan2(normaliseLongitude(b.lon - a.lon) * k, b.lat - a.lat), b2 = Math.atan2(normaliseLongitude(c.lon - b.lon) * k, c.lat - b.lat)
  let d = Math.abs(b2 - b1) * 180 / Math.PI
  if (d > 180) d = 360 - d
  return d
}

/** Drops the offshore cut points (indexes into waypoints, ascending) where the route turns and the leg past them is clear; returns the new distance. */
/** Whether a leg between two waypoints is clear, by the waypoints (shared by every pair whose windows they come from). */
type LegCache = Map<TableWaypoint, Map<TableWaypoint, boolean>>

function dropOffshoreCuts(g: SeaGraph, q: RouteQuery, waypoints: TableWaypoint[], cuts: number[], distanceNm: number, cache: LegCache): number {
  const drop = new Set<number>()
  for (const c of cuts) {
    let p = c - 1
    while (drop.has(p)) p--
    const from = waypoints[p]!, b = waypoints[c]!, next = waypoints[c + 1]
    if (!next || turnDeg(from, b, next) < CUT_TURN_DEG) continue
    let known = cache.get(from)
    if (!known) { known = new Map(); cache.set(from, known) }
    let clear = known.get(next)
    if (clear === undefined) {
      clear = !q.crossesAvoided(from.lat, from.lon, next.lat, next.lon)
        && legClear(g.sight, from.lat, from.lon, next.lat, next.lon, Math.max(0, q.clearanceNm - CUT_TOLERANCE_NM), q.limitLat)
      known.set(next, clear)
    }
    if (!clear) continue
    distanceNm += karneyNm(from, next) - karneyNm(from, b) - karneyNm(b, next)
    drop.add(c)
  }
  if (drop.size) {
    let k = 0
    for (let m = 0; m < waypoints.length; m++) if (!drop.has(m)) waypoints[k++] = waypoints[m]!
    waypoints.length = k
  }
  return distanceNm
}

/** A dropped cut's leg may come this much closer to the coast than the clearance asked for, as in smoothing. */
const CUT_TOLERANCE_NM = 0.5

type Joined = { end: RouteEnd, seeds: Seed[] } | null

/** Smooths the stretch of a path from `start` (an end, or the node before `nodes`) through the nodes to `stop` (an end) or the last node. */
function smoothWindow(g: SeaGraph, q: RouteQuery, start: { point: RouteEnd | number }, nodes: readonly number[], stop: RouteEnd | null): Window {
  const points: PathPoint[] = []
  const clear: number[] = []
  const nodePoint = (v: number): PathPoint => ({ lat: g.lat[v]!, lon: g.lon[v]!, fixed: g.nodePassage[v]! > 0 })
  const first = start.point
  const chain = typeof first === 'number' ? [first, ...nodes] : [...nodes]
  if (typeof first !== 'number') {
    points.push({ lat: first.lat, lon: first.lon, fixed: false })
    clear.push(Math.min(first.clearNm, g.clearNm[chain[0]!]!))
  }
  for (let k = 0; k < chain.length; k++) {
    points.push(nodePoint(chain[k]!))
    if (k + 1 < chain.length) clear.push(g.edgeClearNm[edgeBetween(g, chain[k]!, chain[k + 1]!)] ?? 0)
  }
  if (stop) {
    points.push({ lat: stop.lat, lon: stop.lon, fixed: false })
    clear.push(Math.min(stop.clearNm, g.clearNm[chain[chain.length - 1]!]!))
  }
  const kept = smoothPath(points, { sight: g.sight, clearanceNm: q.clearanceNm, limitLat: q.limitLat, segmentClearNm: clear, crossesAvoided: q.crossesAvoided, areas: q.areas })
  const waypoints: TableWaypoint[] = []
  let nm = 0
  for (let k = 1; k < kept.length; k++) {
    const a = points[kept[k - 1]!]!, b = points[kept[k]!]!
    nm += karneyNm(a, b)
    waypoints.push({ lat: b.lat, lon: normaliseLongitude(b.lon), method: 'geodesic' })
  }
  return { waypoints, nm, via: pathPassages(g, chain) }
}

/** A place placed on navigable water and joined to the graph, on its main body of water when it can be; null when it cannot be placed. */
function joinPlace(g: SeaGraph, p: LatLon, clearanceNm: number, limitLat: number): Joined {
  try {
    if (Math.abs(p.lat) > limitLat) return null
    const a = joinedEnd(g, 'from', p.lat, p.lon, clearanceNm, limitLat)
    return rejoinedOnMainWater(g, 'from', p.lat, p.lon, a, limitLat) ?? a
  }
  catch (e) {
    if (e instanceof EndError) return null
    throw e
  }
}

/**
 * Sea routes for every pair (i, j), i < j, of the places; `onPair` gets each one (null when no sea
 * route joins them), row by row, for the pairs `wanted` asks for. `onRow` is awaited after each
 * origin, so a long build can yield and write progress; it may return false to stop.
 */
export async function seaTable(
  g: SeaGraph, places: readonly LatLon[], opts: SeaRouteOptions,
  onPair: (i: number, j: number, route: TableSeaRoute | null) => void,
  onRow: (i: number) => Promise<boolean> | boolean = () => true,
  wanted: (i: number, j: number) => boolean = () => true,
): Promise<boolean> {
  const q = prepareQuery(g, opts)
  let rows: RowSearches | undefined
  try {
    const joined = places.map(p => joinPlace(g, p, q.clearanceNm, q.limitLat))
    const n = places.length
    const flat = (seeds: Seed[]): FlatSeeds => ({ nodes: seeds.map(s => s.node), costs: seeds.map(s => s.costNm) })
    const requests: (RowRequest | null)[] = joined.map((a, i) => (a
      ? { sources: flat(a.seeds), targets: joined.slice(i + 1).map((b, k) => (b && wanted(i, i + 1 + k) ? flat(b.seeds) : null)) }
      : null))
    if (n) requests[n - 1] = null
    rows = new RowSearches(costedGraph(g, q), requests)
    const N = g.nodeCount
    // Windows between two cut nodes (and from a cut node to a place's end) smoothed once for the whole table: the path
    // between them is the same in most origins' trees; the stored nodes are compared before a window is reused.
    const shared = new Map<number, { nodes: number[], w: Window }>()
    const legCache: LegCache = new Map()
    const sharedWindow = (nodes: number[], from: number, to: number, key: number, make: () => Window): Window => {
      const hit = shared.get(key)
      if (hit && hit.nodes.length === to - from + 1 && hit.nodes.every((v, k) => v === nodes[from + k])) return hit.w
      const w = make()
      shared.set(key, { nodes: nodes.slice(from, to + 1), w })
      return w
    }
    for (let i = 0; i < n - 1; i++) {
      const a = joined[i]
      if (!a) {
        for (let j = i + 1; j < n; j++) if (wanted(i, j)) onPair(i, j, null)
      }
      else {
        const row = await rows.next(i)
        const paths = (row ?? []).map(p => (p ? Array.from(p) : null))
        // The origin's first window (its end to the path's first cut node) is shared by every place of this row beyond that node.
        const firstWindows = new Map<number, Window>()
        const origin: TableWaypoint = { lat: a.end.lat, lon: normaliseLongitude(a.end.lon), method: 'geodesic' }
        for (let j = i + 1; j < n; j++) {
          const nodes = paths[j - i - 1] ?? null
          if (nodes && !nodes.length) continue // not wanted
          if (!nodes) { onPair(i, j, null); continue }
          const waypoints: TableWaypoint[] = [origin]
          const via: number[] = []
          let distanceNm = 0
          const take = (w: Window) => {
            for (const p of w.waypoints) waypoints.push(p)
            distanceNm += w.nm
            for (const p of w.via) if (!via.includes(p)) via.push(p)
          }
          // Waypoints at offshore cut nodes, by their index in waypoints.
          const offshoreCuts: number[] = []
          const last = joined[j]!.end
          let from = -1
          for (let at = MIN_GAP; at < nodes.length - MIN_GAP; at++) {
            if (at - from < MIN_GAP || !isCut(nodes[at]!)) continue
            const end = nodes[at]!
            let w: Window | undefined
            if (from < 0) {
              w = firstWindows.get(end)
              if (!w) { w = smoothWindow(g, q, { point: a.end }, nodes.slice(0, at + 1), null); firstWindows.set(end, w) }
            }
            else w = sharedWindow(nodes, from, at, nodes[from]! * N + end, () => smoothWindow(g, q, { point: nodes[from]! }, nodes.slice(from + 1, at + 1), null))
            take(w)
            if (g.clearNm[end]! >= OFFSHORE_CUT_NM && !g.nodePassage[end]) offshoreCuts.push(waypoints.length - 1)
            from = at
          }
          if (from < 0) take(smoothWindow(g, q, { point: a.end }, nodes, last))
          else take(sharedWindow(nodes, from, nodes.length - 1, -(nodes[from]! * n + j) - 1, () => smoothWindow(g, q, { point: nodes[from]! }, nodes.slice(from + 1), last)))
          if (offshoreCuts.length && !q.areas.any) distanceNm = dropOffshoreCuts(g, q, waypoints, offshoreCuts, distanceNm, legCache)
          onPair(i, j, { distanceNm, via: via.map(p => PASSAGES[p]!.id), waypoints })
        }
      }
      if (!(await onRow(i))) return false
    }
    return true
  }
  finally {
    rows?.close()
    q.release()
  }
}
