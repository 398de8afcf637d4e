import { describe, expect, it } from 'vitest'
import geodesic from 'geographiclib-geodesic'
import { greatEllipseDensify, greatEllipseInverse } from '../../shared/utils/greatEllipse'
import { seededRandom } from './support/random'
import { WorstErrors, angleDiff } from './support/oracle'

// Independent construction for the tests: WGS84 from NIMA TR8350.2, the section curve traced by
// rays from the centre in the plane of the two points, its length by chord sums with Romberg
// extrapolation (chord error O(h²)), its direction by a finite difference.
const A = 6378137
const F = 1 / 298.257223563
const B = A * (1 - F)
const E2 = F * (2 - F)
type V = [number, number, number]
const rad = Math.PI / 180
function xyz(lat: number, lon: number): V {
  const n = A / Math.sqrt(1 - E2 * Math.sin(lat * rad) ** 2)
  return [n * Math.cos(lat * rad) * Math.cos(lon * rad), n * Math.cos(lat * rad) * Math.sin(lon * rad), n * (1 - E2) * Math.sin(lat * rad)]
}
const cross = (a: V, b: V): V => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]]
const dot = (a: V, b: V) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2]
const unit = (a: V): V => { const l = Math.hypot(...a); return [a[0] / l, a[1] / l, a[2] / l] }
function sectionCurve(p: { lat: number, lon: number }, q: { lat: number, lon: number }) {
  const p1 = xyz(p.lat, p.lon)
  const p2 = xyz(q.lat, q.lon)
  const e1 = unit(p1)
  const e2 = unit(cross(unit(cross(p1, p2)), e1))
  const theta = Math.atan2(Math.hypot(...cross(p1, p2)), dot(p1, p2))
  const at = (t: number): V => {
    const d: V = [Math.cos(t) * e1[0] + Math.sin(t) * e2[0], Math.cos(t) * e1[1] + Math.sin(t) * e2[1], Math.cos(t) * e1[2] + Math.sin(t) * e2[2]]
    const r = 1 / Math.sqrt((d[0] ** 2 + d[1] ** 2) / A ** 2 + d[2] ** 2 / B ** 2)
    return [d[0] * r, d[1] * r, d[2] * r]
  }
  return { at, theta }
}
function chordLength(c: ReturnType<typeof sectionCurve>, m: number): number {
  let sum = 0
  let prev = c.at(0)
  for (let i = 1; i <= m; i++) {
    const cur = c.at(c.theta * i / m)
    sum += Math.hypot(cur[0] - prev[0], cur[1] - prev[1], cur[2] - prev[2])
    prev = cur
  }
  return sum
}
function arcByRomberg(p: { lat: number, lon: number }, q: { lat: number, lon: number }): number {
  const c = sectionCurve(p, q)
  const l1 = chordLength(c, 1000)
  const l2 = chordLength(c, 2000)
  const l4 = chordLength(c, 4000)
  const r1 = (4 * l2 - l1) / 3
  const r2 = (4 * l4 - l2) / 3
  return (16 * r2 - r1) / 15
}
function courseByDifference(p: { lat: number, lon: number }, q: { lat: number, lon: number }): number {
  const c = sectionCurve(p, q)
  const d = c.at(1e-7)
  const o = c.at(0)
  const t: V = [d[0] - o[0], d[1] - o[1], d[2] - o[2]]
  const east: V = [-Math.sin(p.lon * rad), Math.cos(p.lon * rad), 0]
  const north: V = [-Math.sin(p.lat * rad) * Math.cos(p.lon * rad), -Math.sin(p.lat * rad) * Math.sin(p.lon * rad), Math.cos(p.lat * rad)]
  return Math.atan2(dot(t, east), dot(t, north)) / rad
}

describe('great ellipse', () => {
  it('along the equator it is the equator: (0,0) → (0,100) = a·Δλ = 11 131 949 m (GeographicLib Octave tests)', () => {
    const r = greatEllipseInverse({ lat: 0, lon: 0 }, { lat: 0, lon: 100 })
    expect(Math.abs(r.distanceM - A * 100 * rad)).toBeLessThan(1e-6) // a·Δλ
    expect(Math.round(r.distanceM)).toBe(11131949) // GeographicLib Octave tests
    expect(r.initialCourse).toBe(90)
    expect(r.finalCourse).toBe(90)
  })

  it('along a meridian it is the meridian ellipse: (0,0) → (90,0) is the quarter meridian (GeographicLib tests)', () => {
    expect(greatEllipseInverse({ lat: 0, lon: 0 }, { lat: 90, lon: 0 }).distanceM).toBeCloseTo(10001965.729, 3)
  })

  it('distance within 1 mm of an independent arc-length integration; never shorter than the geodesic; ≤ 13.5 m longer under 10 000 km', () => {
    const rnd = seededRandom(31)
    const raw = geodesic.Geodesic.WGS84
    const worst = new WorstErrors()
    for (let i = 0; i < 200; i++) {
      const p = { lat: Math.asin(2 * rnd() - 1) / rad, lon: 360 * rnd() - 180 }
      const q = { lat: Math.asin(2 * rnd() - 1) / rad, lon: 360 * rnd() - 180 }
      const ge = greatEllipseInverse(p, q)
      const ref = arcByRomberg(p, q)
      const geo = raw.Inverse(p.lat, p.lon, q.lat, q.lon).s12!
      worst.add('distance vs integration m', ge.distanceM - ref, JSON.stringify([p, q]))
      worst.add('initial course vs finite difference °', angleDiff(ge.initialCourse, courseByDifference(p, q)), JSON.stringify([p, q]))
      expect(ge.distanceM).toBeGreaterThanOrEqual(geo - 1e-6)
      // GeographicLib documentation, "Great ellipses": at most 13.5 m longer for paths under 10 000 km
      if (geo < 10_000_000) expect(ge.distanceM - geo).toBeLessThanOrEqual(13.5)
      worst.add('great ellipse − geodesic, paths < 10 000 km, m', geo < 10_000_000 ? ge.distanceM - geo : 0, JSON.stringify([p, q]))
    }
    worst.print('Great ellipse, worst differences:')
    expect(worst.get('distance vs integration m')).toBeLessThan(1e-3)
    expect(worst.get('initial course vs finite difference °')).toBeLessThan(1e-5)
  })

  it('points along it lie in the plane of the two points and on the ellipsoid', () => {
    const p = { lat: 35.4, lon: 139.9 }
    const q = { lat: 48.4, lon: -124.8 }
    const n = unit(cross(xyz(p.lat, p.lon), xyz(q.lat, q.lon)))
    for (const pt of greatEllipseDensify(p, q, 100)) expect(Math.abs(dot(unit(xyz(pt.lat, pt.lon)), n))).toBeLessThan(1e-12)
  })

  it('coincident and antipodal points give defined answers', () => {
    expect(greatEllipseInverse({ lat: 5, lon: 5 }, { lat: 5, lon: 5 }).distanceM).toBe(0)
    const anti = greatEllipseInverse({ lat: 10, lon: 20 }, { lat: -10, lon: -160 })
    expect(anti.distanceM).toBeCloseTo(2 * 10001965.729, 2) // half the meridian ellipse (GeographicLib tests, ×2)
  })
})
