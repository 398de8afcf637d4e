// Builds the navigable graph once from the routing coastline: an adaptive lon/lat quadtree over
// water (coarse offshore, refined near coasts), one node per water leaf with its distance to land,
// and edges to the nodes within a few cell sizes where the chord between them is clear of land.
import Flatbush from 'flatbush'
import { G, geod } from '#shared/utils/engine/wgs84'
import { normaliseLongitude } from '#shared/utils/position'
import type { LandData } from '../land'
import { NM_PER_DEG_LAT, coastDistanceNm, isRoutingLand } from './coast'
import { chordClearExact } from './visibility'
import { fieldNm } from './distanceField'
import type { DistanceField } from './distanceField'

export interface GraphParams {
  /** Finest quadtree level below the 2° base cells (6 → 1/32°, about 1.9 nm). */
  maxLevel: number
  /** A cell is split while land lies within alpha × its size of its centre. */
  alpha: number
  /** Each node is joined to the nodes within rho × its cell size. */
  rho: number
  latMin: number
  latMax: number
  /** Clearances are measured up to this distance (nm). */
  capNm: number
  /** Nodes of the finest level closer to land than this are dropped (nm). */
  minClearNm: number
  /** From this level on, cells are split only in narrow water. */
  openLevel: number
}

export const DEFAULT_GRAPH_PARAMS: GraphParams = { maxLevel: 6, alpha: 2, rho: 2.3, latMin: -78, latMax: 84, capNm: 50, minClearNm: 0.2, openLevel: 4 }

const RAD = Math.PI / 180

/** Longitude factor of the base cells: cells stay about square in nm up to high latitudes. */
function bandFactor(latCentre: number): number {
  const a = Math.abs(latCentre)
  return a < 44 ? 1 : a < 68 ? 2 : a < 80 ? 4 : 8
}

/** Distance in nm, flat-earth on the ellipsoid at the mid-latitude (meridional and normal radii); for short chords. */
export function localNm(lat1: number, lon1: number, lat2: number, lon2: number): number {
  const phi = ((lat1 + lat2) / 2) * RAD
  const s = Math.sin(phi), w = 1 - 0.00669437999014132 * s * s
  const n = 6378137 / Math.sqrt(w), m = (n * (1 - 0.00669437999014132)) / w
  const dy = (lat2 - lat1) * RAD * m, dx = normaliseLongitude(lon2 - lon1) * RAD * n * Math.cos(phi)
  return Math.hypot(dx, dy) / 1852
}

function edgeLengthNm(lat1: number, lon1: number, lat2: number, lon2: number): number {
  const approx = localNm(lat1, lon1, lat2, lon2)
  return approx < 60 ? approx : geod.Inverse(lat1, lon1, lat2, lon2, G.DISTANCE).s12! / 1852
}

/** Cells this size (nm) or larger take their distance to land from the coastline itself, smaller ones from the field. */
const FIELD_BELOW_NM = 30

/**
 * Narrow water: no direction leads away from land at anything like the rate an open coast would
 * (clearance at distance r in any of 8 directions stays below c + r/2). Only such cells are refined
 * below the open-coast size, so fine nodes follow channels and straits, not every shore.
 */
function isNarrow(f: DistanceField, lat: number, lon: number, c: number, sizeNm: number): boolean {
  const r = Math.max(sizeNm, c)
  const dLat = r / NM_PER_DEG_LAT, dLon = dLat / Math.max(0.1, Math.cos(lat * RAD))
  for (let k = 0; k < 8; k++) {
    const a = (k * Math.PI) / 4
    const v = fieldNm(f, lat + dLat * Math.cos(a), normaliseLongitude(lon + dLon * Math.sin(a)))
    if (v >= c + r / 2) return false
  }
  return true
}

function buildNodes(d: LandData, f: DistanceField, p: GraphParams): GridNodes {
  const out: GridNodes = { lat: [], lon: [], size: [], clear: [] }
  let hint = -1
  const visit = (lat0: number, lon0: number, h: number, w: number, level: number) => {
    const clat = lat0 + h / 2, clon = lon0 + w / 2
    const sizeNm = NM_PER_DEG_LAT * h
    const splitNm = p.alpha * sizeNm
    let c: number
    if (sizeNm >= FIELD_BELOW_NM) {
      const near = coastDistanceNm(d, clat, clon, Math.max(splitNm, p.capNm), hint)
      if (near.edge >= 0) hint = near.edge
      c = near.nm
    }
    else c = fieldNm(f, clat, clon)
    const wantsSplit = c < splitNm && level < p.maxLevel
    if (wantsSplit && (level < p.openLevel || isNarrow(f, clat, clon, c, sizeNm))) {
      for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) visit(lat0 + (i * h) / 2, lon0 + (j * w) / 2, h / 2, w / 2, level + 1)
      return
    }
    if (isRoutingLand(d, clat, clon)) return
    if (c < splitNm) {
      const near = coastDistanceNm(d, clat, clon, p.capNm, hint)
      if (near.edge >= 0) hint = near.edge
      c = near.nm
      if (c < p.minClearNm) return
    }
    out.lat.push(clat); out.lon.push(clon); out.size.push(sizeNm); out.clear.push(Math.min(c, p.capNm))
  }
  for (let lat0 = p.latMin; lat0 < p.latMax; lat0 += 2) {
    const k = bandFactor(lat0 + 1)
    for (let lon0 = -180; lon0 < 180; lon0 += 2 * k) visit(lat0, lon0, 2, 2 * k, 0)
  }
  return out
}

/** Lowest clearance along a chord: the ends' for short chords, else also the field sampled every field cell. */
function chordClearance(f: DistanceField, lat1: number, lon1: number, c1: number, lat2: number, lon2: number, c2: number, lengthNm: number, shortNm: number): number {
  let low = Math.min(c1, c2)
  if (lengthNm <= shortNm) return low
  const steps = Math.ceil(lengthNm / 1.5)
  const dlon = normaliseLongitude(lon2 - lon1)
  for (let k = 1; k < steps; k++) {
    const t = k / steps
    low = Math.min(low, fieldNm(f, lat1 + t * (lat2 - lat1), normaliseLongitude(lon1 + t * dlon)) + 1)
  }
  return low
}

/** Margin (nm) every graph chord keeps from the coastline beyond the chord's bow against the geodesic sailed along it. */
const CHORD_MARGIN_NM = 0.02

/**
 * Whether the chord between two nodes crosses land or comes closer to the coastline than the
 * geodesic between its ends may stray from it (sagitta L²·tan φ / 8R, plus a small margin), so a
 * leg sailed on the geodesic is clear wherever the chord is; long chords are split along the way first.
 */
function segmentCrossesLand(d: LandData, lat1: number, lon1: number, lat2: number, lon2: number, lengthNm: number): boolean {
  const pieces = Math.max(1, Math.ceil(lengthNm / 20))
  const pieceNm = lengthNm / pieces
  let ax = lon1, ay = lat1
  for (let i = 1; i <= pieces; i++) {
    const t = i / pieces
    // Linear in lon/lat is within a few metres of the geodesic over 20 nm below 84°.
    const by = lat1 + t * (lat2 - lat1)
    const bx = ax + normaliseLongitude(lon1 + t * normaliseLongitude(lon2 - lon1) - ax)
    const tanLat = Math.tan(Math.min(85, Math.max(Math.abs(ay), Math.abs(by))) * RAD)
    if (!chordClearExact(d, ax, ay, bx, by, (pieceNm * pieceNm * tanLat) / (8 * 3440) + CHORD_MARGIN_NM)) return true
    ax = normaliseLongitude(bx); ay = by
  }
  return false
}

/** Undirected edges before they are packed: endpoints, length, clearance and the passage they belong to (0: none). */
export interface EdgeList { from: number[], to: number[], lengthNm: number[], clearNm: number[], passage: number[] }

export interface GridNodes { lat: number[], lon: number[], size: number[], clear: number[] }

/** The water nodes of the quadtree. */
export function buildGridNodes(d: LandData, f: DistanceField, p: GraphParams = DEFAULT_GRAPH_PARAMS): GridNodes {
  return buildNodes(d, f, p)
}

/** A point index over nodes (lon, lat). */
export function nodeIndex(lat: ArrayLike<number>, lon: ArrayLike<number>, count = lat.length): Flatbush {
  const index = new Flatbush(Math.max(1, count))
  for (let i = 0; i < count; i++) index.add(lon[i]!, lat[i]!)
  if (count === 0) index.add(0, 0)
  index.finish()
  return index
}

/** Node ids within radiusNm of a point, across the 180° meridian too. */
export function nodesWithin(index: Flatbush, lat: number, lon: number, radiusNm: number): number[] {
  const dLat = radiusNm / NM_PER_DEG_LAT
  const dLon = Math.min(180, dLat / Math.max(0.05, Math.cos(Math.min(89, Math.abs(lat) + dLat) * RAD)))
  const out = index.search(lon - dLon, lat - dLat, lon + dLon, lat + dLat)
  if (lon - dLon < -180) out.push(...index.search(lon - dLon + 360, lat - dLat, 180, lat + dLat))
  if (lon + dLon > 180) out.push(...index.search(-180, lat - dLat, lon + dLon - 360, lat + dLat))
  return out
}

/** Edges between grid nodes within rho cell sizes of each other whose chord is clear of land. */
export function buildGridEdges(d: LandData, f: DistanceField, nodes: GridNodes, p: GraphParams = DEFAULT_GRAPH_PARAMS): EdgeList {
  const n = nodes.lat.length
  const index = nodeIndex(nodes.lat, nodes.lon)
  const out: EdgeList = { from: [], to: [], lengthNm: [], clearNm: [], passage: [] }
  for (let u = 0; u < n; u++) {
    const la = nodes.lat[u]!, lo = nodes.lon[u]!, cu = nodes.clear[u]!, ru = p.rho * nodes.size[u]!
    for (const v of nodesWithin(index, la, lo, ru)) {
      if (v === u) continue
      const lb = nodes.lat[v]!, lob = nodes.lon[v]!
      const l = localNm(la, lo, lb, lob)
      if (l > ru || (v < u && l <= p.rho * nodes.size[v]!)) continue // the pair is added once, by the node whose reach covers it first
      const cv = nodes.clear[v]!
      if (cu + cv <= l + 0.5 && segmentCrossesLand(d, la, lo, lb, lob, l)) continue
      out.from.push(u); out.to.push(v); out.lengthNm.push(edgeLengthNm(la, lo, lb, lob)); out.passage.push(0)
      out.clearNm.push(chordClearance(f, la, lo, cu, lb, lob, cv, l, 1.2 * Math.max(nodes.size[u]!, nodes.size[v]!)))
    }
  }
  return out
}

export interface Csr { offsets: Uint32Array, targets: Uint32Array, lengthNm: Float32Array, edgeClearNm: Float32Array, passage: Uint8Array }

/** Packs undirected edges into compressed sparse rows, each edge once in each direction. */
export function packEdges(n: number, e: EdgeList): Csr {
  const m = e.from.length
  const offsets = new Uint32Array(n + 1)
  for (let k = 0; k < m; k++) { offsets[e.from[k]! + 1]!++; offsets[e.to[k]! + 1]!++ }
  for (let i = 0; i < n; i++) offsets[i + 1]! += offsets[i]!
  const fill = offsets.slice(0, n)
  const targets = new Uint32Array(2 * m), lengthNm = new Float32Array(2 * m), edgeClearNm = new Float32Array(2 * m), passage = new Uint8Array(2 * m)
  const put = (a: number, b: number, k: number) => {
    const at = fill[a]!++
    targets[at] = b; lengthNm[at] = e.lengthNm[k]!; edgeClearNm[at] = e.clearNm[k]!; passage[at] = e.passage[k]!
  }
  for (let k = 0; k < m; k++) { put(e.from[k]!, e.to[k]!, k); put(e.to[k]!, e.from[k]!, k) }
  return { offsets, targets, lengthNm, edgeClearNm, passage }
}

export { edgeLengthNm, segmentCrossesLand }
