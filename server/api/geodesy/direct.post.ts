import { geodesyDirectSchema } from '#shared/types/geodesy'
import { RhumbPoleError } from '#shared/utils/rhumb'
import type { DirectSolution } from '#shared/utils/solver'

// Position after sailing a course for a distance, by geodesic or rhumb line.
export default defineRoleHandler(ALL_ROLES, async (event) => {
  const { from, course, distanceM, method } = await readValidatedBody(event, geodesyDirectSchema.parse)
  try {
    return directByMethod(from, course, distanceM, method) satisfies DirectSolution
  }
  catch (e) {
    if (e instanceof RhumbPoleError)
      throw createError({ statusCode: 400, statusMessage: 'The rhumb line would pass over a pole, where its longitude is undefined' })
    throw e
  }
})
