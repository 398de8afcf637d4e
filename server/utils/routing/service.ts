// The sea-route service behind the API: the passages list and one route, with the router's
// refusals turned into 422 answers that name the end concerned.
import type { PassageSummary, SeaRouteInput, SeaRouteOptions, SeaRouteResult } from '#shared/types/routing'
import { PASSAGES } from '#shared/utils/routing/passages'
import { useSeaGraph } from './graphStore'
import { EndError } from './ends'
import { NoRouteError, seaRoute } from './seaRoute'

export function listPassages(): PassageSummary[] {
  return PASSAGES.map(p => ({ id: p.id, name: p.name, kind: p.kind, ...(p.transitNm ? { transitNm: p.transitNm } : {}) }))
}

/** One sea route; `areas` is where zones (no-go, risk, emission control) come in. */
export async function planSeaRoute(input: SeaRouteInput, areas: SeaRouteOptions['areas'] = []): Promise<SeaRouteResult> {
  const graph = await useSeaGraph()
  try {
    return seaRoute(graph, input.from, input.to, { avoid: input.avoid, clearanceNm: input.clearanceNm, limitLat: input.limitLat, areas })
  }
  catch (error) {
    if (error instanceof EndError) throw createError({ statusCode: 422, statusMessage: error.message, data: { field: error.field } })
    if (error instanceof NoRouteError) throw createError({ statusCode: 422, statusMessage: error.message })
    throw error
  }
}
