// Axis ticks at 1, 2 or 5 × 10ⁿ steps (common practice for chart axes).

/** Rounded axis bounds and evenly spaced tick values covering [min, max] with about `count` intervals. */
export function niceTicks(min: number, max: number, count = 5): { lo: number, hi: number, step: number, ticks: number[] } {
  if (!(max > min)) { max = min + 1 }
  const raw = (max - min) / count
  const mag = 10 ** Math.floor(Math.log10(raw))
  const step = ([1, 2, 5, 10].find(m => m * mag >= raw) ?? 10) * mag
  const lo = Math.floor(min / step) * step
  const hi = Math.ceil(max / step) * step
  const ticks: number[] = []
  for (let v = lo; v <= hi + step / 2; v += step) ticks.push(Number(v.toFixed(10)))
  return { lo, hi, step, ticks }
}
