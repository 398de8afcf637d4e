// Debian's geographiclib-tools (GeodSolve, RhumbSolve, GeographicLib 2.1.2) as an independent oracle:
// one child process per batch, one input line per case.
import { spawnSync } from 'node:child_process'

export type OracleTool = 'GeodSolve' | 'RhumbSolve'

/** Run a batch of input lines through the tool and return the numbers of each output line. */
export function runOracle(tool: OracleTool, args: string[], lines: string[]): number[][] {
  const r = spawnSync(`/usr/bin/${tool}`, args, { input: lines.join('\n') + '\n', encoding: 'utf8', maxBuffer: 256 << 20 })
  if (r.error) throw r.error
  const out = r.stdout.trim().split('\n')
  if (out.length !== lines.length) throw new Error(`${tool} answered ${out.length} lines for ${lines.length}: ${r.stderr}`)
  return out.map(l => l.trim().split(/\s+/).map(v => (/^-?nan$/i.test(v) ? Number.NaN : Number(v))))
}

/** Decimal text with no exponent, so that JavaScript and the C++ tools read the same double. */
export function fmt(x: number, decimals = 15): string {
  return x.toFixed(decimals)
}

/** Round-trip a number through the text sent to the oracle (both sides then see the same input). */
export function same(x: number, decimals = 15): number {
  return Number(fmt(x, decimals))
}

/** Angular difference a − b in degrees, reduced to −180..180. */
export function angleDiff(a: number, b: number): number {
  return ((((a - b) % 360) + 540) % 360) - 180
}

/** Worst-error bookkeeping, printed for the report. */
export class WorstErrors {
  private rows = new Map<string, { value: number, at: string }>()
  add(key: string, value: number, at: string) {
    const v = Math.abs(value)
    const cur = this.rows.get(key)
    if (!cur || v > cur.value || Number.isNaN(v)) this.rows.set(key, { value: v, at })
  }
  /** The worst difference recorded under `key`; throws for a key never recorded, so a misspelt key cannot pass. */
  get(key: string): number {
    const row = this.rows.get(key)
    if (!row) throw new Error(`no differences recorded under "${key}"`)
    return row.value
  }
  print(title: string) {
    const lines = [...this.rows.entries()].map(([k, { value, at }]) => `  ${k.padEnd(42)} ${value.toExponential(3).padStart(11)}   (${at})`)
    console.log(`${title}\n${lines.join('\n')}`)
  }
}
