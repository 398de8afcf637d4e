// ISO 8601 UTC text for a time in milliseconds, by integer arithmetic (days to civil date after
// H. Hinnant, "chrono-Compatible Low-Level Date Algorithms"); about three times faster than
// Date#toISOString, which matters when a long plan is recomputed on every edit.

const pad2 = (n: number) => (n < 10 ? `0${n}` : `${n}`)
const pad3 = (n: number) => (n < 10 ? `00${n}` : n < 100 ? `0${n}` : `${n}`)

/** Same text as new Date(ms).toISOString() for years 0000–9999. */
export function isoUtc(ms: number): string {
  const t = Math.trunc(ms) // TimeClip truncates toward zero (ECMA-262 §21.4.1.31)
  const days = Math.floor(t / 86_400_000)
  let rem = t - days * 86_400_000
  const z = days + 719_468
  const era = Math.floor(z / 146_097)
  const doe = z - era * 146_097
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36_524) - Math.floor(doe / 146_096)) / 365)
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100))
  const mp = Math.floor((5 * doy + 2) / 153)
  const day = doy - Math.floor((153 * mp + 2) / 5) + 1
  const month = mp < 10 ? mp + 3 : mp - 9
  const year = yoe + era * 400 + (month <= 2 ? 1 : 0)
  if (year < 0 || year > 9999) return new Date(ms).toISOString()
  const h = Math.floor(rem / 3_600_000)
  rem -= h * 3_600_000
  const mi = Math.floor(rem / 60_000)
  rem -= mi * 60_000
  const s = Math.floor(rem / 1000)
  return `${String(year).padStart(4, '0')}-${pad2(month)}-${pad2(day)}T${pad2(h)}:${pad2(mi)}:${pad2(s)}.${pad3(rem - s * 1000)}Z`
}
