// The navigable graph as the router uses it: grid nodes and edges from graphBuild, the declared
// passages' fairways joined at their ends, the graph edges each passage's gate cuts, landmark
// distances for the A* bound (Goldberg & Harrelson, "Computing the shortest path: A* search meets
// graph theory", SODA 2005) and the clearance raster for line-of-sight tests.
import type Flatbush from 'flatbush'
import { G, geod } from '#shared/utils/engine/wgs84'
import { normaliseLongitude } from '#shared/utils/position'
import { PASSAGES } from '#shared/utils/routing/passages'
import type { LandData } from '../land'
import FlatQueue from 'flatqueue'
import { chordCrossesLand, coastDistanceNm, isRoutingLand } from './coast'
import { buildDistanceField } from './distanceField'
import {
  DEFAULT_GRAPH_PARAMS, buildGridEdges, buildGridNodes, edgeLengthNm, localNm, nodeIndex, nodesWithin, packEdges, segmentCrossesLand,
} from './graphBuild'
import type { Csr, EdgeList, GraphParams, GridNodes } from './graphBuild'
import { buildClearanceRaster } from './visibility'
import type { ClearanceRaster, Sight } from './visibility'
import { dijkstraLengths } from './search'
import { UNREACHED_NM } from './ends'

export interface SeaGraph extends Csr {
  nodeCount: number
  lat: Float64Array
  lon: Float64Array
  clearNm: Float32Array
  /** Passage number (index in PASSAGES + 1) of fairway nodes, 0 for grid nodes. */
  nodePassage: Uint8Array
  /** Directed edge ids each passage's gate cuts, by passage index. */
  gateEdges: Uint32Array[]
  index: Flatbush
  landmarks: Uint32Array
  /** Graph distance (nm) from each landmark to each node, node-major: [node * L + landmark]. */
  landmarkNm: Float32Array
  land: LandData
  raster: ClearanceRaster
  sight: Sight
}

/** How far a fairway end looks for grid nodes to join, nm. */
const FAIRWAY_JOIN_NM = 12
const FAIRWAY_JOINS = 10
export const LANDMARK_COUNT = 12

function karneyNm(lat1: number, lon1: number, lat2: number, lon2: number): number {
  return geod.Inverse(lat1, lon1, lat2, lon2, G.DISTANCE).s12! / 1852
}

/** Appends each passage's fairway as a chain of nodes and joins both ends to the nearest grid nodes they see. */
function addFairways(land: LandData, nodes: GridNodes, edges: EdgeList, passageOf: number[]): void {
  const gridCount = nodes.lat.length
  const index = nodeIndex(nodes.lat, nodes.lon)
  PASSAGES.forEach((p, pi) => {
    if (!p.fairway) return
    const first = nodes.lat.length
    for (const [lat, lon] of p.fairway) {
      nodes.lat.push(lat); nodes.lon.push(lon); nodes.size.push(0)
      nodes.clear.push(isRoutingLand(land, lat, lon) ? 0 : coastDistanceNm(land, lat, lon, 50).nm)
      passageOf.push(pi + 1)
    }
    for (let k = first; k + 1 < nodes.lat.length; k++) {
      edges.from.push(k); edges.to.push(k + 1); edges.passage.push(pi + 1)
      edges.lengthNm.push(karneyNm(nodes.lat[k]!, nodes.lon[k]!, nodes.lat[k + 1]!, nodes.lon[k + 1]!))
      edges.clearNm.push(p.kind === 'canal' ? 0 : Math.min(nodes.clear[k]!, nodes.clear[k + 1]!))
    }
    for (const end of [first, nodes.lat.length - 1]) {
      const la = nodes.lat[end]!, lo = nodes.lon[end]!
      const near = nodesWithin(index, la, lo, FAIRWAY_JOIN_NM).filter(v => v < gridCount)
        .map(v => ({ v, nm: localNm(la, lo, nodes.lat[v]!, nodes.lon[v]!) })).sort((a, b) => a.nm - b.nm)
      let joined = 0
      for (const { v, nm } of near) {
        if (joined >= FAIRWAY_JOINS) break
        if (segmentCrossesLand(land, la, lo, nodes.lat[v]!, nodes.lon[v]!, nm)) continue
        edges.from.push(end); edges.to.push(v); edges.passage.push(0); edges.lengthNm.push(nm)
        edges.clearNm.push(Math.min(nodes.clear[end]!, nodes.clear[v]!))
        joined++
      }
      if (!joined) throw new Error(`passage ${p.id}: fairway end ${la}, ${lo} joins no graph node`)
    }
  })
}

/** How far (in its own cell sizes, and at most nm) a node of a small component looks for a node of another one to bridge to. */
const BRIDGE_CELLS = 4
const BRIDGE_MAX_NM = 12
const BRIDGE_TESTS = 12

function root(parent: Int32Array, u: number): number {
  while (parent[u] !== u) { parent[u] = parent[parent[u]!]!; u = parent[u]! }
  return u
}

/** Lowest distance to the coastline along a short chord, sampled every quarter nm (nm). */
function chordCoastNm(land: LandData, lat1: number, lon1: number, lat2: number, lon2: number, lengthNm: number): number {
  const n = Math.max(1, Math.ceil(lengthNm * 4))
  const dLon = normaliseLongitude(lon2 - lon1)
  let low = Infinity, hint = -1
  for (let k = 0; k <= n; k++) {
    const c = coastDistanceNm(land, lat1 + ((lat2 - lat1) * k) / n, normaliseLongitude(lon1 + (dLon * k) / n), 50, hint)
    hint = c.edge
    if (c.nm < low) low = c.nm
  }
  return low
}

/**
 * Water the quadtree leaves in pieces: a fjord, sound or channel whose mouth is narrower than the
 * cells around it gets no node in the mouth, so its nodes form a component of their own although
 * the coastline leaves it open. Each grid node outside the largest component is joined to the
 * nearest node of another component it sees with a chord clear of land, if one lies near enough.
 * Water the coastline closes (a lagoon, a lake) stays apart: no clear chord leads out of it.
 */
function bridgeComponents(land: LandData, nodes: GridNodes, edges: EdgeList, gridCount: number): number {
  const n = nodes.lat.length
  const parent = Int32Array.from({ length: n }, (_, i) => i)
  for (let k = 0; k < edges.from.length; k++) {
    const a = root(parent, edges.from[k]!), b = root(parent, edges.to[k]!)
    if (a !== b) parent[a] = b
  }
  const comp = Int32Array.from({ length: n }, (_, i) => root(parent, i))
  const size = new Map<number, number>()
  for (let i = 0; i < n; i++) size.set(comp[i]!, (size.get(comp[i]!) ?? 0) + 1)
  let main = -1, mainSize = 0
  for (const [c, s] of size) if (s > mainSize) { main = c; mainSize = s }
  const index = nodeIndex(nodes.lat, nodes.lon, gridCount)
  let added = 0
  for (let u = 0; u < gridCount; u++) {
    if (comp[u] === main) continue
    const la = nodes.lat[u]!, lo = nodes.lon[u]!
    const reach = Math.min(BRIDGE_MAX_NM, BRIDGE_CELLS * nodes.size[u]!)
    const near = nodesWithin(index, la, lo, reach).filter(v => v < gridCount && comp[v] !== comp[u])
      .map(v => ({ v, nm: localNm(la, lo, nodes.lat[v]!, nodes.lon[v]!) })).filter(c => c.nm <= reach).sort((a, b) => a.nm - b.nm)
    for (const { v, nm } of near.slice(0, BRIDGE_TESTS)) {
      const lb = nodes.lat[v]!, lob = nodes.lon[v]!
      if (segmentCrossesLand(land, la, lo, lb, lob, nm)) continue
      edges.from.push(u); edges.to.push(v); edges.passage.push(0); edges.lengthNm.push(edgeLengthNm(la, lo, lb, lob))
      edges.clearNm.push(Math.min(nodes.clear[u]!, nodes.clear[v]!, chordCoastNm(land, la, lo, lb, lob, nm)))
      added++
      break
    }
  }
  return added
}

/** Channel search for water left apart: raster step (nm), margin round a component (nm), largest raster (cells). */
const CHANNEL_STEP_NM = 0.2
const CHANNEL_PAD_NM = 12
const CHANNEL_MAX_CELLS = 400_000
const CHANNEL_MIN_NODES = 3

function components(n: number, edges: EdgeList): Int32Array {
  const parent = Int32Array.from({ length: n }, (_, i) => i)
  for (let k = 0; k < edges.from.length; k++) {
    const a = root(parent, edges.from[k]!), b = root(parent, edges.to[k]!)
    if (a !== b) parent[a] = b
  }
  return Int32Array.from({ length: n }, (_, i) => root(parent, i))
}

/**
 * Water joined to the rest only by a channel too narrow or too bent for any graph chord (a fjord
 * behind its narrows, a bay behind a bar): for each component outside the largest, a search over a
 * fine raster of the water round it (0.2 nm cells, moves between cell centres clear of the
 * coastline, dearer near the shore) finds the nearest node of another component; the channel is
 * then laid as a chain of new nodes, each chord clear of land, and the two joined. Water the
 * coastline closes stays apart: the search finds no way out.
 */
function channelBridges(land: LandData, nodes: GridNodes, edges: EdgeList): number {
  const comp = components(nodes.lat.length, edges)
  const members = new Map<number, number[]>()
  comp.forEach((c, v) => { const m = members.get(c); if (m) m.push(v); else members.set(c, [v]) })
  let main = -1, mainSize = 0
  for (const [c, m] of members) if (m.length > mainSize) { main = c; mainSize = m.length }
  const index = nodeIndex(nodes.lat, nodes.lon)
  const merged = Int32Array.from({ length: nodes.lat.length }, (_, i) => i)
  let added = 0
  for (const [c, m] of members) {
    if (c === main || m.length < CHANNEL_MIN_NODES) continue
    let s = Infinity, nth = -Infinity, w = Infinity, e = -Infinity
    for (const v of m) { s = Math.min(s, nodes.lat[v]!); nth = Math.max(nth, nodes.lat[v]!); w = Math.min(w, nodes.lon[v]!); e = Math.max(e, nodes.lon[v]!) }
    if (e - w > 180) continue // across the 180° meridian: not searched
    const cos = Math.cos((Math.min(80, Math.max(Math.abs(s), Math.abs(nth))) * Math.PI) / 180)
    const dLat = CHANNEL_STEP_NM / 60, dLon = dLat / cos
    s -= CHANNEL_PAD_NM / 60; nth += CHANNEL_PAD_NM / 60; w -= CHANNEL_PAD_NM / 60 / cos; e += CHANNEL_PAD_NM / 60 / cos
    const rows = Math.ceil((nth - s) / dLat), cols = Math.ceil((e - w) / dLon)
    if (rows * cols > CHANNEL_MAX_CELLS || w < -180 || e > 180) continue
    const mine = root(merged, c)
    const cellOf = (lat: number, lon: number) => {
      const j = Math.floor((lat - s) / dLat), i = Math.floor((lon - w) / dLon)
      return j >= 0 && j < rows && i >= 0 && i < cols ? j * cols + i : -1
    }
    const centre = (k: number): [number, number] => [s + (Math.floor(k / cols) + 0.5) * dLat, w + ((k % cols) + 0.5) * dLon]
    // Cells holding a node of another component (after the bridges laid so far), and the start cells.
    const goal = new Map<number, number>()
    for (const v of nodesWithin(index, (s + nth) / 2, (w + e) / 2, Math.max((nth - s) * 60, (e - w) * 60 * cos))) {
      if (root(merged, comp[v]!) === mine) continue
      const k = cellOf(nodes.lat[v]!, nodes.lon[v]!)
      if (k >= 0 && !goal.has(k)) goal.set(k, v)
    }
    if (!goal.size) continue
    const water = new Int8Array(rows * cols) // 0 unknown, 1 water, -1 land
    const isWater = (k: number) => {
      if (!water[k]) { const [la, lo] = centre(k); water[k] = isRoutingLand(land, la, lo) ? -1 : 1 }
      return water[k] === 1
    }
    const cost = new Float64Array(rows * cols).fill(Infinity), pred = new Int32Array(rows * cols).fill(-1), origin = new Int32Array(rows * cols).fill(-1)
    const queue = new FlatQueue<number>()
    for (const v of m) {
      const k = cellOf(nodes.lat[v]!, nodes.lon[v]!)
      if (k < 0 || !isWater(k)) continue
      cost[k] = 0; origin[k] = v; queue.push(k, 0)
    }
    let reached = -1
    while (queue.length) {
      const d = queue.peekValue()!, u = queue.pop()!
      if (d > cost[u]!) continue
      if (goal.has(u)) { reached = u; break }
      const [la, lo] = centre(u)
      const ju = Math.floor(u / cols), iu = u % cols
      for (let dj = -1; dj <= 1; dj++) {
        for (let di = -1; di <= 1; di++) {
          if (!dj && !di) continue
          const j = ju + dj, i = iu + di
          if (j < 0 || j >= rows || i < 0 || i >= cols) continue
          const v = j * cols + i
          if (!isWater(v)) continue
          const [lb, lob] = centre(v)
          const len = Math.hypot(dj * CHANNEL_STEP_NM, di * CHANNEL_STEP_NM)
          const clear = coastDistanceNm(land, lb, lob, 1).nm
          const nd = d + len * (1 + 1 / Math.max(0.05, clear))
          if (nd >= cost[v]!) continue
          if (chordCrossesLand(land, lo, la, lob, lb)) continue
          cost[v] = nd; pred[v] = u; origin[v] = origin[u]!; queue.push(v, nd)
        }
      }
    }
    if (reached < 0) continue
    const target = goal.get(reached)!
    const path: [number, number][] = [[nodes.lat[target]!, nodes.lon[target]!]]
    for (let k = reached; k >= 0; k = pred[k]!) path.push(centre(k))
    let start = reached
    while (pred[start]! >= 0) start = pred[start]!
    const source = origin[start]!
    path.push([nodes.lat[source]!, nodes.lon[source]!])
    // Greedy: from each kept point the farthest point along the path whose chord is clear of land.
    const kept = [0]
    let ok = true
    for (let i = 0; i < path.length - 1;) {
      let best = -1
      for (let j = i + 1; j < path.length; j++) {
        const [la, lo] = path[i]!, [lb, lob] = path[j]!
        if (segmentCrossesLand(land, la, lo, lb, lob, localNm(la, lo, lb, lob))) break
        best = j
      }
      if (best < 0) { ok = false; break }
      kept.push(best); i = best
    }
    if (!ok) continue
    let prev = target
    for (let q = 1; q < kept.length; q++) {
      let v: number
      if (q === kept.length - 1) v = source
      else {
        const [la, lo] = path[kept[q]!]!
        v = nodes.lat.length
        nodes.lat.push(la); nodes.lon.push(lo); nodes.size.push(CHANNEL_STEP_NM); nodes.clear.push(coastDistanceNm(land, la, lo, 50).nm)
      }
      const la = nodes.lat[prev]!, lo = nodes.lon[prev]!, lb = nodes.lat[v]!, lob = nodes.lon[v]!
      const nm = localNm(la, lo, lb, lob)
      edges.from.push(prev); edges.to.push(v); edges.passage.push(0); edges.lengthNm.push(edgeLengthNm(la, lo, lb, lob))
      edges.clearNm.push(Math.min(nodes.clear[prev]!, nodes.clear[v]!, chordCoastNm(land, la, lo, lb, lob, nm)))
      prev = v
    }
    merged[root(merged, comp[target]!)] = mine
    added++
  }
  return added
}

function segmentsCross(a: number[], b: number[], c: number[], d: number[]): boolean {
  const o = (p: number[], q: number[], r: number[]) => (q[0]! - p[0]!) * (r[1]! - p[1]!) - (q[1]! - p[1]!) * (r[0]! - p[0]!)
  return (o(a, b, c) > 0) !== (o(a, b, d) > 0) && (o(c, d, a) > 0) !== (o(c, d, b) > 0)
}

/** Directed edges whose chord crosses each passage's gate (planar lon/lat; gates are short). */
function gateEdges(g: Pick<SeaGraph, 'lat' | 'lon' | 'offsets' | 'targets' | 'index'>): Uint32Array[] {
  return PASSAGES.map((p) => {
    const [[la1, lo1], [la2, lo2]] = p.gate
    const a = [lo1, la1], b = [lo2, la2]
    const midLat = (la1 + la2) / 2, midLon = (lo1 + lo2) / 2
    const reach = localNm(la1, lo1, la2, lo2) / 2 + 400
    const cut: number[] = []
    for (const u of nodesWithin(g.index, midLat, midLon, reach)) {
      for (let k = g.offsets[u]!; k < g.offsets[u + 1]!; k++) {
        const v = g.targets[k]!
        let lonV = g.lon[v]!
        lonV += 360 * Math.round((g.lon[u]! - lonV) / 360)
        if (segmentsCross(a, b, [g.lon[u]!, g.lat[u]!], [lonV, g.lat[v]!])) cut.push(k)
      }
    }
    return Uint32Array.from(new Set(cut))
  })
}

/** Landmarks by farthest selection over graph distance, then their distances to every node. */
function landmarks(g: Csr & { lat: Float64Array }, n: number): { landmarks: Uint32Array, landmarkNm: Float32Array } {
  const chosen: number[] = []
  const nearest = new Float64Array(n).fill(Infinity)
  const table = new Float32Array(n * LANDMARK_COUNT)
  // Start from the node farthest from an arbitrary mid-Atlantic node, so the first landmark lies on the rim.
  let next = 0
  let dist = dijkstraLengths(g, n, 0)
  for (let i = 0; i < n; i++) if (Number.isFinite(dist[i]!) && dist[i]! > dist[next]!) next = i
  for (let l = 0; l < LANDMARK_COUNT; l++) {
    chosen.push(next)
    dist = dijkstraLengths(g, n, next)
    let far = 0, farNm = -1
    for (let i = 0; i < n; i++) {
      const v = dist[i]!
      table[i * LANDMARK_COUNT + l] = Number.isFinite(v) ? v : UNREACHED_NM
      if (v < nearest[i]!) nearest[i] = v
      if (Number.isFinite(nearest[i]!) && nearest[i]! > farNm) { farNm = nearest[i]!; far = i }
    }
    next = far
  }
  return { landmarks: Uint32Array.from(chosen), landmarkNm: table }
}

/** The cached part of a SeaGraph: typed arrays only. */
export type GraphArrays = Omit<SeaGraph, 'nodeCount' | 'index' | 'land' | 'sight'>

/** Everything the router needs that is worth building once and caching: about 15 s on two cores. */
export function buildSeaGraphArrays(land: LandData, params: GraphParams = DEFAULT_GRAPH_PARAMS): GraphArrays {
  const field = buildDistanceField(land)
  const raster = buildClearanceRaster(field)
  const nodes = buildGridNodes(land, field, params)
  const edges = buildGridEdges(land, field, nodes, params)
  bridgeComponents(land, nodes, edges, nodes.lat.length)
  channelBridges(land, nodes, edges)
  const passageOf: number[] = nodes.lat.map(() => 0)
  addFairways(land, nodes, edges, passageOf)
  const n = nodes.lat.length
  const csr = packEdges(n, edges)
  const lat = Float64Array.from(nodes.lat), lon = Float64Array.from(nodes.lon)
  const index = nodeIndex(lat, lon)
  const gates = gateEdges({ lat, lon, offsets: csr.offsets, targets: csr.targets, index })
  const marks = landmarks({ ...csr, lat }, n)
  return {
    lat, lon, clearNm: Float32Array.from(nodes.clear), nodePassage: Uint8Array.from(passageOf),
    ...csr,
    gateEdges: gates, landmarks: marks.landmarks, landmarkNm: marks.landmarkNm, raster,
  }
}

export function seaGraphFrom(a: GraphArrays, land: LandData): SeaGraph {
  return { ...a, nodeCount: a.lat.length, index: nodeIndex(a.lat, a.lon), land, sight: { land, raster: a.raster } }
}
