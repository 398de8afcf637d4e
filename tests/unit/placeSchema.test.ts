import { describe, expect, it } from 'vitest'
import { placeSchema } from '#shared/types/place'
import { niceTicks } from '#shared/utils/niceTicks'

describe('place schema (API, form and CSV import share it)', () => {
  it('reads positions in decimal degrees and in navigators\' notation', () => {
    const p = placeSchema.parse({ name: ' Yokohama ', kind: 'Port', lat: '35°26.62\'N', lon: '139 38.28E', unlocode: 'jp yok', timeZone: '' })
    expect(p).toMatchObject({ name: 'Yokohama', kind: 'port', unlocode: 'JPYOK', timeZone: null })
    expect(p.lat).toBeCloseTo(35 + 26.62 / 60, 12)
    expect(p.lon).toBeCloseTo(139 + 38.28 / 60, 12)
    expect(placeSchema.parse({ name: 'A', kind: 'pilot station', lat: -33.86, lon: -179.5 })).toMatchObject({ kind: 'pilot_station', lon: -179.5 })
    expect(placeSchema.safeParse({ name: 'A', kind: 'port', lat: 0, lon: 190 }).success).toBe(false)
  })

  it('names the field of each problem', () => {
    const r = placeSchema.safeParse({ name: '', kind: 'harbour', lat: '95N', lon: 'x', unlocode: 'J1', timeZone: 'Mars/Olympus' })
    expect(r.success).toBe(false)
    const fields = r.error!.issues.map(i => i.path.join('.'))
    expect(fields).toEqual(expect.arrayContaining(['name', 'kind', 'lat', 'lon', 'unlocode', 'timeZone']))
    const lat = r.error!.issues.find(i => i.path[0] === 'lat')!
    expect(lat.message).not.toMatch(/^Latitude:/)
  })
})

describe('axis ticks', () => {
  it('steps at 1, 2 or 5 × 10ⁿ and covers the range', () => {
    expect(niceTicks(10, 17, 6)).toMatchObject({ lo: 10, hi: 18, step: 2, ticks: [10, 12, 14, 16, 18] })
    expect(niceTicks(0, 55.4, 5)).toMatchObject({ lo: 0, hi: 60, step: 20 })
  })
})
