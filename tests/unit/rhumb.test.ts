import { describe, expect, it } from 'vitest'
import { QUARTER_MERIDIAN_M, RhumbPoleError, meridianDistanceM, rhumbDensify, rhumbDirect, rhumbInverse } from '../../shared/utils/rhumb'
import { ALL_KINDS, generatePairs, seededRandom } from './support/random'
import { WorstErrors, angleDiff, fmt, runOracle, same } from './support/oracle'

const dms = (d: number, m: number, s = 0) => d + m / 60 + s / 3600
const JFK = { lat: dms(40, 38, 23), lon: -dms(73, 46, 44) }
const SIN = { lat: dms(1, 21, 33), lon: dms(103, 59, 22) }

describe('rhumb line check values', () => {
  it('JFK → Singapore (RhumbSolve manual)', () => {
    const r = rhumbInverse(JFK, SIN)
    expect(Math.abs(r.course - dms(103, 34, 58.2)) * 3600).toBeLessThan(0.05) // RhumbSolve(1) manual, 0.1″ printed
    expect(Math.abs(r.distanceM - 18523563)).toBeLessThan(0.5) // RhumbSolve(1) manual, metres
    const at2000 = rhumbDirect(JFK, r.course, 2_000_000)
    expect(Math.abs(at2000.lat - dms(36, 24, 30.3)) * 3600).toBeLessThan(0.05) // RhumbSolve(1) manual
    expect(Math.abs(at2000.lon + dms(51, 28, 26.4)) * 3600).toBeLessThan(0.05) // RhumbSolve(1) manual
    const at10000 = rhumbDirect(JFK, r.course, 10_000_000)
    expect(Math.abs(at10000.lat - dms(19, 27, 18.7)) * 3600).toBeLessThan(0.05) // RhumbSolve(1) manual
    expect(Math.abs(at10000.lon - dms(27, 59, 22.1)) * 3600).toBeLessThan(0.05) // RhumbSolve(1) manual
  })

  it('equator to pole: the quarter meridian (GeographicLib tests)', () => {
    const r = rhumbInverse({ lat: 0, lon: 0 }, { lat: 90, lon: 0 })
    expect(r.course).toBe(0)
    expect(r.distanceM).toBeCloseTo(10001965.729, 3) // GeographicLib rhumb tests
    expect(QUARTER_MERIDIAN_M).toBeCloseTo(10001965.729, 3) // GeographicLib rhumb tests
  })

  it('Bennett 1996, appendix', () => {
    // Bennett, "Practical rhumb line calculations on the spheroid", J. Navigation 49 (1996), appendix
    const a = rhumbInverse({ lat: dms(10, 18.4), lon: dms(37, 41.7) }, { lat: dms(53, 29.5), lon: dms(113, 17.1) })
    expect(Math.abs(a.course - 54.99008056)).toBeLessThan(2e-7) // Bennett gives 8 decimals
    expect(Math.abs(a.distanceNm - 4507.7)).toBeLessThan(0.05) // Bennett, nm to 0.1
    expect(Math.abs(a.distanceM - 8348285.202)).toBeLessThan(1e-3) // metres reproduced with RhumbSolve (check-values.md)
    const b = rhumbInverse({ lat: dms(48, 45), lon: -dms(61, 31.1) }, { lat: dms(48, 45), lon: dms(5, 13.2) })
    expect(b.course).toBe(90) // along a parallel
    expect(Math.abs(b.distanceNm - 2649.9)).toBeLessThan(0.1) // Bennett; check-values.md asks 0.1 nm
  })

  it('a minute of latitude: 1842.905 m at the equator, 1861.566 m at the pole (check-values.md, computed)', () => {
    expect(Math.abs(meridianDistanceM(-0.5 / 60, 0.5 / 60) - 1842.905)).toBeLessThan(6e-4)
    expect(Math.abs(meridianDistanceM(90 - 1 / 60, 90) - 1861.566)).toBeLessThan(6e-4)
  })
})

describe('rhumb line against RhumbSolve (oracle, exact elliptic-integral mode)', () => {
  it(`inverse on ${8 * 300} generated cases of every kind`, () => {
    const pairs = generatePairs(424242, 300, ALL_KINDS).map(p => ({ ...p, lat1: same(p.lat1), lon1: same(p.lon1), lat2: same(p.lat2), lon2: same(p.lon2) }))
    const lines = pairs.map(p => [p.lat1, p.lon1, p.lat2, p.lon2].map(x => fmt(x)).join(' '))
    const out = runOracle('RhumbSolve', ['-i', '-p', '10'], lines)
    const worst = new WorstErrors()
    pairs.forEach((p, i) => {
      const [azi, s12] = out[i]!
      const r = rhumbInverse({ lat: p.lat1, lon: p.lon1 }, { lat: p.lat2, lon: p.lon2 })
      worst.add(`distance m (${p.kind})`, r.distanceM - s12!, lines[i]!)
      worst.add(`course ° (${p.kind})`, angleDiff(r.course, azi!), lines[i]!)
      worst.add('distance m (all)', r.distanceM - s12!, lines[i]!)
      worst.add('course ° (all)', angleDiff(r.course, azi!), lines[i]!)
    })
    worst.print('Rhumb inverse vs RhumbSolve, worst absolute differences:')
    // domain.md: 1 mm in distance and 1e-9° in course, for every kind on its own.
    for (const kind of ALL_KINDS) {
      expect(worst.get(`distance m (${kind})`), kind).toBeLessThan(1e-3)
      expect(worst.get(`course ° (${kind})`), kind).toBeLessThan(1e-9)
    }
    // The kinds the divided differences are for (domain.md): legs of 100 m to 1 nm, and legs within
    // 1e-4° of east–west, where Δμ/Δψ taken as a plain quotient loses most of its digits to cancellation.
    // Held a thousand times tighter than the millimetre (the oracle agrees to some 1e-8 m).
    expect(worst.get('distance m (short)')).toBeLessThan(1e-6)
    expect(worst.get('distance m (eastWest)')).toBeLessThan(1e-6)
    expect(worst.get('course ° (eastWest)')).toBeLessThan(1e-11)
  })

  it('direct on 2,000 generated cases, including lines that would pass over a pole', () => {
    const rnd = seededRandom(99)
    const cases = Array.from({ length: 2000 }, (_, i) => ({
      lat: same(i % 10 === 0 ? (rnd() < 0.5 ? -1 : 1) * (84 + 5.9 * rnd()) : Math.asin(2 * rnd() - 1) * 180 / Math.PI),
      lon: same(360 * rnd() - 180),
      azi: same(i % 7 === 0 ? 90 + (rnd() - 0.5) * 1e-6 : 360 * rnd()),
      s: same(10 ** (1 + 6.3 * rnd()), 9),
    }))
    const out = runOracle('RhumbSolve', ['-p', '10'], cases.map(c => `${fmt(c.lat)} ${fmt(c.lon)} ${fmt(c.azi)} ${fmt(c.s, 9)}`))
    const worst = new WorstErrors()
    let overPole = 0
    cases.forEach((c, i) => {
      const [lat2, lon2] = out[i]!
      if (Number.isNaN(lon2)) {
        overPole++
        expect(() => rhumbDirect({ lat: c.lat, lon: c.lon }, c.azi, c.s)).toThrow(RhumbPoleError)
        return
      }
      const r = rhumbDirect({ lat: c.lat, lon: c.lon }, c.azi, c.s)
      worst.add('direct latitude °', r.lat - lat2!, JSON.stringify(c))
      worst.add('direct longitude °', angleDiff(r.lon, lon2!), JSON.stringify(c))
    })
    worst.print(`Rhumb direct vs RhumbSolve, worst absolute differences (${overPole} cases pass a pole):`)
    expect(overPole).toBeGreaterThan(0)
    expect(worst.get('direct latitude °')).toBeLessThan(1e-9)
    expect(worst.get('direct longitude °')).toBeLessThan(1e-9)
  })

  it('points along the JFK → Singapore rhumb line match RhumbSolve -L', () => {
    const r = rhumbInverse(JFK, SIN)
    const pts = rhumbDensify(JFK, SIN, 500)
    const steps = pts.length - 1
    const dists = Array.from({ length: steps + 1 }, (_, i) => r.distanceM * i / steps)
    const out = runOracle('RhumbSolve', ['-p', '10', '-L', fmt(JFK.lat), fmt(JFK.lon), fmt(r.course)], dists.map(d => fmt(d, 9)))
    pts.forEach((p, i) => {
      expect(Math.abs(p.lat - out[i]![0]!)).toBeLessThan(1e-9)
      expect(Math.abs(angleDiff(p.lon, out[i]![1]!))).toBeLessThan(1e-9)
    })
    expect(r.distanceM / (steps * 1852)).toBeLessThanOrEqual(500)
  })
})

describe('rhumb line at the poles and other edges', () => {
  it('a pole has no longitude: the meridian, as RhumbSolve gives on the same meridian', () => {
    const out = runOracle('RhumbSolve', ['-i', '-p', '10'], ['10 20 -90 20', '-35 -70 90 -70'])
    const a = rhumbInverse({ lat: 10, lon: 20 }, { lat: -90, lon: 20 })
    expect(a.course).toBe(180)
    expect(Math.abs(a.distanceM - out[0]![1]!)).toBeLessThan(1e-3)
    const b = rhumbInverse({ lat: -35, lon: -70 }, { lat: 90, lon: 123 }) // any longitude at the pole
    expect(b.course).toBe(0)
    expect(Math.abs(b.distanceM - out[1]![1]!)).toBeLessThan(1e-3)
  })

  it('a line over a pole is refused, a line to it is not', () => {
    expect(() => rhumbDirect({ lat: 80, lon: 0 }, 10, 2_000_000)).toThrow(RhumbPoleError)
    expect(rhumbDirect({ lat: 80, lon: 0 }, 0, QUARTER_MERIDIAN_M - meridianDistanceM(0, 80)).lat).toBeCloseTo(90, 9)
  })

  it('coincident points and exact east–west legs', () => {
    const c = rhumbInverse({ lat: 12, lon: 34 }, { lat: 12, lon: 34 })
    expect(c.distanceM).toBe(0)
    expect(c.course).toBe(0)
    const ew = rhumbInverse({ lat: 0, lon: 0 }, { lat: 0, lon: 100 })
    expect(ew.course).toBe(90)
    expect(ew.distanceM).toBeCloseTo(11131949.079, 3) // a·Δλ on the equator (GeographicLib Octave tests, 11 131 949 m)
    const back = rhumbDirect({ lat: 0, lon: 0 }, 90, ew.distanceM)
    expect(back.lat).toBe(0)
    expect(back.lon).toBeCloseTo(100, 12)
  })
})
