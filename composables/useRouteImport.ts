// Route file import in the browser: upload for a preview (nothing is created), then create the draft.
import type { RouteImportIssue } from '#shared/types/routeFile'
import type { Waypoint } from '#shared/types/waypoint'
import { planCreateSchema } from '#shared/types/plan'

export interface RouteImportPreview {
  format: 'csv' | 'gpx' | 'rtz'
  routeName: string | null
  /** What the file says of the voyage (RTZ): its vessel's name, departure time and usual leg speed. */
  file?: { vesselName: string | null, departureUtc: string | null, speedKn: number | null }
  waypoints: Waypoint[]
  errors: RouteImportIssue[]
  warnings: RouteImportIssue[]
}
export interface RouteImportHeader { vesselId: number | null, title: string, departureUtc: string, speedKn: number | null }
export interface RouteImportFailure { message: string, issue?: RouteImportIssue, errors?: RouteImportIssue[] }

// Same limit as the server (server/utils/routeFiles/common.ts): refused here before uploading.
const MAX_FILE_BYTES = 2 * 1024 * 1024

function failureOf(e: any, fallback: string): RouteImportFailure {
  return { message: errorMessage(e, fallback), issue: e?.data?.data?.issue, errors: e?.data?.data?.errors }
}

export function useRouteImport() {
  const file = shallowRef<File | null>(null)
  const preview = shallowRef<RouteImportPreview | null>(null)
  const failure = ref<RouteImportFailure | null>(null)
  const fieldErrors = ref<Record<string, string>>({})
  const { busy, failure: cause, run } = useWrite({ refresh: 'plans' })

  function formFor(fields: Record<string, string>) {
    const body = new FormData()
    body.append('file', file.value!, file.value!.name)
    for (const [k, v] of Object.entries(fields)) body.append(k, v)
    return body
  }

  async function load(selected: File) {
    file.value = selected
    preview.value = null
    failure.value = null
    if (selected.size > MAX_FILE_BYTES) {
      failure.value = { message: `The file is ${(selected.size / 1048576).toFixed(1)} MB; route files may be at most 2 MB` }
      return
    }
    preview.value = await run(() => $fetch<RouteImportPreview>('/api/plans/import', { method: 'POST', body: formFor({ mode: 'preview' }) }), { refresh: [] })
    if (!preview.value) failure.value = failureOf(cause.value, 'The file could not be read')
  }

  /** Checks the header with the same schema as the server, then creates the draft and opens it. */
  async function create(header: RouteImportHeader) {
    const checked = planCreateSchema.safeParse(header)
    fieldErrors.value = Object.fromEntries(checked.error?.issues.map(i => [String(i.path[0]), i.message]) ?? [])
    if (!checked.success || !file.value) return
    failure.value = null
    const fields = { mode: 'create', vesselId: String(checked.data.vesselId), title: checked.data.title, departureUtc: checked.data.departureUtc, speedKn: String(checked.data.speedKn) }
    const created = await run(() => $fetch<{ id: number }>('/api/plans/import', { method: 'POST', body: formFor(fields) }))
    if (created) await navigateTo(`/plans/${created.id}`)
    else failure.value = failureOf(cause.value, 'The draft could not be created')
  }

  return { file, preview, failure, fieldErrors: readonly(fieldErrors), busy, load, create }
}
