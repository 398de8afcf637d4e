import type { PlanAction } from '#shared/utils/signoffRules'

type PostAction = Exclude<PlanAction, 'remark'> | 'remarks'

/**
 * Sign-off steps, revisions, the crew brief and remarks for one plan: POST, then refresh the
 * plan's data. `busy` names the step running; `error` holds the server's message for the panel.
 */
export function usePlanActions(id: MaybeRefOrGetter<number>) {
  const writer = useWrite({ refresh: () => `plan-${toValue(id)}` })
  const notice = ref<string | null>(null)

  function post<T>(action: PostAction, body?: Record<string, unknown>): Promise<T | null> {
    notice.value = null
    return writer.write<T>(`/api/plans/${toValue(id)}/${action}`, 'POST', body, { label: action })
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

  return { busy: writer.pending as Readonly<Ref<PostAction | null>>, error: readonly(writer.error), notice: readonly(notice), submit, approve, returnWithRemarks, addRemark, revise, sendBrief }
}
