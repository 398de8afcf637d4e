import { describe, expect, it } from 'vitest'
import { courseChangeDeg, formatZoneDescription, rateOfTurnDegPerMin, wheelOverNm, zoneDescription, zoneTime } from '../../shared/utils/manoeuvre'

describe('manoeuvres (common practice)', () => {
  it('wheel-over distance R·tan(Δ/2) plus speed × helm delay', () => {
    expect(wheelOverNm(1, 90)).toBeCloseTo(1, 12) // R·tan 45° = R (common practice)
    expect(wheelOverNm(2, 60)).toBeCloseTo(2 * Math.tan(Math.PI / 6), 12)
    expect(wheelOverNm(1, -90, 12, 30)).toBeCloseTo(1 + 12 * 30 / 3600, 12) // 12 kn for 30 s = 0.1 nm
  })
  it('rate of turn ≈ 57.3·V/(60·R) °/min (check-values.md, common practice)', () => {
    expect(rateOfTurnDegPerMin(12, 1)).toBeCloseTo(57.3 * 12 / 60, 1)
    expect(Math.abs(rateOfTurnDegPerMin(15, 0.5) / (57.3 * 15 / 30) - 1)).toBeLessThan(1e-3)
  })
  it('course change is signed, positive to starboard', () => {
    expect(courseChangeDeg(350, 10)).toBe(20)
    expect(courseChangeDeg(10, 350)).toBe(-20)
    expect(courseChangeDeg(90, 270)).toBe(180)
  })
})

describe('zone time (US Navy navigation training manual, via check-values.md)', () => {
  it.each([
    [0, 0], [7.4, 0], [-7.4, 0], [7.6, -1], [-7.6, 1], [-122.47, 8], [151.2, -10], [139.7, -9],
    [172.4, -11], [172.6, -12], [180, -12], [-172.6, 12], [-179.9, 12],
  ])('longitude %f has zone description %i', (lon, zd) => {
    expect(zoneDescription(lon)).toBe(zd)
  })
  it('UTC = zone time + ZD', () => {
    expect(zoneTime('2026-03-01T12:00:00Z', 8)).toBe('2026-03-01 04:00')
    expect(zoneTime('2026-03-01T20:00:00Z', -10)).toBe('2026-03-02 06:00')
    expect(formatZoneDescription(8)).toBe('+8')
    expect(formatZoneDescription(-10)).toBe('−10')
    expect(formatZoneDescription(0)).toBe('0')
  })
})
