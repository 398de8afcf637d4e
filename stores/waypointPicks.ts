import { skipHydrate } from 'pinia'
import type { Waypoint } from '#shared/types/waypoint'

/**
 * Rows picked in the waypoint sheet for acting on several at once. Picks follow the waypoints
 * themselves, not row numbers: the draft never changes a waypoint in place, so a pick survives
 * moves, inserts and undo elsewhere, and scrolling (the sheet draws only the rows in view).
 */
export const useWaypointPicksStore = defineStore('waypointPicks', () => {
  const picked = skipHydrate(shallowRef<ReadonlySet<Waypoint>>(new Set()))
  /** The last row picked or unpicked by itself, where a Shift-pick range starts. */
  const anchor = skipHydrate(shallowRef<Waypoint | null>(null))

  function toggle(w: Waypoint) {
    const next = new Set(picked.value)
    if (!next.delete(w)) next.add(w)
    picked.value = next
    anchor.value = w
  }
  /** Picks every row from the anchor to `w` (inclusive), as Shift-click does in a file list. */
  function extend(list: readonly Waypoint[], w: Waypoint) {
    const to = list.indexOf(w)
    const from = anchor.value ? list.indexOf(anchor.value) : -1
    if (from < 0 || to < 0) return toggle(w)
    const next = new Set(picked.value)
    for (let i = Math.min(from, to); i <= Math.max(from, to); i++) next.add(list[i]!)
    picked.value = next
  }
  function set(ws: readonly Waypoint[]) { picked.value = new Set(ws) }
  function clear() { picked.value = new Set(); anchor.value = null }
  return { picked, anchor, toggle, extend, set, clear }
})
