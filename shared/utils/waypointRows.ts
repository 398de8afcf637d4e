// Several waypoint rows at once: delete, move and reverse, each giving a new list (the draft takes
// it as one undoable step). A waypoint's method, speed, XTE limit and turn radius belong to the leg
// arriving at it; names, positions and notes belong to the waypoint.
import type { Waypoint } from '../types/waypoint'

/** Row numbers in order, once each, within the list. */
function rowsOf(list: readonly unknown[], rows: readonly number[]): number[] {
  return [...new Set(rows)].filter(i => Number.isInteger(i) && i >= 0 && i < list.length).sort((a, b) => a - b)
}

/** The list without the given rows. */
export function deleteRows(list: readonly Waypoint[], rows: readonly number[]): Waypoint[] {
  const gone = new Set(rowsOf(list, rows))
  return list.filter((_, i) => !gone.has(i))
}

/**
 * The given rows taken out and put back together, in their order, so that the first of them lands
 * at row `to` of the result (clamped to the list). Each waypoint keeps its own leg settings.
 * Answers the list and where the moved rows now are.
 */
export function moveRows(list: readonly Waypoint[], rows: readonly number[], to: number): { list: Waypoint[], rows: number[] } {
  const picked = rowsOf(list, rows)
  const set = new Set(picked)
  const rest = list.filter((_, i) => !set.has(i))
  const at = Math.max(0, Math.min(Math.round(to), rest.length))
  const moved = picked.map(i => list[i]!)
  return { list: [...rest.slice(0, at), ...moved, ...rest.slice(at)], rows: moved.map((_, k) => at + k) }
}

/**
 * The rows from the first to the last given one sailed the other way. The leg into the span and the
 * leg out of it keep their settings; each leg inside it keeps its own settings too, which now sit on
 * the waypoint it arrives at the other way round.
 */
export function reverseRows(list: readonly Waypoint[], rows: readonly number[]): { list: Waypoint[], from: number, to: number } {
  const picked = rowsOf(list, rows)
  const a = picked[0] ?? 0
  const b = picked.at(-1) ?? -1
  const out = list.slice()
  for (let k = 0; a + k <= b; k++) {
    const at = list[b - k]!
    // The leg arriving at row a + k: the leg into the span for k = 0, else the old leg b − k → b − k + 1.
    const leg = k === 0 ? list[a]! : list[b - k + 1]!
    out[a + k] = { name: at.name, lat: at.lat, lon: at.lon, notes: at.notes ?? null, method: leg.method, speedKn: leg.speedKn ?? null, xteNm: leg.xteNm ?? null, turnRadiusNm: leg.turnRadiusNm ?? null }
  }
  return { list: out, from: a, to: b }
}
