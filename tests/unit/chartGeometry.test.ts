import { describe, expect, it } from 'vitest'
import { corridorRing, createChartGeometry, landMarks } from '../../composables/useChartGeometry'
import { densifyLeg } from '../../shared/utils/track'
import { geodesicInverse } from '../../shared/utils/geodesic'
import { rhumbInverse } from '../../shared/utils/rhumb'
import { angleDiff, fmt, runOracle } from './support/oracle'

// The demo North Pacific crossing (Yokohama – Juan de Fuca, seeded positions), with XTE limits added.
const pacific = [
  { lat: 35.4437, lon: 139.6380, method: 'rhumb' as const },
  { lat: 34.85, lon: 139.95, method: 'rhumb' as const, xteNm: 2 },
  { lat: 48.4950, lon: -124.8000, method: 'geodesic' as const, xteNm: 25 },
  { lat: 48.1420, lon: -123.4000, method: 'rhumb' as const, xteNm: 1 },
]

describe('chart geometry', () => {
  it('a Pacific track across 180° unwraps to one continuous, monotonic longitude range', () => {
    const g = createChartGeometry()(pacific, { limitLat: 48.75 })
    const lons = g.track.map(p => p.lon)
    for (let i = 1; i < lons.length; i++) {
      expect(Math.abs(lons[i]! - lons[i - 1]!)).toBeLessThan(1)
      expect(lons[i]!).toBeGreaterThanOrEqual(lons[i - 1]!)
    }
    expect(lons[0]).toBeCloseTo(139.638, 9)
    expect(lons.at(-1)).toBeCloseTo(360 - 123.4, 9)
    // Markers sit on the unwrapped track: Juan de Fuca at 235.2°, not −124.8°.
    expect(g.waypoints.map(p => p.lon)).toEqual([139.638, 139.95, 360 - 124.8, 360 - 123.4].map(x => expect.closeTo(x, 9)))
    expect(g.bounds!.east - g.bounds!.west).toBeLessThan(100)
  })

  it('the rhumb alternative, vertex, corridor and limit parallel sit on the same unwrapped range', () => {
    const g = createChartGeometry()(pacific, { limitLat: 48.75, greatEllipse: true })
    expect(g.rhumbAlternatives).toHaveLength(1)
    const alt = g.rhumbAlternatives[0]!
    expect(alt[0]!.lon).toBeCloseTo(139.95, 9)
    expect(alt.at(-1)!.lon).toBeCloseTo(235.2, 9)
    expect(g.vertices).toHaveLength(1)
    expect(g.vertices[0]!.lat).toBeGreaterThan(48.5)
    expect(g.vertices[0]!.lon).toBeGreaterThan(180)
    expect(g.vertices[0]!.lon).toBeLessThan(235.2)
    expect(g.corridors).toHaveLength(3)
    for (const ring of g.corridors) for (const p of ring) expect(p.lon).toBeGreaterThan(130)
    expect(g.greatEllipses).toHaveLength(3)
    expect(g.greatEllipses[1]!.at(-1)!.lon).toBeCloseTo(235.2, 6)
    expect(g.limitParallel!.every(p => p.lat === 48.75)).toBe(true)
    expect(g.limitParallel![0]!.lon).toBeLessThan(139.638)
    expect(g.limitParallel![1]!.lon).toBeGreaterThan(236.6)
  })

  it('the limit parallel goes in the hemisphere of the track', () => {
    const cape = [{ lat: -34.55, lon: 18.45 }, { lat: -40, lon: 30, method: 'geodesic' as const }]
    expect(createChartGeometry()(cape, { limitLat: 40 }).limitParallel![0]!.lat).toBe(-40)
    expect(createChartGeometry()(cape, { limitLat: null }).limitParallel).toBeNull()
  })

  it('reuses unchanged legs when one waypoint moves', () => {
    const build = createChartGeometry()
    const first = build(pacific)
    const moved = pacific.map((w, i) => (i === 3 ? { ...w, lat: 48.2 } : w))
    const second = build(moved)
    expect(second.track.slice(0, 300)).toEqual(first.track.slice(0, 300))
    expect(second.track.at(-1)!.lat).toBe(48.2)
    // The legs away from the moved waypoint are the very same pieces (the chart skips redrawing them).
    expect(second.pieces[0]).toBe(first.pieces[0])
    expect(second.pieces[1]).toBe(first.pieces[1])
    expect(second.pieces[2]).not.toBe(first.pieces[2])
    expect(second).toEqual({ ...createChartGeometry()(moved), pieces: second.pieces })
  })

  // Oracle: GeodSolve (GeographicLib 2.1.2, Debian geographiclib-tools), inverse problem.
  it.each([
    ['geodesic across 180°', { lat: 34.85, lon: 139.95 }, { lat: 48.495, lon: -124.8 }, 'geodesic' as const, 25],
    ['rhumb line in the South Atlantic', { lat: -34.55, lon: 18.45 }, { lat: -40, lon: 30 }, 'rhumb' as const, 10],
  ])('corridor points are xteNm from the track, perpendicular to it: %s (GeodSolve)', (_name, a, b, method, xteNm) => {
    const track = densifyLeg(a, b, method, 10)
    const ring = corridorRing(track, method, xteNm)
    expect(ring).toHaveLength(track.length * 2)
    const sparse = corridorRing(track, method, xteNm, 4)
    expect(sparse).toHaveLength(2 * (Math.ceil((track.length - 1) / 4) + 1))
    expect(sparse[sparse.length / 2 - 1]).toEqual(ring[track.length - 1])
    const lines: string[] = []
    const courses: number[] = []
    track.forEach((p, k) => {
      const course = method === 'rhumb' ? rhumbInverse(a, b).course
        : k + 1 < track.length ? geodesicInverse(p, track[k + 1]!).initialCourse : geodesicInverse(track[k - 1]!, p).finalCourse
      for (const q of [ring[k]!, ring[ring.length - 1 - k]!]) {
        lines.push(`${fmt(p.lat)} ${fmt(p.lon)} ${fmt(q.lat)} ${fmt(q.lon)}`)
        courses.push(course)
      }
    })
    const out = runOracle('GeodSolve', ['-i', '-p', '9'], lines)
    out.forEach(([azi1, , s12], n) => {
      expect(Math.abs(s12! - xteNm * 1852)).toBeLessThan(1e-3)
      expect(Math.abs(angleDiff(azi1!, courses[n]!))).toBeCloseTo(90, 6)
      // Port side first (course − 90°), starboard back (course + 90°).
      expect(Math.sign(angleDiff(azi1!, courses[n]!))).toBe(n % 2 === 0 ? -1 : 1)
    })
  })
})

describe('land check marks', () => {
  it('sit on the world copy of their leg and only for flagged legs', () => {
    const g = createChartGeometry()(pacific)
    const coast = { lat: 48.4, lon: -124.7 }
    const legs = [
      { index: 0, crossesLand: false, firstLandPoint: null, crossings: [], closestApproachNm: 30, closestCoastPoint: coast, withinClearance: false },
      { index: 1, crossesLand: false, firstLandPoint: null, crossings: [], closestApproachNm: 3.2, closestCoastPoint: coast, withinClearance: true },
      {
        index: 2, crossesLand: true, firstLandPoint: { lat: 48.3, lon: -123.9 }, closestApproachNm: 0, closestCoastPoint: coast, withinClearance: true,
        crossings: [{ enter: { lat: 48.3, lon: -123.9 }, exit: { lat: 48.31, lon: -123.8 } }, { enter: { lat: 48.35, lon: -123.5 }, exit: null }],
      },
    ]
    const marks = landMarks(g, legs)
    // One mark for every place a leg goes ashore, not only the first.
    expect(marks.map(m => [m.legIndex, m.kind])).toEqual([[1, 'near'], [2, 'crossing'], [2, 'crossing']])
    expect(marks[0]!.lon).toBeCloseTo(360 - 124.7, 9)
    expect(marks[1]!.lon).toBeCloseTo(360 - 123.9, 9)
    expect(marks[2]!.lon).toBeCloseTo(360 - 123.5, 9)
  })
})
