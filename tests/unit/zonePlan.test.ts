// The zone step on whole plans: the seeded ECAs (db/seeds/ecaZones.ts) on the demo Rotterdam → New York
// plan against a hand computation, validity dates, and the per-plan step against leg-by-leg answers.
import { describe, expect, it } from 'vitest'
import { computeLegTable } from '../../shared/utils/legTable'
import { prepareZones } from '../../shared/utils/zones/prepare'
import { legZoneDistances, planZoneDistances } from '../../shared/utils/zones/legZones'
import type { ZoneInput } from '../../shared/utils/zones/types'
import { ecaZones } from '../../db/seeds/ecaZones'
import { demoPlans } from '../../db/seeds/demoData'

const zoneInputs: ZoneInput[] = ecaZones.map((z, i) => ({ id: i + 1, name: z.name, kind: z.kind, polygons: z.polygons, validFromMs: z.validFrom ? Date.parse(z.validFrom) : null }))
const zones = prepareZones(zoneInputs)
const demo = demoPlans.find(p => p.title.startsWith('Rotterdam'))!
const waypoints = demo.waypoints.map(([name, lat, lon, method]) => ({ name, lat, lon, method }))
const table = computeLegTable(waypoints, demo.departureUtc, demo.speedKn)
const result = planZoneDistances(zones, table.legs)
const zoneNm = (name: string) => result.totals.byZone.find(z => z.name.startsWith(name))?.distanceNm ?? 0

describe('Rotterdam → New York (demo plan) through the seeded ECAs', () => {
  it('North Sea ECA: Maas Center to the 5°W meridian off the Lizard (hand computation)', () => {
    // Working: legs 1 (Maas Center → Dover Strait) and 2 (→ Off Casquets, 49°54′N 2°36′W) lie wholly in the
    // area (east of 5°W, north of 48°30′N). Leg 3 is a rhumb line from 2°36′W to 6°42′W: along a rhumb line
    // longitude is linear in isometric latitude and distance in meridian arc, which over its 0.2° of latitude
    // are proportional to 1 part in 10³, so the part east of 5°W is (5.0 − 2.6)/(6.7 − 2.6) = 0.5854 of it.
    const [l1, l2, l3] = table.legs
    const expected = l1!.distanceNm + l2!.distanceNm + (5.0 - 2.6) / (6.7 - 2.6) * l3!.distanceNm
    expect(Math.abs(zoneNm('North Sea') - expected)).toBeLessThan(0.5)
    expect(result.legs[2]![0]!.distanceNm).toBeLessThan(l3!.distanceNm)
  })

  it('North American ECA: from its 50°30′W side south-east of Newfoundland to Ambrose (hand computation)', () => {
    // Working: leg 5 is the geodesic from 44°N 50°W to 40°24′N 69°W. On a sphere its latitude at longitude λ is
    // tan φ = [tan φ1 sin(λ2 − λ) + tan φ2 sin(λ − λ1)] / sin(λ2 − λ1); at λ = 50.5°W that is 43.9°N. The piece
    // east of 50.5°W is the arc from (44°N, 50°W) to that point (haversine, R = 3440.07 nm, the mean radius);
    // the rest of leg 5 and all of leg 6 (Nantucket shoals offing → Ambrose, inshore) lie inside.
    const rad = Math.PI / 180
    const [p1, p2] = [{ lat: 44 * rad, lon: -50 * rad }, { lat: 40.4 * rad, lon: -69 * rad }]
    const lon = -50.5 * rad
    const lat = Math.atan((Math.tan(p1.lat) * Math.sin(p2.lon - lon) + Math.tan(p2.lat) * Math.sin(lon - p1.lon)) / Math.sin(p2.lon - p1.lon))
    const h = Math.sin((lat - p1.lat) / 2) ** 2 + Math.cos(lat) * Math.cos(p1.lat) * Math.sin((lon - p1.lon) / 2) ** 2
    const outsideNm = 2 * 3440.07 * Math.asin(Math.sqrt(h))
    expect(lat / rad).toBeCloseTo(43.9, 1)
    const [, , , , l5, l6] = table.legs
    expect(Math.abs(zoneNm('North American') - (l5!.distanceNm - outsideNm + l6!.distanceNm))).toBeLessThan(0.5)
  })

  it('the open Atlantic leg from Bishop Rock meets no ECA; totals by kind add the zones', () => {
    expect(result.legs[3]).toEqual([])
    const eca = result.totals.byKind.find(k => k.kind === 'eca')!.distanceNm
    expect(eca).toBeCloseTo(zoneNm('North Sea') + zoneNm('North American'), 9)
    expect(result.totals.byZone).toHaveLength(2)
  })
})

describe('zones in force', () => {
  // A leg from off Malta (35.8°N 14.6°E) to off Crete (35.5°N 23.5°E) lies in the Mediterranean ECA only from 1 May 2025.
  const leg = { from: { lat: 35.8, lon: 14.6 }, to: { lat: 35.5, lon: 23.5 }, method: 'rhumb' as const }
  it('counts the Mediterranean ECA only while the ship is on the leg after it came into force', () => {
    const before = legZoneDistances(zones, { ...leg, startMs: Date.parse('2025-04-20T00:00Z'), endMs: Date.parse('2025-04-22T00:00Z') })
    const after = legZoneDistances(zones, { ...leg, startMs: Date.parse('2025-05-02T00:00Z'), endMs: Date.parse('2025-05-04T00:00Z') })
    expect(before).toEqual([])
    expect(after.map(z => z.name)).toEqual(['Mediterranean Sea ECA'])
    expect(after[0]!.distanceNm).toBeCloseTo(legZoneDistances(zones, leg)[0]!.distanceNm, 9)
  })
})

describe('the plan step carries each leg\'s end state to the next', () => {
  it('gives the same distances as each leg on its own, on a plan of 120 short legs through three ECAs', () => {
    const path = [[60.0, 26.0], [55.3, 14.5], [57.9, 10.0], [51.5, 2.0], [49.7, -6.7], [44.0, -50.0], [40.4, -73.8], [32.0, -79.0]]
    const wps = path.slice(1).flatMap(([lat, lon], i) => Array.from({ length: 17 }, (_, k) => ({
      lat: path[i]![0]! + (lat! - path[i]![0]!) * k / 17, lon: path[i]![1]! + (lon! - path[i]![1]!) * k / 17, method: (k % 2 ? 'geodesic' : 'rhumb') as 'geodesic' | 'rhumb',
    })))
    const legs = computeLegTable(wps, '2026-06-01T00:00:00Z', 14).legs
    const chained = planZoneDistances(zones, legs).legs
    legs.forEach((l, i) => {
      const alone = legZoneDistances(zones, { from: l.from, to: l.to, method: l.method })
      expect(chained[i]!.map(z => [z.zoneId, z.distanceNm.toFixed(6)]), `leg ${i + 1}`).toEqual(alone.map(z => [z.zoneId, z.distanceNm.toFixed(6)]))
    })
    expect(chained.filter(z => z.length > 0).length).toBeGreaterThan(60)
  })
})
