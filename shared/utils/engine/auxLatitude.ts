// Auxiliary latitudes on WGS84: conformal χ, isometric ψ, rectifying μ (Karney 2011, "Transverse
// Mercator with an accuracy of a few nanometers", J. Geodesy 85, eqs. 7–9, 14, 19–21, 35–36).
import { WGS84_A, WGS84_E, WGS84_E2, WGS84_N } from '../navConstants'
import { sinSeries } from './divided'

const n = WGS84_N
const n2 = n * n, n3 = n2 * n, n4 = n3 * n, n5 = n4 * n, n6 = n5 * n

/** Rectifying radius A = a/(1+n)·(1 + n²/4 + n⁴/64 + n⁶/256) (Karney 2011, eq. 14). */
export const RECTIFYING_RADIUS_M = WGS84_A / (1 + n) * (1 + n2 / 4 + n4 / 64 + n6 / 256)

/** μ = χ + Σ α_j sin 2jχ: conformal → rectifying (Krüger's α, Karney 2011, eq. 35). */
export const CHI_TO_MU: readonly number[] = [0,
  n / 2 - 2 * n2 / 3 + 5 * n3 / 16 + 41 * n4 / 180 - 127 * n5 / 288 + 7891 * n6 / 37800,
  13 * n2 / 48 - 3 * n3 / 5 + 557 * n4 / 1440 + 281 * n5 / 630 - 1983433 * n6 / 1935360,
  61 * n3 / 240 - 103 * n4 / 140 + 15061 * n5 / 26880 + 167603 * n6 / 181440,
  49561 * n4 / 161280 - 179 * n5 / 168 + 6601661 * n6 / 7257600,
  34729 * n5 / 80640 - 3418889 * n6 / 1995840,
  212378941 * n6 / 319334400]

/** χ = μ − Σ β_j sin 2jμ: rectifying → conformal (Krüger's β with the sign folded in, Karney 2011, eq. 36). */
export const MU_TO_CHI: readonly number[] = [0,
  -(n / 2 - 2 * n2 / 3 + 37 * n3 / 96 - n4 / 360 - 81 * n5 / 512 + 96199 * n6 / 604800),
  -(n2 / 48 + n3 / 15 - 437 * n4 / 1440 + 46 * n5 / 105 - 1118711 * n6 / 3870720),
  -(17 * n3 / 480 - 37 * n4 / 840 - 209 * n5 / 4480 + 5569 * n6 / 90720),
  -(4397 * n4 / 161280 - 11 * n5 / 504 - 830251 * n6 / 7257600),
  -(4583 * n5 / 161280 - 108847 * n6 / 3991680),
  -(20648693 * n6 / 638668800)]

const E2M = 1 - WGS84_E2
const TOL = Math.sqrt(Number.EPSILON) / 10
const TAUMAX = 2 / Math.sqrt(Number.EPSILON)

/** tan χ from tan φ: τ′ = τ√(1+σ²) − σ√(1+τ²), σ = sinh(e·atanh(eτ/√(1+τ²))) (Karney 2011, eqs. 7–9). */
export function conformalTan(tau: number): number {
  if (!Number.isFinite(tau)) return tau
  const tau1 = Math.hypot(1, tau)
  const sig = Math.sinh(WGS84_E * Math.atanh(WGS84_E * tau / tau1))
  return Math.hypot(1, sig) * tau - sig * tau1
}

/** tan φ from tan χ by Newton's method (Karney 2011, eqs. 19–21). */
export function geodeticTan(taup: number): number {
  if (!Number.isFinite(taup)) return taup
  let tau = Math.abs(taup) > 70 ? taup * Math.exp(WGS84_E * Math.atanh(WGS84_E)) : taup / E2M
  if (!(Math.abs(tau) < TAUMAX)) return tau
  const stol = TOL * Math.max(1, Math.abs(taup))
  for (let i = 0; i < 5; i++) {
    const taupa = conformalTan(tau)
    const dtau = (taup - taupa) * (1 + E2M * tau * tau) / (E2M * Math.hypot(1, tau) * Math.hypot(1, taupa))
    tau += dtau
    if (!(Math.abs(dtau) >= stol)) break
  }
  return tau
}

/** tan φ for φ in degrees with exact values at multiples of 45° and ±∞ at the poles. */
export function tanDeg(lat: number): number {
  if (lat === 90) return Infinity
  if (lat === -90) return -Infinity
  if (Math.abs(lat) === 45) return Math.sign(lat)
  return Math.tan(lat * Math.PI / 180)
}

/** Rectifying latitude μ (radians) from tan χ (Karney 2011, eq. 35). */
export function rectifyingFromConformalTan(taup: number): number {
  const chi = Math.atan(taup)
  return chi + sinSeries(chi, CHI_TO_MU)
}

/** tan χ from the rectifying latitude μ in radians (Karney 2011, eq. 36). */
export function conformalTanFromRectifying(mu: number): number {
  return Math.tan(mu + sinSeries(mu, MU_TO_CHI))
}
