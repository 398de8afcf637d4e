import { describe, expect, it } from 'vitest'
import { isoUtc } from '../../shared/utils/engine/isoTime'
import { seededRandom } from './support/random'

describe('ISO 8601 UTC text for ETAs', () => {
  it('matches the platform Date#toISOString (ECMA-262 §21.4.4.36) over 100 000 random instants and leap days', () => {
    const rnd = seededRandom(3)
    for (let i = 0; i < 100_000; i++) {
      const ms = (rnd() - 0.3) * 8e12 + rnd()
      expect(isoUtc(ms)).toBe(new Date(ms).toISOString())
    }
    expect(isoUtc(Date.UTC(2028, 1, 29, 23, 59, 59, 999))).toBe('2028-02-29T23:59:59.999Z')
    expect(isoUtc(Date.UTC(2100, 2, 1))).toBe('2100-03-01T00:00:00.000Z')
    expect(isoUtc(-1)).toBe('1969-12-31T23:59:59.999Z')
  })
})
