// Distance inside each zone per leg and per plan (domain.md, "Distance inside a polygon"): split
// the leg where it crosses the boundary, decide each piece by its midpoint, add the pieces inside.
import { NM_M } from '../navConstants'
import type { LegMethod, LatLon } from '../../types/geo'
import type { PreparedZones } from './prepare'
import { searchWrapped } from './prepare'
import type { LegZoneDistance, ZoneInput, ZoneKind, ZoneLeg } from './types'
import { ZONE_KINDS } from './types'
import { curvePosition, legCurve } from './legCurve'
import { geodesicCrossings, rhumbCrossings } from './crossings'
import { pointInZone } from './inside'

/** A zone applies to a leg when its validity overlaps the time the ship is on the leg (always, without times). */
function applies(zone: ZoneInput, leg: ZoneLeg): boolean {
  if (leg.startMs === undefined || leg.endMs === undefined) return true
  if (zone.validFromMs != null && zone.validFromMs > leg.endMs) return false
  if (zone.validToMs != null && zone.validToMs <= leg.startMs) return false
  return true
}

/**
 * What the zone step knows about a leg's end for the next leg: per zone met (by box) whether the
 * end is inside, or null when a crossing lies within a metre of the end (then the next leg tests).
 */
export type LegEndState = Map<number, boolean | null>

const END_SLACK_M = 1

/**
 * Distances inside every zone the leg enters (split at the boundary on the ellipsoid). `start`
 * (the state at the end of the previous leg, when this leg starts where that one ended) spares
 * the position test of a leg that crosses no boundary.
 */
export function legZoneDistances(prepared: PreparedZones, leg: ZoneLeg, start?: LegEndState, end?: LegEndState): LegZoneDistance[] {
  if (!prepared.zoneIndex) return []
  const c = legCurve(leg)
  if (!(c.lengthM > 0)) return []
  const hits: number[] = []
  searchWrapped(prepared.zoneIndex, c.lonMin, c.latMin, c.lonMax, c.latMax, (i) => {
    if (end) end.set(i, null)
    if (applies(prepared.zones[i]!.zone, leg)) hits.push(i)
  })
  if (hits.length === 0) return []
  const cuts = new Map<number, number[]>(hits.map(i => [i, []]))
  searchWrapped(prepared.edgeIndex, c.lonMin, c.latMin, c.lonMax, c.latMax, (i) => {
    const e = prepared.edges[i]!
    const out = cuts.get(e.zone)
    if (!out) return
    if (c.method === 'geodesic') geodesicCrossings(c, e, out)
    else rhumbCrossings(c, e, out)
  })
  const result: LegZoneDistance[] = []
  for (const zi of hits) {
    const s = cuts.get(zi)!.sort((a, b) => a - b)
    // Without crossings the whole leg is as its start, which the previous leg may already know.
    const known = s.length === 0 && start ? (start.has(zi) ? start.get(zi)! : false) : null
    s.unshift(0)
    s.push(c.lengthM)
    let inside = 0
    let last: boolean | null = null
    for (let k = 1; k < s.length; k++) {
      const piece = s[k]! - s[k - 1]!
      if (piece < 1e-3) continue
      if (known !== null) last = known
      else {
        const mid = curvePosition(c, (s[k]! + s[k - 1]!) / 2)
        last = pointInZone(prepared, zi, mid.lat, mid.lon)
      }
      if (last) inside += piece
    }
    if (end) end.set(zi, s.length > 2 && c.lengthM - s[s.length - 2]! < END_SLACK_M ? null : last)
    const zone = prepared.zones[zi]!.zone
    if (inside > 0) result.push({ zoneId: zone.id, name: zone.name, kind: zone.kind, distanceNm: inside / NM_M })
  }
  return result
}

/** A leg-table leg as the zone step reads it: method, course(s), distance and its ETA. */
export interface ZoneTableLeg {
  from: LatLon
  to: LatLon
  method: LegMethod
  distanceNm: number
  course?: number
  initialCourse?: number
  hours?: number
  etaUtc?: string
}

export interface PlanZoneTotals {
  byZone: LegZoneDistance[]
  byKind: { kind: ZoneKind, distanceNm: number }[]
}

/** Per-leg zone distances for a leg table, using its courses and distances, and their sums by zone and by kind. */
export function planZoneDistances(prepared: PreparedZones, legs: readonly ZoneTableLeg[]): { legs: LegZoneDistance[][], totals: PlanZoneTotals } {
  const byZone = new Map<number, LegZoneDistance>()
  let prevEnd: LegEndState | null = null
  let prevTo: LatLon | null = null
  const perLeg = legs.map((l) => {
    const endMs = l.etaUtc ? Date.parse(l.etaUtc) : undefined
    const startMs = endMs !== undefined && l.hours !== undefined ? endMs - l.hours * 3_600_000 : undefined
    const courseDeg = l.method === 'geodesic' ? l.initialCourse : l.course
    const end: LegEndState = new Map()
    const joined = prevEnd && prevTo && prevTo.lat === l.from.lat && prevTo.lon === l.from.lon ? prevEnd : undefined
    const found = legZoneDistances(prepared, { from: l.from, to: l.to, method: l.method, distanceNm: l.distanceNm, courseDeg, startMs, endMs }, joined, end)
    prevEnd = end
    prevTo = l.to
    for (const z of found) {
      const sum = byZone.get(z.zoneId)
      if (sum) sum.distanceNm += z.distanceNm
      else byZone.set(z.zoneId, { ...z })
    }
    return found
  })
  const zones = [...byZone.values()]
  const byKind = ZONE_KINDS.map(kind => ({ kind, distanceNm: zones.filter(z => z.kind === kind).reduce((s, z) => s + z.distanceNm, 0) }))
  return { legs: perLeg, totals: { byZone: zones, byKind } }
}
