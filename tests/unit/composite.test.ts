import { describe, expect, it } from 'vitest'
import geodesic from 'geographiclib-geodesic'
import { compositeSailing } from '../../shared/utils/composite'
import { seededRandom } from './support/random'
import { WorstErrors } from './support/oracle'

const raw = geodesic.Geodesic.WGS84

describe('composite sailing under a limiting latitude', () => {
  it('tangent points on the limit parallel, nothing poleward, never shorter than the geodesic (random ocean crossings)', () => {
    const rnd = seededRandom(2024)
    const worst = new WorstErrors()
    let composite = 0
    for (let i = 0; i < 300; i++) {
      const h = rnd() < 0.5 ? 1 : -1
      const limit = 35 + 20 * rnd()
      const a = { lat: h * (limit - 1 - 30 * rnd()), lon: 360 * rnd() - 180 }
      const b = { lat: h * (limit - 1 - 30 * rnd()), lon: a.lon + (rnd() < 0.5 ? 1 : -1) * (60 + 110 * rnd()) }
      const r = compositeSailing(a, b, h * limit)
      const g = raw.Inverse(a.lat, a.lon, b.lat, b.lon).s12!
      expect(r.distanceM).toBeGreaterThanOrEqual(g - 1e-6)
      expect(Math.abs(r.geodesicDistanceM - g)).toBeLessThan(1e-6)
      if (r.kind !== 'composite') continue
      composite++
      const [, t1, t2] = r.points
      worst.add('tangent point latitude − limit °', Math.abs(t1!.lat) - limit, JSON.stringify([a, b, limit]))
      worst.add('tangent point latitude − limit °', Math.abs(t2!.lat) - limit, JSON.stringify([a, b, limit]))
      // tangency: the geodesic meets the parallel heading due east or west (Clairaut)
      const in1 = raw.Inverse(a.lat, a.lon, t1!.lat, t1!.lon)
      worst.add('course at tangent point − 090/270 °', Math.cos(in1.azi2! * Math.PI / 180) * 180 / Math.PI, JSON.stringify([a, b, limit]))
      // densely sampled geodesic legs stay equatorward of the limit
      for (const leg of [r.legs[0]!, r.legs[2]!]) {
        const line = raw.InverseLine(leg.from.lat, leg.from.lon, leg.to.lat, leg.to.lon)
        for (let k = 0; k <= 200; k++) worst.add('poleward excursion °', Math.max(0, Math.abs(line.Position(line.s13 * k / 200).lat2!) - limit), JSON.stringify([a, b, limit]))
      }
      const sum = r.legs.reduce((s, l) => s + l.distanceM, 0)
      expect(Math.abs(sum - r.distanceM)).toBeLessThan(1e-6)
      expect(r.extraM).toBeGreaterThan(0)
      expect(r.legs[1]!.initialCourse === 90 || r.legs[1]!.initialCourse === 270).toBe(true)
    }
    worst.print(`Composite sailing (${composite} composite tracks), worst values:`)
    expect(composite).toBeGreaterThan(50)
    expect(worst.get('tangent point latitude − limit °')).toBeLessThan(1e-9)
    expect(worst.get('poleward excursion °')).toBeLessThan(1e-9)
    expect(worst.get('course at tangent point − 090/270 °')).toBeLessThan(1e-7)
  })

  it('the parallel run is a rhumb line due east: N cos φ · Δλ (domain.md)', () => {
    const r = compositeSailing({ lat: 35.0, lon: 141.0 }, { lat: 48.4, lon: -124.8 }, 50)
    expect(r.kind).toBe('composite')
    const run = r.legs[1]!
    const phi = 50 * Math.PI / 180
    const e2 = (1 / 298.257223563) * (2 - 1 / 298.257223563)
    const dLon = ((run.to.lon - run.from.lon + 360) % 360) * Math.PI / 180
    expect(run.distanceM).toBeCloseTo(dLon * 6378137 * Math.cos(phi) / Math.sqrt(1 - e2 * Math.sin(phi) ** 2), 3)
  })

  it('clear answers when the limit is not needed or cannot be kept', () => {
    const notNeeded = compositeSailing({ lat: 35, lon: 141 }, { lat: 48.4, lon: -124.8 }, 60)
    expect(notNeeded.kind).toBe('not-needed')
    expect(notNeeded.legs).toHaveLength(1)
    expect(notNeeded.extraM).toBe(0)
    const beyond = compositeSailing({ lat: 35, lon: 141 }, { lat: 48.4, lon: -124.8 }, 45)
    expect(beyond.kind).toBe('end-beyond-limit')
    expect(beyond.message).toMatch(/destination/i)
    expect(() => compositeSailing({ lat: 0, lon: 0 }, { lat: 1, lon: 1 }, 95)).toThrow(RangeError)
    // Southern hemisphere: Cape of Good Hope → Fremantle held at 40°S
    const south = compositeSailing({ lat: -34.5, lon: 18.5 }, { lat: -32.1, lon: 115.6 }, -40)
    expect(south.kind).toBe('composite')
    expect(south.points[1]!.lat).toBeCloseTo(-40, 9)
  })
})
