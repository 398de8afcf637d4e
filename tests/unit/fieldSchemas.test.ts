// The named field schemas every object schema is built from (shared/types/fields.ts): the bounds
// come from the storage (PostgreSQL integer, numeric(5,2)) and the product brief's units.
import { describe, expect, it } from 'vitest'
import { dateTimeUtcSchema, idParamsSchema, idSchema, lonSchema, numberTextSchema, latSchema, speedKnSchema, turnRadiusNmSchema, versionSchema, xteNmSchema } from '#shared/types/fields'
import { planCreateSchema } from '#shared/types/plan'
import { waypointSchema } from '#shared/types/waypoint'

const message = (r: { success: boolean, error?: { issues: { message: string }[] } }) => r.error?.issues[0]?.message

describe('ids and versions', () => {
  // PostgreSQL documentation, "Numeric Types": integer is -2147483648 to +2147483647.
  it('stop at the largest PostgreSQL integer', () => {
    expect(idSchema.parse(2_147_483_647)).toBe(2_147_483_647)
    expect(message(idSchema.safeParse(2_147_483_648))).toBe('must be a record id (a whole number) from 1 to 2147483647')
    expect(message(versionSchema.safeParse(2 ** 53))).toBe('must be a whole number from 1 to 2147483647')
    expect(idSchema.safeParse(0).success).toBe(false)
    expect(idSchema.safeParse(1.5).success).toBe(false)
  })

  it('the :id parameter takes digits only', () => {
    expect(idParamsSchema.parse({ id: '42' })).toEqual({ id: 42 })
    for (const id of ['1e3', '0x10', ' 7', '-1', '4.0', '', '99999999999', '2147483648'])
      expect(idParamsSchema.safeParse({ id }).success, id).toBe(false)
  })
})

describe('speeds, XTE and turn radius', () => {
  it('are rounded to what numeric(…, 2) stores, so a value is never stored as 0', () => {
    expect(speedKnSchema.parse(12.345)).toBe(12.35)
    for (const v of [0.004, 1.5e-320, 0, -1, 60.01, Number.NaN, Number.POSITIVE_INFINITY])
      expect(speedKnSchema.safeParse(v).success, String(v)).toBe(false)
    expect(message(speedKnSchema.safeParse(0.004))).toBe('must be from 0.1 to 60 kn')
    expect(xteNmSchema.safeParse(0.004).success).toBe(false)
    expect(turnRadiusNmSchema.safeParse(0.004).success).toBe(false)
    expect(xteNmSchema.parse(0.01)).toBe(0.01)
  })

  it('a waypoint names the field of a bad leg value', () => {
    const r = waypointSchema.safeParse({ lat: 1, lon: 2, xteNm: 0.001 })
    expect(r.error!.issues.map(i => `${i.path.join('.')}: ${i.message}`)).toEqual(['xteNm: must be from 0.01 to 100 nm'])
  })
})

describe('positions', () => {
  it('latitude within ±90, longitude within ±180, each saying so', () => {
    expect(message(latSchema.safeParse(90.5))).toBe('must be between -90 and 90')
    expect(message(lonSchema.safeParse(190))).toBe('must be between -180 and 180')
    expect(lonSchema.parse(-180)).toBe(-180)
  })

  it('a number typed as text: blank is missing, not 0', () => {
    const lat = numberTextSchema(latSchema)
    expect(lat.parse(' -33.86 ')).toBe(-33.86)
    expect(message(lat.safeParse(''))).toBe('is required')
    expect(message(lat.safeParse('12abc'))).toBe('must be a number')
    expect(message(lat.safeParse('95'))).toBe('must be between -90 and 90')
  })
})

describe('dates', () => {
  it('a departure must fall in 1900–2199', () => {
    expect(dateTimeUtcSchema.safeParse('2027-03-01T06:00:00Z').success).toBe(true)
    expect(message(dateTimeUtcSchema.safeParse('9999-12-31T00:00:00Z'))).toBe('must be between the years 1900 and 2199')
    expect(message(dateTimeUtcSchema.safeParse('tomorrow'))).toMatch(/ISO 8601/)
  })

  it('the plan header composes the same fields', () => {
    const r = planCreateSchema.safeParse({ vesselId: 3_000_000_000, title: 'Probe', departureUtc: '9999-01-01T00:00:00Z', speedKn: 0.004 })
    expect(r.error!.issues.map(i => i.path.join('.')).sort()).toEqual(['departureUtc', 'speedKn', 'vesselId'])
  })
})
