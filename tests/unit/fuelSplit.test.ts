// Fuel by grade: each leg's fuel split by its share of distance inside ECAs (hand-worked figures).
import { describe, expect, it } from 'vitest'
import { ecaShare, fuelByGrade } from '../../shared/utils/zones/fuelSplit'

const eca = (distanceNm: number) => ({ zoneId: 1, name: 'ECA', kind: 'eca' as const, distanceNm })
const risk = (distanceNm: number) => ({ zoneId: 2, name: 'Risk', kind: 'risk' as const, distanceNm })

describe('fuel by grade', () => {
  it('splits each leg by its ECA share and the reserve in proportion', () => {
    // Working: leg 1, 100 nm, 40 nm inside an ECA, 10 t → 4 t MGO, 6 t VLSFO; leg 2, 200 nm, none inside (a risk zone
    // is not an ECA), 30 t VLSFO. Totals 36 t VLSFO, 4 t MGO; a 4 t reserve splits 3.6 t / 0.4 t; at 600 and 800 per tonne
    // the passage costs 21 600 and 3 200.
    const rows = fuelByGrade([10, 30], [{ distanceNm: 100 }, { distanceNm: 200 }], [[eca(40)], [risk(50)]], 4,
      { outside: 'VLSFO', insideEca: 'MGO' }, [{ grade: 'vlsfo', pricePerTonne: 600 }, { grade: 'MGO', pricePerTonne: 800 }])
    expect(rows.map(r => r.grade)).toEqual(['VLSFO', 'MGO'])
    expect(rows[0]!.tonnes).toBeCloseTo(36, 12)
    expect(rows[1]!.tonnes).toBeCloseTo(4, 12)
    expect(rows[0]!.reserveTonnes).toBeCloseTo(3.6, 12)
    expect(rows[1]!.reserveTonnes).toBeCloseTo(0.4, 12)
    expect(rows[0]!.cost).toBeCloseTo(21_600, 9)
    expect(rows[1]!.cost).toBeCloseTo(3_200, 9)
    expect(rows[1]!.costWithReserve).toBeCloseTo(4.4 * 800, 9)
  })

  it('shows one grade when the vessel burns the same inside and out, and no cost without a price', () => {
    const rows = fuelByGrade([10], [{ distanceNm: 100 }], [[eca(100)]], 1, { outside: 'MGO', insideEca: 'MGO' }, [])
    expect(rows).toHaveLength(1)
    expect(rows[0]).toMatchObject({ grade: 'MGO', tonnes: 10, reserveTonnes: 1, cost: null })
  })

  it('caps the share at the whole leg (rounding in the zone sums)', () => {
    expect(ecaShare(100, [eca(60), eca(40.0000001)])).toBe(1)
    expect(ecaShare(0, [eca(1)])).toBe(0)
  })
})
