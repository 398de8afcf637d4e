import { geodesyCrossTrackSchema } from '#shared/types/geodesy'

// Cross-track (positive to starboard) and along-track distance of a position from a geodesic leg.
export default defineRoleHandler(ALL_ROLES, async (event) => {
  const { from, to, position } = await readValidatedBody(event, geodesyCrossTrackSchema.parse)
  const { crossTrackM, alongTrackM } = crossTrack(from, to, position)
  return { crossTrackM, alongTrackM }
})
