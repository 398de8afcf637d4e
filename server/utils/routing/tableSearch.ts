// Sea distances for distance tables: one Dijkstra per origin over the navigable graph, run until
// every later place's joining nodes are settled, instead of one A* per pair. Each pair's graph path
// is then smoothed into geodesic legs exactly as a single sea route is (routeThrough), so a table
// cell and POST /api/routing/sea agree; the passages come from the path's fairway nodes and the
// gates its edges cut, in the order the route meets them.
import type { RouteWaypoint, SeaRouteOptions } from '#shared/types/routing'
import { PASSAGES } from '#shared/utils/routing/passages'
import type { LatLon } from '#shared/types/geo'
import { EndError, joinedEnd, rejoinedOnMainWater } from './ends'
import type { RouteEnd } from './ends'
import { dijkstraTree } from './search'
import type { Seed } from './search'
import { karneyNm, prepareQuery, routeThrough } from './seaRoute'
import type { SeaGraph } from './seaGraph'

/** One pair's sea route as a table keeps it. */
export interface TableSeaRoute {
  distanceNm: number
  /** Passage ids in the order the route meets them. */
  via: string[]
  waypoints: RouteWaypoint[]
}

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

/** Passage ids a graph path uses, in order: fairway nodes and gate-cutting edges. */
export function pathPassages(g: SeaGraph, nodes: number[]): string[] {
  const gates = gatesOf(g)
  const seen = new Set<number>()
  const out: string[] = []
  const meet = (p: number) => { if (!seen.has(p)) { seen.add(p); out.push(PASSAGES[p]!.id) } }
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

type Joined = { end: RouteEnd, seeds: Seed[] } | null

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
  try {
    const joined = places.map(p => joinPlace(g, p, q.clearanceNm, q.limitLat))
    const n = places.length
    for (let i = 0; i < n - 1; i++) {
      const a = joined[i]
      if (!a) {
        for (let j = i + 1; j < n; j++) if (wanted(i, j)) onPair(i, j, null)
      }
      else {
        const targets = new Set<number>()
        for (let j = i + 1; j < n; j++) if (wanted(i, j)) for (const s of joined[j]?.seeds ?? []) targets.add(s.node)
        const tree = dijkstraTree(g, a.seeds, q.model, targets)
        // Read the whole row off the tree before anything else searches this graph.
        const paths: (number[] | null)[] = []
        for (let j = i + 1; j < n; j++) {
          const b = wanted(i, j) ? joined[j] : undefined
          let best = Infinity, bestNode = -1
          for (const s of b?.seeds ?? []) {
            if (tree.stamp[s.node] !== tree.gen) continue
            const c = tree.cost[s.node]! + s.costNm
            if (c < best) { best = c; bestNode = s.node }
          }
          if (bestNode < 0) { paths.push(b ? null : []); continue }
          const nodes: number[] = []
          for (let v = bestNode; v >= 0; v = tree.pred[v]!) nodes.push(v)
          paths.push(nodes.reverse())
        }
        for (let j = i + 1; j < n; j++) {
          const nodes = paths[j - i - 1] ?? null
          if (nodes && !nodes.length) continue // not wanted
          if (!nodes) { onPair(i, j, null); continue }
          const waypoints = routeThrough(g, q, a.end, joined[j]!.end, nodes)
          let distanceNm = 0
          for (let k = 0; k + 1 < waypoints.length; k++) distanceNm += karneyNm(waypoints[k]!, waypoints[k + 1]!)
          onPair(i, j, { distanceNm, via: pathPassages(g, nodes), waypoints })
        }
      }
      if (!(await onRow(i))) return false
    }
    return true
  }
  finally { q.release() }
}
