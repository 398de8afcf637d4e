import type { LandCheckResult, StoredLandCheck } from '#shared/types/landCheck'

/**
 * Runs the coarse land check of the draft's track and keeps the result in the draft store. A saved
 * track of a plan an editor may change is checked by the plan's own route, which keeps the result
 * (history, sign-off); unsaved changes are checked as they stand and kept nowhere.
 */
export function useLandCheck() {
  const store = usePlanDraftStore()
  const { user } = useUserSession()
  const refresh = () => (store.planId ? `plan-${store.planId}` : undefined)
  const { busy, error, run: send } = useWrite({ fallback: 'Land check failed', refresh })
  const { busy: acknowledging, error: ackError, run: sendAck } = useWrite({ fallback: 'The note was not kept', refresh })
  /** True when a check is kept with the plan: a saved, unapproved plan and a user who may edit it. */
  const keeps = computed(() => !!store.planId && !store.dirty && store.status !== 'approved' && canEditPlan(user.value))

  async function run(clearanceNm: number) {
    if (keeps.value) {
      const kept = await send(() => $fetch<StoredLandCheck>(`/api/plans/${store.planId}/land-check`, { method: 'POST', body: { version: store.version, clearanceNm } }))
      if (kept) store.landCheck = kept
      return
    }
    const waypoints = store.waypoints.map(w => ({ lat: w.lat, lon: w.lon, method: w.method }))
    const result = await send(() => $fetch<LandCheckResult>('/api/land-check', { method: 'POST', body: { waypoints, clearanceNm } }), { refresh: [] })
    if (result) store.landCheck = result
  }

  async function acknowledge(checkId: number, legIndex: number, note: string) {
    const kept = await sendAck(() => $fetch<StoredLandCheck>(`/api/plans/${store.planId}/land-check/acknowledge`, { method: 'POST', body: { checkId, legIndex, note } }))
    if (kept) store.landCheck = kept
    return !!kept
  }

  return { checking: busy, error: readonly(error), keeps, run, acknowledge, acknowledging, ackError: readonly(ackError) }
}
