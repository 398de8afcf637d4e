// Shortest paths over the navigable graph: A* with a landmark (ALT) and great-circle lower bound
// for one route, Dijkstra from one place to all others for distance tables (flatqueue as the
// binary heap). Edge cost = length × a clearance penalty when the edge passes closer to land
// than the requested clearance (none along a passage's fairway), × an area factor; blocked edges and nodes poleward of the limiting
// latitude are skipped.
import FlatQueue from 'flatqueue'
import type { Csr } from './graphBuild'

/** Cost factor at zero clearance is 1 + CLEARANCE_PENALTY, falling linearly to 1 at the requested clearance. */
export const CLEARANCE_PENALTY = 2
/** Great-circle distance on a sphere of 3440.065 nm, scaled below the shortest WGS84 radius of curvature: a lower bound of the geodesic. */
const SPHERE_LOWER_NM = 3440.065 * 0.994
const RAD = Math.PI / 180

export interface CostModel {
  clearanceNm: number
  limitLat: number
  /** 1 for directed edges that may not be used (avoided passages, blocked areas). */
  blockedEdge?: Uint8Array
  /** Cost factor per node (≥ 1); an edge takes the larger of its ends'. Infinity blocks the node. */
  nodeFactor?: Float32Array
}

export interface SearchGraph extends Csr {
  nodeCount: number
  lat: Float64Array
  lon: Float64Array
  landmarkNm: Float32Array
}

export interface Seed { node: number, costNm: number }

export function edgeCost(g: Csr, k: number, u: number, v: number, m: CostModel): number {
  // A declared passage's fairway is the track ships keep in narrow water: its clearance is what the passage allows, not a penalty.
  const c = g.passage[k] ? Infinity : g.edgeClearNm[k]!, want = m.clearanceNm
  let cost = g.lengthNm[k]! * (c >= want ? 1 : 1 + CLEARANCE_PENALTY * (1 - c / want))
  if (m.nodeFactor) cost *= Math.max(m.nodeFactor[u]!, m.nodeFactor[v]!)
  return cost
}

export function sphereLowerNm(lat1: number, lon1: number, lat2: number, lon2: number): number {
  const p1 = lat1 * RAD, p2 = lat2 * RAD
  const h = Math.sin((p2 - p1) / 2) ** 2 + Math.cos(p1) * Math.cos(p2) * Math.sin(((lon2 - lon1) * RAD) / 2) ** 2
  return 2 * SPHERE_LOWER_NM * Math.asin(Math.min(1, Math.sqrt(h)))
}

class Buffers {
  g: Float64Array
  pred: Int32Array
  stamp: Uint32Array
  closed: Uint32Array
  gen = 0
  queue = new FlatQueue<number>()
  constructor(n: number) {
    this.g = new Float64Array(n)
    this.pred = new Int32Array(n)
    this.stamp = new Uint32Array(n)
    this.closed = new Uint32Array(n)
  }

  next() {
    if (++this.gen === 0xFFFFFFFF) { this.stamp.fill(0); this.closed.fill(0); this.gen = 1 }
    this.queue.clear()
  }
}

const buffers = new WeakMap<object, Buffers>()
function buffersFor(g: SearchGraph): Buffers {
  let b = buffers.get(g)
  if (!b) { b = new Buffers(g.nodeCount); buffers.set(g, b) }
  return b
}

export interface PathResult { nodes: number[], costNm: number, settled: number }

/**
 * A* from several seeded nodes to several target nodes (each with the cost of its last leg to the
 * goal point). Bound: the larger of the landmark bound and the great-circle bound to the goal.
 */
export function aStar(g: SearchGraph, sources: Seed[], targets: Seed[], goal: { lat: number, lon: number }, m: CostModel): PathResult | null {
  const L = g.landmarkNm.length / g.nodeCount
  const toGoal = new Float64Array(L).fill(Infinity)
  const targetCost = new Map<number, number>()
  for (const t of targets) {
    targetCost.set(t.node, Math.min(targetCost.get(t.node) ?? Infinity, t.costNm))
    for (let l = 0; l < L; l++) toGoal[l] = Math.min(toGoal[l]!, g.landmarkNm[t.node * L + l]! + t.costNm)
  }
  const h = (v: number) => {
    let best = sphereLowerNm(g.lat[v]!, g.lon[v]!, goal.lat, goal.lon)
    const base = v * L
    for (let l = 0; l < L; l++) {
      const d = toGoal[l]! - g.landmarkNm[base + l]!
      const a = d < 0 ? -d : d
      if (a > best) best = a
    }
    return best
  }
  const b = buffersFor(g)
  b.next()
  const { g: cost, pred, stamp, closed, queue } = b
  const gen = b.gen
  const limit = m.limitLat
  for (const s of sources) {
    if (stamp[s.node] === gen && cost[s.node]! <= s.costNm) continue
    stamp[s.node] = gen; cost[s.node] = s.costNm; pred[s.node] = -1
    queue.push(s.node, s.costNm + h(s.node))
  }
  let bestNm = Infinity, bestNode = -1, settled = 0
  while (queue.length) {
    if (queue.peekValue()! >= bestNm) break
    const u = queue.pop()!
    if (closed[u] === gen) continue
    closed[u] = gen
    const gu = cost[u]!
    settled++
    const tc = targetCost.get(u)
    if (tc !== undefined && gu + tc < bestNm) { bestNm = gu + tc; bestNode = u }
    for (let k = g.offsets[u]!, end = g.offsets[u + 1]!; k < end; k++) {
      if (m.blockedEdge && m.blockedEdge[k]) continue
      const v = g.targets[k]!
      if (Math.abs(g.lat[v]!) > limit) continue
      const nv = gu + edgeCost(g, k, u, v, m)
      if (nv === Infinity || (stamp[v] === gen && nv >= cost[v]!)) continue
      stamp[v] = gen; cost[v] = nv; pred[v] = u
      queue.push(v, nv + h(v))
    }
  }
  if (bestNode < 0) return null
  const nodes: number[] = []
  for (let v = bestNode; v >= 0; v = pred[v]!) nodes.push(v)
  return { nodes: nodes.reverse(), costNm: bestNm, settled }
}

/** Dijkstra over pure edge lengths from one node to all: for landmarks. Unreached nodes are Infinity. */
export function dijkstraLengths(g: Csr, n: number, source: number): Float64Array {
  const dist = new Float64Array(n).fill(Infinity)
  const q = new FlatQueue<number>()
  dist[source] = 0
  q.push(source, 0)
  while (q.length) {
    const du = q.peekValue()!
    const u = q.pop()!
    if (du > dist[u]!) continue
    for (let k = g.offsets[u]!, end = g.offsets[u + 1]!; k < end; k++) {
      const v = g.targets[k]!, nd = du + g.lengthNm[k]!
      if (nd < dist[v]!) { dist[v] = nd; q.push(v, nd) }
    }
  }
  return dist
}

export interface Tree { cost: Float64Array, pred: Int32Array, stamp: Uint32Array, gen: number }

/**
 * Dijkstra from seeded nodes under a cost model until every wanted node is settled (or all are).
 * The returned arrays are reused by the next search on this graph: read them before searching again.
 */
export function dijkstraTree(g: SearchGraph, sources: Seed[], m: CostModel, wanted: Set<number>): Tree {
  const b = buffersFor(g)
  b.next()
  const { g: cost, pred, stamp, queue } = b
  const gen = b.gen
  for (const s of sources) {
    if (stamp[s.node] === gen && cost[s.node]! <= s.costNm) continue
    stamp[s.node] = gen; cost[s.node] = s.costNm; pred[s.node] = -1
    queue.push(s.node, s.costNm)
  }
  let remaining = wanted.size
  while (queue.length && remaining > 0) {
    const du = queue.peekValue()!
    const u = queue.pop()!
    if (du > cost[u]!) continue
    if (wanted.has(u)) remaining--
    for (let k = g.offsets[u]!, end = g.offsets[u + 1]!; k < end; k++) {
      if (m.blockedEdge && m.blockedEdge[k]) continue
      const v = g.targets[k]!
      if (Math.abs(g.lat[v]!) > m.limitLat) continue
      const nv = du + edgeCost(g, k, u, v, m)
      if (nv === Infinity || (stamp[v] === gen && nv >= cost[v]!)) continue
      stamp[v] = gen; cost[v] = nv; pred[v] = u
      queue.push(v, nv)
    }
  }
  return { cost, pred, stamp, gen }
}
