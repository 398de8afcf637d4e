import { skipHydrate } from 'pinia'
import type { LandCheckResult, StoredLandCheck } from '#shared/types/landCheck'
import type { PlanDetail } from '#shared/types/plan'
import type { PlanView } from '#shared/types/planView'
import type { Waypoint } from '#shared/types/waypoint'
import { computeLegTable, createLegMemo } from '#shared/utils/legTable'
import { normaliseLongitude } from '#shared/utils/position'

export interface PlanHeaderDraft {
  vesselId: number | null
  title: string
  departureUtc: string
  speedKn: number
  limitLat: number | null
  departurePlaceId: number | null
  arrivalPlaceId: number | null
}

/** What the draft loads from a plan view (the workspace page fetches no legs: it computes them). */
type LoadedView = Pick<PlanView, 'plan' | 'waypoints'> & { landCheck?: StoredLandCheck | null }

/** Same leg data, field by field (what a save would send). */
function sameWaypoint(a: Waypoint, b: Waypoint | undefined) {
  return a === b || (!!b && a.name === b.name && a.lat === b.lat && a.lon === b.lon && a.method === b.method && (a.speedKn ?? null) === (b.speedKn ?? null)
    && (a.xteNm ?? null) === (b.xteNm ?? null) && (a.turnRadiusNm ?? null) === (b.turnRadiusNm ?? null) && (a.notes ?? null) === (b.notes ?? null))
}

/**
 * What the planner is editing: the header and waypoints of one plan, with undo until saved.
 * The waypoint list and its waypoints are never changed in place: every edit replaces the one
 * waypoint it changes and the list around it, so with 5,000 waypoints an edit costs what it changes
 * (rows, legs and chart pieces compare waypoints by identity) and undo keeps lists, not copies.
 * The page loads the draft from its fetched plan on both sides, so the lists are not sent twice
 * in the page payload (skipHydrate).
 */
export const usePlanDraftStore = defineStore('planDraft', () => {
  const planId = ref<number | null>(null)
  const version = ref(0)
  const status = ref<PlanDetail['status']>('draft')
  const header = ref<PlanHeaderDraft>({ vesselId: null, title: '', departureUtc: new Date().toISOString(), speedKn: 14, limitLat: null, departurePlaceId: null, arrivalPlaceId: null })
  const waypoints = skipHydrate(shallowRef<readonly Waypoint[]>([]))
  const savedHeader = skipHydrate(shallowRef<PlanHeaderDraft | null>(null))
  const savedWaypoints = skipHydrate(shallowRef<readonly Waypoint[]>([]))
  const undoStack = skipHydrate(shallowRef<readonly { label: string, waypoints: readonly Waypoint[] }[]>([]))
  const selected = ref<number | null>(null)
  /** The plan as last loaded or saved (names, time zones, revision) for display. */
  const plan = skipHydrate(shallowRef<PlanDetail | null>(null))
  /** False for roles that only read (shore, admin): nothing becomes editable for them. */
  const roleMayEdit = ref(true)
  /** Cells whose typed text cannot be read, keyed by cell; nothing is saved while any remain. */
  const cellErrors = ref<Record<string, string>>({})
  /** Where the chart is looking (UI state), so a first waypoint can start there. */
  const viewCentre = ref<{ lat: number, lon: number } | null>(null)
  /** The last land check of the current track (kept with the plan when it has an id), cleared by any change to the waypoints. */
  const landCheck = skipHydrate(shallowRef<LandCheckResult | StoredLandCheck | null>(null))
  const legMemo = createLegMemo()

  const headerDirty = computed(() => JSON.stringify(header.value) !== JSON.stringify(savedHeader.value))
  const waypointsDirty = computed(() => {
    const now = waypoints.value
    const then = savedWaypoints.value
    return now.length !== then.length || now.some((w, i) => !sameWaypoint(w, then[i]))
  })
  const dirty = computed(() => headerDirty.value || waypointsDirty.value)
  const editable = computed(() => roleMayEdit.value && (status.value === 'draft' || status.value === 'returned'))
  const hasCellErrors = computed(() => Object.keys(cellErrors.value).length > 0)

  const legTable = computed(() => {
    const valid = waypoints.value.filter(w => Number.isFinite(w.lat) && Number.isFinite(w.lon))
    if (valid.length < 2 || !(header.value.speedKn > 0)) return null
    try { return computeLegTable(valid, header.value.departureUtc, header.value.speedKn, { memo: legMemo }) }
    catch { return null }
  })

  function load(view: LoadedView) {
    const p = view.plan
    plan.value = p
    // The kept check belongs to the saved track: shown only while it is the track checked.
    landCheck.value = view.landCheck?.current ? view.landCheck : null
    planId.value = p.id
    version.value = p.version
    status.value = p.status
    header.value = { vesselId: p.vesselId, title: p.title, departureUtc: p.departureUtc, speedKn: p.speedKn, limitLat: p.limitLat, departurePlaceId: p.departurePlaceId, arrivalPlaceId: p.arrivalPlaceId }
    // The fetched waypoints are read only here: the draft replaces, never changes them.
    waypoints.value = view.waypoints
    savedHeader.value = { ...header.value }
    savedWaypoints.value = view.waypoints
    undoStack.value = []
    selected.value = null
  }

  function checkpoint(label: string) {
    undoStack.value = [...undoStack.value.slice(-99), { label, waypoints: waypoints.value }]
  }

  function setList(list: readonly Waypoint[]) {
    waypoints.value = list
    landCheck.value = null
  }

  function updateWaypoint(i: number, patch: Partial<Waypoint>) {
    const current = waypoints.value[i]
    if (!current) return
    const list = waypoints.value.slice()
    list[i] = { ...current, ...patch }
    setList(list)
  }

  function moveWaypoint(i: number, to: { lat: number, lon: number }) {
    updateWaypoint(i, { lat: to.lat, lon: normaliseLongitude(to.lon) })
  }

  function insertWaypoint(at: number, w: Waypoint) {
    checkpoint('insert waypoint')
    setList([...waypoints.value.slice(0, at), w, ...waypoints.value.slice(at)])
  }

  function removeWaypoint(i: number) {
    checkpoint('delete waypoint')
    setList(waypoints.value.filter((_, k) => k !== i))
  }

  function reorder(from: number, to: number) {
    if (to < 0 || to >= waypoints.value.length) return
    checkpoint('reorder waypoints')
    const list = waypoints.value.slice()
    const [w] = list.splice(from, 1)
    list.splice(to, 0, w!)
    setList(list)
  }

  /** Track tools replace the list in one undoable step. */
  function replaceWaypoints(list: readonly Waypoint[], label: string) {
    checkpoint(label)
    setList(list)
  }

  function setCellError(key: string, message: string | null) {
    if (message) cellErrors.value = { ...cellErrors.value, [key]: message }
    else if (key in cellErrors.value) {
      const { [key]: _, ...rest } = cellErrors.value
      cellErrors.value = rest
    }
  }

  function undo() {
    const last = undoStack.value.at(-1)
    if (!last) return
    undoStack.value = undoStack.value.slice(0, -1)
    setList(last.waypoints)
  }

  /** Back to the last saved header and waypoints (as one undoable step for the waypoints). */
  function revert() {
    if (!savedHeader.value) return
    header.value = { ...savedHeader.value }
    replaceWaypoints(savedWaypoints.value, 'discard changes')
  }

  function markSaved(view: LoadedView) {
    load(view)
  }

  return {
    planId, version, status, header, waypoints, selected, undoStack, dirty, headerDirty, waypointsDirty, editable, legTable, plan, roleMayEdit,
    cellErrors, hasCellErrors, landCheck, viewCentre, load, checkpoint, updateWaypoint, moveWaypoint, insertWaypoint, removeWaypoint, reorder, replaceWaypoints,
    undo, revert, markSaved, setCellError,
  }
})
