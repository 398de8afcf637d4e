import type { PlanView } from '#shared/types/planView'
import type { Waypoint } from '#shared/types/waypoint'

/** What differs between the draft and the plan someone else saved meanwhile. */
export interface PlanConflict {
  theirs: PlanView
  myBaseVersion: number
  changes: string[]
}

function describeChanges(mine: { header: Record<string, unknown>, waypoints: readonly Waypoint[] }, theirs: PlanView, baseVersion: number): string[] {
  const out = [`The server has version ${theirs.plan.version}; your draft started from version ${baseVersion}.`]
  if (theirs.plan.status !== 'draft') out.push(`The plan is now ${theirs.plan.status}.`)
  const a = mine.waypoints
  const b = theirs.waypoints
  if (a.length !== b.length) out.push(`Waypoints: ${b.length} on the server, ${a.length} in your draft.`)
  const moved = b.filter((w, i) => a[i] && (Math.abs(a[i]!.lat - w.lat) > 1e-9 || Math.abs(a[i]!.lon - w.lon) > 1e-9)).length
  if (moved) out.push(`${moved} waypoint position${moved === 1 ? '' : 's'} differ${moved === 1 ? 's' : ''}.`)
  for (const key of ['title', 'departureUtc', 'speedKn', 'limitLat'] as const) {
    if (String(mine.header[key] ?? '') !== String(theirs.plan[key] ?? '')) out.push(`${key} on the server: ${theirs.plan[key] ?? '—'}.`)
  }
  return out
}

/** Saves the draft (header, then waypoints) under the plan's version; a stale version becomes a conflict to resolve. */
export function usePlanSave() {
  const store = usePlanDraftStore()
  const { busy: saving, error, failure, run } = useWrite({ fallback: 'Saving failed' })
  const conflict = shallowRef<PlanConflict | null>(null)

  async function put() {
    const id = store.planId!
    let view: PlanView | null = null
    if (store.headerDirty) {
      const h = store.header
      view = await $fetch<PlanView>(`/api/plans/${id}`, {
        method: 'PUT',
        body: { version: store.version, title: h.title, departureUtc: h.departureUtc, speedKn: h.speedKn, limitLat: h.limitLat, departurePlaceId: h.departurePlaceId, arrivalPlaceId: h.arrivalPlaceId },
      })
      store.version = view.plan.version
    }
    if (store.waypointsDirty || !view)
      view = await $fetch<PlanView>(`/api/plans/${id}/waypoints`, { method: 'PUT', body: { version: store.version, waypoints: store.waypoints } })
    store.markSaved(view)
    return view
  }

  async function save() {
    if (store.hasCellErrors) { error.value = 'Correct the marked cells before saving.'; return }
    const base = store.version
    if (await run(put)) { conflict.value = null; return }
    const stale = failure.value?.statusCode === 409 && failure.value?.data?.data?.currentVersion !== undefined
    if (!stale) return
    const theirs = await run(() => $fetch<PlanView>(`/api/plans/${store.planId}`))
    if (theirs) conflict.value = { theirs, myBaseVersion: base, changes: describeChanges({ header: { ...store.header }, waypoints: store.waypoints }, theirs, base) }
  }

  function reloadTheirs() {
    if (conflict.value) store.load(conflict.value.theirs)
    conflict.value = null
  }

  async function overwriteWithMine() {
    if (!conflict.value) return
    store.version = conflict.value.theirs.plan.version
    await save()
  }

  return { saving, error, conflict, save, reloadTheirs, overwriteWithMine }
}
