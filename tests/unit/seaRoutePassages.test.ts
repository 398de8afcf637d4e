// Every declared passage carries a route between the waters it joins, and avoiding it gives the
// way round (or no route where the passage is the only way in). End positions lie in the water on
// either side of each passage, from memory; capes and headlands named below are from memory too.
import { describe, expect, it } from 'vitest'
import { useSeaGraph } from '../../server/utils/routing/graphStore'
import { NoRouteError, seaRoute } from '../../server/utils/routing/seaRoute'
import { PASSAGES } from '../../shared/utils/routing/passages'
import type { LatLon } from '../../shared/types/geo'
import type { SeaRouteResult } from '../../shared/types/routing'
import { landPoints } from '../support/seaRouteChecks'

const graph = await useSeaGraph()

interface Through {
  id: string
  from: LatLon
  to: LatLon
  /** What the route avoiding the passage must show; 'none' where the passage is the only way between the two waters. */
  round: 'none' | ((r: SeaRouteResult) => void)
}

const minLat = (r: SeaRouteResult) => Math.min(...r.waypoints.map(w => w.lat))
const maxLat = (r: SeaRouteResult) => Math.max(...r.waypoints.map(w => w.lat))
const ids = (r: SeaRouteResult) => r.via.map(v => v.id)

const CASES: Through[] = [
  // Eastern Mediterranean to the northern Red Sea; round the Cape of Good Hope (34°21′S) without Suez.
  { id: 'suez', from: { lat: 31.8, lon: 31.5 }, to: { lat: 27.5, lon: 34.0 }, round: r => expect(minLat(r)).toBeLessThan(-34.3) },
  // Caribbean off Colón to the Gulf of Panama; without the canal by the Strait of Magellan or round Cape Horn (south of 52°S).
  { id: 'panama', from: { lat: 9.6, lon: -79.9 }, to: { lat: 8.5, lon: -79.4 }, round: r => expect(minLat(r)).toBeLessThan(-52) },
  // German Bight to Kiel Bay; without the canal round the Skaw (57°44′N) and through the Danish straits.
  {
    id: 'kiel', from: { lat: 54.0, lon: 8.3 }, to: { lat: 54.6, lon: 10.4 },
    round: (r) => {
      expect(maxLat(r)).toBeGreaterThan(57.7)
      expect(ids(r).some(id => id === 'great-belt' || id === 'oresund')).toBe(true)
    },
  },
  // Black Sea to the Sea of Marmara, and Marmara to the Aegean: no other way in.
  { id: 'bosporus', from: { lat: 41.6, lon: 29.3 }, to: { lat: 40.8, lon: 28.8 }, round: 'none' },
  { id: 'dardanelles', from: { lat: 40.7, lon: 27.5 }, to: { lat: 39.8, lon: 25.8 }, round: 'none' },
  // Kattegat to the western Baltic: without the Great Belt through the Øresund, and the other way about.
  { id: 'great-belt', from: { lat: 55.9, lon: 10.9 }, to: { lat: 54.55, lon: 11.0 }, round: r => expect(ids(r)).toContain('oresund') },
  { id: 'oresund', from: { lat: 56.1, lon: 12.6 }, to: { lat: 55.3, lon: 12.95 }, round: r => expect(ids(r)).toContain('great-belt') },
  // Tyrrhenian to Ionian Sea; without Messina round Sicily south of Capo Passero (36°41′N).
  { id: 'messina', from: { lat: 38.4, lon: 15.8 }, to: { lat: 37.9, lon: 15.5 }, round: r => expect(minLat(r)).toBeLessThan(36.7) },
  // South China Sea to the Malacca Strait's southern end.
  { id: 'singapore', from: { lat: 1.3, lon: 104.6 }, to: { lat: 1.1, lon: 103.3 }, round: r => expect(ids(r)).not.toContain('singapore') },
  // Southern North Sea to the English Channel; without Dover round the north of Scotland (Dunnet Head 58°40′N).
  { id: 'dover', from: { lat: 51.5, lon: 2.0 }, to: { lat: 50.5, lon: 0.5 }, round: r => expect(maxLat(r)).toBeGreaterThan(58.6) },
  // Gulf of Cádiz to the Alborán Sea; without Gibraltar round Africa and through Suez.
  { id: 'gibraltar', from: { lat: 36.0, lon: -6.5 }, to: { lat: 36.0, lon: -4.5 }, round: r => expect(ids(r)).toContain('suez') },
  // Southern Red Sea to the Gulf of Aden; without Bab-el-Mandeb through Suez and round Africa.
  { id: 'bab-el-mandeb', from: { lat: 13.5, lon: 42.8 }, to: { lat: 12.0, lon: 44.5 }, round: r => expect(ids(r)).toContain('suez') },
  // Persian Gulf to the Gulf of Oman: no other way out.
  { id: 'hormuz', from: { lat: 26.3, lon: 54.5 }, to: { lat: 25.0, lon: 57.5 }, round: 'none' },
  // Andaman Sea off Sumatra to Singapore; without Malacca through the Sunda or Lombok Strait (south of 5°S).
  { id: 'malacca', from: { lat: 4.0, lon: 99.5 }, to: { lat: 1.3, lon: 103.5 }, round: r => expect(minLat(r)).toBeLessThan(-5) },
  // Atlantic to Pacific entrance of the Strait of Magellan; without it round Cape Horn (55°59′S) or through Le Maire.
  { id: 'magellan', from: { lat: -52.5, lon: -68.3 }, to: { lat: -52.6, lon: -75.2 }, round: r => expect(minLat(r)).toBeLessThan(-54.8) },
  // The Gulf of Mexico off Galveston to Barbours Cut, and the St. Lawrence estuary below Québec to Montréal: no other way in.
  { id: 'houston', from: { lat: 29.1, lon: -94.5 }, to: { lat: 29.7, lon: -95.0 }, round: 'none' },
  { id: 'st-lawrence', from: { lat: 47.3, lon: -70.2 }, to: { lat: 45.56, lon: -73.52 }, round: 'none' },
  // Arafura Sea to the Coral Sea; without Torres round New Guinea (north of the equator's 1°S) or Tasmania.
  { id: 'torres', from: { lat: -10.0, lon: 140.5 }, to: { lat: -10.0, lon: 144.5 }, round: r => expect(minLat(r) < -39 || maxLat(r) > -1.5).toBe(true) },
]

describe('declared passages', () => {
  it('has a case for every declared passage', () => {
    expect(CASES.map(c => c.id).sort()).toEqual(PASSAGES.map(p => p.id).sort())
  })

  it.each(CASES.map(c => [c.id, c] as const))('%s carries a route between the waters it joins, both ways', (id, c) => {
    for (const [a, b] of [[c.from, c.to], [c.to, c.from]] as const) {
      const r = seaRoute(graph, a, b)
      expect(ids(r)).toContain(id)
      expect(landPoints(graph.land, r)).toEqual([])
    }
  })

  it.each(CASES.map(c => [c.id, c] as const))('avoiding %s goes the other way or finds none', (id, c) => {
    const through = seaRoute(graph, c.from, c.to)
    if (c.round === 'none') {
      expect(() => seaRoute(graph, c.from, c.to, { avoid: [id] })).toThrow(NoRouteError)
      return
    }
    const r = seaRoute(graph, c.from, c.to, { avoid: [id] })
    expect(ids(r)).not.toContain(id)
    expect(r.waypoints.some(w => w.passageId === id)).toBe(false)
    expect(r.distanceNm).toBeGreaterThan(through.distanceNm)
    expect(landPoints(graph.land, r)).toEqual([])
    c.round(r)
  })
})

describe('an end inside a passage', () => {
  // Inside the Great Belt off Korsør (from memory), about 2 nm beside the fairway's leg from
  // 55.034° N up to 55.718° N, bound for the Skaw: the route joins the fairway beside the start
  // and sails north, never back south to the fairway point behind it.
  const inside = { lat: 55.1, lon: 10.95 }
  const skaw = { lat: 57.9, lon: 10.8 }

  it('joins the fairway at its nearest point, both ways', () => {
    for (const r of [seaRoute(graph, inside, skaw), seaRoute(graph, skaw, inside)]) {
      expect(ids(r)).toContain('great-belt')
      expect(minLat(r)).toBeGreaterThan(inside.lat - 0.02)
      expect(landPoints(graph.land, r)).toEqual([])
    }
  })
})
