import { describe, expect, it } from 'vitest'
import geodesic from 'geographiclib-geodesic'
import { densifyLeg, densifyRoute, unwrapLongitudes } from '../../shared/utils/track'
import { fmt, runOracle } from './support/oracle'

const raw = geodesic.Geodesic.WGS84

describe('densified tracks', () => {
  const a = { lat: 50.5, lon: 170.2 }
  const b = { lat: 52.1, lon: -165.4 }

  it('geodesic: both ends, steps of at most the given length', () => {
    const pts = densifyLeg(a, b, 'geodesic', 10)
    expect(pts[0]).toEqual(a)
    expect(pts.at(-1)).toEqual(b)
    for (let i = 1; i < pts.length; i++) expect(raw.Inverse(pts[i - 1]!.lat, pts[i - 1]!.lon, pts[i]!.lat, pts[i]!.lon).s12!).toBeLessThanOrEqual(10 * 1852 + 1e-6)
  })

  it('rhumb: every point on the rhumb line, steps of at most the given length (RhumbSolve)', () => {
    const pts = densifyLeg(a, b, 'rhumb', 10)
    const out = runOracle('RhumbSolve', ['-i', '-p', '10'], pts.slice(1).map((p, i) => `${fmt(pts[i]!.lat)} ${fmt(pts[i]!.lon)} ${fmt(p.lat)} ${fmt(p.lon)}`))
    const whole = runOracle('RhumbSolve', ['-i', '-p', '10'], [`${fmt(a.lat)} ${fmt(a.lon)} ${fmt(b.lat)} ${fmt(b.lon)}`])[0]!
    let sum = 0
    for (const [azi, s] of out) {
      expect(Math.abs(azi! - whole[0]!)).toBeLessThan(1e-8)
      expect(s!).toBeLessThanOrEqual(10 * 1852 + 1e-6)
      sum += s!
    }
    expect(Math.abs(sum - whole[1]!)).toBeLessThan(1e-3)
  })

  it('a route joins its legs without repeating the joints', () => {
    const route = densifyRoute([a, { ...b, method: 'geodesic' }, { lat: 55, lon: -160, method: 'rhumb' }], 50)
    const n1 = densifyLeg(a, b, 'geodesic', 50).length
    const n2 = densifyLeg(b, { lat: 55, lon: -160 }, 'rhumb', 50).length
    expect(route).toHaveLength(n1 + n2 - 1)
  })

  it('unwrapped longitudes change by less than 180° between points, across the 180° meridian', () => {
    const pts = unwrapLongitudes(densifyLeg(a, b, 'geodesic', 10))
    for (let i = 1; i < pts.length; i++) expect(Math.abs(pts[i]!.lon - pts[i - 1]!.lon)).toBeLessThan(180)
    expect(pts.at(-1)!.lon).toBeCloseTo(360 - 165.4, 9)
    expect(unwrapLongitudes([{ lat: 0, lon: 179 }, { lat: 0, lon: -179 }, { lat: 0, lon: 179 }]).map(p => p.lon)).toEqual([179, 181, 179])
  })
})
