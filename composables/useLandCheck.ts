import type { LandCheckResult } from '#shared/types/landCheck'

/** Runs the coarse land check of the draft's track on the server and keeps the result in the draft store. */
export function useLandCheck() {
  const store = usePlanDraftStore()
  const { busy, error, run: send } = useWrite({ fallback: 'Land check failed' })

  async function run(clearanceNm: number) {
    const waypoints = store.waypoints.map(w => ({ lat: w.lat, lon: w.lon, method: w.method }))
    const result = await send(() => $fetch<LandCheckResult>('/api/land-check', { method: 'POST', body: { waypoints, clearanceNm } }))
    if (result) store.landCheck = result
  }

  return { checking: busy, error: readonly(error), run }
}
