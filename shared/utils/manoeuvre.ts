// Manoeuvres and time (common practice): wheel-over, rate of turn, course change, zone time.
import { normaliseLongitude } from './position'

/** Course change from one course to the next, −180 < Δ ≤ 180, positive to starboard. */
export function courseChangeDeg(fromCourse: number, toCourse: number): number {
  const d = (((toCourse - fromCourse) % 360) + 360) % 360
  return d > 180 ? d - 360 : d
}

/** Wheel-over distance before the waypoint: R·tan(|Δ|/2) plus speed × helm delay (common practice). */
export function wheelOverNm(turnRadiusNm: number, courseChange: number, speedKn = 0, helmDelayS = 0): number {
  const half = Math.min(Math.abs(courseChange), 179.9) / 2 * Math.PI / 180
  return turnRadiusNm * Math.tan(half) + speedKn * helmDelayS / 3600
}

/** Rate of turn, °/min, for speed V kn on radius R nm: V/R rad/h = (180/π)/60 · V/R ≈ 0.96·V/R (common practice). */
export function rateOfTurnDegPerMin(speedKn: number, turnRadiusNm: number): number {
  return (180 / Math.PI) / 60 * speedKn / turnRadiusNm
}

/** Nautical zone description ZD = −round(λ/15), west positive, zone 12 split at 180° (US Navy navigation manual). */
export function zoneDescription(lon: number): number {
  const l = normaliseLongitude(lon)
  const zd = -Math.sign(l) * Math.round(Math.abs(l) / 15)
  return zd === 0 ? 0 : zd
}

/** Zone description as written: +9, −10, 0. */
export function formatZoneDescription(zd: number): string {
  return zd > 0 ? `+${zd}` : zd < 0 ? `−${-zd}` : '0'
}

/** Zone time for a UTC instant: zone time = UTC − ZD, as YYYY-MM-DD HH:mm (common practice). */
export function zoneTime(utc: Date | string, zd: number): string {
  const ms = new Date(utc).getTime() - zd * 3_600_000
  return new Date(ms).toISOString().slice(0, 16).replace('T', ' ')
}
