import type { DistanceTableCreateInput, DistanceTableDetail } from '#shared/types/distanceTable'

const tablePath = (id: number): string => `/api/tables/${id}`

/** Writes on distance tables; each refreshes the saved list (and the open table). */
export function useDistanceTableActions() {
  const { busy, failure, run } = useWrite({ refresh: 'tables' })
  return {
    busy,
    /** The raw error, for `AppError` to show with its status code. */
    error: failure,
    build: (input: DistanceTableCreateInput) => run(() => $fetch<DistanceTableDetail>('/api/tables', { method: 'POST', body: input })),
    rebuild: (id: number) => run(() => $fetch<DistanceTableDetail>(`/api/tables/${id}/rebuild`, { method: 'POST' })),
    // A plain string path: matching the typed route of a DELETE overflows the type checker.
    remove: (id: number) => run(() => $fetch<null>(tablePath(id), { method: 'DELETE' })),
  }
}

/** The open table; polled every second while it builds so the progress bar moves. */
export function useDistanceTable(id: MaybeRefOrGetter<number | null>) {
  const key = computed(() => `table-${toValue(id) ?? 'none'}`)
  // On the server the request's cookies go along, so a table opened by its address renders signed in.
  const request = useRequestFetch()
  const result = useAsyncData(key, () => {
    const value = toValue(id)
    return value ? request<DistanceTableDetail>(`/api/tables/${value}`) : Promise.resolve(null)
  }, { watch: [() => toValue(id)] })
  let timer: ReturnType<typeof setTimeout> | undefined
  const schedule = () => {
    clearTimeout(timer)
    if (result.data.value?.status !== 'building') return
    timer = setTimeout(async () => {
      // The saved list shows the same progress, so it is refreshed with the open table.
      await Promise.all([result.refresh(), refreshNuxtData('tables')])
      schedule()
    }, 1000)
  }
  if (import.meta.client) {
    watch(() => result.data.value?.status, schedule, { immediate: true })
    onScopeDispose(() => clearTimeout(timer))
  }
  return result
}
