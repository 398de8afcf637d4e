// Zones prepared once for many legs: each geodesic edge cut into sub-edges of at most
// SUB_EDGE_M along the same geodesic (the boundary is unchanged), with a bounding-box index
// (flatbush, a packed Hilbert R-tree) of the sub-edges and of the zones, so a leg looks only at
// the boundary near it and no step is quadratic in waypoints or vertices.
import Flatbush from 'flatbush'
import type { ZoneInput } from './types'
import { DEG_PER_RAD, WGS84_F } from '../navConstants'
import { LINE_CAPS, POS_MASK, auxVector, cross3, geod, isometricLat, radii, unit3, wrap180, type V3 } from './geometry'

/** Sub-edges are short enough that a rhumb line meets one at most twice and its bulge is tiny. */
export const SUB_EDGE_M = 100 * 1852
const EARTH_R = 6_371_000

type GeodesicLine = ReturnType<typeof geod.InverseLine>

export interface SubEdge {
  zone: number
  poly: number
  /** Ring within the polygon (0 = outer) and the edge's place in the ring (from vertex `edge` to `edge + 1`). */
  ring: number
  edge: number
  lat1: number
  /** Start longitude; lon2 continues from it (may pass ±180). */
  lon1: number
  lat2: number
  lon2: number
  azi1: number
  lengthM: number
  /** The whole edge's geodesic, this sub-edge's offset along it and its start longitude in the line's own frame. */
  line: GeodesicLine
  t0: number
  lineLon1: number
  /** Isometric latitudes of the ends and a bound of the sub-edge's bow off its chord in the Mercator plane. */
  psi1: number
  psi2: number
  mercBulge: number
  v1: V3
  v2: V3
  normal: V3
  /** How far the geodesic may stray from the great circle through v1, v2 on the auxiliary sphere. */
  auxMargin: number
  latMin: number
  latMax: number
}

export interface PreparedZone { zone: ZoneInput, latMin: number, latMax: number, lonMin: number, lonMax: number, polygonCount: number }

export interface PreparedZones {
  zones: PreparedZone[]
  edges: SubEdge[]
  edgeIndex: Flatbush | null
  zoneIndex: Flatbush | null
}

/** Sagitta bound of a geodesic piece over its chord, degrees of latitude (ℓ²/8R, doubled for safety). */
const latBulgeDeg = (lengthM: number) => lengthM * lengthM / (4 * EARTH_R) * DEG_PER_RAD / EARTH_R + 1e-9

/**
 * Bow of a geodesic piece off its chord in the Mercator plane (radians of longitude): the plane
 * curvature of a geodesic under a conformal map of scale 1/(N cos φ) is about sin φ per unit,
 * so the sagitta is ≤ sin φ·L²/8 with L = ℓ/(N cos φ); doubled for safety.
 */
function mercatorBulge(lengthM: number, latMin: number, latMax: number) {
  const lat = Math.min(89.9, Math.max(Math.abs(latMin), Math.abs(latMax)))
  const L = lengthM / radii(lat).parallel
  return Math.sin(lat * Math.PI / 180) * L * L / 4 + 1e-12
}

/** Each ring's longitudes made continuous (each step the shorter way round), holes near their outer ring. */
function unwrapRing(ring: [number, number][], anchor: number): [number, number][] {
  const out: [number, number][] = []
  let prev = anchor
  let prevRaw = anchor
  for (const [lon, lat] of ring) {
    prev = out.length === 0 ? anchor + wrap180(lon - anchor) : prev + wrap180(lon - prevRaw)
    prevRaw = lon
    out.push([prev, lat])
  }
  return out
}

function addEdge(out: SubEdge[], zone: number, poly: number, ring: number, edge: number, a: [number, number], b: [number, number]) {
  const line = geod.InverseLine(a[1], a[0], b[1], b[0], LINE_CAPS)
  const total = line.s13
  if (!(total > 1e-6)) return
  const parts = Math.max(1, Math.ceil(total / SUB_EDGE_M))
  let lat1 = a[1]
  let lon1 = a[0]
  let azi1 = line.azi1
  for (let j = 1; j <= parts; j++) {
    const t = total * j / parts
    const p = line.Position(t, POS_MASK)
    const lat2 = j === parts ? b[1] : p.lat2!
    const lon2 = j === parts ? b[0] : p.lon2!
    const lengthM = total / parts
    const v1 = auxVector(lat1, lon1)
    const v2 = auxVector(lat2, lon2)
    const bulge = latBulgeDeg(lengthM)
    const latMin = Math.min(lat1, lat2) - bulge
    const latMax = Math.max(lat1, lat2) + bulge
    out.push({
      zone, poly, ring, edge, lat1, lon1, lat2, lon2, azi1, lengthM, line, t0: total * (j - 1) / parts, lineLon1: lon1, v1, v2,
      psi1: isometricLat(lat1), psi2: isometricLat(lat2), mercBulge: mercatorBulge(lengthM, latMin, latMax),
      normal: unit3(cross3(v1, v2)), auxMargin: 2.5 * WGS84_F * lengthM / EARTH_R + 1e-12, latMin, latMax,
    })
    lat1 = lat2
    lon1 = lon2
    azi1 = p.azi2!
  }
}

/** Sub-edges of one zone, shifted so that the zone's western edge lies in −180..180. */
function prepareZone(zone: ZoneInput, zoneIndex: number, edges: SubEdge[]): PreparedZone {
  const first = edges.length
  let lonMin = Infinity
  let lonMax = -Infinity
  zone.polygons.forEach((rings, poly) => {
    const anchor = rings[0]?.[0]?.[0] ?? 0
    rings.forEach((raw, r) => {
      const ring = unwrapRing(raw, anchor)
      for (const [lon] of ring) { lonMin = Math.min(lonMin, lon); lonMax = Math.max(lonMax, lon) }
      for (let i = 1; i < ring.length; i++) addEdge(edges, zoneIndex, poly, r, i - 1, ring[i - 1]!, ring[i]!)
    })
  })
  const shift = Number.isFinite(lonMin) ? wrap180(lonMin) - lonMin : 0
  let latMin = Infinity
  let latMax = -Infinity
  for (let k = first; k < edges.length; k++) {
    const e = edges[k]!
    if (shift !== 0) { e.lon1 += shift; e.lon2 += shift }
    latMin = Math.min(latMin, e.latMin)
    latMax = Math.max(latMax, e.latMax)
  }
  return { zone, latMin, latMax, lonMin: lonMin + shift, lonMax: lonMax + shift, polygonCount: zone.polygons.length }
}

/** Prepares zones for many legs: sub-edges, their index and the zones' boxes. */
export function prepareZones(zones: readonly ZoneInput[]): PreparedZones {
  const edges: SubEdge[] = []
  const prepared = zones.map((z, i) => prepareZone(z, i, edges))
  let edgeIndex: Flatbush | null = null
  if (edges.length) {
    edgeIndex = new Flatbush(edges.length)
    for (const e of edges) edgeIndex.add(Math.min(e.lon1, e.lon2), e.latMin, Math.max(e.lon1, e.lon2), e.latMax)
    edgeIndex.finish()
  }
  const withEdges = prepared.filter(z => Number.isFinite(z.latMin))
  let zoneIndex: Flatbush | null = null
  if (withEdges.length) {
    zoneIndex = new Flatbush(prepared.length)
    for (const z of prepared) {
      if (Number.isFinite(z.latMin)) zoneIndex.add(z.lonMin, z.latMin, z.lonMax, z.latMax)
      else zoneIndex.add(1e3, 1e3, 1e3, 1e3) // a zone with no edges is never met
    }
    zoneIndex.finish()
  }
  return { zones: prepared, edges, edgeIndex, zoneIndex }
}

/**
 * Calls visit(i) once for every item of the index whose box meets the box [minLon, maxLon] × [minLat, maxLat]
 * on the globe: the query is also tried shifted by ±360° so boxes across 180° are found.
 */
export function searchWrapped(index: Flatbush | null, minLon: number, minLat: number, maxLon: number, maxLat: number, visit: (i: number) => void) {
  if (!index) return
  const shift = wrap180(minLon) - minLon
  const lo = minLon + shift
  const hi = maxLon + shift
  const wrapsEast = hi > 180
  const wrapsWest = index.maxX > 180 && lo + 360 <= index.maxX
  if (!wrapsEast && !wrapsWest) {
    index.search(lo, minLat, hi, maxLat, (i) => { visit(i); return false })
    return
  }
  const seen = new Set<number>()
  const each = (i: number) => { if (!seen.has(i)) { seen.add(i); visit(i) } return false }
  index.search(lo, minLat, hi, maxLat, each)
  if (wrapsEast) index.search(lo - 360, minLat, hi - 360, maxLat, each)
  if (wrapsWest) index.search(lo + 360, minLat, hi + 360, maxLat, each)
}
