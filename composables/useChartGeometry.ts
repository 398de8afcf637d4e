// What the plan chart draws, as plain coordinates: pure functions of the waypoints, no Leaflet.
// Longitudes are unwrapped along the whole route so a passage across 180° is one continuous line
// (Leaflet then draws it beyond ±180°, on the repeated world copy of the tiles).
import type { LatLon, LegMethod } from '#shared/types/geo'
import type { LandCheckLeg } from '#shared/types/landCheck'
import { densifyLeg, unwrapLongitudes } from '#shared/utils/track'
import { geodesicDirect, geodesicInverse, geodesicVertex } from '#shared/utils/geodesic'
import { greatEllipseDensify } from '#shared/utils/greatEllipse'
import { rhumbInverse } from '#shared/utils/rhumb'
import { normaliseCourse, wrapLongitude } from '#shared/utils/position'
import { NM_M } from '#shared/utils/navConstants'

export interface ChartWaypoint extends LatLon { method?: LegMethod, xteNm?: number | null }

export interface ChartVertex extends LatLon { legIndex: number }

/**
 * One leg as drawn, at unwrapped longitudes starting from its first waypoint's. Pieces are kept
 * between builds, so an unchanged leg is the same object and the chart's layers can skip it.
 */
export interface ChartLegPiece {
  track: LatLon[]
  rhumb: LatLon[] | null
  corridor: LatLon[] | null
  vertex: LatLon | null
  bounds: { south: number, west: number, north: number, east: number }
  /** The great ellipse between the leg's ends, made the first time it is asked for (null: antipodal ends). */
  ellipse?: LatLon[] | null
}

export interface ChartGeometry {
  /** The planned track, every leg densified by its own method, one continuous unwrapped line. */
  track: LatLon[]
  /** Waypoints at the unwrapped longitudes of the track. */
  waypoints: LatLon[]
  /** The rhumb line between the ends of each geodesic leg. */
  rhumbAlternatives: LatLon[][]
  /** One closed ring per leg with a cross-track limit: the band ±xteNm either side of the leg. */
  corridors: LatLon[][]
  /** Vertex (highest latitude) of each geodesic leg that lies between its ends. */
  vertices: ChartVertex[]
  /** The great ellipse between the ends of every leg (only when asked for). */
  greatEllipses: LatLon[][]
  /** The limiting parallel across the track's longitudes, in the track's hemisphere. */
  limitParallel: LatLon[] | null
  bounds: { south: number, west: number, north: number, east: number } | null
  /** The same lines leg by leg (leg i from waypoint i to i + 1). */
  pieces: ChartLegPiece[]
}

export interface ChartGeometryOptions {
  stepNm?: number
  limitLat?: number | null
  greatEllipse?: boolean
}

interface LegShape { track: LatLon[], rhumb: LatLon[] | null, corridor: LatLon[] | null, vertex: LatLon | null }


/** Shift a line by whole turns so that it starts at the given (unwrapped) longitude. */
function anchorAt(points: LatLon[], lon: number): LatLon[] {
  const line = unwrapLongitudes(points)
  const shift = lon + wrapLongitude(line[0]!.lon - lon) - line[0]!.lon
  return shift === 0 ? line : line.map(p => ({ lat: p.lat, lon: p.lon + shift }))
}

/**
 * Corridor ring: track points moved xteNm to port and to starboard along the geodesic perpendicular
 * to the track there (geographiclib direct through the engine, Karney 2013), port side forward,
 * starboard back. Offsets are taken at every `stride`-th densified point (the band is a chart
 * overlay; a 40 nm chord of it is within a pixel of the curve at zoom 8).
 */
export function corridorRing(track: LatLon[], method: LegMethod, xteNm: number, stride = 1): LatLon[] {
  const rhumbCourse = method === 'rhumb' ? rhumbInverse(track[0]!, track.at(-1)!).course : 0
  const port: LatLon[] = []
  const starboard: LatLon[] = []
  const last = track.length - 1
  for (let k = 0; k <= last; k = k === last ? last + 1 : Math.min(k + stride, last)) {
    const p = track[k]!
    let course = rhumbCourse
    if (method === 'geodesic') course = k < last ? geodesicInverse(p, track[k + 1]!).initialCourse : geodesicInverse(track[k - 1]!, p).finalCourse
    const left = geodesicDirect(p, normaliseCourse(course - 90), xteNm * NM_M)
    const right = geodesicDirect(p, normaliseCourse(course + 90), xteNm * NM_M)
    // Keep each offset within half a turn of its track point so the ring never spans the globe.
    port.push({ lat: left.lat, lon: p.lon + wrapLongitude(left.lon - p.lon) })
    starboard.push({ lat: right.lat, lon: p.lon + wrapLongitude(right.lon - p.lon) })
  }
  return [...port, ...starboard.reverse()]
}

/** Overlays (rhumb alternative, corridor) are sampled about every 40 nm: they are for the eye, the track is for the numbers. */
const OVERLAY_STEP_NM = 40

function legShape(a: ChartWaypoint, b: ChartWaypoint, stepNm: number): LegShape {
  const method = b.method ?? 'rhumb'
  let track: LatLon[]
  // A leg the engine cannot sail (a rhumb line through a pole) still draws, as a straight segment.
  try { track = densifyLeg(a, b, method, stepNm) }
  catch { return { track: [{ lat: a.lat, lon: a.lon }, { lat: b.lat, lon: b.lon }], rhumb: null, corridor: null, vertex: null } }
  const geodesic = method === 'geodesic'
  const v = geodesic ? geodesicVertex(a, b) : null
  return {
    track,
    rhumb: geodesic ? densifyLeg(a, b, 'rhumb', Math.max(stepNm, OVERLAY_STEP_NM)) : null,
    corridor: b.xteNm && b.xteNm > 0 ? corridorRing(track, method, b.xteNm, Math.max(1, Math.round(OVERLAY_STEP_NM / stepNm))) : null,
    vertex: v?.between ? { lat: v.lat, lon: v.lon } : null,
  }
}

/** A leg's shape moved to the world copy where its first waypoint lies at longitude `lon`. */
function anchorPiece(shape: LegShape, lon: number): ChartLegPiece {
  const track = anchorAt(shape.track, lon)
  return {
    track,
    rhumb: shape.rhumb ? anchorAt(shape.rhumb, lon) : null,
    corridor: shape.corridor ? anchorAt(shape.corridor, lon) : null,
    vertex: shape.vertex ? { lat: shape.vertex.lat, lon: lon + wrapLongitude(shape.vertex.lon - lon) } : null,
    bounds: boundsOf(track)!,
  }
}

interface LegMemo { from: ChartWaypoint, stepNm: number, shape: LegShape, lon: number, piece: ChartLegPiece }

/**
 * A geometry builder that remembers each leg by its two waypoint objects (the draft replaces a
 * waypoint to change it, never changes one in place), and each drawn piece by its world copy, so
 * dragging one waypoint of a long plan recomputes only the two legs that touch it and hands the
 * chart the same objects for every other leg.
 */
export function createChartGeometry() {
  const memo = new WeakMap<ChartWaypoint, LegMemo>()

  return function build(waypoints: readonly ChartWaypoint[], options: ChartGeometryOptions = {}): ChartGeometry {
    const stepNm = options.stepNm ?? 10
    const pieces: ChartLegPiece[] = []
    let lon = waypoints[0]?.lon ?? 0
    for (let i = 1; i < waypoints.length; i++) {
      const a = waypoints[i - 1]!
      const b = waypoints[i]!
      let m = memo.get(b)
      if (!m || m.from !== a || m.stepNm !== stepNm) {
        const shape = legShape(a, b, stepNm)
        m = { from: a, stepNm, shape, lon, piece: anchorPiece(shape, lon) }
        memo.set(b, m)
      }
      else if (m.lon !== lon) {
        m = { ...m, lon, piece: anchorPiece(m.shape, lon) }
        memo.set(b, m)
      }
      pieces.push(m.piece)
      lon = m.piece.track.at(-1)!.lon
    }
    return assemble(waypoints, pieces, options)
  }
}

function assemble(waypoints: readonly ChartWaypoint[], pieces: ChartLegPiece[], options: ChartGeometryOptions): ChartGeometry {
  const track: LatLon[] = pieces.length ? [pieces[0]!.track[0]!] : waypoints.slice(0, 1).map(w => ({ lat: w.lat, lon: w.lon }))
  const marks: LatLon[] = [...track]
  const rhumbAlternatives: LatLon[][] = []
  const corridors: LatLon[][] = []
  const vertices: ChartVertex[] = []
  const greatEllipses: LatLon[][] = []
  let bounds: ChartGeometry['bounds'] = track.length ? boundsOf(track) : null
  pieces.forEach((p, i) => {
    for (let k = 1; k < p.track.length; k++) track.push(p.track[k]!)
    marks.push(p.track.at(-1)!)
    if (p.rhumb) rhumbAlternatives.push(p.rhumb)
    if (p.corridor) corridors.push(p.corridor)
    if (p.vertex) vertices.push({ legIndex: i, ...p.vertex })
    if (options.greatEllipse) {
      if (p.ellipse === undefined) {
        try { p.ellipse = anchorAt(greatEllipseDensify(waypoints[i]!, waypoints[i + 1]!, options.stepNm ?? 10), p.track[0]!.lon) }
        catch { p.ellipse = null } // antipodal ends: no single great ellipse to draw
      }
      if (p.ellipse) greatEllipses.push(p.ellipse)
    }
    const b = p.bounds
    bounds = { south: Math.min(bounds!.south, b.south), west: Math.min(bounds!.west, b.west), north: Math.max(bounds!.north, b.north), east: Math.max(bounds!.east, b.east) }
  })
  return { track, waypoints: marks, rhumbAlternatives, corridors, vertices, greatEllipses, limitParallel: limitLine(bounds, options.limitLat), bounds, pieces }
}

function boundsOf(points: LatLon[]): ChartGeometry['bounds'] {
  if (!points.length) return null
  let south = 90, north = -90, west = Infinity, east = -Infinity
  for (const p of points) {
    south = Math.min(south, p.lat); north = Math.max(north, p.lat)
    west = Math.min(west, p.lon); east = Math.max(east, p.lon)
  }
  return { south, west, north, east }
}

/** The limit parallel on the side of the equator where the track reaches farthest from it. */
function limitLine(bounds: ChartGeometry['bounds'], limitLat?: number | null): LatLon[] | null {
  if (!bounds || limitLat == null || !Number.isFinite(limitLat)) return null
  const lat = Math.abs(bounds.north) >= Math.abs(bounds.south) ? Math.abs(limitLat) : -Math.abs(limitLat)
  const margin = Math.max(10, (bounds.east - bounds.west) * 0.15)
  return [{ lat, lon: bounds.west - margin }, { lat, lon: bounds.east + margin }]
}

export interface ChartLandMark extends LatLon { legIndex: number, kind: 'crossing' | 'near', closestNm: number }

/** Land check findings at the world copy of their leg (crossing: first land point; near: closest coast point). */
export function landMarks(g: ChartGeometry, legs: readonly LandCheckLeg[] | undefined): ChartLandMark[] {
  const out: ChartLandMark[] = []
  for (const l of legs ?? []) {
    const ref = g.waypoints[l.index]?.lon
    // Every place the leg goes ashore, not only the first.
    const points = l.crossesLand ? (l.crossings?.length ? l.crossings.map(c => c.enter) : [l.firstLandPoint]) : l.withinClearance ? [l.closestCoastPoint] : []
    for (const p of points) {
      if (ref == null || !p) continue
      out.push({ legIndex: l.index, kind: l.crossesLand ? 'crossing' : 'near', closestNm: l.closestApproachNm, lat: p.lat, lon: ref + wrapLongitude(p.lon - ref) })
    }
  }
  return out
}

/** Composable form for components: one builder per chart instance. */
export function useChartGeometry() {
  return createChartGeometry()
}
