// Fuel against speed (common practice: daily consumption rises roughly with the cube of speed,
// the admiralty-coefficient rule). Pure functions; no I/O.
import type { FuelPoint, FuelReserve } from '../types/fuel'

/** t/day = c · V^k (V in knots), with the quality of the fit in log–log space. */
export interface FuelCurve {
  c: number
  k: number
  /** Coefficient of determination of ln(t/day) on ln V (1 = perfect). */
  r2: number
  /** Root-mean-square residual of ln(t/day): 0.05 ≈ points within about 5 % of the curve. */
  rmsLog: number
}

/**
 * Bad fuel data. The fit throws this rather than returning a result type: routes validate with
 * `fuelPointsSchema` first (400 with field names), so reaching it here is a programming error.
 */
export class FuelDataError extends Error {
  constructor(message: string, readonly field?: string) {
    super(message)
    this.name = 'FuelDataError'
  }
}

function checkFuelPoints(points: readonly FuelPoint[]) {
  if (points.length < 2) throw new FuelDataError(`fuel data needs at least 2 points to fit a curve (got ${points.length})`)
  const speeds = new Set<number>()
  points.forEach((p, i) => {
    if (!Number.isFinite(p.speedKn) || p.speedKn <= 0) throw new FuelDataError(`point ${i + 1}: speedKn must be greater than 0 (got ${p.speedKn})`, 'speedKn')
    if (!Number.isFinite(p.tonnesPerDay) || p.tonnesPerDay <= 0) throw new FuelDataError(`point ${i + 1}: tonnesPerDay must be greater than 0 (got ${p.tonnesPerDay})`, 'tonnesPerDay')
    if (speeds.has(p.speedKn)) throw new FuelDataError(`point ${i + 1}: speedKn ${p.speedKn} is given twice`, 'speedKn')
    speeds.add(p.speedKn)
  })
}

/** Fits t/day = c·V^k by ordinary least squares of ln(t/day) on ln V (domain.md, "Manoeuvres, time and fuel"). Throws FuelDataError. */
export function fitFuelCurve(points: readonly FuelPoint[]): FuelCurve {
  checkFuelPoints(points)
  const n = points.length
  const xs = points.map(p => Math.log(p.speedKn))
  const ys = points.map(p => Math.log(p.tonnesPerDay))
  const xMean = xs.reduce((a, b) => a + b, 0) / n
  const yMean = ys.reduce((a, b) => a + b, 0) / n
  let sxx = 0
  let sxy = 0
  let syy = 0
  for (let i = 0; i < n; i++) {
    const dx = xs[i]! - xMean
    const dy = ys[i]! - yMean
    sxx += dx * dx
    sxy += dx * dy
    syy += dy * dy
  }
  const k = sxy / sxx
  const lnC = yMean - k * xMean
  let ssRes = 0
  for (let i = 0; i < n; i++) ssRes += (ys[i]! - (lnC + k * xs[i]!)) ** 2
  // Equal consumption at every speed: the flat line fits exactly.
  const r2 = syy > 0 ? Math.max(0, 1 - ssRes / syy) : 1
  return { c: Math.exp(lnC), k, r2, rmsLog: Math.sqrt(ssRes / n) }
}

/** Consumption in tonnes per day at a speed: c · V^k. */
export function fuelRate(curve: Pick<FuelCurve, 'c' | 'k'>, speedKn: number): number {
  if (!(speedKn >= 0)) throw new FuelDataError(`speedKn must not be negative (got ${speedKn})`, 'speedKn')
  return speedKn === 0 ? 0 : curve.c * speedKn ** curve.k
}

/** Fuel for a leg sailed at a speed for some hours: rate(V) · hours / 24. */
export function legFuelTonnes(curve: Pick<FuelCurve, 'c' | 'k'>, speedKn: number, hours: number): number {
  if (!(hours >= 0)) throw new FuelDataError(`hours must not be negative (got ${hours})`, 'hours')
  return fuelRate(curve, speedKn) * hours / 24
}

/** Reserve margin: a percentage of the passage fuel, or days of steaming at a speed (which needs the curve). */
export function reserveTonnes(totalTonnes: number, reserve: FuelReserve, curve?: Pick<FuelCurve, 'c' | 'k'>): number {
  if (reserve.kind === 'percent') return totalTonnes * reserve.value / 100
  if (!curve) throw new FuelDataError('a reserve in days needs the vessel\'s fuel curve')
  return fuelRate(curve, reserve.speedKn) * reserve.value
}

/** Speed that covers a distance in the hours available: D / t. */
export function speedForArrival(distanceNm: number, hoursAvailable: number): number {
  if (!(distanceNm >= 0)) throw new FuelDataError(`distanceNm must not be negative (got ${distanceNm})`, 'distanceNm')
  if (!(hoursAvailable > 0)) throw new FuelDataError(`hoursAvailable must be greater than 0 (got ${hoursAvailable})`, 'hoursAvailable')
  return distanceNm / hoursAvailable
}

/** The arrival speed and the fuel it burns over the whole distance: rate(D/t) · t / 24. */
export function fuelForArrival(curve: Pick<FuelCurve, 'c' | 'k'>, distanceNm: number, hoursAvailable: number) {
  const speedKn = speedForArrival(distanceNm, hoursAvailable)
  return { speedKn, hours: hoursAvailable, tonnes: legFuelTonnes(curve, speedKn, hoursAvailable) }
}

/** Fuel per leg, total, reserve and total with reserve for a plan's legs (each with its speed and hours). */
export function planFuel(curve: Pick<FuelCurve, 'c' | 'k'>, legs: readonly { speedKn: number, hours: number }[], reserve: FuelReserve) {
  const legTonnes = legs.map(l => legFuelTonnes(curve, l.speedKn, l.hours))
  const totalTonnes = legTonnes.reduce((a, b) => a + b, 0)
  const marginTonnes = reserveTonnes(totalTonnes, reserve, curve)
  return { legTonnes, totalTonnes, reserveTonnes: marginTonnes, withReserveTonnes: totalTonnes + marginTonnes }
}
