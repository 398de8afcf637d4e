// Line of sight with clearance for the sea router: is a geodesic leg clear of the routing coastline
// by at least a required distance? A coarse raster of lower bounds on the distance to land settles
// open water cheaply; near land the leg is densified every nm along the geodesic (Karney's
// GeodesicLine) and each chord is tested exactly against the coastline edges.
import { G, geod } from '#shared/utils/engine/wgs84'
import type { LandData } from '../land'
import { NM_PER_DEG_LAT, chordCrossesLand } from './coast'
import { FIELD_LAT_MIN, FIELD_PER_DEG, fieldHalfDiagonalNm } from './distanceField'
import type { DistanceField } from './distanceField'

export const RASTER_PER_DEG = 16
const RATIO = FIELD_PER_DEG / RASTER_PER_DEG
/** Raster values are in quarter nm, saturating at 63.75 nm. */
const QUARTERS = 4
/** A 5×5 chamfer distance exceeds the straight distance by at most 1/cos(13.3°) (Borgefors 1986). */
const CHAMFER_EXCESS = 1.03
const RAD = Math.PI / 180
const LINE_CAPS = G.LATITUDE | G.LONGITUDE | G.DISTANCE_IN
const OPEN_PIECE_NM = 30
const NEAR_STEP_NM = 1

export interface ClearanceRaster { lowerBound: Uint8Array, rows: number, cols: number }

/** Lower bound (quarter nm) on the distance to land of every point in each raster cell, from the fine field. */
export function buildClearanceRaster(f: DistanceField): ClearanceRaster {
  const rows = f.rows / RATIO, cols = f.cols / RATIO
  const lowerBound = new Uint8Array(rows * cols)
  for (let j = 0; j < rows; j++) {
    const lat = FIELD_LAT_MIN + (j + 0.5) / RASTER_PER_DEG
    const slack = 2 * fieldHalfDiagonalNm(Math.abs(lat) < 1 ? 0 : lat - Math.sign(lat) / RASTER_PER_DEG)
    for (let i = 0; i < cols; i++) {
      let low = Infinity
      for (let a = 0; a < RATIO; a++) for (let b = 0; b < RATIO; b++) low = Math.min(low, f.units[(j * RATIO + a) * f.cols + i * RATIO + b]!)
      const nm = low / 50 / CHAMFER_EXCESS - slack
      lowerBound[j * cols + i] = Math.max(0, Math.min(255, Math.floor(nm * QUARTERS)))
    }
  }
  return { lowerBound, rows, cols }
}

export function rasterLowerBoundNm(r: ClearanceRaster, lat: number, lon: number): number {
  const j = Math.floor((lat - FIELD_LAT_MIN) * RASTER_PER_DEG)
  if (j < 0 || j >= r.rows) return 0
  const i = ((Math.floor((lon + 180) * RASTER_PER_DEG) % r.cols) + r.cols) % r.cols
  return r.lowerBound[j * r.cols + i]! / QUARTERS
}

export interface Sight { land: LandData, raster: ClearanceRaster }

function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return (bx - ax) * (cy - ay) - (by - ay) * (cx - ax)
}

function pointSegment2(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const vx = bx - ax, vy = by - ay, len2 = vx * vx + vy * vy
  const t = len2 > 0 ? Math.max(0, Math.min(1, ((px - ax) * vx + (py - ay) * vy) / len2)) : 0
  const qx = ax + t * vx - px, qy = ay + t * vy - py
  return qx * qx + qy * qy
}

/** Squared distance between two planar segments (0 when they cross). */
function segmentSegment2(ax: number, ay: number, bx: number, by: number, cx: number, cy: number, dx: number, dy: number): number {
  const o1 = orient(ax, ay, bx, by, cx, cy), o2 = orient(ax, ay, bx, by, dx, dy)
  const o3 = orient(cx, cy, dx, dy, ax, ay), o4 = orient(cx, cy, dx, dy, bx, by)
  if ((o1 > 0) !== (o2 > 0) && (o3 > 0) !== (o4 > 0)) return 0
  return Math.min(pointSegment2(ax, ay, cx, cy, dx, dy), pointSegment2(bx, by, cx, cy, dx, dy), pointSegment2(cx, cy, ax, ay, bx, by), pointSegment2(dx, dy, ax, ay, bx, by))
}

/** Whether any coastline edge comes within reqNm of the chord (local equirectangular frame, nm). */
function coastWithin(d: LandData, ax: number, ay: number, bx: number, by: number, reqNm: number): boolean {
  const cosm = Math.cos(((ay + by) / 2) * RAD)
  const dLat = reqNm / NM_PER_DEG_LAT, dLon = dLat / Math.max(0.05, cosm)
  const req2 = (reqNm / NM_PER_DEG_LAT) ** 2
  const probe = (sx: number) => d.edgeIndex.collides(Math.min(ax, bx) + sx - dLon, Math.min(ay, by) - dLat, Math.max(ax, bx) + sx + dLon, Math.max(ay, by) + dLat, (e) => {
    if (d.artificial[e]) return false
    const x1 = (d.edges[4 * e]! - sx - ax) * cosm, y1 = d.edges[4 * e + 1]! - ay
    const x2 = (d.edges[4 * e + 2]! - sx - ax) * cosm, y2 = d.edges[4 * e + 3]! - ay
    return segmentSegment2(0, 0, (bx - ax) * cosm, by - ay, x1, y1, x2, y2) < req2
  })
  if (probe(0)) return true
  if (Math.max(ax, bx) + dLon > 180) return probe(360)
  if (Math.min(ax, bx) - dLon < -180) return probe(-360)
  return false
}

/** A short chord (b unwrapped next to a) clear of land by reqNm, tested exactly. */
function chordClearExact(d: LandData, ax: number, ay: number, bx: number, by: number, reqNm: number): boolean {
  if (chordCrossesLand(d, ax, ay, bx, by)) return false
  return reqNm <= 0 || !coastWithin(d, ax, ay, bx, by, reqNm)
}

const unwrapNear = (x: number, ref: number) => x + 360 * Math.round((ref - x) / 360)

/**
 * Whether the geodesic from a to b keeps at least reqNm from the coastline and stays within
 * |lat| ≤ limitLat. Open water is cleared by the raster every 2 nm along 30-nm chords; pieces
 * near land are densified every nm on the geodesic and tested exactly.
 */
export function legClear(s: Sight, lat1: number, lon1: number, lat2: number, lon2: number, reqNm: number, limitLat = 90): boolean {
  const line = geod.InverseLine(lat1, lon1, lat2, lon2, LINE_CAPS)
  const total = line.s13 / 1852
  if (limitLat < 90 && !withinLimit(line, lat1, lat2, limitLat)) return false
  const pieces = Math.max(1, Math.ceil(total / OPEN_PIECE_NM))
  const at = (nm: number) => {
    const p = line.Position(nm * 1852, G.LATITUDE | G.LONGITUDE)
    return [p.lat2!, p.lon2!] as const
  }
  let [ay, ax] = [lat1, lon1]
  for (let k = 1; k <= pieces; k++) {
    const [by, bxRaw] = k === pieces ? [lat2, lon2] : at((total * k) / pieces)
    const bx = unwrapNear(bxRaw, ax)
    const pieceNm = total / pieces
    // Chord sagitta against the geodesic: L²·tan φ / 8R, plus half the sample spacing.
    const margin = (pieceNm * pieceNm * Math.tan(Math.min(85, Math.max(Math.abs(ay), Math.abs(by))) * RAD)) / (8 * 3440) + 1.1
    const samples = Math.max(1, Math.ceil(pieceNm / 2))
    let open = true
    for (let i = 0; i <= samples && open; i++) {
      const t = i / samples
      if (rasterLowerBoundNm(s.raster, ay + t * (by - ay), ax + t * (bx - ax)) < reqNm + margin) open = false
    }
    if (!open) {
      const steps = Math.max(1, Math.ceil(pieceNm / NEAR_STEP_NM))
      const start = (total * (k - 1)) / pieces
      let py = ay, px = ax
      for (let i = 1; i <= steps; i++) {
        const [qy, qxRaw] = i === steps ? [by, bx] : at(start + (pieceNm * i) / steps)
        const qx = unwrapNear(qxRaw, px)
        if (!chordClearExact(s.land, px, py, qx, qy, reqNm)) return false
        px = qx; py = qy
      }
    }
    ax = bx; ay = by
    if (ax > 180 || ax < -180) ax = unwrapNear(ax, 0)
  }
  return true
}

/** Whether a geodesic line stays within |lat| ≤ limitLat: its vertex, if between the ends, decides (Clairaut). */
function withinLimit(line: { azi1: number, s13: number }, lat1: number, lat2: number, limitLat: number): boolean {
  if (Math.abs(lat1) > limitLat + 1e-9 || Math.abs(lat2) > limitLat + 1e-9) return false
  const l = line as unknown as { Position: (s: number, caps: number) => { lat2: number }, a13: number, ArcPosition: (a: number, caps: number) => { lat2: number } }
  // Sample the latitude along the line; the extreme is a smooth maximum, so a fine sampling suffices.
  const n = Math.max(4, Math.ceil(line.s13 / 1852 / 50))
  for (let i = 1; i < n; i++) if (Math.abs(l.ArcPosition((l.a13 * i) / n, G.LATITUDE).lat2) > limitLat + 1e-9) return false
  return true
}

/** Exact clearance (nm) of a geodesic leg from the coastline up to capNm, sampled every stepNm. */
export { chordClearExact }
