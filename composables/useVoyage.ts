import type { ReportInput, TrackImportResult, VoyageReport } from '#shared/types/voyage'

/** Writes on a voyage (reports, deletions, track imports), each refreshing the voyage page's data. */
export function useVoyage(planId: MaybeRefOrGetter<number>, refreshKey: MaybeRefOrGetter<string>) {
  const { busy, pending, error, failure, run } = useWrite({ refresh: () => [toValue(refreshKey), 'fleet'] })
  const base = () => `/api/plans/${toValue(planId)}/reports`

  const addReport = (body: ReportInput) => run(() => $fetch<VoyageReport>(base(), { method: 'POST', body }), { label: 'report' })
  const deleteReport = (id: number) => run(() => $fetch(`${base()}/${id}`, { method: 'DELETE' }), { label: `delete-${id}` })

  /** Preview writes nothing and refreshes nothing; create adds the reports. */
  function importLog(file: File, mode: 'preview' | 'create', intervalMin: number, skipProblems = false) {
    const form = new FormData()
    form.append('file', file)
    form.append('mode', mode)
    form.append('intervalMin', String(intervalMin))
    if (skipProblems) form.append('skipProblems', 'true')
    return run(() => $fetch<TrackImportResult>(`${base()}/import`, { method: 'POST', body: form }), { label: mode, refresh: mode === 'preview' ? [] : undefined })
  }
  return { busy, pending, error, failure, addReport, deleteReport, importLog }
}
