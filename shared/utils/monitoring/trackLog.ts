// Track logs: NMEA 0183 (RMC, with GGA where present; IEC 61162-1) read with the registry parser
// nmea-simple, or CSV with time, latitude and longitude. Every line that cannot be used is reported
// with its number; the fixes come out in time order, one per timestamp, and are sampled into one
// position report per chosen interval of the clock (common practice: hourly or at noon).
import Papa from 'papaparse'
import { parseNmeaSentence, type GGAPacket, type RMCPacket } from 'nmea-simple'
import { parseLatitude, parseLongitude, normaliseLongitude } from '../position'

export const MAX_TRACK_LINES = 50_000
/** Reported problems kept in an answer; the count says how many there were in all. */
export const MAX_LISTED_PROBLEMS = 200

export interface TrackFix { line: number, timeUtc: string, t: number, lat: number, lon: number, speedKn: number | null }
export interface TrackLog { format: 'nmea' | 'csv', lineCount: number, fixes: TrackFix[], problems: string[], problemCount: number, ignoredSentences: number }

export class TrackLogError extends Error {}

const DAY_MS = 86_400_000

/** NMEA 0183 checksum (IEC 61162-1): the XOR of every character between `$`/`!` and `*` equals the two hex digits after `*`. */
export function validChecksum(sentence: string): boolean {
  const star = sentence.lastIndexOf('*')
  const given = sentence.slice(star + 1, star + 3)
  if (star < 1 || !/^[0-9A-Fa-f]{2}$/.test(given)) return false
  let x = 0
  for (let i = 1; i < star; i++) x ^= sentence.charCodeAt(i)
  return x === Number.parseInt(given, 16)
}

/** The lines of the text, without a byte-order mark; throws past MAX_TRACK_LINES non-blank lines. */
function splitLines(text: string): string[] {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/)
  while (lines.length && !lines.at(-1)!.trim()) lines.pop()
  let count = 0
  for (const l of lines) if (l.trim() && ++count > MAX_TRACK_LINES) throw new TrackLogError(`a track log holds at most ${MAX_TRACK_LINES.toLocaleString('en-GB')} lines; split this one`)
  return lines
}

class Problems {
  list: string[] = []
  count = 0
  add(line: number, message: string) {
    if (++this.count <= MAX_LISTED_PROBLEMS) this.list.push(`line ${line}: ${message}`)
  }
}

/** Reads a track log; the format is NMEA when the first non-blank line starts with `$` or `!`. */
export function readTrackLog(text: string): TrackLog {
  const lines = splitLines(text)
  const first = lines.find(l => l.trim())
  if (!first) throw new TrackLogError('the file is empty')
  const nmea = /^\s*[$!]/.test(first)
  const problems = new Problems()
  const { fixes, ignored } = nmea ? readNmea(lines, problems) : { fixes: readCsv(lines, problems), ignored: 0 }
  return { format: nmea ? 'nmea' : 'csv', lineCount: lines.filter(l => l.trim()).length, fixes: inTimeOrder(fixes, problems), problems: problems.list, problemCount: problems.count, ignoredSentences: ignored }
}

/** Later fixes only: a fix at or before the one kept before it is reported (the same second from RMC and GGA is one fix). */
function inTimeOrder(fixes: TrackFix[], problems: Problems): TrackFix[] {
  const kept: TrackFix[] = []
  for (const fix of fixes) {
    const prev = kept.at(-1)
    if (prev && fix.t === prev.t) continue
    if (prev && fix.t < prev.t) { problems.add(fix.line, `time ${fix.timeUtc} is before line ${prev.line} (${prev.timeUtc}); the log must run forward in time`); continue }
    kept.push(fix)
  }
  return kept
}

function fixOf(line: number, t: number, lat: number, lon: number, speedKn: number | null): TrackFix {
  return { line, t, timeUtc: new Date(t).toISOString(), lat, lon: normaliseLongitude(lon), speedKn }
}

/** RMC carries date and time; GGA only the time of day, dated by the RMC before it (the next day past midnight). */
function readNmea(lines: string[], problems: Problems) {
  const fixes: TrackFix[] = []
  let ignored = 0
  let lastDate: number | null = null // UTC midnight of the last RMC, ms
  let lastT: number | null = null
  lines.forEach((raw, i) => {
    const line = i + 1
    const s = raw.trim()
    if (!s) return
    if (!/^[$!]/.test(s)) return problems.add(line, 'not an NMEA sentence (expected $…*hh)')
    const id = s.slice(3, 6)
    if (id !== 'RMC' && id !== 'GGA') { ignored++; return }
    if (!s.includes('*')) return problems.add(line, `${id} has no checksum`)
    if (!validChecksum(s)) return problems.add(line, `${id} checksum does not match the sentence`)
    let packet: RMCPacket | GGAPacket
    try { packet = parseNmeaSentence(s) as RMCPacket | GGAPacket }
    catch (e) { return problems.add(line, `${id} cannot be read (${(e as Error).message.slice(0, 80)})`) }
    if (packet.sentenceId === 'RMC') {
      if (packet.status !== 'valid') return problems.add(line, 'RMC marks its fix as not valid (status V); left out')
      const t = packet.datetime.getTime()
      if (!Number.isFinite(t) || !Number.isFinite(packet.latitude) || !Number.isFinite(packet.longitude)) return problems.add(line, 'RMC has no time or position')
      lastDate = Math.floor(t / DAY_MS) * DAY_MS
      lastT = t
      fixes.push(fixOf(line, t, packet.latitude, packet.longitude, Number.isFinite(packet.speedKnots) ? packet.speedKnots : null))
      return
    }
    if (packet.fixType === 'none') return problems.add(line, 'GGA has no fix (quality 0); left out')
    if (lastDate === null) { ignored++; return } // no date yet: an undated GGA is left for the RMC that follows
    const timeOfDay = packet.time.getTime() % DAY_MS
    let t = lastDate + timeOfDay
    if (lastT !== null && t < lastT - DAY_MS / 2) t += DAY_MS // past midnight since the last RMC
    if (!Number.isFinite(t) || !Number.isFinite(packet.latitude) || !Number.isFinite(packet.longitude)) return problems.add(line, 'GGA has no time or position')
    fixes.push(fixOf(line, t, packet.latitude, packet.longitude, null))
  })
  return { fixes, ignored }
}

const CSV_HEADERS: Record<string, 'time' | 'lat' | 'lon'> = {
  time: 'time', timeutc: 'time', utc: 'time', datetime: 'time', date: 'time', timestamp: 'time',
  lat: 'lat', latitude: 'lat', lon: 'lon', long: 'lon', lng: 'lon', longitude: 'lon',
}

/** An ISO 8601 time; without an offset it is read as UTC. A space may stand for the T. */
export function parseLogTime(text: string): number {
  let s = text.trim().replace(' ', 'T')
  if (!/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:?\d{2})?$/i.test(s)) return Number.NaN
  if (!/(Z|[+-]\d{2}:?\d{2})$/i.test(s)) s += 'Z'
  return Date.parse(s)
}

function readCsv(lines: string[], problems: Problems): TrackFix[] {
  const parsed = Papa.parse<string[]>(lines.join('\n'), { skipEmptyLines: false })
  const rows = parsed.data
  let columns = { time: 0, lat: 1, lon: 2 }
  let start = 0
  const head = rows[0] ?? []
  if (!Number.isFinite(parseLogTime(head[0] ?? ''))) {
    const keys = head.map(h => CSV_HEADERS[h.toLowerCase().replace(/[^a-z]/g, '')])
    const at = (k: string) => keys.indexOf(k as never)
    if (at('time') < 0 || at('lat') < 0 || at('lon') < 0) {
      problems.add(1, 'header must name time, lat and lon (or start straight with data: time, lat, lon)')
      return []
    }
    columns = { time: at('time'), lat: at('lat'), lon: at('lon') }
    start = 1
  }
  const fixes: TrackFix[] = []
  for (let i = start; i < rows.length; i++) {
    const cells = rows[i]!
    const line = i + 1
    if (cells.every(c => !c.trim())) continue
    const t = parseLogTime(cells[columns.time] ?? '')
    if (!Number.isFinite(t)) { problems.add(line, 'time must be an ISO 8601 date and time in UTC (2026-11-24T06:00:00Z)'); continue }
    let lat: number, lon: number
    try {
      lat = parseLatitude(cells[columns.lat] ?? '')
      lon = parseLongitude(cells[columns.lon] ?? '')
      if (!(Math.abs(lat) <= 90) || !(Math.abs(lon) <= 180)) throw new Error('position out of range')
    }
    catch (e) { problems.add(line, (e as Error).message); continue }
    fixes.push(fixOf(line, t, lat, lon, null))
  }
  return fixes
}

/** One fix per interval of the clock (the first fix in each; hourly: the first fix of each hour). */
export function sampleFixes(fixes: readonly TrackFix[], intervalMin: number): TrackFix[] {
  const step = intervalMin * 60_000
  const out: TrackFix[] = []
  let bucket = Number.NEGATIVE_INFINITY
  for (const f of fixes) {
    const b = Math.floor(f.t / step)
    if (b !== bucket) { out.push(f); bucket = b }
  }
  return out
}

/** At most `max` points of the track for the chart: evenly spaced by index, the first and last kept. */
export function thinTrack<T>(points: readonly T[], max: number): T[] {
  if (points.length <= max) return [...points]
  const out: T[] = []
  const stride = (points.length - 1) / (max - 1)
  for (let i = 0; i < max; i++) out.push(points[Math.round(i * stride)]!)
  return out
}
