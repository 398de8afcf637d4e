// Coarse land check against Natural Earth 1:50m land (public domain, world-atlas 2.0.2).
// The topology is bundled as JSON so the built server carries it; it is turned into
// planar lon/lat rings and indexed on first use only.
import Flatbush from 'flatbush'
import { feature } from 'topojson-client'
import type { Topology } from 'topojson-specification'
import type { FeatureCollection, MultiPolygon, Polygon } from 'geojson'
import land50m from 'world-atlas/land-50m.json'
import { densifyLeg } from '#shared/utils/track'
import { geodesicInverse } from '#shared/utils/geodesic'
import { normaliseLongitude } from '#shared/utils/position'
import type { LatLon, LegMethod } from '#shared/types/geo'
import type { LandCrossing } from '#shared/types/landCheck'

/** Land polygons as planar lon/lat rings, with the indexes the checks and the tiles use. */
export interface LandData {
  /** Closed rings, flat [lon, lat, lon, lat, …]; a ring that crosses 180° also has a copy 360° west. */
  rings: Float64Array[]
  /** First edge number of each ring (edge k of ring r is number ringEdge[r] + k). */
  ringEdge: Uint32Array
  ringIndex: Flatbush
  /** Edges, flat [lon1, lat1, lon2, lat2, …], numbered as items of edgeIndex. */
  edges: Float64Array
  /** 1 where an edge is not coastline: a cut along the 180° meridian or a closure over a pole. */
  artificial: Uint8Array
  edgeIndex: Flatbush
  /** Inside/outside state of the corners of a regular grid, to start point-in-polygon walks. */
  corners: Uint8Array
}

export interface TrackCheck {
  crossesLand: boolean
  /** Where the track first meets land; index is the track point the entering segment starts from. */
  firstLandPoint?: LatLon & { index: number }
  closestApproachNm: number
  closestCoastPoint: LatLon
  withinClearance: boolean
}

export interface LegToCheck { from: LatLon, to: LatLon, method: LegMethod }
export type LegCheck = TrackCheck & { index: number }

const NM_PER_DEG = 60
const MAX_STEP_NM = 2
// The grid origin is offset by odd fractions so no corner lies on the 180° cuts, the poles or a data vertex.
const GRID = 0.25
const GRID_X0 = -180.25 + 0.000123457
const GRID_Y0 = -90.25 + 0.0000987654
const GRID_NX = Math.ceil((180 - GRID_X0) / GRID) + 2
const GRID_NY = Math.ceil((90 - GRID_Y0) / GRID) + 2

let land: LandData | undefined

/** The indexed 1:50m land polygons, built on first use (about 0.2 s). */
export function landData(): LandData {
  land ??= buildLandData(land50m as unknown as Topology)
  return land
}

function isOddMultipleOf180(x: number): boolean {
  const m = ((((x - 180) % 360) + 360) % 360)
  return m < 1e-7 || m > 360 - 1e-7
}

interface PlanarRing { xy: number[], cut: number[] }

/** Unwraps one spherical ring into the plane; rings round a pole are closed over the pole. */
function unwrapRing(coords: number[][]): PlanarRing | undefined {
  if (coords.every(c => Math.abs(c[1]!) > 89.99)) return undefined // the pole's own sliver ring
  const xy: number[] = [coords[0]![0]!, coords[0]![1]!]
  for (let i = 1; i < coords.length; i++) {
    const prev = xy[xy.length - 2]!
    const d = coords[i]![0]! - normaliseLongitude(prev)
    xy.push(prev + d - 360 * Math.round(d / 360), coords[i]![1]!)
  }
  const cut: number[] = []
  const net = xy[xy.length - 2]! - xy[0]!
  if (Math.abs(net) > 180) {
    const meanLat = coords.reduce((s, c) => s + c[1]!, 0) / coords.length
    const pole = meanLat < 0 ? -90 : 90
    const end = xy.length / 2 - 1
    xy.push(xy[xy.length - 2]!, pole, xy[0]!, pole, xy[0]!, xy[1]!)
    cut.push(end, end + 1, end + 2)
  }
  for (let k = 0; k < xy.length / 2 - 1; k++) {
    const x1 = xy[2 * k]!, x2 = xy[2 * k + 2]!
    if (Math.abs(x1 - x2) < 1e-9 && isOddMultipleOf180(x1)) cut.push(k)
  }
  return { xy, cut }
}

/** Places a ring so its west end lies in [-180, 180), adding a copy 360° west when it reaches past 180°. */
function placeRing(ring: PlanarRing): PlanarRing[] {
  let minX = Infinity, maxX = -Infinity
  for (let i = 0; i < ring.xy.length; i += 2) { minX = Math.min(minX, ring.xy[i]!); maxX = Math.max(maxX, ring.xy[i]!) }
  const shift = -360 * Math.floor((minX + 180) / 360)
  const placed = { xy: ring.xy.map((v, i) => (i % 2 === 0 ? v + shift : v)), cut: ring.cut }
  if (maxX + shift <= 180 + 1e-9) return [placed]
  return [placed, { xy: placed.xy.map((v, i) => (i % 2 === 0 ? v - 360 : v)), cut: ring.cut }]
}

function landRings(topo: Topology): PlanarRing[] {
  const collection = feature(topo, topo.objects.land!) as unknown as FeatureCollection<Polygon | MultiPolygon>
  const rings: PlanarRing[] = []
  for (const f of collection.features) {
    const polygons = f.geometry.type === 'Polygon' ? [f.geometry.coordinates] : f.geometry.coordinates
    for (const polygon of polygons) {
      for (const coords of polygon) {
        const ring = unwrapRing(coords)
        if (ring) rings.push(...placeRing(ring))
      }
    }
  }
  return rings
}

/** Indexes the land of a Natural Earth topology (object `land`); the sea router uses it for 1:10m. */
export function buildLandData(topo: Topology): LandData {
  const planar = landRings(topo)
  const rings = planar.map(r => Float64Array.from(r.xy))
  const ringEdge = new Uint32Array(rings.length)
  let edgeCount = 0
  rings.forEach((r, i) => { ringEdge[i] = edgeCount; edgeCount += r.length / 2 - 1 })
  const edges = new Float64Array(edgeCount * 4)
  const artificial = new Uint8Array(edgeCount)
  const edgeIndex = new Flatbush(edgeCount)
  const ringIndex = new Flatbush(rings.length)
  rings.forEach((r, i) => {
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity
    for (let k = 0; k < r.length / 2 - 1; k++) {
      const e = ringEdge[i]! + k
      const x1 = r[2 * k]!, y1 = r[2 * k + 1]!, x2 = r[2 * k + 2]!, y2 = r[2 * k + 3]!
      edges.set([x1, y1, x2, y2], e * 4)
      edgeIndex.add(Math.min(x1, x2), Math.min(y1, y2), Math.max(x1, x2), Math.max(y1, y2))
      minX = Math.min(minX, x1); minY = Math.min(minY, y1); maxX = Math.max(maxX, x1); maxY = Math.max(maxY, y1)
    }
    for (const k of planar[i]!.cut) artificial[ringEdge[i]! + k] = 1
    ringIndex.add(minX, minY, maxX, maxY)
  })
  edgeIndex.finish()
  ringIndex.finish()
  const data: LandData = { rings, ringEdge, ringIndex, edges, artificial, edgeIndex, corners: new Uint8Array(0) }
  data.corners = cornerStates(data)
  return data
}

/** Even-odd state of every grid corner, by a scanline along each corner row. */
function cornerStates(d: LandData): Uint8Array {
  const states = new Uint8Array(GRID_NX * GRID_NY)
  for (let j = 0; j < GRID_NY; j++) {
    const y = GRID_Y0 + j * GRID
    const xs: number[] = []
    for (const e of d.edgeIndex.search(-1e4, y, 1e4, y)) {
      const x1 = d.edges[4 * e]!, y1 = d.edges[4 * e + 1]!, x2 = d.edges[4 * e + 2]!, y2 = d.edges[4 * e + 3]!
      if ((y1 > y) !== (y2 > y)) xs.push(x1 + ((y - y1) * (x2 - x1)) / (y2 - y1))
    }
    xs.sort((a, b) => a - b)
    let passed = 0
    for (let i = 0; i < GRID_NX; i++) {
      const x = GRID_X0 + i * GRID
      while (passed < xs.length && xs[passed]! < x) passed++
      states[j * GRID_NX + i] = passed % 2
    }
  }
  return states
}

function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return (bx - ax) * (cy - ay) - (by - ay) * (cx - ax)
}

/** Parameter t in [0, 1] along a→b where it crosses edge e, or -1 (half-open at vertices so parity stays right). */
export function crossingParam(d: LandData, e: number, ax: number, ay: number, bx: number, by: number): number {
  const x1 = d.edges[4 * e]!, y1 = d.edges[4 * e + 1]!, x2 = d.edges[4 * e + 2]!, y2 = d.edges[4 * e + 3]!
  if ((orient(ax, ay, bx, by, x1, y1) > 0) === (orient(ax, ay, bx, by, x2, y2) > 0)) return -1
  const o3 = orient(x1, y1, x2, y2, ax, ay), o4 = orient(x1, y1, x2, y2, bx, by)
  if ((o3 > 0) === (o4 > 0)) return -1
  return o3 / (o3 - o4)
}

/** Point in land: even-odd walk from the grid corner south-west of the point (ray crossing, Shimrat 1962). */
export function isLand(lat: number, lon: number): boolean {
  return isLandIn(landData(), lat, lon)
}

export function isLandIn(d: LandData, lat: number, lon: number): boolean {
  const x = normaliseLongitude(lon), y = Math.max(-90, Math.min(90, lat))
  const i = Math.floor((x - GRID_X0) / GRID), j = Math.floor((y - GRID_Y0) / GRID)
  const cx = GRID_X0 + i * GRID, cy = GRID_Y0 + j * GRID
  let inside = d.corners[j * GRID_NX + i] === 1
  for (const e of d.edgeIndex.search(cx, cy, x, y)) {
    if (crossingParam(d, e, cx, cy, x, y) >= 0) inside = !inside
  }
  return inside
}

export interface Nearest { d2: number, edge: number, t: number }

/** Squared distance (degrees of latitude) from the origin to edge e, in the point's local equirectangular frame. */
function edgeDistance(d: LandData, e: number, px: number, py: number, cosP: number, out: Nearest): void {
  const ax = (d.edges[4 * e]! - px) * cosP, ay = d.edges[4 * e + 1]! - py
  const bx = (d.edges[4 * e + 2]! - px) * cosP, by = d.edges[4 * e + 3]! - py
  const vx = bx - ax, vy = by - ay, len2 = vx * vx + vy * vy
  const t = len2 > 0 ? Math.max(0, Math.min(1, -(ax * vx + ay * vy) / len2)) : 0
  const qx = ax + t * vx, qy = ay + t * vy
  const d2 = qx * qx + qy * qy
  if (d2 < out.d2) { out.d2 = d2; out.edge = e; out.t = t }
}

function upperBound(value: number, arr: number[]): number {
  let i = 0, j = arr.length - 1
  while (i < j) {
    const m = (i + j) >> 1
    if (arr[m]! > value) j = m
    else i = m + 1
  }
  return arr[i]!
}

/** Branch-and-bound descent of the edge R-tree with the local metric (box distance is a lower bound). */
function descend(d: LandData, px: number, py: number, cosP: number, best: Nearest): void {
  const { _boxes: boxes, _indices: indices, _levelBounds: levels, nodeSize, numItems } = d.edgeIndex
  const leaves4 = numItems * 4
  const stack = [boxes.length - 4]
  while (stack.length) {
    const node = stack.pop()!
    const end = Math.min(node + nodeSize * 4, upperBound(node, levels))
    for (let pos = node; pos < end; pos += 4) {
      const dx = Math.max(boxes[pos]! - px, px - boxes[pos + 2]!, 0) * cosP
      const dy = Math.max(boxes[pos + 1]! - py, py - boxes[pos + 3]!, 0)
      if (dx * dx + dy * dy >= best.d2) continue
      const child = indices[pos >> 2]!
      if (pos >= leaves4) stack.push(child)
      else if (!d.artificial[child]) edgeDistance(d, child, px, py, cosP, best)
    }
  }
}

/**
 * Nearest coastline edge to a point; `hint` (an edge near the previous point) seeds the bound.
 * With `maxDeg` only edges closer than that many degrees of latitude are looked for (edge -1 when none is).
 */
export function nearestCoast(d: LandData, p: LatLon, hint: number, maxDeg = Infinity): Nearest {
  const px = normaliseLongitude(p.lon), py = p.lat
  const cosP = Math.cos((py * Math.PI) / 180)
  const best: Nearest = { d2: maxDeg * maxDeg, edge: -1, t: 0 }
  if (hint >= 0) edgeDistance(d, hint, px, py, cosP, best)
  descend(d, px, py, cosP, best)
  const toSeam = (180 - Math.abs(px)) * cosP
  if (toSeam * toSeam < best.d2) {
    const other: Nearest = { ...best, d2: best.d2 }
    const shifted = px - Math.sign(px || 1) * 360
    descend(d, shifted, py, cosP, other)
    if (other.edge !== best.edge) return other
  }
  return best
}

export function pointOnEdge(d: LandData, n: Nearest): LatLon {
  const e = n.edge
  const lon = d.edges[4 * e]! + n.t * (d.edges[4 * e + 2]! - d.edges[4 * e]!)
  const lat = d.edges[4 * e + 1]! + n.t * (d.edges[4 * e + 3]! - d.edges[4 * e + 1]!)
  return { lat, lon: normaliseLongitude(lon) }
}

/** Splits a→b at the 180° meridian when it crosses it (shortest way round). */
export function seamPieces(a: LatLon, b: LatLon): [number, number, number, number][] {
  const ax = normaliseLongitude(a.lon), bx = normaliseLongitude(b.lon)
  if (Math.abs(bx - ax) <= 180) return [[ax, a.lat, bx, b.lat]]
  const bu = bx + (bx < ax ? 360 : -360)
  const seam = ax > 0 ? 180 : -180
  const lat = a.lat + ((seam - ax) / (bu - ax)) * (b.lat - a.lat)
  return [[ax, a.lat, seam, lat], [-seam, lat, bx, b.lat]]
}

/** First place where the segment a→b crosses the coastline, or undefined. */
function firstCrossing(d: LandData, a: LatLon, b: LatLon): LatLon | undefined {
  for (const [ax, ay, bx, by] of seamPieces(a, b)) {
    let tMin = Infinity
    const hits = d.edgeIndex.search(Math.min(ax, bx), Math.min(ay, by), Math.max(ax, bx), Math.max(ay, by))
    for (const e of hits) {
      if (d.artificial[e]) continue
      const t = crossingParam(d, e, ax, ay, bx, by)
      if (t >= 0 && t < tMin) tMin = t
    }
    if (tMin <= 1) return { lat: ay + tMin * (by - ay), lon: normaliseLongitude(ax + tMin * (bx - ax)) }
  }
  return undefined
}

function localNm(a: LatLon, b: LatLon): number {
  const dx = normaliseLongitude(b.lon - a.lon) * Math.cos((((a.lat + b.lat) / 2) * Math.PI) / 180)
  return NM_PER_DEG * Math.hypot(dx, b.lat - a.lat)
}

const geodesicNm = (a: LatLon, b: LatLon): number => geodesicInverse(a, b).distanceNm

/** Closest approach of the track points to the coastline; points that cannot beat the best so far are skipped. */
function closestApproach(d: LandData, points: LatLon[]): { point: LatLon, coast: LatLon } {
  let bestNm = Infinity, bestPoint = points[0]!, bestCoast: Nearest = { d2: Infinity, edge: -1, t: 0 }
  let hint = -1
  for (let i = 0; i < points.length;) {
    const near = nearestCoast(d, points[i]!, hint)
    hint = near.edge
    const nm = NM_PER_DEG * Math.sqrt(near.d2)
    if (nm < bestNm) { bestNm = nm; bestPoint = points[i]!; bestCoast = near }
    // Distance to land changes no faster than distance along the track (triangle inequality).
    const slack = 0.98 * (nm - bestNm)
    let along = 0
    i++
    while (i < points.length - 1 && (along += localNm(points[i - 1]!, points[i]!)) < slack) i++
  }
  return { point: bestPoint, coast: pointOnEdge(d, bestCoast) }
}

/**
 * Land check of a densified track: crossing by segment/coast-edge intersection, closest approach
 * by nearest coastline edge in a local equirectangular frame per point (good to about 1 % within
 * a few hundred miles), then the reported distance is the WGS84 geodesic to that coast point.
 */
export function checkTrack(points: LatLon[], clearanceNm: number, d: LandData = landData()): TrackCheck {
  if (points.length === 0) throw new Error('checkTrack needs at least one point')
  const start = points[0]!
  if (isLandIn(d, start.lat, normaliseLongitude(start.lon))) {
    const { coast } = closestApproach(d, [start])
    const firstLandPoint = { lat: start.lat, lon: normaliseLongitude(start.lon), index: 0 }
    return { crossesLand: true, firstLandPoint, closestApproachNm: 0, closestCoastPoint: coast, withinClearance: true }
  }
  for (let i = 0; i < points.length - 1; i++) {
    const hit = firstCrossing(d, points[i]!, points[i + 1]!)
    if (hit) return { crossesLand: true, firstLandPoint: { ...hit, index: i }, closestApproachNm: 0, closestCoastPoint: hit, withinClearance: true }
  }
  const { point, coast } = closestApproach(d, points)
  const closestApproachNm = geodesicNm(point, coast)
  return { crossesLand: false, closestApproachNm, closestCoastPoint: coast, withinClearance: closestApproachNm < clearanceNm }
}

/** Land check per leg, each densified at ≤ 2 nm by the navigation engine (against the 1:50m land unless another is given). */
export function checkLegs(legs: LegToCheck[], clearanceNm: number, stepNm = MAX_STEP_NM, d: LandData = landData()): LegCheck[] {
  const step = Math.min(stepNm, MAX_STEP_NM)
  return legs.map((leg, index) => ({ index, ...checkTrack(densifyLeg(leg.from, leg.to, leg.method, step), clearanceNm, d) }))
}

/** Sampling step of the distance tables' land pass: chords this far apart depart from the geodesic by well under a mile. */
export const LAND_STEP_NM = 20

/**
 * Does the geodesic from → to cross the coastline at all? The distance tables' cheaper question
 * (no closest approach, stops at the first crossing): the geodesic sampled every `stepNm`, each
 * chord tested against the coastline edges, so no coastline between samples is missed.
 */
export function geodesicCrossesLand(lat1: number, lon1: number, lat2: number, lon2: number, stepNm = LAND_STEP_NM): boolean {
  const d = landData()
  const points = densifyLeg({ lat: lat1, lon: lon1 }, { lat: lat2, lon: lon2 }, 'geodesic', stepNm)
  for (let i = 0; i < points.length - 1; i++) if (firstCrossing(d, points[i]!, points[i + 1]!)) return true
  return false
}

/**
 * Every stretch of a densified track over land, in order: where it goes ashore (a coastline edge
 * crossed from the sea, or the first point when that is ashore) and where it is afloat again (null
 * when the track ends ashore). The same segment/edge intersections as checkTrack, all of them.
 */
export function landCrossings(points: LatLon[], d: LandData = landData()): LandCrossing[] {
  const out: LandCrossing[] = []
  const start = points[0]
  if (!start) return out
  let ashore = isLandIn(d, start.lat, start.lon)
  if (ashore) out.push({ enter: { lat: start.lat, lon: normaliseLongitude(start.lon) }, exit: null })
  for (let i = 0; i < points.length - 1; i++) {
    for (const [ax, ay, bx, by] of seamPieces(points[i]!, points[i + 1]!)) {
      const ts: number[] = []
      for (const e of d.edgeIndex.search(Math.min(ax, bx), Math.min(ay, by), Math.max(ax, bx), Math.max(ay, by))) {
        if (d.artificial[e]) continue
        const t = crossingParam(d, e, ax, ay, bx, by)
        if (t >= 0 && t <= 1) ts.push(t)
      }
      ts.sort((a, b) => a - b)
      for (const t of ts) {
        const p = { lat: ay + t * (by - ay), lon: normaliseLongitude(ax + t * (bx - ax)) }
        if (ashore) out[out.length - 1]!.exit = p
        else out.push({ enter: p, exit: null })
        ashore = !ashore
      }
    }
  }
  return out
}
