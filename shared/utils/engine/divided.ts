// Divided differences (f(x) − f(y)) / (x − y) that keep full precision when x ≈ y.
// Forms as in GeographicLib's Rhumb class (Karney, "The area of rhumb polygons", 2024, appendix).

/** (atan x − atan y)/(x − y) via atan((x − y)/(1 + xy)) (Karney 2024). */
export function dAtan(x: number, y: number): number {
  const d = x - y
  const xy = x * y
  if (d === 0) return 1 / (1 + xy)
  return (2 * xy > -1 ? Math.atan(d / (1 + xy)) : Math.atan(x) - Math.atan(y)) / d
}

/** (asinh x − asinh y)/(x − y) via asinh(x√(1+y²) − y√(1+x²)) (Karney 2024). */
export function dAsinh(x: number, y: number): number {
  const d = x - y
  const hx = Math.hypot(1, x)
  const hy = Math.hypot(1, y)
  if (d === 0) return 1 / hx
  return Math.asinh(x * y > 0 ? d * (x + y) / (x * hy + y * hx) : x * hy - y * hx) / d
}

/** (sinh x − sinh y)/(x − y) = cosh((x + y)/2) · sinh(d)/d, d = (x − y)/2. */
export function dSinh(x: number, y: number): number {
  const d = (x - y) / 2
  return Math.cosh((x + y) / 2) * (d !== 0 ? Math.sinh(d) / d : 1)
}

/**
 * Divided difference of g(x) = Σ c[j] sin(2jx), j = 1..N, by matrix Clenshaw summation
 * (GeographicLib Rhumb::SinCosSeries; Karney 2024, eq. for "divided differences of Fourier series").
 * c[0] is ignored.
 */
export function dSinSeries(x: number, y: number, c: readonly number[]): number {
  const p = x + y
  const d = x - y
  const cp = Math.cos(p)
  const cd = Math.cos(d)
  const sp = Math.sin(p)
  const sd = d !== 0 ? Math.sin(d) / d : 1
  const m = 2 * cp * cd
  const s = sp * sd
  const a1 = -s * d * d
  const a2 = -4 * s
  const n = c.length - 1
  // b1 = b_j, b2 = b_{j+1}; 2×2 matrices in row-major order
  let b10 = c[n]!, b11 = 0, b12 = 0, b13 = c[n]!
  let b20 = 0, b21 = 0, b22 = 0, b23 = 0
  for (let j = n - 1; j > 0; j--) {
    const t0 = m * b10 + a1 * b12 - b20 + c[j]!
    const t1 = m * b11 + a1 * b13 - b21
    const t2 = a2 * b10 + m * b12 - b22
    const t3 = a2 * b11 + m * b13 - b23 + c[j]!
    b20 = b10; b21 = b11; b22 = b12; b23 = b13
    b10 = t0; b11 = t1; b12 = t2; b13 = t3
  }
  return b12 * (cd * sp) + b13 * (2 * sd * cp)
}

/** Σ c[j] sin(2jx), j = 1..N, by Clenshaw summation (Clenshaw 1955). */
export function sinSeries(x: number, c: readonly number[]): number {
  const ar = 2 * Math.cos(2 * x)
  let k0 = 0
  let k1 = 0
  for (let j = c.length - 1; j > 0; j--) {
    const k2 = k1
    k1 = k0
    k0 = ar * k1 - k2 + c[j]!
  }
  return Math.sin(2 * x) * k0
}
