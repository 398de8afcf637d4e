import { deleteRows, moveRows, reverseRows } from '#shared/utils/waypointRows'

/** Delete, move or reverse the picked rows of the waypoint sheet, each as one undoable step. */
export function useWaypointBulk() {
  const draft = usePlanDraftStore()
  const picks = useWaypointPicksStore()
  const message = ref('')
  /** Row numbers of the picked waypoints still in the draft, in order. */
  const rows = computed(() => {
    const set = picks.picked
    if (!set.size) return []
    const out: number[] = []
    draft.waypoints.forEach((w, i) => { if (set.has(w)) out.push(i) })
    return out
  })
  const rowsText = (r: number[]) => (r.length === 1 ? `row ${r[0]! + 1}` : `${r.length} rows`)

  function remove() {
    const r = rows.value
    if (!r.length) return
    if (draft.waypoints.length - r.length < 2 && draft.waypoints.length >= 2) { message.value = 'A plan keeps at least two waypoints: pick fewer rows.'; return }
    draft.replaceWaypoints(deleteRows(draft.waypoints, r), `delete ${rowsText(r)}`)
    picks.clear()
    message.value = `Deleted ${rowsText(r)}.`
  }

  /** Moves the picked rows together so the first lands at row `to` (0-based). */
  function moveTo(to: number) {
    const r = rows.value
    if (!r.length) return
    const { list, rows: now } = moveRows(draft.waypoints, r, to)
    if (now.every((i, k) => i === r[k])) return
    draft.replaceWaypoints(list, `move ${rowsText(r)}`)
    picks.set(now.map(i => list[i]!))
    draft.selected = now[0]!
    message.value = `Moved ${rowsText(r)} to row ${now[0]! + 1}${now.length > 1 ? `–${now.at(-1)! + 1}` : ''}.`
  }
  const moveBy = (delta: -1 | 1) => { if (rows.value.length) moveTo(rows.value[0]! + delta) }

  function reverse() {
    const r = rows.value
    if (r.length < 2) { message.value = 'Pick at least two rows to reverse.'; return }
    const { list, from, to } = reverseRows(draft.waypoints, r)
    draft.replaceWaypoints(list, `reverse rows ${from + 1}–${to + 1}`)
    picks.set(list.slice(from, to + 1))
    message.value = `Rows ${from + 1}–${to + 1} reversed: each leg keeps its method, speed and limits.`
  }

  return { rows, message, remove, moveTo, moveBy, reverse }
}
