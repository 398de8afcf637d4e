// Working a report out only against the legs near it (legsNear) picks the same leg and cross-track as
// working it out against every leg, on a long plan, and the cross-track is the GeodSolve distance from
// the position to the foot.
import { describe, expect, it } from 'vitest'
import { computeLegTable } from '../../shared/utils/legTable'
import { legCrossTrack, legsNear, locateOnPlan } from '../../shared/utils/monitoring/planPosition'
import { NM_M } from '../../shared/utils/navConstants'
import { seededRandom } from './support/random'
import { fmt, runOracle } from './support/oracle'

// An invented zigzag of 100 short legs along 40°S, rhumb and geodesic mixed (clear of land).
const waypoints = Array.from({ length: 101 }, (_, i) => ({ lat: -40 + (i % 2) * 0.5, lon: 20 + i * 0.9, method: (i % 3 ? 'rhumb' : 'geodesic') as 'rhumb' | 'geodesic' }))
const legs = computeLegTable(waypoints, '2026-11-24T06:00:00Z', 12).legs

/** The rule of locateOnPlan applied to every leg: inside a span first (the nearest), else nearest to a span. */
function everyLeg(p: { lat: number, lon: number }) {
  const c = legs.map((leg) => {
    const r = legCrossTrack(leg, p)
    const len = leg.distanceNm * NM_M
    const outside = r.alongTrackM < 0 ? -r.alongTrackM : r.alongTrackM > len ? r.alongTrackM - len : 0
    const inside = r.alongTrackM >= -1e-3 && (leg.index === legs.length - 1 ? r.alongTrackM <= len + 1e-3 : r.alongTrackM < len - 1e-3)
    return { leg, r, score: Math.hypot(r.crossTrackM, outside), inside }
  })
  const pool = c.some(x => x.inside) ? c.filter(x => x.inside) : c
  return pool.reduce((a, b) => (b.score < a.score ? b : a))
}

describe('reports worked out against the legs near them', () => {
  const rnd = seededRandom(1414)
  const positions = Array.from({ length: 200 }, () => ({ lat: -40.6 + rnd() * 1.7, lon: 19 + rnd() * 92 }))

  it('picks the leg the full search picks, with the same cross-track (200 positions within about 40 nm of a 100-leg plan)', () => {
    for (const p of positions) {
      const full = everyLeg(p)
      const at = locateOnPlan(legs, p)
      expect(at.legIndex, JSON.stringify(p)).toBe(full.leg.index)
      expect(at.crossTrackNm).toBeCloseTo(full.r.crossTrackM / NM_M, 9)
      expect(legsNear(legs, p).length).toBeLessThan(legs.length / 4)
    }
  })

  it('keeps the chosen leg among the near ones; its cross-track is the GeodSolve distance to the foot', () => {
    const feet = positions.map((p) => {
      const at = locateOnPlan(legs, p)
      return { p, foot: legCrossTrack(legs[at.legIndex]!, p).foot }
    })
    // Debian geographiclib-tools: GeodSolve inverse "lat1 lon1 lat2 lon2" → "azi1 azi2 s12"
    const s12 = runOracle('GeodSolve', ['-i', '-p', '9'], feet.map(f => `${fmt(f.p.lat)} ${fmt(f.p.lon)} ${fmt(f.foot.lat)} ${fmt(f.foot.lon)}`)).map(r => r[2]!)
    feet.forEach((f, i) => {
      const at = locateOnPlan(legs, f.p)
      expect(legsNear(legs, f.p).map(l => l.index)).toContain(at.legIndex)
      expect(Math.abs(at.crossTrackNm * NM_M - Math.sign(at.crossTrackNm) * s12[i]!)).toBeLessThan(1e-3)
    })
  })
})
