// The routing coastline: Natural Earth 1:10m land (public domain, world-atlas 2.0.2) indexed the
// same way as the 1:50m land check (server/utils/land.ts), plus the geometric tests the router needs.
import type { Topology } from 'topojson-specification'
import { normaliseLongitude } from '#shared/utils/position'
import { buildLandData, crossingParam, isLandIn, nearestCoast } from '../land'
import type { LandData } from '../land'

/** The indexed 1:10m land (about 1.5 s); the 3 MB topology is loaded only when the graph is built. */
export async function buildRoutingLand(): Promise<LandData> {
  const land10m = await import('world-atlas/land-10m.json')
  return buildLandData((land10m.default ?? land10m) as unknown as Topology)
}

export const NM_PER_DEG_LAT = 60

/** Whether a planar lon/lat chord (b unwrapped next to a, within ±180 of a) crosses a coastline edge. */
export function chordCrossesLand(d: LandData, ax: number, ay: number, bx: number, by: number): boolean {
  const test = (x1: number, y1: number, x2: number, y2: number) => d.edgeIndex.collides(
    Math.min(x1, x2), Math.min(y1, y2), Math.max(x1, x2), Math.max(y1, y2),
    e => !d.artificial[e] && crossingParam(d, e, x1, y1, x2, y2) >= 0,
  )
  if (bx >= -180 && bx <= 180 && ax >= -180 && ax <= 180) return test(ax, ay, bx, by)
  // Across the 180° meridian: test both copies (rings reaching past 180° also have a copy 360° west).
  const shift = bx > 180 || ax > 180 ? -360 : 360
  return test(ax, ay, bx, by) || test(ax + shift, ay, bx + shift, by)
}

/** Distance in nm to the nearest coastline (local equirectangular frame), or capNm when none is nearer. */
export function coastDistanceNm(d: LandData, lat: number, lon: number, capNm: number, hint = -1): { nm: number, edge: number } {
  const near = nearestCoast(d, { lat, lon }, hint, capNm / NM_PER_DEG_LAT)
  return near.edge < 0 ? { nm: capNm, edge: hint } : { nm: NM_PER_DEG_LAT * Math.sqrt(near.d2), edge: near.edge }
}

export function isRoutingLand(d: LandData, lat: number, lon: number): boolean {
  return isLandIn(d, lat, normaliseLongitude(lon))
}
