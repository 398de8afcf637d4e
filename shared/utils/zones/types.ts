// Types of the zone engine (capability 12): polygons on the WGS84 ellipsoid whose edges are
// geodesics between consecutive vertices, as MARPOL Annex VI Appendix VII joins its points.
import type { LatLon, LegMethod } from '../../types/geo'

export const ZONE_KINDS = ['eca', 'no-go', 'risk', 'custom'] as const
export type ZoneKind = typeof ZONE_KINDS[number]

/** GeoJSON MultiPolygon coordinates: polygons → rings (outer first, then holes) → [lon, lat]. */
export type ZonePolygons = [number, number][][][]

/** A zone as the engine reads it; validity bounds are epoch milliseconds (open when missing). */
export interface ZoneInput {
  id: number
  name: string
  kind: ZoneKind
  polygons: ZonePolygons
  validFromMs?: number | null
  validToMs?: number | null
}

/** A leg as the zone engine reads it; distance and course are taken from the leg table when given. */
export interface ZoneLeg {
  from: LatLon
  to: LatLon
  method?: LegMethod
  distanceNm?: number
  /** Rhumb course, or the initial course of a geodesic leg. */
  courseDeg?: number
  /** When the ship is on the leg (epoch ms), to apply zones only while they are in force. */
  startMs?: number
  endMs?: number
}

/** Distance inside one zone on one leg. */
export interface LegZoneDistance { zoneId: number, name: string, kind: ZoneKind, distanceNm: number }
