// The navigable graph as the router uses it: grid nodes and edges from graphBuild, the declared
// passages' fairways joined at their ends, the graph edges each passage's gate cuts, landmark
// distances for the A* bound (Goldberg & Harrelson, "Computing the shortest path: A* search meets
// graph theory", SODA 2005) and the clearance raster for line-of-sight tests.
import type Flatbush from 'flatbush'
import { G, geod } from '#shared/utils/engine/wgs84'
import { normaliseLongitude } from '#shared/utils/position'
import { PASSAGES } from '#shared/utils/routing/passages'
import type { LandData } from '../land'
import { coastDistanceNm, isRoutingLand } from './coast'
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
  const passageOf: number[] = nodes.lat.map(() => 0)
  const gridCount = nodes.lat.length
  bridgeComponents(land, nodes, edges, gridCount)
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
