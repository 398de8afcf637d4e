// How courses, durations, numbers and times are written on screen, in print and in the crew brief.
// Three-figure true courses, day/hour/minute durations and `…Z` UTC are common practice in
// passage plans and logbooks. Port and zone times are tested in timeFormat.test.ts.
import { describe, expect, it } from 'vitest'
import { formatCourse, formatDuration, formatLegCourse, formatNumber, formatUtc } from '../../shared/utils/format'

describe('courses', () => {
  it('writes three figures and the decimals asked for', () => {
    expect(formatCourse(5)).toBe('005.0°')
    expect(formatCourse(45.26)).toBe('045.3°')
    expect(formatCourse(270)).toBe('270.0°')
    expect(formatCourse(7.125, 2)).toBe('007.13°')
    expect(formatCourse(90, 0)).toBe('090°')
  })

  it('never writes 360: a course that rounds up to it is north', () => {
    expect(formatCourse(359.96)).toBe('000.0°')
    expect(formatCourse(359.994, 2)).toBe('359.99°')
    expect(formatCourse(359.996, 2)).toBe('000.00°')
  })

  it('gives a geodesic leg its initial and final course, a rhumb line its one course', () => {
    expect(formatLegCourse({ method: 'geodesic', initialCourse: 52.34, finalCourse: 118.05 })).toBe('052.3° → 118.1°')
    expect(formatLegCourse({ method: 'rhumb', course: 90 })).toBe('090.0°')
  })
})

describe('durations', () => {
  it('writes days, hours and minutes, to the minute', () => {
    expect(formatDuration(0.5)).toBe('00h 30m')
    expect(formatDuration(5.2)).toBe('05h 12m')
    expect(formatDuration(49.5)).toBe('2d 01h 30m')
    expect(formatDuration(23.9999)).toBe('1d 00h 00m')
  })
})

describe('numbers and times', () => {
  it('groups thousands and fixes the decimals', () => {
    expect(formatNumber(4079.26)).toBe('4,079.3')
    expect(formatNumber(0.126, 2)).toBe('0.13')
  })

  it('writes UTC to the minute with Z', () => {
    expect(formatUtc('2026-12-10T02:00:40.000Z')).toBe('2026-12-10 02:00Z')
  })
})
