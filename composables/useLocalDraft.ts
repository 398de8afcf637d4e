import type { PlanHeaderDraft } from '~/stores/planDraft'
import type { Waypoint } from '#shared/types/waypoint'

interface StoredDraft { savedAt: string, header: PlanHeaderDraft, waypoints: readonly Waypoint[] }

/** Keeps unsaved changes in localStorage (per plan and version) so a reload does not lose them. */
export function useLocalDraft() {
  const store = usePlanDraftStore()
  const restoredAt = ref<string | null>(null)
  const key = () => `passagewright:draft:${store.planId}:${store.version}`

  function restore() {
    if (!import.meta.client || store.planId == null) return
    const text = localStorage.getItem(key())
    if (!text) return
    try {
      const draft = JSON.parse(text) as StoredDraft
      store.header = draft.header
      store.replaceWaypoints(draft.waypoints, 'restore local draft')
      restoredAt.value = draft.savedAt
    }
    catch { localStorage.removeItem(key()) }
  }

  let timer: ReturnType<typeof setTimeout> | undefined
  function persist() {
    clearTimeout(timer)
    timer = setTimeout(() => {
      if (store.planId == null) return
      if (store.dirty) localStorage.setItem(key(), JSON.stringify({ savedAt: new Date().toISOString(), header: store.header, waypoints: store.waypoints } satisfies StoredDraft))
      else localStorage.removeItem(key())
    }, 300)
  }

  onMounted(() => {
    restore()
    // The header is edited in place; the waypoint list is replaced whole on every change.
    watch(() => store.header, persist, { deep: true })
    watch(() => [store.waypoints, store.version], persist)
    // Versions already saved past leave their drafts behind: drop them.
    for (const k of Object.keys(localStorage))
      if (k.startsWith(`passagewright:draft:${store.planId}:`) && k !== key()) localStorage.removeItem(k)
  })
  onBeforeUnmount(() => clearTimeout(timer))

  return { restoredAt, dismiss: () => { restoredAt.value = null } }
}
