import { describe, expect, it } from 'vitest'
import geodesic from 'geographiclib-geodesic'
import { intermediateAtMeridians, intermediateEveryNm } from '../../shared/utils/intermediate'
import { seededRandom } from './support/random'

const raw = geodesic.Geodesic.WGS84
const onLeg = (a: { lat: number, lon: number }, b: { lat: number, lon: number }, p: { lat: number, lon: number }) =>
  raw.Inverse(a.lat, a.lon, p.lat, p.lon).s12! + raw.Inverse(p.lat, p.lon, b.lat, b.lon).s12! - raw.Inverse(a.lat, a.lon, b.lat, b.lon).s12!

describe('intermediate waypoints on a geodesic leg', () => {
  it('at meridians that are multiples of N°: on the geodesic, in order, one per meridian', () => {
    const rnd = seededRandom(77)
    for (let i = 0; i < 60; i++) {
      const a = { lat: 120 * rnd() - 60, lon: 360 * rnd() - 180 }
      const b = { lat: 120 * rnd() - 60, lon: a.lon + (rnd() < 0.5 ? -1 : 1) * 150 * rnd() }
      const every = [1, 5, 10][i % 3]!
      const pts = intermediateAtMeridians(a, b, every)
      const dLon = ((raw.Inverse(a.lat, a.lon, b.lat, b.lon, geodesic.Geodesic.LONGITUDE | geodesic.Geodesic.LONG_UNROLL).lon2!) - a.lon)
      const lo = Math.min(a.lon, a.lon + dLon)
      const hi = Math.max(a.lon, a.lon + dLon)
      let expected = 0
      for (let k = Math.ceil(lo / every); k * every <= hi; k++) if (k * every > lo + 1e-9 && k * every < hi - 1e-9) expected++
      expect(pts).toHaveLength(expected)
      let prev = 0
      for (const p of pts) {
        expect(Math.abs(((p.lon / every) % 1 + 1) % 1 - 0) < 1e-9 || Math.abs(((p.lon / every) % 1 + 1) % 1 - 1) < 1e-9).toBe(true)
        expect(Math.abs(onLeg(a, b, p))).toBeLessThan(1e-6)
        const s = raw.Inverse(a.lat, a.lon, p.lat, p.lon).s12!
        expect(s).toBeGreaterThan(prev)
        prev = s
      }
    }
  })

  it('a meridional leg crosses no meridian', () => {
    expect(intermediateAtMeridians({ lat: -10, lon: 30 }, { lat: 40, lon: 30 }, 5)).toEqual([])
  })

  it('every N nm: at k·N·1852 m from the start', () => {
    const a = { lat: 49.9, lon: -6 }
    const b = { lat: 40.4, lon: -73.8 }
    const pts = intermediateEveryNm(a, b, 300)
    const total = raw.Inverse(a.lat, a.lon, b.lat, b.lon).s12!
    expect(pts).toHaveLength(Math.ceil(total / (300 * 1852)) - 1)
    pts.forEach((p, i) => {
      expect(Math.abs(raw.Inverse(a.lat, a.lon, p.lat, p.lon).s12! - (i + 1) * 300 * 1852)).toBeLessThan(1e-6)
      expect(Math.abs(onLeg(a, b, p))).toBeLessThan(1e-6)
    })
  })
})
