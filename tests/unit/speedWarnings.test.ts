// Speed warnings (shared/utils/speedWarnings.ts): the case, 17.5 kn against fuel data up
// to 16 kn, and a service speed. The figures are the issue's own; the rule compares speeds only.
import { describe, expect, it } from 'vitest'
import { legNumbersText, speedWarnings } from '../../shared/utils/speedWarnings'

const legs = (speeds: number[]) => speeds.map((speedKn, index) => ({ index, speedKn }))

describe('speedWarnings', () => {
  it('warns when the plan is faster than the service speed and beyond the fuel data', () => {
    const w = speedWarnings(legs([17.5, 17.5, 17.5]), { serviceSpeedKn: 15, dataSpeedKn: { min: 10, max: 16 } })
    expect(w).toHaveLength(2)
    expect(w[0]).toBe('Every leg at 17.5 kn: faster than the vessel\'s service speed of 15 kn.')
    expect(w[1]).toMatch(/^Fuel for every leg is extrapolated: 17\.5 kn lies outside the vessel's fuel data \(10–16 kn\)/)
  })

  it('names only the legs concerned, slower than the data included', () => {
    const w = speedWarnings(legs([12, 16.5, 16.5, 12, 8, 17]), { serviceSpeedKn: 16, dataSpeedKn: { min: 10, max: 16 } })
    expect(w[0]).toBe('Legs 2–3, 6 at 16.5 kn, 17 kn: faster than the vessel\'s service speed of 16 kn.')
    expect(w[1]).toMatch(/^Fuel for legs 2–3, 5–6 is extrapolated: 8 kn, 16\.5 kn, 17 kn lies outside/)
  })

  it('says nothing at the limits themselves, nor without limits', () => {
    expect(speedWarnings(legs([16, 10, 15.999]), { serviceSpeedKn: 16, dataSpeedKn: { min: 10, max: 16 } })).toEqual([])
    expect(speedWarnings(legs([30]), {})).toEqual([])
    expect(speedWarnings(legs([30]), { serviceSpeedKn: null, dataSpeedKn: null })).toEqual([])
  })

  it('writes leg numbers as runs', () => {
    expect(legNumbersText([1, 2, 3, 5, 7, 8])).toBe('1–3, 5, 7–8')
    expect(legNumbersText([4])).toBe('4')
  })
})
