// Zones on the plan chart, in Passagewright's own zone style (olive dashes for ECAs, a heavy
// plum outline for no-go areas, burnt-orange dots for risk areas, slate dash-dots for own areas).
// Leaflet is passed in by the client-only chart component: this file must not import it.
import type * as Leaflet from 'leaflet'
import type { ZoneSummary } from '#shared/types/zone'
import type { ZoneKind } from '#shared/utils/zones/types'
import { geodesicDensify } from '#shared/utils/geodesic'

export const ZONE_STYLES: Record<ZoneKind, { color: string, weight: number, dashArray?: string, fillOpacity: number }> = {
  'eca': { color: '#5f6f22', weight: 1.5, dashArray: '8 5', fillOpacity: 0.07 },
  'no-go': { color: '#7a1f3d', weight: 2.5, fillOpacity: 0.2 },
  'risk': { color: '#b4531f', weight: 2, dashArray: '1 5', fillOpacity: 0.1 },
  'custom': { color: '#51508a', weight: 1.5, dashArray: '10 4 2 4', fillOpacity: 0.08 },
}

/** A ring drawn along its geodesic edges (points at most 60 nm apart), longitudes continuous. */
function drawnRing(ring: [number, number][]): [number, number][] {
  const out: [number, number][] = []
  let offset = 0
  for (let i = 1; i < ring.length; i++) {
    const pts = geodesicDensify({ lat: ring[i - 1]![1], lon: ring[i - 1]![0] }, { lat: ring[i]![1], lon: ring[i]![0] }, 60)
    for (let k = i === 1 ? 0 : 1; k < pts.length; k++) {
      let lon = pts[k]!.lon + offset
      const prev = out.at(-1)
      if (prev) {
        while (lon - prev[1] > 180) { lon -= 360; offset -= 360 }
        while (lon - prev[1] < -180) { lon += 360; offset += 360 }
      }
      out.push([pts[k]!.lat, lon])
    }
  }
  return out
}

export function useChartZones(L: typeof Leaflet, map: Leaflet.Map) {
  const group = L.layerGroup()
  let drawnFor: ZoneSummary[] | null = null

  function draw(zones: ZoneSummary[]) {
    group.clearLayers()
    for (const z of zones) {
      const s = ZONE_STYLES[z.kind]
      const rings = z.geometry.coordinates.map(poly => poly.map(drawnRing))
      // Copies a turn of the globe either side, so a zone shows beside a track drawn across 180°.
      for (const shift of [-360, 0, 360]) {
        const latlngs = rings.map(poly => poly.map(ring => ring.map(([lat, lon]) => [lat, lon + shift] as [number, number])))
        // Clicks go on to the map (placing waypoints on a zone); the name shows as a tooltip.
        L.polygon(latlngs, { ...s, fillColor: s.color, interactive: true, bubblingMouseEvents: true, className: `pw-zone pw-zone--${z.kind}`, smoothFactor: 0.5 })
          .bindTooltip(`${z.name}${z.approximate ? ' (approximate outline)' : ''}`, { sticky: true })
          .addTo(group)
      }
    }
    drawnFor = zones
  }

  function update(zones: ZoneSummary[], visible: boolean) {
    if (zones !== drawnFor) draw(zones)
    if (visible && !map.hasLayer(group)) group.addTo(map)
    if (!visible && map.hasLayer(group)) group.remove()
    // Under the track and its markers.
    group.eachLayer(l => (l as Leaflet.Path).bringToBack?.())
  }

  return { update }
}
