// A suggested sea route on the plan chart, before it is accepted: a dashed indigo line over the
// track with a pale halo, its passages as small brass squares named on hover, and with a
// minimum-ECA comparison the shortest route as a thin slate line beside it.
// Leaflet is passed in by the client-only chart component: this file must not import it.
import type * as Leaflet from 'leaflet'
import type { LatLon } from '#shared/types/geo'
import type { SeaRoutePreview } from '~/stores/seaRoutePreview'
import { densifyRoute, unwrapLongitudes } from '#shared/utils/track'

export const PREVIEW_COLOURS = { route: '#2f3f8f', halo: '#fbfaf6', shortest: '#56657a', passage: '#c0832a' } as const

/** Points of a geodesic line every 25 nm, its longitudes continuous and starting near `anchorLon`. */
function drawn(points: readonly LatLon[], anchorLon: number): [number, number][] {
  const line = unwrapLongitudes(densifyRoute(points.map(p => ({ ...p, method: 'geodesic' as const })), 25))
  const shift = Math.round((anchorLon - line[0]!.lon) / 360) * 360
  return line.map(p => [p.lat, p.lon + shift])
}

export function useChartRoutePreview(L: typeof Leaflet, map: Leaflet.Map) {
  map.createPane('pw-preview').style.zIndex = '640'
  const group = L.layerGroup().addTo(map)
  let shownFor: SeaRoutePreview | null = null

  function update(p: SeaRoutePreview | null) {
    if (p === shownFor) return
    shownFor = p
    group.clearLayers()
    if (!p) return
    // Where the chart draws waypoint `from`: the track is unwrapped from the plan's first waypoint.
    const anchorLon = unwrapLongitudes(p.basis.slice(0, p.from + 1)).at(-1)!.lon
    const added = p.proposed.length - p.basis.length + p.replaces
    const piece = p.proposed.slice(p.from, p.from + added + 2)
    const line = drawn(piece, anchorLon)
    const pane = 'pw-preview'
    L.polyline(line, { pane, color: PREVIEW_COLOURS.halo, weight: 7, opacity: 0.8, interactive: false }).addTo(group)
    L.polyline(line, { pane, color: PREVIEW_COLOURS.route, weight: 3, dashArray: '9 6', interactive: false, className: 'pw-route-preview' }).addTo(group)
    const shortest = p.result.ecaComparison?.shortest.waypoints
    if (shortest && shortest.length > 1)
      L.polyline(drawn(shortest, anchorLon), { pane, color: PREVIEW_COLOURS.shortest, weight: 1.5, dashArray: '2 5', interactive: false, className: 'pw-route-shortest' }).addTo(group)
    for (const w of p.result.waypoints.slice(1, -1)) {
      const passage = !!w.passageId
      const at = nearestCopy(w, line)
      L.circleMarker(at, { pane, radius: passage ? 4 : 3, color: PREVIEW_COLOURS.route, weight: 1.5, fillColor: passage ? PREVIEW_COLOURS.passage : PREVIEW_COLOURS.halo, fillOpacity: 1, className: 'pw-route-preview-point' })
        .bindTooltip(w.name, { direction: 'top', offset: [0, -4] })
        .addTo(group)
    }
    map.fitBounds(L.latLngBounds(line), { padding: [28, 28], maxZoom: 7 })
  }

  return { update }
}

/** The point at the longitude copy (±360°) nearest the drawn line, so markers sit on it across 180°. */
function nearestCopy(p: LatLon, line: [number, number][]): [number, number] {
  let best = p.lon
  let gap = Infinity
  for (const shift of [-360, 0, 360]) {
    const lon = p.lon + shift
    for (let k = 0; k < line.length; k += 8) {
      const d = Math.abs(line[k]![1] - lon)
      if (d < gap) { gap = d; best = lon }
    }
  }
  return [p.lat, best]
}
