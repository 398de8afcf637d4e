import { skipHydrate } from 'pinia'
import type { ZonedSeaRouteResult } from '#shared/types/routing'
import type { Waypoint } from '#shared/types/waypoint'

/** A suggested sea route shown on the chart before the planner accepts it into the draft. */
export interface SeaRoutePreview {
  result: ZonedSeaRouteResult
  /** The draft's waypoint list the route was asked for (a different list makes the preview stale). */
  basis: readonly Waypoint[]
  /** The list the draft would have after accepting. */
  proposed: Waypoint[]
  /** Which waypoints it joins (indexes in `basis`) and what it replaces between them. */
  from: number
  to: number
  replaces: number
}

/** Client state shared by the sea-route panel and the chart: the route on preview, if any. */
export const useSeaRoutePreviewStore = defineStore('seaRoutePreview', () => {
  const preview = skipHydrate(shallowRef<SeaRoutePreview | null>(null))
  function show(p: SeaRoutePreview) { preview.value = p }
  function clear() { preview.value = null }
  return { preview, show, clear }
})
