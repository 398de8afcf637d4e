import { describe, expect, it } from 'vitest'
import { formatPlaceTime, formatUtc, parseUtcText } from '../../shared/utils/format'

describe('UTC times typed as in a log (ISO 8601 calendar dates, 24-hour clock)', () => {
  const accepted: [string, string][] = [
    ['2026-12-10 06:00', '2026-12-10T06:00:00.000Z'],
    ['2026-12-10 06:00Z', '2026-12-10T06:00:00.000Z'],
    ['2026-12-10T0600Z', '2026-12-10T06:00:00.000Z'],
    ['2026-12-10 18:45 UTC', '2026-12-10T18:45:00.000Z'],
    ['2026-12-10 23:59:30', '2026-12-10T23:59:30.000Z'],
    ['2028-2-29 0:00', '2028-02-29T00:00:00.000Z'],
  ]
  it.each(accepted)('reads %s', (text, iso) => expect(parseUtcText(text)).toBe(iso))

  const rejected: [string, RegExp][] = [
    ['10/12/2026 06:00', /2026-12-10 06:00/],
    ['2026-12-10', /add the time/],
    ['2026-12-10 24:00', /00:00 to 23:59/],
    ['2026-12-10 06:60', /00:00 to 23:59/],
    ['2027-02-29 06:00', /2027-02-29 is not a date/],
    ['2026-12-10 6 PM', /2026-12-10 06:00/],
  ]
  it.each(rejected)('refuses %s', (text, message) => expect(() => parseUtcText(text)).toThrow(message))

  it('reads back what it shows', () => {
    const iso = '2026-12-03T14:00:00.000Z'
    expect(parseUtcText(formatUtc(iso))).toBe(iso)
  })
})

describe('the time at a place says whether it is port time or nautical zone time', () => {
  // Singapore keeps UTC+8 (IANA tz database) though its longitude gives zone −7 (US Navy zone-time rule).
  it('names the port\'s civil zone', () => {
    expect(formatPlaceTime('2026-12-13T11:16:00Z', 'Asia/Singapore')).toBe('2026-12-13 19:16 port time (Asia/Singapore)')
  })
  it('reads IANA Etc/GMT-8 as UTC+8 (POSIX sign, reversed; IANA tz database, etcetera file)', () => {
    expect(formatPlaceTime('2026-12-13T11:16:00Z', 'Etc/GMT-8')).toBe('2026-12-13 19:16 zone time (UTC+8)')
    expect(formatPlaceTime('2026-12-13T11:16:00Z', 'Etc/GMT+10')).toBe('2026-12-13 01:16 zone time (UTC−10)')
    expect(formatPlaceTime('2026-12-13T11:16:00Z', 'Etc/GMT')).toBe('2026-12-13 11:16 zone time (UTC)')
  })
})
