import type { PlaceListItem } from '#shared/types/place'
import type { SeaRouteInput, ZonedSeaRouteResult } from '#shared/types/routing'
import type { Waypoint } from '#shared/types/waypoint'
import { DEFAULT_ROUTE_CLEARANCE_NM, DEFAULT_ROUTE_LIMIT_LAT } from '#shared/types/routing'
import { spliceSeaRoute } from '#shared/utils/routing/spliceRoute'

export interface SeaRouteChoices {
  from: number
  to: number
  avoid: string[]
  clearanceNm: number
  limitLat: number
  avoidRisk: boolean
  leastEca: boolean
}

const placeWaypoint = (p: PlaceListItem): Waypoint => ({ name: p.name, lat: p.lat, lon: p.lon, method: 'rhumb', speedKn: null, xteNm: null, turnRadiusNm: null, notes: null })

/**
 * The sea-route panel's logic: ask the router for a route between two of the draft's waypoints
 * (or its departure and arrival places while it has fewer than two), preview it, and accept it
 * into the draft as one undoable step.
 */
export function useSeaRoute(places: () => PlaceListItem[]) {
  const draft = usePlanDraftStore()
  const previewStore = useSeaRoutePreviewStore()
  const { busy, error, run } = useWrite({ fallback: 'No route could be found' })
  const message = ref('')

  const choices = reactive<SeaRouteChoices>({
    from: 0, to: Math.max(1, draft.waypoints.length - 1), avoid: [], clearanceNm: DEFAULT_ROUTE_CLEARANCE_NM,
    limitLat: clampLimit(draft.header.limitLat), avoidRisk: false, leastEca: false,
  })

  /** The waypoints the route is laid into: the draft's, or its departure and arrival places. */
  const basis = computed<readonly Waypoint[] | null>(() => {
    if (draft.waypoints.length >= 2) return draft.waypoints
    const byId = (id: number | null) => places().find(p => p.id === id)
    const dep = byId(draft.header.departurePlaceId)
    const arr = byId(draft.header.arrivalPlaceId)
    return dep && arr ? [placeWaypoint(dep), placeWaypoint(arr)] : null
  })

  // A new list (another edit, an undo) makes the ends and any preview stale.
  watch(() => draft.waypoints, (list, before) => {
    // An end on the last waypoint stays on the last one.
    const last = Math.max(1, list.length - 1)
    choices.to = choices.to === before.length - 1 ? last : Math.min(Math.max(choices.to, 1), last)
    choices.from = Math.min(choices.from, choices.to - 1)
    if (previewStore.preview && previewStore.preview.basis !== basis.value) previewStore.clear()
  })
  watch(() => draft.header.limitLat, (l) => { choices.limitLat = clampLimit(l) })
  onBeforeUnmount(() => previewStore.clear())

  async function suggest() {
    message.value = ''
    const list = basis.value
    const { from, to } = list && list.length === 2 ? { from: 0, to: 1 } : choices
    const a = list?.[from]
    const b = list?.[to]
    if (!list || !a || !b) { message.value = 'The plan needs a departure and an arrival (two waypoints, or both places in the header).'; return }
    if (from >= to) { message.value = 'Choose a first waypoint before the second.'; return }
    const body: SeaRouteInput = {
      from: { lat: a.lat, lon: a.lon }, to: { lat: b.lat, lon: b.lon }, avoid: choices.avoid,
      clearanceNm: Number(choices.clearanceNm), limitLat: Number(choices.limitLat),
      avoidZones: [...(choices.avoidRisk ? ['risk' as const] : []), ...(choices.leastEca ? ['eca' as const] : [])],
      ...(draft.header.vesselId ? { vesselId: draft.header.vesselId } : {}),
      ...(draft.header.speedKn > 0 ? { speedKn: draft.header.speedKn } : {}),
    }
    const result = await run(() => $fetch<ZonedSeaRouteResult>('/api/routing/sea', { method: 'POST', body }))
    if (!result) return
    previewStore.show({ result, basis: list, proposed: spliceSeaRoute(list, from, to, result.waypoints), from, to, replaces: to - from - 1 })
  }

  function accept() {
    const p = previewStore.preview
    if (!p) return
    if (p.basis !== basis.value) { previewStore.clear(); message.value = 'The plan changed since the route was suggested: suggest it again.'; return }
    draft.replaceWaypoints(p.proposed, 'sea route')
    previewStore.clear()
    message.value = `Sea route laid in: ${p.proposed.length - p.basis.length + p.replaces} waypoints added${p.replaces ? `, ${p.replaces} replaced` : ''}.`
  }

  function discard() {
    previewStore.clear()
    message.value = ''
  }

  return { choices, basis, busy, error, message, suggest, accept, discard, preview: computed(() => previewStore.preview) }
}

/** The router takes limits of 20°–84°; without the plan's own it keeps its default. */
function clampLimit(limit: number | null): number {
  if (limit == null) return DEFAULT_ROUTE_LIMIT_LAT
  return Math.min(84, Math.max(20, Math.abs(limit)))
}
