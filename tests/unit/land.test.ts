// Coarse land check against Natural Earth 1:50m land (world-atlas 2.0.2). Positions are from
// memory (atlas knowledge), chosen well inside land or sea so the coarse coastline cannot matter.
import { describe, expect, it } from 'vitest'
import { checkLegs, checkTrack, geodesicCrossesLand, isLand, landData } from '../../server/utils/land'
import type { LatLon } from '../../shared/types/geo'

/** Points along a straight line in latitude/longitude (a rhumb line for these short tests). */
function line(from: LatLon, to: LatLon, n = 400): LatLon[] {
  return Array.from({ length: n + 1 }, (_, i) => ({ lat: from.lat + ((to.lat - from.lat) * i) / n, lon: from.lon + ((to.lon - from.lon) * i) / n }))
}

describe('isLand', () => {
  it.each([
    ['central Sahara', 23, 13],
    ['central Australia', -23.7, 133.9],
    ['Amazon basin', -5, -60],
    ['Chukotka east of 180°', 66, -172],
    ['Chukotka west of 180°', 67, 178],
    ['Antarctic plateau', -85, 0],
    ['near the South Pole', -89.9, 50],
  ])('%s is land', (_name, lat, lon) => expect(isLand(lat, lon)).toBe(true))

  it.each([
    ['mid North Atlantic', 35, -40],
    ['equatorial Pacific', 0, -150],
    ['Mediterranean, Ionian Sea', 35, 18],
    ['Caspian Sea (a hole in the land polygon)', 42, 51],
    ['Bering Sea', 57.5, 175],
    ['Arctic Ocean near the pole', 88, 0],
  ])('%s is sea', (_name, lat, lon) => expect(isLand(lat, lon)).toBe(false))

  it('reads longitudes outside ±180 the way round', () => {
    expect(isLand(23, 13 + 360)).toBe(true)
    expect(isLand(66, -172 + 360)).toBe(true)
    expect(isLand(35, -40 - 360)).toBe(false)
  })
})

describe('checkTrack', () => {
  it('finds Florida on a track along 27°N from the Gulf of Mexico to the Atlantic', () => {
    const r = checkTrack(line({ lat: 27, lon: -83.5 }, { lat: 27, lon: -79 }), 5)
    expect(r.crossesLand).toBe(true)
    expect(r.withinClearance).toBe(true)
    expect(r.closestApproachNm).toBe(0)
    // Florida's Gulf coast near Sarasota lies near 82.5°W (from memory).
    expect(r.firstLandPoint!.lon).toBeGreaterThan(-82.8)
    expect(r.firstLandPoint!.lon).toBeLessThan(-82.2)
    expect(r.firstLandPoint!.lat).toBeCloseTo(27, 6)
  })

  it('finds Africa on a track along 10°N from the Atlantic to the Arabian Sea', () => {
    const r = checkTrack(line({ lat: 10, lon: -20 }, { lat: 10, lon: 60 }), 5)
    expect(r.crossesLand).toBe(true)
    // The coast of Guinea at 10°N is near 14°W (from memory).
    expect(r.firstLandPoint!.lon).toBeGreaterThan(-15)
    expect(r.firstLandPoint!.lon).toBeLessThan(-13)
  })

  it('clears a mid North Atlantic track by a wide margin', () => {
    const r = checkTrack(line({ lat: 40, lon: -50 }, { lat: 45, lon: -30 }), 20)
    expect(r.crossesLand).toBe(false)
    expect(r.firstLandPoint).toBeUndefined()
    expect(r.withinClearance).toBe(false)
    expect(r.closestApproachNm).toBeGreaterThan(150) // Newfoundland and the Azores are both far off
  })

  it('measures about 60 nm from a point 1° of latitude south of the straight Nullarbor coast', () => {
    // Bunda Cliffs, Great Australian Bight: a straight coast near 31.6°S at 130°E (from memory).
    // One degree of latitude at 32°S is 59.9 nm on WGS84 (meridian arc).
    const r = checkTrack([{ lat: -32.6, lon: 130 }], 10)
    expect(r.crossesLand).toBe(false)
    expect(r.closestApproachNm).toBeGreaterThan(57)
    expect(r.closestApproachNm).toBeLessThan(63)
    expect(r.closestCoastPoint.lat).toBeGreaterThan(-31.9)
    expect(r.closestCoastPoint.lat).toBeLessThan(-31.3)
    expect(Math.abs(r.closestCoastPoint.lon - 130)).toBeLessThan(1)
  })

  it('flags a track inside the clearance without crossing land', () => {
    const r = checkTrack([{ lat: -32.6, lon: 129.5 }, { lat: -32.6, lon: 130.5 }], 70)
    expect(r.crossesLand).toBe(false)
    expect(r.withinClearance).toBe(true)
  })

  it('crosses the 180° meridian through the Bering Sea without finding land, and through Chukotka finding it', () => {
    // Longitudes past 180 (unwrapped, as a track across the meridian may give them).
    const bering = checkTrack(line({ lat: 57.5, lon: 175 }, { lat: 57.5, lon: 182 }), 5)
    expect(bering.crossesLand).toBe(false)
    expect(bering.closestApproachNm).toBeGreaterThan(100)
    const wrapped = checkTrack(line({ lat: 57.5, lon: 175 }, { lat: 57.5, lon: 182 }).map(p => ({ ...p, lon: p.lon > 180 ? p.lon - 360 : p.lon })), 5)
    expect(wrapped.closestApproachNm).toBeCloseTo(bering.closestApproachNm, 6)
    const chukotka = checkTrack(line({ lat: 64.5, lon: -170 }, { lat: 64.5, lon: -185 }), 5)
    expect(chukotka.crossesLand).toBe(true)
  })

  it('agrees with a brute-force search over every coastline edge', () => {
    const d = landData()
    const tracks = [
      line({ lat: 35.5, lon: -12 }, { lat: 35.9, lon: -6.5 }, 30), // Gulf of Cadiz towards the Strait
      line({ lat: 20, lon: -30 }, { lat: 25, lon: -20 }, 30), // off West Africa
      line({ lat: 52, lon: 179 }, { lat: 54, lon: 181 }, 30), // Aleutians, across 180°
      line({ lat: -50, lon: 60 }, { lat: -45, lon: 80 }, 30), // Southern Ocean, Kerguelen
    ]
    for (const points of tracks) {
      const r = checkTrack(points, 0)
      expect(r.crossesLand).toBe(false)
      let best = Infinity
      for (const p of points) {
        const cos = Math.cos((p.lat * Math.PI) / 180)
        for (const shift of Math.abs(p.lon) > 170 ? [0, 360, -360] : [0]) {
          for (let e = 0; e < d.artificial.length; e++) {
            if (d.artificial[e]) continue
            const ax = (d.edges[4 * e]! + shift - p.lon) * cos, ay = d.edges[4 * e + 1]! - p.lat
            const bx = (d.edges[4 * e + 2]! + shift - p.lon) * cos, by = d.edges[4 * e + 3]! - p.lat
            const vx = bx - ax, vy = by - ay, l2 = vx * vx + vy * vy
            const t = l2 > 0 ? Math.max(0, Math.min(1, -(ax * vx + ay * vy) / l2)) : 0
            const qx = ax + t * vx, qy = ay + t * vy
            best = Math.min(best, 60 * Math.sqrt(qx * qx + qy * qy))
          }
        }
      }
      // The reported distance is the geodesic to the coast point; the brute force uses the local frame.
      expect(Math.abs(r.closestApproachNm - best) / best).toBeLessThan(0.01)
    }
  })
})

describe('checkLegs (densified by the navigation engine)', () => {
  it('checks each leg of a North Atlantic passage and finds the one across Florida', () => {
    const legs = [
      { from: { lat: 27, lon: -84 }, to: { lat: 27, lon: -78 }, method: 'rhumb' as const }, // across Florida
      { from: { lat: 27, lon: -78 }, to: { lat: 40, lon: -50 }, method: 'geodesic' as const },
      { from: { lat: 40, lon: -50 }, to: { lat: 45, lon: -30 }, method: 'geodesic' as const },
    ]
    const r = checkLegs(legs, 10)
    expect(r.map(l => l.index)).toEqual([0, 1, 2])
    expect(r[0]!.crossesLand).toBe(true)
    expect(r[2]!.crossesLand).toBe(false)
    expect(r[2]!.closestApproachNm).toBeGreaterThan(150)
  })

  it('finds Africa on a geodesic from Dakar approaches to the Gulf of Aden', () => {
    const r = checkLegs([{ from: { lat: 14.5, lon: -17.8 }, to: { lat: 12, lon: 46 }, method: 'geodesic' }], 5)
    expect(r[0]!.crossesLand).toBe(true)
  })
})

describe('geodesicCrossesLand (the distance tables\' land pass)', () => {
  // Positions from memory, well off any coast, so the coarse coastline cannot decide the answer.
  it.each([
    ['Rotterdam approaches to the Gulf of Genoa, across France', 52, 3.5, 43.8, 8.8, true],
    ['Dakar approaches to the Gulf of Aden, across Africa', 14.5, -17.8, 12, 46, true],
    ['North Pacific across 180° to the Gulf of Alaska', 50, 175, 55, -145, false],
    ['Lisbon approaches to New York approaches, open Atlantic', 38.6, -9.6, 40.3, -73.5, false],
  ])('%s: %s', (_name, lat1, lon1, lat2, lon2, crosses) => {
    expect(geodesicCrossesLand(lat1, lon1, lat2, lon2)).toBe(crosses)
    // The full check, densified at 2 nm, agrees.
    expect(checkLegs([{ from: { lat: lat1, lon: lon1 }, to: { lat: lat2, lon: lon2 }, method: 'geodesic' }], 0)[0]!.crossesLand).toBe(crosses)
  })
})
