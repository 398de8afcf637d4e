// Positions as navigators write and read them: parsing, formatting, longitude normalisation.
import dms from 'geographiclib-dms'
import type { LatLon } from '../types/geo'

/** A typed position that cannot be read; the message names the problem. */
export class PositionError extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'PositionError'
  }
}

type AngleKind = 'latitude' | 'longitude'
interface AnglePart { text: string, mark: 'deg' | 'min' | 'sec' | 'sep' | 'none' }

const MARK_CLASS: Record<string, AnglePart['mark']> = {
  '°': 'deg', 'º': 'deg', '˚': 'deg', 'D': 'deg',
  '\'': 'min', '′': 'min', '’': 'min',
  '"': 'sec', '″': 'sec', '”': 'sec', '\'\'': 'sec',
  ':': 'sep', '-': 'sep',
}
const PART_RE = /\s*(\d+(?:\.\d*)?|\.\d+)\s*(''|[°º˚D'′’"″”:-])?/y
const PART_NAMES = ['degrees', 'minutes', 'seconds'] as const

function normaliseText(text: string): string {
  return String(text).trim().toUpperCase().replace(/[\u2212\u2013\u2014]/g, '-').replace(/\s+/g, ' ')
}

/** Split off a leading or trailing hemisphere letter (N, S, E, W). */
function takeHemisphere(s: string): { body: string, hemi: string | null } {
  const lead = /^([NSEW])\s*(.*)$/.exec(s)
  const body = lead ? lead[2]! : s
  const trail = /^(.*?)\s*([NSEW])$/.exec(body)
  if (lead && trail) throw new PositionError('two hemisphere letters')
  if (trail) return { body: trail[1]!, hemi: trail[2]! }
  return { body, hemi: lead ? lead[1]! : null }
}

/** Read 1–3 numbers (degrees, minutes, seconds) and the marks after them. */
function readParts(body: string): AnglePart[] {
  const parts: AnglePart[] = []
  PART_RE.lastIndex = 0
  let m: RegExpExecArray | null
  let end = 0
  while ((m = PART_RE.exec(body))) {
    parts.push({ text: m[1]!, mark: m[2] ? MARK_CLASS[m[2]]! : 'none' })
    end = PART_RE.lastIndex
  }
  const rest = body.slice(end).trim()
  if (rest) throw new PositionError(rest[0] === ',' ? 'use a point, not a comma, for decimals' : `unexpected "${rest[0]}"`)
  if (!parts.length) throw new PositionError('no number found')
  if (parts.length > 3) throw new PositionError('too many numbers (at most degrees, minutes and seconds)')
  return parts
}

function checkParts(parts: AnglePart[]): void {
  parts.forEach((p, i) => {
    const expected = (['deg', 'min', 'sec'] as const)[i]
    if ((p.mark === 'deg' || p.mark === 'min' || p.mark === 'sec') && p.mark !== expected)
      throw new PositionError(`the mark after ${p.text} does not fit ${PART_NAMES[i]}`)
    if (i < parts.length - 1 && p.text.includes('.'))
      throw new PositionError(`only the last number may have decimals (${PART_NAMES[i]} ${p.text})`)
    if (i === parts.length - 1 && p.mark === 'sep') throw new PositionError('ends with a separator')
    if (i > 0 && Number(p.text) >= 60) throw new PositionError(`${PART_NAMES[i]} must be less than 60 (got ${p.text})`)
  })
}

function hemisphereFits(kind: AngleKind, hemi: string): boolean {
  return kind === 'latitude' ? hemi === 'N' || hemi === 'S' : hemi === 'E' || hemi === 'W'
}

/** Parse one angle: d, d m, d m s with °/′/″, spaces, hyphens or colons; sign or hemisphere (common practice). */
function parseAngle(text: string, kind: AngleKind): number {
  const s = normaliseText(text)
  if (!s) throw new PositionError(`${kind} is empty`)
  try {
    const { body, hemi } = takeHemisphere(s)
    if (hemi && !hemisphereFits(kind, hemi))
      throw new PositionError(`${hemi} is not a ${kind} hemisphere (use ${kind === 'latitude' ? 'N or S' : 'E or W'})`)
    const signMatch = /^([+-])\s*/.exec(body)
    if (signMatch && hemi) throw new PositionError('give a sign or a hemisphere letter, not both')
    const parts = readParts(signMatch ? body.slice(signMatch[0].length) : body)
    checkParts(parts)
    if (parts.length > 1 && !hemi && !signMatch)
      throw new PositionError(`missing hemisphere (${kind === 'latitude' ? 'N or S' : 'E or W'})`)
    // geographiclib-dms decodes the canonical d°m′s″ form with its careful summation
    const canonical = parts.map((p, i) => p.text + ['d', '\'', '"'][i]).join('')
    const magnitude = dms.Decode(canonical).val
    const value = (signMatch?.[1] === '-' || hemi === 'S' || hemi === 'W') ? -magnitude : magnitude
    const limit = kind === 'latitude' ? 90 : 180
    if (Math.abs(value) > limit) throw new PositionError(`${Math.abs(value)}° is beyond ${limit}°`)
    return value
  }
  catch (e) {
    if (e instanceof PositionError) throw new PositionError(`${kind === 'latitude' ? 'Latitude' : 'Longitude'}: ${e.message}`)
    throw new PositionError(`${kind === 'latitude' ? 'Latitude' : 'Longitude'}: ${(e as Error).message}`)
  }
}

/** Parse a latitude as navigators type it (37°47.5'N, 37 47.5N, 33-51.7S, N37°47'30", -33.86). */
export function parseLatitude(text: string): number {
  return parseAngle(text, 'latitude')
}

/** Parse a longitude as navigators type it (122°28.0'W, 122-28.0W, E151 12.5, 151.21). */
export function parseLongitude(text: string): number {
  return parseAngle(text, 'longitude')
}

/**
 * A limiting latitude as navigators write it (50, 50N, 50°N, 48°45′N, 48 45, 40S): the magnitude,
 * since the limit applies on whichever side of the equator the track's vertex lies (common practice).
 */
export function parseLimitLatitude(text: string): number {
  const s = normaliseText(text)
  if (!s) throw new PositionError('Limiting latitude is empty')
  let value: number
  try { value = parseLatitude(s) }
  catch (e) {
    // "48 45" needs no hemisphere here: the limit is a magnitude.
    if (!/missing hemisphere/.test((e as Error).message)) throw new PositionError(`Limiting ${(e as Error).message.replace(/^Latitude/, 'latitude')}`)
    value = parseLatitude(`${s}N`)
  }
  const magnitude = Math.abs(value)
  if (!(magnitude > 0 && magnitude < 90)) throw new PositionError('Limiting latitude must be between 0° and 90° (it applies north and south)')
  return magnitude
}

/** A limiting latitude shown as it is written on the chart: 48°45.0′ (no hemisphere: it applies both sides). */
export function formatLimitLatitude(limit: number): string {
  return formatLatitude(Math.abs(limit), 1).slice(0, -1)
}

/** Split a position into its two angles: at a comma/semicolon, at hemisphere letters, or by counting numbers. */
function splitPosition(s: string): [string, string] {
  const sep = s.split(/[,;]/)
  if (sep.length === 2) return [sep[0]!, sep[1]!]
  if (sep.length > 2) throw new PositionError('too many commas')
  const letters = [...s.matchAll(/[NSEW]/g)]
  if (letters.length >= 2 || (letters.length === 1 && letters[0]!.index! > 0)) {
    const cut = /^[NSEW]/.test(s) ? letters[1]?.index : letters[0]!.index! + 1
    if (cut !== undefined && cut < s.length) return [s.slice(0, cut), s.slice(cut)]
    if (letters.length === 1) throw new PositionError('longitude is missing')
  }
  const words = s.split(' ')
  if (words.length % 2 === 0 && words.length <= 6) {
    const half = words.length / 2
    return [words.slice(0, half).join(' '), words.slice(half).join(' ')]
  }
  throw new PositionError('cannot tell where the latitude ends: separate latitude and longitude with a comma')
}

/** Parse a full position; a longitude written first is accepted when its E/W letter says so. */
export function parsePosition(text: string): LatLon {
  const s = normaliseText(text)
  if (!s) throw new PositionError('Position is empty')
  if (!/\d/.test(s)) throw new PositionError('Position has no numbers')
  let [first, second] = splitPosition(s).map(p => p.trim()) as [string, string]
  if (/[EW]/.test(first.replace(/D/g, '')) && /[NS]/.test(second)) [first, second] = [second, first]
  return { lat: parseLatitude(first), lon: parseLongitude(second) }
}

/** Format degrees and decimal minutes with a hemisphere letter, rounding with carry (37°47.50′N). */
function formatAngle(value: number, pos: string, neg: string, degDigits: number, decimals: number): string {
  const scale = 10 ** decimals
  const units = Math.round(Math.abs(value) * 60 * scale)
  const d = Math.floor(units / (60 * scale))
  const m = (units - d * 60 * scale) / scale
  const hemi = value < 0 && units > 0 ? neg : pos
  return `${String(d).padStart(degDigits, '0')}°${m.toFixed(decimals).padStart(decimals + 3, '0')}′${hemi}`
}

/** Latitude as 37°47.50′N. */
export function formatLatitude(lat: number, decimals = 2): string {
  return formatAngle(lat, 'N', 'S', 2, decimals)
}

/** Longitude as 122°28.00′W (normalised to −180..180 first). */
export function formatLongitude(lon: number, decimals = 2): string {
  return formatAngle(normaliseLongitude(lon), 'E', 'W', 3, decimals)
}

/** Position as 37°47.50′N 122°28.00′W. */
export function formatPosition(p: LatLon, decimals = 2): string {
  return `${formatLatitude(p.lat, decimals)} ${formatLongitude(p.lon, decimals)}`
}

/** Longitude reduced to −180..180 (exact remainder, as GeographicLib's AngNormalize); also the signed difference of two longitudes. */
export function normaliseLongitude(lon: number): number {
  const y = lon % 360
  return y > 180 ? y - 360 : y < -180 ? y + 360 : y
}

/** Longitude reduced to −180 ≤ λ < 180: half-open, so edges and cells never count the 180° meridian twice. */
export function wrapLongitude(lon: number): number {
  const y = normaliseLongitude(lon)
  return y === 180 ? -180 : y
}

/** Course in 0 ≤ c < 360. */
export function normaliseCourse(deg: number): number {
  if (deg > 0 && deg < 360) return deg
  let c = deg % 360
  if (c < 0) c += 360
  return c >= 360 || c === 0 ? 0 : c
}
