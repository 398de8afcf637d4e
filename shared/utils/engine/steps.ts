import { NM_M } from '../navConstants'

/** Number of equal steps no longer than stepNm (at least 1; guarded against runaway sizes). */
export function stepCount(distanceM: number, stepNm: number): number {
  if (!(stepNm > 0)) throw new RangeError('step must be greater than 0 nm')
  const steps = Math.max(1, Math.ceil(distanceM / (stepNm * NM_M) - 1e-9))
  if (steps > 1_000_000) throw new RangeError('step too small for this distance')
  return steps
}
