import { describe, expect, it } from 'vitest'
import { choosePlans, computeDistances, pairCount, pairIndex, rowChunks } from '../../shared/utils/distanceTable'
import { distanceTableCsv } from '../../shared/utils/distanceTableCsv'
import type { TablePlace, TablePlan } from '../../shared/types/distanceTable'

const places: TablePlace[] = [
  { id: 1, name: 'Alpha', lat: 0, lon: 0 },
  { id: 2, name: 'Bravo', lat: 0, lon: 10 },
  { id: 3, name: '=Charlie', lat: 10, lon: 10 },
]

describe('distance table arithmetic', () => {
  it('numbers every pair of the upper triangle once, in row order', () => {
    const n = 7
    const seen = new Set<number>()
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) seen.add(pairIndex(i, j, n))
    expect([...seen].sort((a, b) => a - b)).toEqual(Array.from({ length: pairCount(n) }, (_, k) => k))
    expect(pairIndex(4, 2, n)).toBe(pairIndex(2, 4, n))
    expect(rowChunks(n, 5).flat()).toContain(n - 1)
  })

  it('takes the shortest approved plan whose ends lie within the radius, in either direction', () => {
    const plans: TablePlan[] = [
      { id: 10, title: 'long', start: { lat: 0.1, lon: 0 }, end: { lat: 0, lon: 10.1 }, distanceNm: 700 },
      { id: 11, title: 'short, reversed', start: { lat: 0, lon: 9.9 }, end: { lat: 0, lon: 0.2 }, distanceNm: 650 },
      { id: 12, title: 'too far off', start: { lat: 2, lon: 0 }, end: { lat: 10, lon: 10 }, distanceNm: 1 },
    ]
    const choice = choosePlans(places, plans, 30)
    expect(choice.planId[pairIndex(0, 1, 3)]).toBe(11)
    expect(choice.distanceNm[pairIndex(0, 1, 3)]).toBe(650)
    expect(choice.planId[pairIndex(0, 2, 3)]).toBe(0)
    const { distanceNm } = computeDistances(places, plans, 30)
    expect(distanceNm[pairIndex(0, 1, 3)]).toBe(650)
    expect(distanceNm[pairIndex(1, 0, 3)]).toBe(650) // same pair, either order
    expect(distanceNm[pairIndex(0, 2, 3)]).toBeGreaterThan(800)
  })

  it('writes CSV with a header of place names, one decimal, marks, ECA distances, passages and formula-safe names', () => {
    const csv = distanceTableCsv({
      id: 1, name: 'T', status: 'ready', progress: 1, placeCount: 3, radiusNm: 30, avoid: ['suez'], builtAt: null, createdAt: '', error: null, places,
      matrix: {
        distanceNm: [650, 840.04, 600.96], planId: [11, null, null], source: ['plan', 'sea', 'direct'], via: [null, ['dover', 'gibraltar'], null],
        ecaNm: [12.34, 0, null], crossesLand: [null, null, true], plans: [{ id: 11, title: 'A, B' }],
        passages: [{ id: 'dover', name: 'Dover Strait' }, { id: 'gibraltar', name: 'Strait of Gibraltar' }], landStepNm: 20,
      },
    })
    const lines = csv.split('\r\n')
    expect(lines[0]).toBe(`Distance (nm),Alpha,Bravo,'=Charlie`)
    expect(lines[1]).toBe('Alpha,,650.0,840.0')
    expect(lines[3]).toBe(`'=Charlie,840.0,601.0,`)
    expect(lines).toContain('Alpha,,P11,S')
    expect(lines).toContain('Bravo,P11,,DL')
    // Distance inside ECAs: one decimal, empty where the pair has none computed (direct).
    expect(lines).toContain('Alpha,,12.3,0.0')
    expect(lines).toContain('Bravo,12.3,,')
    expect(lines).toContain('Alpha,,,dover gibraltar')
    expect(lines).toContain('P11,"approved plan: A, B"')
    expect(lines).toContain('S,"computed sea route, avoiding suez"')
    expect(lines).toContain('gibraltar,Strait of Gibraltar')
  })
})
