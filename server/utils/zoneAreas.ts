// Zones as areas for the sea router: no-go areas blocked always, risk areas blocked on request,
// ECAs weighted on request by what a mile inside costs against a mile outside (the ECA grade's
// price over the outside grade's; fuel per mile is the same). Rings are drawn along their geodesic
// edges every few miles, since the router tests membership in the plane of longitude and latitude.
import type { ZoneSummary } from '#shared/types/zone'
import { geodesicDensify } from '#shared/utils/geodesic'

export type ZoneRouteArea = { rings: [number, number][][], mode: 'block' } | { rings: [number, number][][], mode: 'weight', factor: number }
export type AvoidZoneKind = 'risk' | 'eca'

// Blocked rings are drawn finely (a 10-nm geodesic piece is within 0.01 nm of its chord); weighted ones coarser.
const BLOCK_STEP_NM = 10
const WEIGHT_STEP_NM = 30

function denseRing(ring: [number, number][], stepNm: number): [number, number][] {
  const out: [number, number][] = []
  let offset = 0
  for (let i = 1; i < ring.length; i++) {
    const pts = geodesicDensify({ lat: ring[i - 1]![1], lon: ring[i - 1]![0] }, { lat: ring[i]![1], lon: ring[i]![0] }, stepNm)
    for (let k = i === 1 ? 0 : 1; k < pts.length; k++) {
      let lon = pts[k]!.lon + offset
      const prev = out.at(-1)
      if (prev) {
        while (lon - prev[0] > 180) { lon -= 360; offset -= 360 }
        while (lon - prev[0] < -180) { lon += 360; offset += 360 }
      }
      out.push([lon, pts[k]!.lat])
    }
  }
  return out
}

/** Whether the zone is in force at a time (whole UTC days, validTo inclusive). */
function inForce(z: ZoneSummary, atMs: number) {
  if (z.validFrom && Date.parse(`${z.validFrom}T00:00:00Z`) > atMs) return false
  if (z.validTo && Date.parse(`${z.validTo}T00:00:00Z`) + 86_400_000 <= atMs) return false
  return true
}

export function zoneRouteAreas(zones: readonly ZoneSummary[], avoid: readonly AvoidZoneKind[], ecaFactor: number, atMs = Date.now()): ZoneRouteArea[] {
  return zones.filter(z => inForce(z, atMs)).flatMap((z) => {
    const mode = z.kind === 'no-go' || (z.kind === 'risk' && avoid.includes('risk')) ? 'block' : z.kind === 'eca' && avoid.includes('eca') ? 'weight' : null
    if (!mode) return []
    return z.geometry.coordinates.map(poly => (mode === 'block'
      ? { rings: poly.map(r => denseRing(r, BLOCK_STEP_NM)), mode }
      : { rings: poly.map(r => denseRing(r, WEIGHT_STEP_NM)), mode, factor: ecaFactor }))
  })
}
