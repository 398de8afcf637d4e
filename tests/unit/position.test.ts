import { describe, expect, it } from 'vitest'
import { PositionError, formatLatitude, formatLimitLatitude, parseLimitLatitude, formatLongitude, formatPosition, normaliseCourse, normaliseLongitude, wrapLongitude, parseLatitude, parseLongitude, parsePosition } from '../../shared/utils/position'

const SF = { lat: 37 + 47.5 / 60, lon: -(122 + 28 / 60) }

describe('parsing positions as navigators type them (domain.md)', () => {
  const accepted: [string, number, number][] = [
    ['37°47.5\'N 122°28.0\'W', SF.lat, SF.lon],
    ['37 47.5N 122 28.0W', SF.lat, SF.lon],
    ['37 47.5 N 122 28.0 W', SF.lat, SF.lon],
    ['37-47.5N 122-28.0W', SF.lat, SF.lon],
    ['N37°47\'30" W122°28\'00"', SF.lat, SF.lon],
    ['37°47.50′N 122°28.00′W', SF.lat, SF.lon],
    ['37d47.5\'n 122d28w', SF.lat, SF.lon],
    ['37:47:30N 122:28:00W', SF.lat, SF.lon],
    ['122°28.0\'W 37°47.5\'N', SF.lat, SF.lon],
    ['33-51.7S, 151-12.5E', -(33 + 51.7 / 60), 151 + 12.5 / 60],
    ['33-51.7s 151-12.5e', -(33 + 51.7 / 60), 151 + 12.5 / 60],
    ['-33.86 151.21', -33.86, 151.21],
    ['-33.86, 151.21', -33.86, 151.21],
    ['−33.86 −151.21', -33.86, -151.21],
    ['0 0', 0, 0],
    ['90N 180W', 90, -180],
    ['S 0 30 E 0 30', -0.5, 0.5],
  ]
  it.each(accepted)('accepts %s', (text, lat, lon) => {
    const p = parsePosition(text)
    expect(p.lat).toBeCloseTo(lat, 12)
    expect(p.lon).toBeCloseTo(lon, 12)
  })

  const rejected: [string, RegExp][] = [
    ['91N 0E', /beyond 90/],
    ['37°61\'N 122W', /minutes must be less than 60/],
    ['37 47 61N 122W', /seconds must be less than 60/],
    ['37 47.5 122 28', /missing hemisphere/],
    ['37 47.5E 122 28E', /not a latitude hemisphere/],
    ['37.5 30N 1E', /only the last number may have decimals/],
    ['-37 47N 1E', /sign or a hemisphere/],
    ['37°47.5\'N', /longitude is missing/],
    ['abc', /no numbers/],
    ['', /empty/],
    ['37N 190E', /beyond 180/],
    ['37 47 30 10N 1E', /too many numbers/],
  ]
  it.each(rejected)('rejects %s with a message that names the problem', (text, message) => {
    expect(() => parsePosition(text)).toThrow(PositionError)
    expect(() => parsePosition(text)).toThrow(message)
  })

  it('single angles for route-file import', () => {
    expect(parseLatitude('33-51.7S')).toBeCloseTo(-(33 + 51.7 / 60), 12)
    expect(parseLongitude('151 12.5 E')).toBeCloseTo(151 + 12.5 / 60, 12)
    expect(parseLongitude('-0.5')).toBe(-0.5)
    expect(() => parseLatitude('12E')).toThrow(/not a latitude hemisphere/)
    expect(() => parseLongitude('12N')).toThrow(/not a longitude hemisphere/)
    expect(() => parseLatitude('12,5N')).toThrow(/comma/)
  })
})

describe('formatting positions', () => {
  it('as degrees and decimal minutes: 37°47.50′N 122°28.00′W (domain.md)', () => {
    expect(formatPosition(SF)).toBe('37°47.50′N 122°28.00′W')
    expect(formatLatitude(-(33 + 51.7 / 60))).toBe('33°51.70′S')
    expect(formatLongitude(5 + 13.2 / 60)).toBe('005°13.20′E')
  })
  it('carries rounded minutes into the degrees and never shows a negative zero', () => {
    expect(formatLatitude(9.99999999)).toBe('10°00.00′N')
    expect(formatLatitude(-0.0000001)).toBe('00°00.00′N')
    expect(formatLongitude(-179.999999999)).toBe('180°00.00′W')
  })
  it('round-trips through the parser', () => {
    for (const p of [SF, { lat: -12.3456, lon: 179.9999 }, { lat: 0.01, lon: -0.01 }]) {
      const back = parsePosition(formatPosition(p, 4))
      expect(back.lat).toBeCloseTo(p.lat, 6)
      expect(back.lon).toBeCloseTo(p.lon, 6)
    }
  })
  it('normalises longitudes to −180..180 and courses to 0..360', () => {
    expect(normaliseLongitude(190)).toBe(-170)
    expect(normaliseLongitude(-190)).toBe(170)
    expect(normaliseLongitude(540)).toBe(180)
    expect(normaliseLongitude(-180)).toBe(-180)
    // Half-open −180 ≤ λ < 180, by definition of the range: 180° is written −180°.
    expect(wrapLongitude(180)).toBe(-180)
    expect(wrapLongitude(540)).toBe(-180)
    expect(wrapLongitude(-180)).toBe(-180)
    expect(wrapLongitude(179.5 - 360)).toBe(179.5)
    expect(normaliseCourse(360)).toBe(0)
    expect(normaliseCourse(-90)).toBe(270)
    expect(Object.is(normaliseCourse(-0), 0)).toBe(true)
  })
})

describe('limiting latitude as navigators write it (common practice: a magnitude, applied on the vertex side)', () => {
  const accepted: [string, number][] = [
    ['50', 50],
    ['50N', 50],
    ['50°N', 50],
    ['50° N', 50],
    ['N50', 50],
    ['40S', 40],
    ['-40', 40],
    ['48°45′N', 48.75],
    ['48 45', 48.75],
    ['48-45.0N', 48.75],
    ['48.75', 48.75],
    ['48°45.0′', 48.75],
  ]
  it.each(accepted)('reads %s', (text, value) => {
    expect(parseLimitLatitude(text)).toBeCloseTo(value, 12)
  })

  const rejected: [string, RegExp][] = [
    ['', /empty/],
    ['0', /between 0° and 90°/],
    ['90N', /between 0° and 90°/],
    ['95', /beyond 90/],
    ['50E', /not a latitude hemisphere/],
    ['48°61′N', /minutes must be less than 60/],
    ['fifty', /unexpected/],
  ]
  it.each(rejected)('refuses %s with a message naming the problem', (text, message) => {
    expect(() => parseLimitLatitude(text)).toThrow(PositionError)
    expect(() => parseLimitLatitude(text)).toThrow(message)
  })

  it('writes the limit back in degrees and minutes, and reads its own output', () => {
    expect(formatLimitLatitude(48.75)).toBe('48°45.0′')
    expect(formatLimitLatitude(-40)).toBe('40°00.0′')
    expect(parseLimitLatitude(formatLimitLatitude(47.123))).toBeCloseTo(47.123, 3)
  })
})
