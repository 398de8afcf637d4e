import { geodesyCompositeSchema } from '#shared/types/geodesy'
import type { CompositeResult } from '#shared/utils/composite'

// Composite sailing under a limiting latitude; `kind` says whether the limit was needed and could be kept.
export default defineRoleHandler(ALL_ROLES, async (event) => {
  const { from, to, limitLat } = await readValidatedBody(event, geodesyCompositeSchema.parse)
  return compositeSailing(from, to, limitLat) satisfies CompositeResult
})
