import type { PlanAction } from '#shared/utils/signoffRules'

type PostAction = Exclude<PlanAction, 'remark'> | 'remarks'

/**
 * Sign-off steps, revisions, the crew brief and remarks for one plan: POST, then refresh the
 * plan's data. `error` holds the server's message for the panel to show.
 */
export function usePlanActions(id: MaybeRefOrGetter<number>) {
  const busy = ref<PostAction | null>(null)
  const error = ref<string | null>(null)
  const notice = ref<string | null>(null)

  async function post<T>(action: PostAction, body?: Record<string, unknown>): Promise<T | null> {
    busy.value = action
    error.value = null
    notice.value = null
    try {
      const result = await $fetch(`/api/plans/${toValue(id)}/${action}`, { method: 'POST', body }) as unknown as T
      await refreshNuxtData(`plan-${toValue(id)}`)
      return result
    }
    catch (e: any) {
      error.value = e?.data?.message ?? e?.message ?? 'The request failed'
      return null
    }
    finally { busy.value = null }
  }

  const submit = (version?: number) => post('submit', { version })
  const approve = (version?: number) => post('approve', { version })
  const returnWithRemarks = (remarks: string, version?: number) => post('return', { remarks, version })
  const addRemark = (remarks: string) => post('remarks', { remarks })

  /** Starts a revision and opens the new draft. */
  async function revise() {
    const view = await post<{ plan: { id: number } }>('revise')
    if (view) await navigateTo(`/plans/${view.plan.id}`)
    return view
  }

  async function sendBrief() {
    const queued = await post<{ recipientCount: number }>('brief')
    if (queued) notice.value = `Crew brief queued for ${queued.recipientCount} recipients; follow it in the outbox.`
    return queued
  }

  return { busy: readonly(busy), error: readonly(error), notice: readonly(notice), submit, approve, returnWithRemarks, addRemark, revise, sendBrief }
}
