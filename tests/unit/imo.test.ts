import { describe, expect, it } from 'vitest'
import { isValidImoNumber, normaliseImoNumber } from '#shared/utils/imo'
import { imoNumberSchema } from '#shared/types/imo'

// Check digit scheme: IMO Resolution A.600(15) / A.1117(30); worked example 9074729
// (7·9 + 6·0 + 5·7 + 4·4 + 3·7 + 2·2 = 139, last digit 9), ../shared/check-values.md.
describe('isValidImoNumber', () => {
  it('accepts the published example 9074729, with or without the IMO prefix', () => {
    expect(isValidImoNumber('9074729')).toBe(true)
    expect(isValidImoNumber('IMO 9074729')).toBe(true)
    expect(isValidImoNumber('imo9074729')).toBe(true)
  })

  it('rejects every other check digit for the same six digits', () => {
    for (let d = 0; d <= 9; d++) {
      if (d === 9) continue
      expect(isValidImoNumber(`907472${d}`)).toBe(false)
    }
  })

  it('rejects a transposition of two digits that changes the weighted sum', () => {
    // 9704729: 7·9 + 6·7 + 5·0 + 4·4 + 3·7 + 2·2 = 146 → 6, not 9 (computed from the scheme above)
    expect(isValidImoNumber('9704729')).toBe(false)
  })

  it('rejects wrong lengths and non-digits', () => {
    for (const text of ['', '907472', '90747290', '9O74729', '9074-729', 'IMO', '9074729x'])
      expect(isValidImoNumber(text)).toBe(false)
  })

  it('normalises to the seven digits', () => {
    expect(normaliseImoNumber(' IMO 9074729 ')).toBe('9074729')
    expect(normaliseImoNumber('12345')).toBeNull()
  })
})

describe('imoNumberSchema', () => {
  it('parses a valid number to its digits', () => {
    expect(imoNumberSchema.parse('IMO 9074729')).toBe('9074729')
  })

  it('names the problem: format or check digit', () => {
    const format = imoNumberSchema.safeParse('12345')
    expect(format.success).toBe(false)
    expect(format.error!.issues[0]!.message).toMatch(/seven digits/)
    const check = imoNumberSchema.safeParse('9074728')
    expect(check.success).toBe(false)
    expect(check.error!.issues.map(i => i.message)).toEqual(['check digit does not match (IMO number checksum)'])
  })

  it('rejects a non-string', () => {
    expect(imoNumberSchema.safeParse(9074729).success).toBe(false)
  })
})
