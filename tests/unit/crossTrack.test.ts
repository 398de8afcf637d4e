import { describe, expect, it } from 'vitest'
import geodesic from 'geographiclib-geodesic'
import { crossTrack } from '../../shared/utils/crossTrack'
import { seededRandom } from './support/random'
import { WorstErrors } from './support/oracle'

const raw = geodesic.Geodesic.WGS84
const rad = Math.PI / 180

/** Brute force: sample the leg every ~1 km for the nearest point, then bisect on the right-angle condition. */
function bruteForce(a: { lat: number, lon: number }, b: { lat: number, lon: number }, p: { lat: number, lon: number }) {
  const line = raw.InverseLine(a.lat, a.lon, b.lat, b.lon)
  const n = Math.max(100, Math.ceil(line.s13 / 1000))
  let best = 0
  let bestD = Infinity
  for (let i = 0; i <= n; i++) {
    const x = line.Position(line.s13 * i / n)
    const d = raw.Inverse(x.lat2!, x.lon2!, p.lat, p.lon).s12!
    if (d < bestD) { bestD = d; best = i }
  }
  const g = (s: number) => {
    const x = line.Position(s)
    const inv = raw.Inverse(x.lat2!, x.lon2!, p.lat, p.lon)
    return { cos: Math.cos((inv.azi1! - x.azi2!) * rad), d: inv.s12!, side: Math.sin((inv.azi1! - x.azi2!) * rad) }
  }
  let lo = line.s13 * Math.max(0, best - 1) / n
  let hi = line.s13 * Math.min(n, best + 1) / n
  for (let k = 0; k < 80; k++) {
    const mid = (lo + hi) / 2
    if (g(mid).cos > 0) lo = mid
    else hi = mid
  }
  const r = g((lo + hi) / 2)
  return { along: (lo + hi) / 2, cross: r.d * Math.sign(r.side) }
}

describe('cross-track and along-track', () => {
  it('within 1 mm of brute force on 150 random legs and positions', () => {
    const rnd = seededRandom(5)
    const worst = new WorstErrors()
    for (let i = 0; i < 150; i++) {
      const a = { lat: 140 * rnd() - 70, lon: 360 * rnd() - 180 }
      const g = raw.Direct(a.lat, a.lon, 360 * rnd(), 200_000 + 4_800_000 * rnd())
      const b = { lat: g.lat2!, lon: g.lon2! }
      const at = raw.InverseLine(a.lat, a.lon, b.lat, b.lon).Position(g.s12 * (0.1 + 0.8 * rnd()))
      const off = raw.Direct(at.lat2!, at.lon2!, at.azi2! + (rnd() < 0.5 ? 90 : -90), 500_000 * rnd())
      const p = { lat: off.lat2!, lon: off.lon2! }
      const r = crossTrack(a, b, p)
      const ref = bruteForce(a, b, p)
      worst.add('cross-track m', r.crossTrackM - ref.cross, JSON.stringify([a, b, p]))
      worst.add('along-track m', r.alongTrackM - ref.along, JSON.stringify([a, b, p]))
    }
    worst.print('Cross-track vs brute force, worst differences:')
    expect(worst.get('cross-track m')).toBeLessThan(1e-3)
    expect(worst.get('along-track m')).toBeLessThan(1e-3)
  })

  it('positive to starboard: east of a northbound meridian leg', () => {
    const r = crossTrack({ lat: 0, lon: 0 }, { lat: 10, lon: 0 }, { lat: 5, lon: 0.5 })
    expect(r.crossTrackM).toBeGreaterThan(0)
    expect(crossTrack({ lat: 0, lon: 0 }, { lat: 10, lon: 0 }, { lat: 5, lon: -0.5 }).crossTrackM).toBeLessThan(0)
    // On the equator the foot of a meridian offset is on the equator: cross-track is a meridian arc
    const eq = crossTrack({ lat: 0, lon: 0 }, { lat: 0, lon: 10 }, { lat: -1, lon: 5 })
    expect(eq.alongTrackM).toBeCloseTo(raw.Inverse(0, 0, 0, 5).s12!, 3)
    expect(eq.crossTrackM).toBeCloseTo(raw.Inverse(0, 5, -1, 5).s12!, 3)
  })

  it('a position on the track has zero cross-track', () => {
    const r = crossTrack({ lat: 10, lon: 10 }, { lat: 10, lon: 10.5 }, { lat: 10, lon: 10 })
    expect(Math.abs(r.crossTrackM)).toBeLessThan(1e-6)
    expect(Math.abs(r.alongTrackM)).toBeLessThan(1e-6)
  })
})
