// Reading uploaded zone GeoJSON: what is accepted, and every refusal tied to its line.
import { describe, expect, it } from 'vitest'
import { readZoneGeoJson } from '../../shared/utils/zones/geojson'

const square = (lon: number, lat: number, d: number) => [[lon, lat], [lon + d, lat], [lon + d, lat + d], [lon, lat + d], [lon, lat]]
const pretty = (value: unknown) => JSON.stringify(value, null, 2)
const lineOf = (text: string, needle: string, nth = 1) => {
  let at = -1
  for (let k = 0; k < nth; k++) at = text.indexOf(needle, at + 1)
  return text.slice(0, at).split('\n').length
}

describe('zone GeoJSON', () => {
  it('reads a Feature, a FeatureCollection of polygons and multipolygons, and a bare geometry', () => {
    const feature = pretty({ type: 'Feature', properties: { name: 'Box' }, geometry: { type: 'Polygon', coordinates: [square(2, 51, 1)] } })
    expect(readZoneGeoJson(feature)).toMatchObject({ issues: [], vertexCount: 5, polygons: [[square(2, 51, 1)]] })
    const collection = pretty({ type: 'FeatureCollection', features: [
      { type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [square(2, 51, 2), square(2.5, 51.5, 0.5)] } },
      { type: 'Feature', properties: {}, geometry: { type: 'MultiPolygon', coordinates: [[square(10, 10, 1)], [square(20, 10, 1)]] } },
    ] })
    const read = readZoneGeoJson(collection)
    expect(read.issues).toEqual([])
    expect(read.polygons).toHaveLength(3)
    expect(read.polygons[0]).toHaveLength(2)
    expect(readZoneGeoJson(pretty({ type: 'Polygon', coordinates: [square(179.5, 10, 1).map(([x, y]) => [x! > 180 ? x! - 360 : x!, y!])] })).issues).toEqual([])
  })

  it('refuses broken JSON at the line of the fault', () => {
    const text = '{\n  "type": "Polygon",\n  "coordinates": [[[1, 2], [3, 4]\n  ]\n}\n'
    const { issues } = readZoneGeoJson(text)
    expect(issues[0]!.message).toMatch(/not valid JSON/)
    expect(issues[0]!.line).toBe(5)
  })

  it('refuses an open ring at the line of its last position', () => {
    const text = pretty({ type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [[[0, 50], [1, 50], [1, 51], [0, 51]]] } })
    const { issues } = readZoneGeoJson(text)
    expect(issues).toHaveLength(1)
    expect(issues[0]!.message).toMatch(/not closed/)
    expect(issues[0]!.line).toBe(lineOf(text, '51', 2) - 2) // the line of its opening bracket; the latitude is two lines below
  })

  it('refuses a coordinate out of range at its line', () => {
    const ring = square(0, 50, 1)
    ring[2] = [1, 95]
    const text = pretty({ type: 'Polygon', coordinates: [ring] })
    const { issues } = readZoneGeoJson(text)
    expect(issues[0]!.message).toMatch(/position 3: latitude 95/)
    expect(issues[0]!.line).toBe(lineOf(text, '95') - 2)
  })

  it('refuses a ring that crosses itself (a bow tie), naming both edges and their lines', () => {
    const text = pretty({ type: 'Polygon', coordinates: [[[0, 50], [1, 51], [1, 50], [0, 51], [0, 50]]] })
    const { issues } = readZoneGeoJson(text)
    expect(issues).toHaveLength(1)
    expect(issues[0]!.message).toMatch(/edge from position 1 crosses the edge from position 3/)
    expect(issues[0]!.line).toBe(lineOf(text, '[', 3))
    expect(issues[0]!.message).toContain(`(line ${lineOf(text, '[', 5)})`)
  })

  it('refuses a hole that crosses or lies outside its outer ring, a ring round a pole, and the wrong type', () => {
    expect(readZoneGeoJson(pretty({ type: 'Polygon', coordinates: [square(0, 50, 1), square(0.5, 50.5, 1)] })).issues[0]!.message).toMatch(/hole 1's edge/)
    expect(readZoneGeoJson(pretty({ type: 'Polygon', coordinates: [square(0, 50, 1), square(5, 50, 0.5)] })).issues[0]!.message).toMatch(/hole 1 lies outside/)
    const polar = [[0, 80], [90, 80], [180, 80], [-90, 80], [0, 80]]
    expect(readZoneGeoJson(pretty({ type: 'Polygon', coordinates: [polar] })).issues[0]!.message).toMatch(/spans 180\.0°|round a pole/)
    const polar2 = [[0, 80], [60, 80], [120, 80], [180, 80], [-120, 80], [-60, 80], [0, 80]]
    expect(readZoneGeoJson(pretty({ type: 'Polygon', coordinates: [polar2] })).issues[0]!.message).toMatch(/round a pole/)
    expect(readZoneGeoJson(pretty({ type: 'LineString', coordinates: [[0, 0], [1, 1]] })).issues[0]!.message).toMatch(/send a Feature/)
    expect(readZoneGeoJson('').issues[0]!.message).toMatch(/not valid JSON|empty/)
  })

  it('refuses more positions than the limit', () => {
    const ring = Array.from({ length: 10_001 }, (_, i) => [Math.cos(i / 10_000 * 2 * Math.PI), 50 + Math.sin(i / 10_000 * 2 * Math.PI)])
    ring[10_000] = ring[0]!
    expect(readZoneGeoJson(JSON.stringify({ type: 'Polygon', coordinates: [ring] })).issues[0]!.message).toMatch(/at most 10000/)
  })
})

describe('the seeded ECA outlines', () => {
  it('pass the upload checks (closed rings that do not cross themselves)', async () => {
    const { ecaZones } = await import('../../db/seeds/ecaZones')
    for (const z of ecaZones) expect(readZoneGeoJson(JSON.stringify({ type: 'MultiPolygon', coordinates: z.polygons })).issues, z.name).toEqual([])
  })
})
