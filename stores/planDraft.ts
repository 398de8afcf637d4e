import type { LandCheckResult } from '#shared/types/landCheck'
import type { PlanDetail } from '#shared/types/plan'
import type { PlanView } from '#shared/types/planView'
import type { Waypoint } from '#shared/types/waypoint'
import { computeLegTable } from '#shared/utils/legTable'
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

/** What the planner is editing: the header and waypoints of one plan, with undo until saved. */
export const usePlanDraftStore = defineStore('planDraft', () => {
  const planId = ref<number | null>(null)
  const version = ref(0)
  const status = ref<PlanDetail['status']>('draft')
  const header = ref<PlanHeaderDraft>({ vesselId: null, title: '', departureUtc: new Date().toISOString(), speedKn: 14, limitLat: null, departurePlaceId: null, arrivalPlaceId: null })
  const waypoints = ref<Waypoint[]>([])
  const saved = ref<string>('')
  const undoStack = ref<{ label: string, waypoints: Waypoint[] }[]>([])
  const selected = ref<number | null>(null)
  /** The plan as last loaded or saved (names, time zones, revision) for display. */
  const plan = shallowRef<PlanDetail | null>(null)
  /** False for roles that only read (shore, admin): nothing becomes editable for them. */
  const roleMayEdit = ref(true)
  /** Cells whose typed text cannot be read, keyed by cell; nothing is saved while any remain. */
  const cellErrors = ref<Record<string, string>>({})
  /** Where the chart is looking (UI state), so a first waypoint can start there. */
  const viewCentre = ref<{ lat: number, lon: number } | null>(null)
  /** The last land check of the current track, cleared by any change to the waypoints. */
  const landCheck = shallowRef<LandCheckResult | null>(null)

  // Waypoints are replaced whole on every change, so reading each one raw (not through the
  // reactive proxy) keeps the dependency on the list while the engine runs at full speed.
  const rawWaypoints = computed(() => waypoints.value.map(w => toRaw(w)))
  const snapshot = () => JSON.stringify({ header: header.value, waypoints: rawWaypoints.value })
  const dirty = computed(() => snapshot() !== saved.value)
  const savedParts = computed(() => (saved.value ? JSON.parse(saved.value) as { header: PlanHeaderDraft, waypoints: Waypoint[] } : null))
  const headerDirty = computed(() => JSON.stringify(header.value) !== JSON.stringify(savedParts.value?.header))
  const waypointsDirty = computed(() => JSON.stringify(rawWaypoints.value) !== JSON.stringify(savedParts.value?.waypoints))
  const editable = computed(() => roleMayEdit.value && (status.value === 'draft' || status.value === 'returned'))
  const hasCellErrors = computed(() => Object.keys(cellErrors.value).length > 0)

  const legTable = computed(() => {
    const valid = rawWaypoints.value.filter(w => Number.isFinite(w.lat) && Number.isFinite(w.lon))
    if (valid.length < 2 || !(header.value.speedKn > 0)) return null
    try { return computeLegTable(valid, header.value.departureUtc, header.value.speedKn) }
    catch { return null }
  })

  function load(view: PlanView) {
    const p = view.plan
    plan.value = p
    landCheck.value = null
    planId.value = p.id
    version.value = p.version
    status.value = p.status
    header.value = { vesselId: p.vesselId, title: p.title, departureUtc: p.departureUtc, speedKn: p.speedKn, limitLat: p.limitLat, departurePlaceId: p.departurePlaceId, arrivalPlaceId: p.arrivalPlaceId }
    waypoints.value = view.waypoints.map(w => ({ ...w }))
    saved.value = snapshot()
    undoStack.value = []
    selected.value = null
  }

  function checkpoint(label: string) {
    undoStack.value.push({ label, waypoints: waypoints.value.map(w => ({ ...w })) })
    if (undoStack.value.length > 100) undoStack.value.shift()
  }

  function updateWaypoint(i: number, patch: Partial<Waypoint>) {
    const current = waypoints.value[i]
    if (current) waypoints.value[i] = { ...current, ...patch }
  }

  function moveWaypoint(i: number, to: { lat: number, lon: number }) {
    updateWaypoint(i, { lat: to.lat, lon: normaliseLongitude(to.lon) })
  }

  function insertWaypoint(at: number, w: Waypoint) {
    checkpoint('insert waypoint')
    waypoints.value.splice(at, 0, w)
  }

  function removeWaypoint(i: number) {
    checkpoint('delete waypoint')
    waypoints.value.splice(i, 1)
  }

  function reorder(from: number, to: number) {
    if (to < 0 || to >= waypoints.value.length) return
    checkpoint('reorder waypoints')
    const [w] = waypoints.value.splice(from, 1)
    waypoints.value.splice(to, 0, w!)
  }

  /** Track tools replace the list in one undoable step. */
  function replaceWaypoints(list: Waypoint[], label: string) {
    checkpoint(label)
    waypoints.value = list
  }

  function setCellError(key: string, message: string | null) {
    if (message) cellErrors.value = { ...cellErrors.value, [key]: message }
    else if (key in cellErrors.value) {
      const { [key]: _, ...rest } = cellErrors.value
      cellErrors.value = rest
    }
  }

  function undo() {
    const last = undoStack.value.pop()
    if (last) waypoints.value = last.waypoints
  }

  /** Back to the last saved header and waypoints (as one undoable step for the waypoints). */
  function revert() {
    const last = savedParts.value
    if (!last) return
    header.value = { ...last.header }
    replaceWaypoints(last.waypoints, 'discard changes')
  }

  function markSaved(view: PlanView) {
    load(view)
  }

  watch(waypoints, () => { landCheck.value = null }, { deep: true })

  return {
    planId, version, status, header, waypoints, selected, undoStack, dirty, headerDirty, waypointsDirty, editable, legTable, plan, roleMayEdit,
    cellErrors, hasCellErrors, landCheck, viewCentre, load, checkpoint, updateWaypoint, moveWaypoint, insertWaypoint, removeWaypoint, reorder, replaceWaypoints,
    undo, revert, markSaved, setCellError,
  }
})
