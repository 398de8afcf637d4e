// Intl formatters are slow to create; tables of hundreds of legs reuse one per precision.
const formatters = new Map<number, Intl.NumberFormat>()

/** `4,079.3` — grouped, fixed decimals, the same in every browser locale. */
export function formatNumber(value: number, digits = 1): string {
  let f = formatters.get(digits)
  if (!f) formatters.set(digits, f = new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits }))
  return f.format(value)
}
