import { geodesyInverseSchema } from '#shared/types/geodesy'
import type { InverseAllMethods } from '#shared/utils/solver'

// Geodesic, rhumb line and great ellipse between two positions (shared/utils/solver.ts).
export default defineRoleHandler(ALL_ROLES, async (event) => {
  const { from, to } = await readValidatedBody(event, geodesyInverseSchema.parse)
  return inverseAllMethods(from, to) satisfies InverseAllMethods
})
