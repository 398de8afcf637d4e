import type { LatLon } from '#shared/types/geo'
import { geodesicInverse } from '#shared/utils/geodesic'
import { normaliseLongitude } from '#shared/utils/position'

export interface ChartNotice { text: string, tone: 'warn' | 'info', undo: boolean }

/** A move this long is said, ashore or not (a drag can carry a waypoint across an ocean unseen at a small scale). */
const LONG_MOVE_NM = 100

/**
 * Editing the plan on the chart: placing waypoints by clicking (a mode the chart's toggle turns
 * on and off), and a notice with Undo after a drag or a placing that lands ashore or moves far.
 */
export function useChartEditing() {
  const draft = usePlanDraftStore()
  const placing = ref(false)
  const notice = ref<ChartNotice | null>(null)
  let asked = 0
  // The undo step a notice offers: any later edit makes its Undo mean something else, so the notice goes.
  let step: unknown = null
  const show = (n: ChartNotice | null) => { notice.value = n; step = draft.undoStack.at(-1) ?? null }
  watch(() => draft.undoStack.at(-1), (top) => { if (notice.value && top !== step) notice.value = null })

  async function ashore(p: LatLon): Promise<boolean> {
    try { return (await $fetch<{ ashore: boolean }>('/api/land-check/position', { query: { lat: p.lat, lon: normaliseLongitude(p.lon) } })).ashore }
    catch { return false }
  }

  const label = (i: number) => `Waypoint ${i + 1}${draft.waypoints[i]?.name ? ` ${draft.waypoints[i]!.name}` : ''}`

  /** After a waypoint moved from `from`: say how far, and whether it is now ashore. */
  async function moved(i: number, from: LatLon) {
    const to = draft.waypoints[i]
    if (!to) return
    const ask = ++asked
    const nm = geodesicInverse(from, to).distanceNm
    const isAshore = await ashore(to)
    if (ask !== asked) return
    if (isAshore) show({ text: `${label(i)} is now ashore on the coarse coastline (moved ${formatNumber(nm, 1)} nm).`, tone: 'warn', undo: true })
    else if (nm >= LONG_MOVE_NM) show({ text: `${label(i)} moved ${formatNumber(nm, 0)} nm.`, tone: 'info', undo: true })
    else show(null)
  }

  /** Places a waypoint where the chart was clicked: after the selected one, else at the end of the track. */
  async function place(at: LatLon) {
    if (!placing.value || !draft.editable) return
    const i = draft.selected == null ? draft.waypoints.length : draft.selected + 1
    const p = { lat: Math.max(-89, Math.min(89, at.lat)), lon: normaliseLongitude(at.lon) }
    draft.insertWaypoint(i, { name: '', lat: p.lat, lon: p.lon, method: 'rhumb', speedKn: null, xteNm: null, turnRadiusNm: null, notes: null })
    draft.selected = i
    const ask = ++asked
    const isAshore = await ashore(p)
    if (ask !== asked) return
    show(isAshore ? { text: `${label(i)} was placed ashore on the coarse coastline.`, tone: 'warn', undo: true } : null)
  }

  function undo() {
    draft.undo()
    notice.value = null
  }

  // A draft that stops being editable (saved for sign-off, another plan) ends placing.
  watch(() => draft.editable, (editable) => { if (!editable) placing.value = false })
  watch(() => draft.planId, () => { notice.value = null; placing.value = false })

  return { placing, notice, moved, place, undo, dismiss: () => { notice.value = null } }
}
