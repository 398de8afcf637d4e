import { describe, expect, it } from 'vitest'
import { fitFuelCurve, FuelDataError, fuelForArrival, fuelRate, legFuelTonnes, planFuel, reserveTonnes, speedForArrival } from '#shared/utils/fuel'
import { fuelPointsSchema, fuelReserveSchema } from '#shared/types/fuel'
import { seededRandom } from './support/random'

// The law itself is common practice (../shared/check-values.md, "Facts of the trade": fuel per day
// rises roughly with the cube of speed). c = 0.011 (≈ 30 t/day at 14 kn) is an invented coefficient;
// expected values below follow from t/day = c·V^k and fuel = rate · hours / 24 (domain.md) by arithmetic.
const cubic = { c: 0.011, k: 3 }
const fromLaw = (c: number, k: number, speeds: number[]) => speeds.map(speedKn => ({ speedKn, tonnesPerDay: c * speedKn ** k }))


/** Standard normal deviate by Box–Muller. */
function gaussian(random: () => number) {
  return Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random())
}

describe('fitFuelCurve', () => {
  it('recovers c and k from points on a cubic law', () => {
    const fit = fitFuelCurve(fromLaw(cubic.c, cubic.k, [10, 12, 14, 16, 18]))
    expect(fit.k).toBeCloseTo(3, 12)
    expect(fit.c / cubic.c).toBeCloseTo(1, 12)
    expect(fit.r2).toBeCloseTo(1, 12)
    expect(fit.rmsLog).toBeLessThan(1e-12)
  })

  it('recovers a non-integer exponent as well (k = 3.4)', () => {
    const fit = fitFuelCurve(fromLaw(0.004, 3.4, [8, 11, 13.5, 21]))
    expect(fit.k).toBeCloseTo(3.4, 12)
    expect(fit.c / 0.004).toBeCloseTo(1, 11)
  })

  it('two points fix the line: (10 kn, 10 t/day) and (20 kn, 80 t/day) give k = log2 8 = 3, c = 10/10³', () => {
    const fit = fitFuelCurve([{ speedKn: 10, tonnesPerDay: 10 }, { speedKn: 20, tonnesPerDay: 80 }])
    expect(fit.k).toBeCloseTo(3, 14)
    expect(fit.c).toBeCloseTo(0.01, 15)
  })

  it('matches a least-squares fit worked by hand', () => {
    // ln V = 0, 1, 2 and ln t = 1, 2.5, 3: normal equations give k = Sxy/Sxx = 2/2 = 1 and
    // ln c = ȳ − k·x̄ = 13/6 − 1 = 7/6; residuals −1/6, 1/3, −1/6 so SSres = 1/6, SStot = 13/6,
    // r² = 1 − 1/13 = 12/13, rms = √(1/18). (Ordinary least squares, worked by hand.)
    const fit = fitFuelCurve([0, 1, 2].map((x, i) => ({ speedKn: Math.exp(x), tonnesPerDay: Math.exp([1, 2.5, 3][i]!) })))
    expect(fit.k).toBeCloseTo(1, 12)
    expect(Math.log(fit.c)).toBeCloseTo(7 / 6, 12)
    expect(fit.r2).toBeCloseTo(12 / 13, 12)
    expect(fit.rmsLog).toBeCloseTo(Math.sqrt(1 / 18), 12)
  })

  it('stays near the law on noisy points (3 % log-normal scatter, seeded)', () => {
    const random = seededRandom(20260301)
    const speeds = [9, 10.5, 12, 13, 14, 15.5, 17, 19]
    const points = speeds.map(speedKn => ({ speedKn, tonnesPerDay: cubic.c * speedKn ** 3 * Math.exp(0.03 * gaussian(random)) }))
    const fit = fitFuelCurve(points)
    // Standard error of k ≈ σ / √Sxx ≈ 0.03 / √(Σ(ln V − mean)²) ≈ 0.05 for these speeds: allow 4 of them.
    expect(Math.abs(fit.k - 3)).toBeLessThan(0.2)
    // Rate at the middle speed, where the fit is tightest: within 3 %.
    expect(fuelRate(fit, 14) / fuelRate(cubic, 14)).toBeGreaterThan(0.97)
    expect(fuelRate(fit, 14) / fuelRate(cubic, 14)).toBeLessThan(1.03)
    expect(fit.rmsLog).toBeGreaterThan(0.005)
    expect(fit.rmsLog).toBeLessThan(0.06)
    expect(fit.r2).toBeGreaterThan(0.98)
    expect(fit.r2).toBeLessThan(1)
  })

  it('refuses fewer than 2 points, non-positive values and duplicate speeds, naming the problem', () => {
    expect(() => fitFuelCurve([{ speedKn: 12, tonnesPerDay: 20 }])).toThrow(/at least 2 points/)
    expect(() => fitFuelCurve([{ speedKn: 0, tonnesPerDay: 20 }, { speedKn: 12, tonnesPerDay: 25 }])).toThrow(/point 1: speedKn must be greater than 0/)
    expect(() => fitFuelCurve([{ speedKn: 10, tonnesPerDay: 20 }, { speedKn: 12, tonnesPerDay: -1 }])).toThrow(/point 2: tonnesPerDay must be greater than 0/)
    expect(() => fitFuelCurve([{ speedKn: 12, tonnesPerDay: 20 }, { speedKn: 12, tonnesPerDay: 21 }])).toThrow(/speedKn 12 is given twice/)
    expect(() => fitFuelCurve([{ speedKn: Number.NaN, tonnesPerDay: 20 }, { speedKn: 12, tonnesPerDay: 21 }])).toThrow(FuelDataError)
  })
})

describe('fuel for legs and plans', () => {
  it('rate and leg fuel from hours: 0.011·14³ = 30.184 t/day; 36 h → 45.276 t', () => {
    expect(fuelRate(cubic, 14)).toBeCloseTo(30.184, 10)
    expect(legFuelTonnes(cubic, 14, 36)).toBeCloseTo(45.276, 10)
    expect(legFuelTonnes(cubic, 14, 0)).toBe(0)
    expect(() => legFuelTonnes(cubic, 14, -1)).toThrow(/hours must not be negative/)
  })

  it('reserve as a percentage: 10 % of 450 t = 45 t', () => {
    expect(reserveTonnes(450, { kind: 'percent', value: 10 })).toBeCloseTo(45, 12)
  })

  it('reserve as days of steaming: 3 days at 12 kn = 3 · 0.011 · 12³ = 57.024 t', () => {
    expect(reserveTonnes(450, { kind: 'days', value: 3, speedKn: 12 }, cubic)).toBeCloseTo(57.024, 10)
    expect(() => reserveTonnes(450, { kind: 'days', value: 3, speedKn: 12 })).toThrow(/needs the vessel's fuel curve/)
  })

  it('sums a plan: legs, total, reserve and total with reserve', () => {
    const result = planFuel(cubic, [{ speedKn: 14, hours: 36 }, { speedKn: 12, hours: 48 }], { kind: 'percent', value: 10 })
    // 45.276 + 0.011·1728·2 = 45.276 + 38.016 = 83.292; 10 % = 8.3292
    expect(result.legTonnes[0]).toBeCloseTo(45.276, 10)
    expect(result.legTonnes[1]).toBeCloseTo(38.016, 10)
    expect(result.totalTonnes).toBeCloseTo(83.292, 10)
    expect(result.reserveTonnes).toBeCloseTo(8.3292, 10)
    expect(result.withReserveTonnes).toBeCloseTo(91.6212, 10)
  })

  it('required arrival: 3000 nm in 240 h needs 12.5 kn and 0.011·12.5³·10 = 214.84375 t', () => {
    expect(speedForArrival(3000, 240)).toBe(12.5)
    const arrival = fuelForArrival(cubic, 3000, 240)
    expect(arrival.speedKn).toBe(12.5)
    expect(arrival.tonnes).toBeCloseTo(214.84375, 9)
    // slower is cheaper when k > 1: fuel over the distance ∝ V^(k−1)
    expect(fuelForArrival(cubic, 3000, 300).tonnes).toBeLessThan(arrival.tonnes)
    expect(() => speedForArrival(3000, 0)).toThrow(/hoursAvailable must be greater than 0/)
  })
})

describe('fuel schemas', () => {
  it('accepts good points', () => {
    expect(fuelPointsSchema.safeParse([{ speedKn: 12, tonnesPerDay: 19 }, { speedKn: 14, tonnesPerDay: 30 }]).success).toBe(true)
  })

  it('names the field in each message', () => {
    const messages = (value: unknown) => {
      const result = fuelPointsSchema.safeParse(value)
      expect(result.success).toBe(false)
      return result.error!.issues.map(i => `${i.path.join('.')}: ${i.message}`)
    }
    expect(messages([{ speedKn: 12, tonnesPerDay: 19 }])).toEqual([': fuel data needs at least 2 points (speedKn and tonnesPerDay) to fit a curve'])
    expect(messages([{ speedKn: 0, tonnesPerDay: 19 }, { speedKn: 14, tonnesPerDay: 30 }])).toEqual(['0.speedKn: must be from 0.1 to 60 kn'])
    expect(messages([{ speedKn: 12, tonnesPerDay: -3 }, { speedKn: 14, tonnesPerDay: 30 }])).toEqual(['0.tonnesPerDay: must be from 0.01 to 2000 t/day'])
    expect(messages([{ speedKn: 12, tonnesPerDay: 19 }, { speedKn: 12, tonnesPerDay: 20 }])).toEqual(['1.speedKn: speedKn 12 is given twice (points 1 and 2); give one consumption per speed'])
    // speeds are stored to 0.01 kn (numeric(5,2)): 12.001 and 12.004 are the same stored speed
    expect(messages([{ speedKn: 12.001, tonnesPerDay: 19 }, { speedKn: 12.004, tonnesPerDay: 20 }])).toEqual(['1.speedKn: speedKn 12 is given twice (points 1 and 2); give one consumption per speed'])
    expect(messages([{ speedKn: '12', tonnesPerDay: 19 }, { speedKn: 14, tonnesPerDay: 30 }])).toEqual(['0.speedKn: must be a number'])
  })

  it('reserve: percent or days with a speed', () => {
    expect(fuelReserveSchema.parse({ kind: 'percent', value: 10 })).toEqual({ kind: 'percent', value: 10 })
    expect(fuelReserveSchema.safeParse({ kind: 'days', value: 3 }).success).toBe(false)
    expect(fuelReserveSchema.safeParse({ kind: 'percent', value: 150 }).error!.issues[0]!.message).toBe('value (percent) is at most 100')
    expect(fuelReserveSchema.safeParse({ kind: 'litres', value: 1 }).error!.issues[0]!.message).toBe('kind must be "percent" or "days"')
  })
})
