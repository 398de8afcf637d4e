import { describe, expect, it } from 'vitest'
import geodesic from 'geographiclib-geodesic'
import { rhumbCrossTrack } from '../../shared/utils/monitoring/rhumbCrossTrack'
import { rhumbInverse, rhumbLine, rhumbLinePosition } from '../../shared/utils/rhumb'
import { WGS84_A, WGS84_E2 } from '../../shared/utils/navConstants'
import { seededRandom } from './support/random'
import { WorstErrors, angleDiff, fmt, runOracle } from './support/oracle'

const raw = geodesic.Geodesic.WGS84
const rad = Math.PI / 180
type P = { lat: number, lon: number }

/**
 * Brute force, independent of the right-angle condition: sample the rhumb line 1,000 times over a
 * bracket, keep the nearest sample, shrink the bracket around it and repeat until the samples are
 * less than 1 mm apart.
 */
function denseSampling(a: P, b: P, p: P) {
  const { course, distanceM } = rhumbInverse(a, b)
  const line = rhumbLine(a, course)
  const dist = (s: number) => { const x = rhumbLinePosition(line, s); return raw.Inverse(x.lat, x.lon, p.lat, p.lon).s12! }
  let lo = -0.25 * distanceM
  let hi = 1.25 * distanceM
  let best = 0
  let bestD = Infinity
  for (;;) {
    const step = (hi - lo) / 1000
    for (let i = 0; i <= 1000; i++) {
      const s = lo + step * i
      const d = dist(s)
      if (d < bestD) { bestD = d; best = s }
    }
    if (step < 1e-3) break
    lo = best - step
    hi = best + step
  }
  return { along: best, distance: bestD }
}

/** Legs off the parallels and poles: random start in ±65°, course, 200–5,000 km; positions up to 150 km off a point along it. */
function generatedCases(seed: number, n: number) {
  const rnd = seededRandom(seed)
  const out: { a: P, b: P, p: P }[] = []
  while (out.length < n) {
    const a = { lat: 130 * rnd() - 65, lon: 360 * rnd() - 180 }
    const course = 360 * rnd()
    const len = 200_000 + 4_800_000 * rnd()
    let b: P
    try { b = rhumbLinePosition(rhumbLine(a, course), len) }
    catch { continue }
    if (Math.abs(b.lat) > 70) continue
    const at = rhumbLinePosition(rhumbLine(a, course), len * (0.05 + 0.9 * rnd()))
    const off = raw.Direct(at.lat, at.lon, course + (rnd() < 0.5 ? 90 : -90), 150_000 * rnd())
    out.push({ a, b, p: { lat: off.lat2!, lon: off.lon2! } })
  }
  return out
}

describe('cross-track and along-track from a rhumb-line leg', () => {
  it('within 1 mm of dense sampling of the rhumb line on 40 generated legs', () => {
    const worst = new WorstErrors()
    for (const { a, b, p } of generatedCases(11, 40)) {
      const r = rhumbCrossTrack(a, b, p)
      const ref = denseSampling(a, b, p)
      worst.add('|cross-track| − nearest sample, m', Math.abs(r.crossTrackM) - ref.distance, JSON.stringify([a, b, p]))
      worst.add('along-track − nearest sample, m', r.alongTrackM - ref.along, JSON.stringify([a, b, p]))
    }
    worst.print('Rhumb cross-track vs dense sampling, worst differences:')
    expect(worst.get('|cross-track| − nearest sample, m')).toBeLessThan(1e-3)
    // The distance is flat at its minimum (d ≈ xte + Δs²/2·xte), so sampling pins the foot less tightly than the distance.
    expect(worst.get('along-track − nearest sample, m')).toBeLessThan(0.5)
  })

  it('agrees with RhumbSolve (foot) and GeodSolve (distance and right angle) on 300 generated legs', () => {
    const cases = generatedCases(12, 300).map(c => ({ ...c, r: rhumbCrossTrack(c.a, c.b, c.p), course: rhumbInverse(c.a, c.b).course }))
    // Debian geographiclib-tools 2.1.2: RhumbSolve direct "lat1 lon1 azi12 s12" → "lat2 lon2 S12"
    const feet = runOracle('RhumbSolve', ['-p', '12'], cases.map(c => `${fmt(c.a.lat)} ${fmt(c.a.lon)} ${fmt(c.course)} ${fmt(c.r.alongTrackM, 6)}`))
    // GeodSolve inverse "lat1 lon1 lat2 lon2" → "azi1 azi2 s12"
    const legs = runOracle('GeodSolve', ['-i', '-p', '12'], cases.map((c, i) => `${fmt(feet[i]![0]!)} ${fmt(feet[i]![1]!)} ${fmt(c.p.lat)} ${fmt(c.p.lon)}`))
    const worst = new WorstErrors()
    cases.forEach((c, i) => {
      const at = JSON.stringify([c.a, c.b, c.p])
      worst.add('foot latitude vs RhumbSolve, °', c.r.foot.lat - feet[i]![0]!, at)
      worst.add('foot longitude vs RhumbSolve, °', angleDiff(c.r.foot.lon, feet[i]![1]!), at)
      worst.add('|cross-track| vs GeodSolve s12, m', Math.abs(c.r.crossTrackM) - legs[i]![2]!, at)
      const turn = angleDiff(legs[i]![0]!, c.course)
      worst.add('angle at the foot − 90°, °', Math.abs(turn) - 90, at)
      worst.add('side (sign) mismatch', Math.sign(turn) === Math.sign(c.r.crossTrackM) ? 0 : 1, at)
    })
    worst.print('Rhumb cross-track vs RhumbSolve/GeodSolve, worst differences:')
    expect(worst.get('foot latitude vs RhumbSolve, °')).toBeLessThan(1e-9)
    expect(worst.get('foot longitude vs RhumbSolve, °')).toBeLessThan(1e-9)
    expect(worst.get('|cross-track| vs GeodSolve s12, m')).toBeLessThan(1e-3)
    expect(worst.get('angle at the foot − 90°, °')).toBeLessThan(1e-6)
    expect(worst.get('side (sign) mismatch')).toBe(0)
  })

  it('5′ north of the 40°S parallel leg of the Indian Ocean plan is 5.0 nm to port', () => {
    // Seeded plan, leg 40S 030E → 40S 060E, rhumb line along the parallel, course 090°.
    const r = rhumbCrossTrack({ lat: -40, lon: 30 }, { lat: -40, lon: 60 }, { lat: -40 + 5 / 60, lon: 45 })
    // Meridian arc M(φ) = a[(1 − e²/4 − 3e⁴/64 − 5e⁶/256)φ − (3e²/8 + 3e⁴/32 + 45e⁶/1024) sin 2φ
    //   + (15e⁴/256 + 45e⁶/1024) sin 4φ − (35e⁶/3072) sin 6φ] (Snyder, USGS PP 1395, 1987, eq. 3-21);
    // 5′ of latitude from 39°55′S to 40°00′S: M(40°) − M(39°55′) = 9 252.8 m = 4.996 nm.
    const e2 = WGS84_E2, e4 = e2 * e2, e6 = e4 * e2
    const M = (deg: number) => {
      const f = deg * rad
      return WGS84_A * ((1 - e2 / 4 - 3 * e4 / 64 - 5 * e6 / 256) * f - (3 * e2 / 8 + 3 * e4 / 32 + 45 * e6 / 1024) * Math.sin(2 * f)
        + (15 * e4 / 256 + 45 * e6 / 1024) * Math.sin(4 * f) - (35 * e6 / 3072) * Math.sin(6 * f))
    }
    const arc = M(40) - M(40 - 5 / 60)
    expect(arc).toBeCloseTo(9252.8, 1) // the working above
    expect(Math.abs(r.crossTrackM + arc)).toBeLessThan(1e-3) // negative: to port (north of an eastbound track)
    expect((r.crossTrackM / 1852).toFixed(1)).toBe('-5.0')
    // Along the parallel from 30°E to the foot at 45°E: N cos φ · Δλ, N = a/√(1 − e² sin² φ) (Snyder eq. 4-20).
    const N = WGS84_A / Math.sqrt(1 - e2 * Math.sin(40 * rad) ** 2)
    expect(r.alongTrackM).toBeCloseTo(N * Math.cos(40 * rad) * 15 * rad, 3)
    expect(r.foot).toEqual({ lat: -40, lon: 45 })
  })

  it('to starboard south of an eastbound parallel, to port south of a westbound one', () => {
    expect(rhumbCrossTrack({ lat: 30, lon: 0 }, { lat: 30, lon: 10 }, { lat: 29.9, lon: 5 }).crossTrackM).toBeGreaterThan(0)
    expect(rhumbCrossTrack({ lat: 30, lon: 10 }, { lat: 30, lon: 0 }, { lat: 29.9, lon: 5 }).crossTrackM).toBeLessThan(0)
    // A northbound meridian leg: east is starboard.
    expect(rhumbCrossTrack({ lat: 0, lon: 0 }, { lat: 10, lon: 0 }, { lat: 5, lon: 0.5 }).crossTrackM).toBeGreaterThan(0)
  })

  it('a position on the line has no cross-track and its along-track is the rhumb distance to it', () => {
    const a = { lat: 10.3, lon: 37.7 }
    const b = { lat: 53.5, lon: 113.3 }
    const { course } = rhumbInverse(a, b)
    const on = rhumbLinePosition(rhumbLine(a, course), 2_000_000)
    const r = rhumbCrossTrack(a, b, on)
    expect(Math.abs(r.crossTrackM)).toBeLessThan(1e-3)
    expect(r.alongTrackM).toBeCloseTo(2_000_000, 3)
  })

  it('along the leg across the 180° meridian', () => {
    const r = rhumbCrossTrack({ lat: 20, lon: 170 }, { lat: 20, lon: -170 }, { lat: 20.5, lon: 179.5 })
    expect(r.alongTrackM).toBeGreaterThan(0)
    expect(r.crossTrackM).toBeLessThan(0) // north of an eastbound leg: port
  })
})
