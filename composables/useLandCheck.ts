import type { LandCheckResult } from '#shared/types/landCheck'

/** Runs the coarse land check of the draft's track on the server and keeps the result in the draft store. */
export function useLandCheck() {
  const store = usePlanDraftStore()
  const checking = ref(false)
  const error = ref<string | null>(null)

  async function run(clearanceNm: number) {
    checking.value = true
    error.value = null
    try {
      const waypoints = store.waypoints.map(w => ({ lat: w.lat, lon: w.lon, method: w.method }))
      store.landCheck = await $fetch<LandCheckResult>('/api/land-check', { method: 'POST', body: { waypoints, clearanceNm } })
    }
    catch (e: any) { error.value = e?.data?.message || e?.message || 'Land check failed' }
    finally { checking.value = false }
  }

  return { checking: readonly(checking), error: readonly(error), run }
}
