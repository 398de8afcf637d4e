// Every stretch of a track over land (issue 12 item 8: not only the first crossing). Coastline
// positions are from memory (atlas knowledge) and held to a few tenths of a degree, as coarse
// as the 1:50m coastline is; each stretch is also checked against the point-in-land test.
import { describe, expect, it } from 'vitest'
import { isLand, landCrossings } from '../../server/utils/land'
import { checkTrackLegs } from '../../server/utils/landChecks'
import type { LatLon } from '../../shared/types/geo'

function line(from: LatLon, to: LatLon, n = 2000): LatLon[] {
  return Array.from({ length: n + 1 }, (_, i) => ({ lat: from.lat + ((to.lat - from.lat) * i) / n, lon: from.lon + ((to.lon - from.lon) * i) / n }))
}
const mid = (a: LatLon, b: LatLon): LatLon => ({ lat: (a.lat + b.lat) / 2, lon: (a.lon + b.lon) / 2 })

describe('landCrossings', () => {
  // Along 40.5°N from off Tarragona to off Vlorë: Sardinia (Alghero 8.3°E to the east coast near
  // Orosei 9.7°E), the mainland from Cilento (15.0°E) to the Gulf of Taranto (16.9°E), then Salento
  // (Taranto 17.2°E to the Adriatic coast near 18.1°E); all from memory.
  const track = line({ lat: 40.5, lon: 2 }, { lat: 40.5, lon: 19 })
  const crossings = landCrossings(track)

  it('reports every stretch over land in the order the track meets them', () => {
    const expected = [[8.3, 9.75], [15.0, 16.95], [17.2, 18.1]]
    expect(crossings).toHaveLength(3)
    crossings.forEach((c, i) => {
      expect(Math.abs(c.enter.lon - expected[i]![0]!)).toBeLessThan(0.3)
      expect(Math.abs(c.exit!.lon - expected[i]![1]!)).toBeLessThan(0.3)
      expect(c.enter.lat).toBeCloseTo(40.5, 9)
    })
  })

  it('agrees with the point-in-land test: ashore inside each stretch, afloat between them', () => {
    crossings.forEach((c, i) => {
      expect(isLand(mid(c.enter, c.exit!).lat, mid(c.enter, c.exit!).lon)).toBe(true)
      const next = crossings[i + 1]
      if (next) expect(isLand(mid(c.exit!, next.enter).lat, mid(c.exit!, next.enter).lon)).toBe(false)
    })
  })

  it('starts a stretch at the first point when the track starts ashore, and leaves it open when it ends ashore', () => {
    // Central Sahara (23°N 13°E, land) out to the Mediterranean off Libya (34°N 13°E, sea); from memory.
    const out = landCrossings(line({ lat: 23, lon: 13 }, { lat: 34, lon: 13 }))
    expect(out).toHaveLength(1)
    expect(out[0]!.enter).toEqual({ lat: 23, lon: 13 })
    // The Libyan coast at 13°E lies near 32.8°N (Tripoli), from memory.
    expect(Math.abs(out[0]!.exit!.lat - 32.85)).toBeLessThan(0.3)
    const inland = landCrossings(line({ lat: 34, lon: 13 }, { lat: 23, lon: 13 }))
    expect(inland).toHaveLength(1)
    expect(inland[0]!.exit).toBeNull()
  })

  it('finds nothing on an open-ocean track', () => {
    // Mid North Atlantic, hundreds of miles from any land (from memory).
    expect(landCrossings(line({ lat: 40, lon: -50 }, { lat: 45, lon: -30 }))).toEqual([])
  })
})

describe('checkTrackLegs', () => {
  it('gives each crossing leg all its stretches and the others none', () => {
    const legs = checkTrackLegs([
      { lat: 40.5, lon: 2, method: 'rhumb' }, { lat: 40.5, lon: 19, method: 'rhumb' }, { lat: 39, lon: 19.5, method: 'rhumb' },
    ], 5)
    expect(legs[0]!.crossesLand).toBe(true)
    expect(legs[0]!.crossings).toHaveLength(3)
    expect(legs[0]!.firstLandPoint!.lon).toBeCloseTo(legs[0]!.crossings[0]!.enter.lon, 6)
    expect(legs[1]!.crossings).toEqual([])
  })
})
