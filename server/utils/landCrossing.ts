// Whether a direct geodesic crosses the coarse coastline, for distance tables. Cheaper than
// checkTrack (no closest approach, stops at the first crossing): the geodesic is sampled
// every LAND_STEP_NM and each chord between samples is tested against the coastline edges,
// so no coastline between samples is missed; only the chord's departure from the curve
// (well under a mile at this step) is approximated.
import geodesic from 'geographiclib-geodesic'
import { landData, normalizeLon } from './land'
import { NM_M } from '#shared/utils/navConstants'

export const LAND_STEP_NM = 20

const G = geodesic.Geodesic
const geod = G.WGS84
const LINE_CAPS = G.LATITUDE | G.LONGITUDE | G.DISTANCE_IN

function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return (bx - ax) * (cy - ay) - (by - ay) * (cx - ax)
}

/** True when chord a→b (planar lon/lat, b unwrapped next to a) crosses a coastline edge. */
function chordCrosses(ax: number, ay: number, bx: number, by: number): boolean {
  const d = landData()
  for (const e of d.edgeIndex.search(Math.min(ax, bx), Math.min(ay, by), Math.max(ax, bx), Math.max(ay, by))) {
    if (d.artificial[e]) continue
    const x1 = d.edges[4 * e]!, y1 = d.edges[4 * e + 1]!, x2 = d.edges[4 * e + 2]!, y2 = d.edges[4 * e + 3]!
    if ((orient(ax, ay, bx, by, x1, y1) > 0) === (orient(ax, ay, bx, by, x2, y2) > 0)) continue
    if ((orient(x1, y1, x2, y2, ax, ay) > 0) === (orient(x1, y1, x2, y2, bx, by) > 0)) continue
    return true
  }
  return false
}

/** Does the geodesic from → to cross the coastline (Natural Earth 1:50m)? */
export function geodesicCrossesLand(lat1: number, lon1: number, lat2: number, lon2: number, stepNm = LAND_STEP_NM): boolean {
  const line = geod.InverseLine(lat1, lon1, lat2, lon2, LINE_CAPS)
  const total = line.s13
  const steps = Math.max(1, Math.ceil(total / (stepNm * NM_M)))
  let ax = normalizeLon(lon1), ay = lat1
  for (let i = 1; i <= steps; i++) {
    const p = i === steps ? { lat2: lat2, lon2: lon2 } : line.Position((total * i) / steps, G.LATITUDE | G.LONGITUDE)
    const dx = normalizeLon(p.lon2! - ax)
    const bx = ax + dx, by = p.lat2!
    if (chordCrosses(ax, ay, bx, by)) return true
    ax = normalizeLon(bx)
    ay = by
  }
  return false
}
