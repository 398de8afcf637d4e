/** `2026-12-10 02:00Z` — UTC as navigators log it. */
export function formatUtc(iso: string | Date): string {
  const d = typeof iso === 'string' ? new Date(iso) : iso
  return `${d.toISOString().slice(0, 16).replace('T', ' ')}Z`
}

/** Local wall time of an instant in an IANA zone, e.g. `2026-12-10 11:00 (Asia/Tokyo)`. */
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
