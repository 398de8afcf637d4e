// Several waypoint rows at once (shared/utils/waypointRows.ts): which rows go where, and which leg
// settings each waypoint carries afterwards. Positions are invented; no computation is involved.
import { describe, expect, it } from 'vitest'
import type { Waypoint } from '../../shared/types/waypoint'
import { deleteRows, moveRows, reverseRows } from '../../shared/utils/waypointRows'

// Waypoint k carries the leg (k−1 → k): method, and a speed of 10 + k knots so each leg can be traced.
const list: Waypoint[] = Array.from({ length: 8 }, (_, k) => ({
  name: `W${k}`, lat: 50 + k, lon: k, method: k % 2 ? 'geodesic' : 'rhumb', speedKn: 10 + k, xteNm: k === 3 ? 0.4 : null, turnRadiusNm: null, notes: k === 5 ? 'note of W5' : null,
}))
const names = (l: Waypoint[]) => l.map(w => w.name)

describe('deleteRows', () => {
  it('removes exactly the rows given, once each, ignoring rows beyond the list', () => {
    expect(names(deleteRows(list, [6, 1, 3, 3, 42, -1]))).toEqual(['W0', 'W2', 'W4', 'W5', 'W7'])
    expect(deleteRows(list, [])).toEqual(list)
  })
})

describe('moveRows', () => {
  it('gathers scattered rows into one block at the row asked, in their order, each waypoint unchanged', () => {
    const r = moveRows(list, [5, 2, 6], 1)
    expect(names(r.list)).toEqual(['W0', 'W2', 'W5', 'W6', 'W1', 'W3', 'W4', 'W7'])
    expect(r.rows).toEqual([1, 2, 3])
    expect(r.list[2]).toBe(list[5])
  })
  it('clamps the target to the ends of the list', () => {
    expect(names(moveRows(list, [0, 1], 99).list)).toEqual(['W2', 'W3', 'W4', 'W5', 'W6', 'W7', 'W0', 'W1'])
    expect(names(moveRows(list, [7], -3).list)[0]).toBe('W7')
  })
})

describe('reverseRows', () => {
  it('reverses the span from the first to the last row given; each leg keeps its own settings', () => {
    const r = reverseRows(list, [2, 5])
    expect([r.from, r.to]).toEqual([2, 5])
    expect(names(r.list)).toEqual(['W0', 'W1', 'W5', 'W4', 'W3', 'W2', 'W6', 'W7'])
    // The leg into the span (W1 → now W5) keeps the settings of the leg that arrived at row 2 (W1 → W2).
    expect(r.list[2]).toMatchObject({ method: list[2]!.method, speedKn: 12, notes: 'note of W5' })
    // W5 → W4 is the old leg W4 → W5 sailed back: its settings were on W5, now on W4.
    expect(r.list[3]).toMatchObject({ name: 'W4', speedKn: 15, method: list[5]!.method })
    expect(r.list[4]).toMatchObject({ name: 'W3', speedKn: 14, xteNm: null })
    expect(r.list[5]).toMatchObject({ name: 'W2', speedKn: 13, xteNm: 0.4 })
    // The leg out of the span (now W2 → W6) keeps its settings, and rows outside are the same objects.
    expect(r.list[6]).toBe(list[6])
    expect(r.list[0]).toBe(list[0])
  })
  it('twice gives back the list it started from', () => {
    expect(reverseRows(reverseRows(list, [0, 7]).list, [0, 7]).list).toEqual(list)
    expect(reverseRows(reverseRows(list, [3, 6]).list, [3, 6]).list).toEqual(list)
  })
})
