// Fitting a suggested sea route into a plan's waypoint list: the route replaces the waypoints
// strictly between the two chosen ones, which stay as the planner wrote them.
import type { RouteWaypoint } from '../../types/routing'
import type { Waypoint } from '../../types/waypoint'
import { normaliseLongitude } from '../position'

/** Closer than this (about 2 m) the router's end is the planner's waypoint itself. */
const SAME_POINT_DEG = 2e-5

const samePoint = (a: { lat: number, lon: number }, b: { lat: number, lon: number }) =>
  Math.abs(a.lat - b.lat) < SAME_POINT_DEG && Math.abs(normaliseLongitude(a.lon - b.lon)) < SAME_POINT_DEG

/**
 * The list with `route` laid between waypoints `from` and `to` (from < to). The router's ends are
 * kept only where it moved them onto navigable water (the planner's port position lies ashore on the
 * coarse coastline); the route's legs are geodesics, so the leg into `to` becomes one too. Speeds,
 * XTE limits and turn radii of the new waypoints are left empty (the plan's own apply).
 */
export function spliceSeaRoute(list: readonly Waypoint[], from: number, to: number, route: readonly RouteWaypoint[]): Waypoint[] {
  const start = list[from]
  const end = list[to]
  if (!start || !end || from >= to) throw new Error('Choose two waypoints, the first before the second.')
  if (route.length < 2) throw new Error('The route has no legs.')
  const inner = route.slice(1, -1)
  const first = route[0]!
  const last = route.at(-1)!
  const points = [...(samePoint(first, start) ? [] : [{ ...first, name: `Off ${start.name || `WP ${from + 1}`}` }]), ...inner,
    ...(samePoint(last, end) ? [] : [{ ...last, name: `Off ${end.name || `WP ${to + 1}`}` }])]
  const added: Waypoint[] = points.map(p => ({ name: p.name, lat: p.lat, lon: normaliseLongitude(p.lon), method: 'geodesic', speedKn: null, xteNm: null, turnRadiusNm: null, notes: null }))
  return [...list.slice(0, from + 1), ...added, { ...end, method: 'geodesic' }, ...list.slice(to + 1)]
}
