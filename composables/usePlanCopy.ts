/** Starts a new draft from a plan (POST /api/plans/:id/copy) and opens it. */
export function usePlanCopy(planId: () => number) {
  const { busy, pending, error, run } = useWrite({ refresh: 'plans', fallback: 'The plan could not be copied' })
  async function copy(reversed: boolean) {
    const made = await run(() => $fetch<{ id: number }>(`/api/plans/${planId()}/copy`, { method: 'POST', body: { reversed } }), { label: reversed ? 'return' : 'copy' })
    if (made) await navigateTo(`/plans/${made.id}`)
  }
  return { busy, pending, error, copy }
}
