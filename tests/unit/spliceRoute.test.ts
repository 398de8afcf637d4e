// Laying a suggested sea route into a waypoint list (shared/utils/routing/spliceRoute.ts). The
// positions are invented; what is checked is which waypoints stay, go and come in, in order.
import { describe, expect, it } from 'vitest'
import type { RouteWaypoint } from '../../shared/types/routing'
import type { Waypoint } from '../../shared/types/waypoint'
import { spliceSeaRoute } from '../../shared/utils/routing/spliceRoute'

const wp = (name: string, lat: number, lon: number, extra: Partial<Waypoint> = {}): Waypoint =>
  ({ name, lat, lon, method: 'rhumb', speedKn: 12, xteNm: 1, turnRadiusNm: null, notes: null, ...extra })
const rw = (name: string, lat: number, lon: number, passageId?: string): RouteWaypoint =>
  ({ name, lat, lon, method: 'geodesic', ...(passageId ? { passageId } : {}) })

const plan = [wp('A', 10, 10), wp('B', 11, 12), wp('C', 12, 14, { notes: 'goes' }), wp('D', 13, 16, { speedKn: 9 }), wp('E', 14, 18)]

describe('spliceSeaRoute', () => {
  it('replaces only the waypoints strictly between the two chosen ones, keeping both as written', () => {
    const route = [rw('Departure', 11, 12), rw('SR 01', 11.5, 13), rw('Canal 1', 12.5, 15, 'suez'), rw('Arrival', 13, 16)]
    const out = spliceSeaRoute(plan, 1, 3, route)
    expect(out.map(w => w.name)).toEqual(['A', 'B', 'SR 01', 'Canal 1', 'D', 'E'])
    expect(out[0]).toBe(plan[0])
    expect(out[1]).toBe(plan[1])
    expect(out[5]).toBe(plan[4])
    // The leg into D is now the route's last geodesic leg; D keeps its own speed and limits.
    expect(out[4]).toEqual({ ...plan[3], method: 'geodesic' })
    expect(out.slice(2, 4).every(w => w.method === 'geodesic' && w.speedKn === null && w.xteNm === null)).toBe(true)
    expect(plan.map(w => w.name)).toEqual(['A', 'B', 'C', 'D', 'E'])
  })

  it('keeps an end the router moved onto navigable water as an extra waypoint named after the planner\'s', () => {
    const route = [rw('Departure', 10.1, 10.1), rw('SR 01', 12, 14), rw('Arrival', 14, 18)]
    const out = spliceSeaRoute(plan, 0, 4, route)
    expect(out.map(w => w.name)).toEqual(['A', 'Off A', 'SR 01', 'E'])
    expect(out[1]).toMatchObject({ lat: 10.1, lon: 10.1, method: 'geodesic' })
  })

  it('writes longitudes in −180..180 whatever the router sent', () => {
    const list = [wp('West', 50, 170), wp('East', 50, -170)]
    const out = spliceSeaRoute(list, 0, 1, [rw('Departure', 50, 170), rw('SR 01', 51, 185), rw('Arrival', 50, -170)])
    expect(out[1]!.lon).toBeCloseTo(-175, 9)
  })

  it('refuses ends in the wrong order and a route without legs', () => {
    expect(() => spliceSeaRoute(plan, 3, 1, [rw('a', 0, 0), rw('b', 1, 1)])).toThrow(/first before the second/)
    expect(() => spliceSeaRoute(plan, 0, 9, [rw('a', 0, 0), rw('b', 1, 1)])).toThrow()
    expect(() => spliceSeaRoute(plan, 0, 1, [rw('a', 0, 0)])).toThrow(/no legs/)
  })
})
