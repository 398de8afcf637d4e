// Warnings when a plan asks more of its vessel than it can give, or than its fuel data covers:
// beyond the measured speeds the fitted curve is extrapolated and its fuel figures are guesses.
import { formatNumber } from './format'

export interface SpeedLimits {
  /** The vessel's service speed, kn. */
  serviceSpeedKn?: number | null
  /** The slowest and fastest speeds of its fuel data, kn. */
  dataSpeedKn?: { min: number, max: number } | null
}

/** Half the last digit a speed is stored to (numeric(5,2)): closer than this is the same speed. */
const SAME_KN = 0.005

/** Leg numbers (1-based) as 3, 5–9, 12. */
export function legNumbersText(legs: readonly number[]): string {
  const parts: string[] = []
  for (let i = 0; i < legs.length;) {
    let j = i
    while (j + 1 < legs.length && legs[j + 1] === legs[j]! + 1) j++
    parts.push(j > i ? `${legs[i]}–${legs[j]}` : String(legs[i]))
    i = j + 1
  }
  return parts.join(', ')
}

const speed = (v: number) => formatNumber(v, Number.isInteger(v) ? 0 : 1)
const kn = (v: number) => `${speed(v)} kn`
const speedsText = (speeds: number[]) => [...new Set(speeds)].sort((a, b) => a - b).map(kn).join(', ')

function legsText(picked: { index: number }[], all: number): string {
  return picked.length === all ? (all === 1 ? 'the leg' : 'every leg') : `leg${picked.length === 1 ? '' : 's'} ${legNumbersText(picked.map(l => l.index + 1))}`
}

/** What to warn about for these legs (leg speeds in knots), in words; empty when nothing is wrong. */
export function speedWarnings(legs: readonly { index: number, speedKn: number }[], limits: SpeedLimits): string[] {
  const out: string[] = []
  const service = limits.serviceSpeedKn
  if (service != null && service > 0) {
    const fast = legs.filter(l => l.speedKn > service + SAME_KN)
    if (fast.length)
      out.push(`${legsText(fast, legs.length).replace(/^./, c => c.toUpperCase())} at ${speedsText(fast.map(l => l.speedKn))}: faster than the vessel's service speed of ${kn(service)}.`)
  }
  const data = limits.dataSpeedKn
  if (data) {
    const outside = legs.filter(l => l.speedKn > data.max + SAME_KN || l.speedKn < data.min - SAME_KN)
    if (outside.length)
      out.push(`Fuel for ${legsText(outside, legs.length)} is extrapolated: ${speedsText(outside.map(l => l.speedKn))} lies outside the vessel's fuel data (${speed(data.min)}–${kn(data.max)}), so its fuel figures are an estimate beyond what was measured.`)
  }
  return out
}
