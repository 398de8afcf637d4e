import type { BoardSortKey, PlanBoardPage, PlanBoardQueryInput, PlanStatus } from '#shared/types/plan'
import { boardSortKeys, planStatuses } from '#shared/types/plan'

/** Milliseconds between the last keystroke in the filter and the request. */
export const BOARD_FILTER_DEBOUNCE_MS = 200
const PAGE_SIZE = 50

const one = (v: unknown) => (Array.isArray(v) ? v[0] : v) as string | undefined
const positive = (v: unknown) => {
  const n = Number(one(v))
  return Number.isInteger(n) && n > 0 ? n : undefined
}

/**
 * The passage board's state (filter, sort, page) kept in the address, so a reload or the way back
 * from a plan shows the same page; the server pages, sorts and filters (GET /api/plans/board).
 */
export async function usePlanBoard() {
  const route = useRoute()
  const router = useRouter()
  const q0 = route.query
  const filterText = ref(one(q0.q) ?? '')
  const query = reactive({
    q: filterText.value.trim(),
    status: planStatuses.includes(one(q0.status) as PlanStatus) ? one(q0.status) as PlanStatus : undefined,
    vesselId: positive(q0.vesselId),
    view: one(q0.view) === 'all' ? 'all' as const : 'current' as const,
    sort: boardSortKeys.includes(one(q0.sort) as BoardSortKey) ? one(q0.sort) as BoardSortKey : 'departureUtc' as BoardSortKey,
    dir: one(q0.dir) === 'asc' ? 'asc' as const : 'desc' as const,
    page: positive(q0.page) ?? 1,
  })

  let timer: ReturnType<typeof setTimeout> | undefined
  watch(filterText, (text) => {
    clearTimeout(timer)
    timer = setTimeout(() => { query.q = text.trim(); query.page = 1 }, BOARD_FILTER_DEBOUNCE_MS)
  })
  onScopeDispose(() => clearTimeout(timer))

  const request = computed<PlanBoardQueryInput>(() => {
    const r: Record<string, string> = { page: String(query.page), pageSize: String(PAGE_SIZE), sort: query.sort, dir: query.dir, view: query.view }
    if (query.q) r.q = query.q
    if (query.status) r.status = query.status
    if (query.vesselId) r.vesselId = String(query.vesselId)
    return r as PlanBoardQueryInput
  })
  // The address shows only what differs from the default board.
  watch(request, () => {
    const shown: Record<string, string> = {}
    if (query.q) shown.q = query.q
    if (query.status) shown.status = query.status
    if (query.vesselId) shown.vesselId = String(query.vesselId)
    if (query.view !== 'current') shown.view = query.view
    if (query.sort !== 'departureUtc' || query.dir !== 'desc') { shown.sort = query.sort; shown.dir = query.dir }
    if (query.page > 1) shown.page = String(query.page)
    router.replace({ query: shown })
  })

  const { data, status, error } = await useFetch<PlanBoardPage>('/api/plans/board', { key: 'plans', query: request })

  function sortBy(key: BoardSortKey, dir?: 'asc' | 'desc') {
    if (dir) { query.sort = key; query.dir = dir }
    else if (query.sort === key) query.dir = query.dir === 'desc' ? 'asc' : 'desc'
    else { query.sort = key; query.dir = key === 'departureUtc' || key === 'arrivalUtc' ? 'desc' : 'asc' }
    query.page = 1
  }
  function setFilter(patch: { status?: PlanStatus | '', vesselId?: number | null, view?: 'current' | 'all' }) {
    if ('status' in patch) query.status = patch.status || undefined
    if ('vesselId' in patch) query.vesselId = patch.vesselId ?? undefined
    if (patch.view) query.view = patch.view
    query.page = 1
  }
  function goToPage(page: number) { query.page = Math.max(1, page) }

  return { data, status, error, query, filterText, sortBy, setFilter, goToPage }
}
