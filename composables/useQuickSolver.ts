import type { LatLon, LegMethod } from '#shared/types/geo'
import { inverseAllMethods, directByMethod, solverVertex } from '#shared/utils/solver'

export interface SolverPair { from: LatLon, to: LatLon }
export interface SolverDirectQuestion { from: LatLon, course: number, distanceM: number, method: LegMethod }

/** The quick solver's state: answers are computed in the browser by the same engine the server runs. */
export function useQuickSolver() {
  const pair = ref<SolverPair | null>(null)
  const question = ref<SolverDirectQuestion | null>(null)

  const inverse = computed(() => (pair.value ? inverseAllMethods(pair.value.from, pair.value.to) : null))
  const vertex = computed(() => (pair.value ? solverVertex(pair.value.from, pair.value.to) : null))
  const direct = computed(() => {
    const q = question.value
    if (!q) return null
    try {
      return { ...directByMethod(q.from, q.course, q.distanceM, q.method), method: q.method, error: '' }
    }
    catch (e) {
      return { to: null, finalCourse: null, method: q.method, error: (e as Error).message }
    }
  })
  return { pair, question, inverse, vertex, direct }
}
