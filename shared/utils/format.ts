// How the screens, the printed plan and the crew brief write numbers, courses, durations and
// times (and read a typed UTC time back): one definition each, so what a planner reads on
// screen is what the master prints and the crew receive.

// Intl formatters are slow to create; tables of hundreds of legs reuse one per precision.
const formatters = new Map<number, Intl.NumberFormat>()

/** `4,079.3` — grouped, fixed decimals, the same in every browser locale. */
export function formatNumber(value: number, digits = 1): string {
  let f = formatters.get(digits)
  if (!f) formatters.set(digits, f = new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits }))
  return f.format(value)
}

/** `045.0°` — a true course in three-figure notation (common practice); 359.96° rounds to `000.0°`, not `360.0°`. */
export function formatCourse(deg: number, decimals = 1): string {
  const scale = 10 ** decimals
  const rounded = Math.round(deg * scale) / scale
  const c = rounded >= 360 || rounded < 0 ? ((rounded % 360) + 360) % 360 : rounded
  return `${c.toFixed(decimals).padStart(decimals + (decimals ? 4 : 3), '0')}°`
}

/** The course of a leg: to steer on a rhumb line, initial → final on a geodesic. */
type LegCourses = { method: 'rhumb', course: number } | { method: 'geodesic', initialCourse: number, finalCourse: number }
export function formatLegCourse(leg: LegCourses, decimals = 1): string {
  return leg.method === 'geodesic' ? `${formatCourse(leg.initialCourse, decimals)} → ${formatCourse(leg.finalCourse, decimals)}` : formatCourse(leg.course, decimals)
}

/** `2d 03h 25m`, `05h 12m` — time on a leg or passage, to the minute. */
export function formatDuration(hours: number): string {
  const minutes = Math.round(hours * 60)
  const d = Math.floor(minutes / 1440)
  const h = Math.floor((minutes % 1440) / 60)
  const m = minutes % 60
  return `${d ? `${d}d ` : ''}${String(h).padStart(2, '0')}h ${String(m).padStart(2, '0')}m`
}

/** `2026-12-10 02:00Z` — UTC as navigators log it. */
export function formatUtc(iso: string | Date): string {
  const d = typeof iso === 'string' ? new Date(iso) : iso
  return `${d.toISOString().slice(0, 16).replace('T', ' ')}Z`
}

/** Local wall time of an instant in an IANA zone, e.g. `2026-12-10 11:00`. */
export function formatInZone(iso: string | Date, timeZone: string): string {
  const d = typeof iso === 'string' ? new Date(iso) : iso
  const parts = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).formatToParts(d)
  const get = (t: string) => parts.find(p => p.type === t)?.value ?? ''
  return `${get('year')}-${get('month')}-${get('day')} ${get('hour')}:${get('minute')}`
}

/**
 * A UTC date and time as typed in a log: `2026-12-10 06:00`, `2026-12-10T0600Z`, `2026-12-10 06:00:30`.
 * Always 24-hour and always UTC, whatever the browser's locale. Returns an ISO string or throws with the problem.
 */
export function parseUtcText(text: string): string {
  const s = text.trim().toUpperCase().replace(/\s*UTC$/, '').replace(/Z$/, '')
  const m = /^(\d{4})-(\d{1,2})-(\d{1,2})(?:[ T]+(\d{1,2}):?(\d{2})(?::(\d{2}))?)?$/.exec(s)
  if (!m) throw new Error('type the date and time as 2026-12-10 06:00 (UTC, 24-hour)')
  const [year, month, day, hour = 0, minute = 0, second = 0] = m.slice(1).map(v => (v === undefined ? undefined : Number(v))) as number[]
  if (m[4] === undefined) throw new Error('add the time (UTC, 24-hour): 2026-12-10 06:00')
  if (hour! > 23 || minute! > 59 || second! > 59) throw new Error('the time must be 00:00 to 23:59')
  const ms = Date.UTC(year!, month! - 1, day!, hour, minute, second)
  const d = new Date(ms)
  if (d.getUTCMonth() !== month! - 1 || d.getUTCDate() !== day) throw new Error(`${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')} is not a date`)
  return d.toISOString()
}

/**
 * The time at a place, said as what it is: `port time (Asia/Singapore)` for a place's civil zone,
 * `zone time (UTC+8)` when the place lies at sea and only the nautical zone is known (IANA `Etc/GMT-8`
 * means UTC+8: the sign is POSIX's, reversed).
 */
export function formatPlaceTime(iso: string | Date, timeZone: string): string {
  const nautical = /^Etc\/GMT([+-]\d+)?$/.exec(timeZone)
  if (!nautical) return `${formatInZone(iso, timeZone)} port time (${timeZone})`
  const offset = -Number(nautical[1] ?? 0)
  return `${formatInZone(iso, timeZone)} zone time (UTC${offset === 0 ? '' : offset > 0 ? `+${offset}` : `−${-offset}`})`
}
