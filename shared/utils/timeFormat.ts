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
