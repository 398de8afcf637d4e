// Gauss–Legendre quadrature (Abramowitz & Stegun 25.4.29); nodes by Newton's method on P_n
// with the three-term recurrence (Golub & Welsch 1969 give the same nodes).
const ORDER = 12

function legendreNodes(n: number): { x: number[], w: number[] } {
  const x: number[] = []
  const w: number[] = []
  for (let i = 1; i <= n; i++) {
    let z = Math.cos(Math.PI * (i - 0.25) / (n + 0.5))
    let dp = 1
    for (let it = 0; it < 100; it++) {
      let p0 = 1
      let p1 = z
      for (let k = 2; k <= n; k++) [p0, p1] = [p1, ((2 * k - 1) * z * p1 - (k - 1) * p0) / k]
      dp = n * (z * p1 - p0) / (z * z - 1)
      const dz = p1 / dp
      z -= dz
      if (Math.abs(dz) < 1e-17) break
    }
    x.push(z)
    w.push(2 / ((1 - z * z) * dp * dp))
  }
  return { x, w }
}

const NODES = legendreNodes(ORDER)

/** ∫_a^b f by 12-point Gauss–Legendre on equal panels no wider than maxPanel. */
export function gaussLegendre(f: (x: number) => number, a: number, b: number, maxPanel: number): number {
  const panels = Math.max(1, Math.ceil(Math.abs(b - a) / maxPanel))
  const h = (b - a) / panels
  let sum = 0
  for (let p = 0; p < panels; p++) {
    const mid = a + (p + 0.5) * h
    for (let i = 0; i < ORDER; i++) sum += NODES.w[i]! * f(mid + NODES.x[i]! * h / 2)
  }
  return sum * h / 2
}
