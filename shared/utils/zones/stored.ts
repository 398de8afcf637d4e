// A stored zone (as `GET /api/zones` lists it) as the zone engine reads it: validity from the start
// of validFrom to the end of validTo, whole UTC days.
import type { ZoneSummary } from '../../types/zone'
import type { ZoneInput } from './types'

const DAY_MS = 86_400_000

export function zoneInput(z: Pick<ZoneSummary, 'id' | 'name' | 'kind' | 'validFrom' | 'validTo' | 'geometry'>): ZoneInput {
  return {
    id: z.id, name: z.name, kind: z.kind, polygons: z.geometry.coordinates,
    validFromMs: z.validFrom ? Date.parse(`${z.validFrom}T00:00:00Z`) : null, validToMs: z.validTo ? Date.parse(`${z.validTo}T00:00:00Z`) + DAY_MS : null,
  }
}
