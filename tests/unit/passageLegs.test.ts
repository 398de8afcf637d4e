// Legs through declared passages in the land check: a track laid along a canal's fairway is
// reported as through the canal, while the coarse coastline (Natural Earth 1:50m) on its own
// flags it as crossing land; legs off the fairway stay crossings.
import { describe, expect, it } from 'vitest'
import { checkLegs } from '../../server/utils/land'
import { checkTrackLegs } from '../../server/utils/landChecks'
import { PASSAGES } from '../../shared/utils/routing/passages'
import { DEFAULT_CORRIDOR_NM, fairwayDistanceNm, passageOfLeg } from '../../shared/utils/routing/passageLegs'
import type { LegMethod } from '../../shared/types/geo'

const fairway = (id: string) => PASSAGES.find(p => p.id === id)!.fairway!
const track = (pts: readonly (readonly [number, number])[], method: LegMethod = 'geodesic') => pts.map(([lat, lon]) => ({ lat, lon, method }))

describe('distance to a fairway', () => {
  it('is the distance across to the nearest fairway segment', () => {
    // 1 nm east of a north–south segment at 30°N is 1/(60 cos 30°) degrees of longitude (local frame, by construction).
    const f: [number, number][] = [[29.5, 32.5], [30.5, 32.5]]
    expect(fairwayDistanceNm({ lat: 30, lon: 32.5 + 1 / (60 * Math.cos(Math.PI / 6)) }, f)).toBeCloseTo(1, 9)
    // Beyond the segment's end, the distance to the end point: 0.25° of latitude is 15 nm.
    expect(fairwayDistanceNm({ lat: 30.75, lon: 32.5 }, f)).toBeCloseTo(15, 9)
  })
})

describe('legs through declared passages', () => {
  it.each(['suez', 'panama', 'kiel', 'bosporus', 'dardanelles', 'great-belt', 'oresund', 'messina', 'singapore', 'magellan'])('every leg along the %s fairway is through it, rhumb or geodesic', (id) => {
    const f = fairway(id)
    for (const method of ['geodesic', 'rhumb'] as const) {
      for (let i = 0; i + 1 < f.length; i++) {
        const [la1, lo1] = f[i]!, [la2, lo2] = f[i + 1]!
        expect(passageOfLeg({ lat: la1, lon: lo1 }, { lat: la2, lon: lo2 }, method)?.id).toBe(id)
      }
    }
  })

  it('takes a typed track half a mile off the fairway as through the canal', () => {
    // Every Suez fairway point moved 0.5 nm east (less than the 1.5 nm corridor).
    const f = fairway('suez').map(([lat, lon]) => [lat, lon + 0.5 / (60 * Math.cos((lat * Math.PI) / 180))] as const)
    expect(DEFAULT_CORRIDOR_NM).toBeGreaterThan(0.5)
    const legs = checkTrackLegs(track(f), 2)
    expect(legs.map(l => l.passage?.id)).toEqual(f.slice(1).map(() => 'suez'))
  })

  it('reports the Suez legs the coarse coastline flags as through the Suez Canal, not as land', () => {
    const wps = track(fairway('suez'))
    const legs = wps.slice(1).map((to, i) => ({ from: wps[i]!, to, method: to.method }))
    // Without the passage the 1:50m coastline flags the canal: at least one leg crosses land, and all pass within 2 nm of it.
    const raw = checkLegs(legs, 2)
    expect(raw.some(l => l.crossesLand)).toBe(true)
    expect(raw.every(l => l.crossesLand || l.withinClearance)).toBe(true)
    for (const l of checkTrackLegs(wps, 2)) {
      expect(l).toMatchObject({ crossesLand: false, withinClearance: false, firstLandPoint: null, crossings: [], passage: { id: 'suez', name: 'Suez Canal' } })
    }
  })

  it('keeps a leg that cuts across land off the fairway a crossing', () => {
    const legs = checkTrackLegs(track([
      // Port Said straight to Port Tewfik: both ends on the fairway, the middle some 8 nm off it across the desert.
      [31.42, 32.36], [29.84, 32.55],
      // Across Sinai to the Gulf of Aqaba.
      [29.5, 34.9],
    ]), 2)
    expect(legs.map(l => l.passage)).toEqual([null, null])
    expect(legs.map(l => l.crossesLand)).toEqual([true, true])
    expect(legs[0]!.firstLandPoint).not.toBeNull()
    expect(legs[0]!.crossings.length).toBeGreaterThan(0)
  })

  it('keeps a leg that leaves the canal part way a crossing', () => {
    // From the canal at El Ferdan across the Sinai.
    expect(passageOfLeg({ lat: 30.7, lon: 32.34 }, { lat: 30.0, lon: 33.5 }, 'geodesic')).toBeNull()
  })
})
