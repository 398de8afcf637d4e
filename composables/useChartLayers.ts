// Leaflet layers of the plan chart, made once per map and updated in place from a ChartGeometry
// (setLatLngs / setLatLng), so an edit or a drag never recreates the map or its paths.
// Leaflet is passed in by the client-only chart component: this file must not import it (server build).
import type * as Leaflet from 'leaflet'
import type { LatLon } from '#shared/types/geo'
import { formatLatitude } from '#shared/utils/position'
import type { ChartGeometry, ChartLandMark } from './useChartGeometry'

/** Passagewright's chart colours (our own palette: teal ink, brass, violet, red-brown). */
export const CHART_COLOURS = {
  track: '#1f5e5b',
  halo: '#fbfaf6',
  rhumb: '#c0832a',
  ellipse: '#7a4fb0',
  corridor: '#3b7976',
  limit: '#8a3b24',
  vertex: '#c0832a',
} as const

export interface ChartLayerHandlers {
  dragStart: (i: number) => void
  drag: (i: number, at: LatLon) => void
  dragEnd: (i: number, at: LatLon) => void
  select: (i: number) => void
}

export interface ChartMarkerState { editable: boolean, selected: number | null, names: string[] }

const ll = (points: LatLon[]) => points.map(p => [p.lat, p.lon] as [number, number])

export function useChartLayers(L: typeof Leaflet, map: Leaflet.Map, on: ChartLayerHandlers) {
  const C = CHART_COLOURS
  // Leaflet simplifies paths to 1 px by default, which shows as kinks on a long geodesic's curve.
  const smoothFactor = 0.25
  const corridor = L.polygon([], { color: C.corridor, weight: 1, opacity: 0.45, fillColor: C.corridor, fillOpacity: 0.2, interactive: false, className: 'pw-corridor', smoothFactor }).addTo(map)
  const limit = L.polyline([], { color: C.limit, weight: 1.5, dashArray: '10 4 2 4', interactive: false, className: 'pw-limit-parallel' }).addTo(map)
  const rhumb = L.polyline([], { color: C.rhumb, weight: 2, dashArray: '9 6', interactive: false, className: 'pw-rhumb-alternative' }).addTo(map)
  const halo = L.polyline([], { color: C.halo, weight: 7, opacity: 0.75, interactive: false, smoothFactor }).addTo(map)
  const track = L.polyline([], { color: C.track, weight: 3, interactive: false, className: 'pw-track', smoothFactor }).addTo(map)
  // Above the track: the great ellipse runs within a few miles of a geodesic and would hide under it.
  const ellipse = L.polyline([], { color: C.ellipse, weight: 3, dashArray: '0.5 8', lineCap: 'round', interactive: false, className: 'pw-great-ellipse', smoothFactor }).addTo(map)
  const vertexLayer = L.layerGroup().addTo(map)
  const landLayer = L.layerGroup().addTo(map)
  const markers: { marker: Leaflet.Marker, look: string, at: string }[] = []
  let vertexMarkers = new Map<string, Leaflet.Marker>()
  let dragging = -1

  function makeMarker(i: number) {
    const marker = L.marker([0, 0], { keyboard: false, autoPan: true })
    const at = (): LatLon => { const p = marker.getLatLng(); return { lat: Math.max(-89, Math.min(89, p.lat)), lon: p.lng } }
    marker.on('dragstart', () => { dragging = i; on.dragStart(i) })
    marker.on('drag', () => on.drag(i, at()))
    marker.on('dragend', () => { dragging = -1; on.dragEnd(i, at()) })
    marker.on('click', () => on.select(i))
    return { marker: marker.addTo(map), look: '', at: '' }
  }

  function updateMarkers(points: LatLon[], state: ChartMarkerState) {
    while (markers.length > points.length) markers.pop()!.marker.remove()
    while (markers.length < points.length) markers.push(makeMarker(markers.length))
    points.forEach((p, i) => {
      const m = markers[i]!
      // Only markers that moved touch the DOM: a 500-waypoint plan redraws within a frame.
      const at = `${p.lat},${p.lon}`
      if (i !== dragging && m.at !== at) { m.marker.setLatLng([p.lat, p.lon]); m.at = at }
      const look = `${state.selected === i}|${state.names[i] ?? ''}`
      if (m.look !== look && i !== dragging) {
        const cls = `pw-waypoint-marker${state.selected === i ? ' pw-waypoint-marker--selected' : ''}`
        m.marker.setIcon(L.divIcon({ className: cls, html: `<span>${i + 1}</span>`, iconSize: [22, 22], iconAnchor: [11, 11] }))
        m.marker.getElement()?.setAttribute('title', `${i + 1}${state.names[i] ? ` ${state.names[i]}` : ''}`)
        m.marker.getElement()?.setAttribute('data-index', String(i))
        m.look = look
      }
      if (m.marker.dragging && m.marker.dragging.enabled() !== state.editable) (state.editable ? m.marker.dragging.enable() : m.marker.dragging.disable())
    })
  }

  // Vertices are keyed by leg and position: unchanged legs keep their marker.
  function updateVertices(g: ChartGeometry) {
    const next = new Map<string, Leaflet.Marker>()
    for (const v of g.vertices) {
      const key = `${v.legIndex}|${v.lat}|${v.lon}`
      const label = `Vertex of leg ${v.legIndex + 1}: ${formatLatitude(v.lat, 1)}`
      next.set(key, vertexMarkers.get(key) ?? L.marker([v.lat, v.lon], { keyboard: false, zIndexOffset: -500, title: label, icon: L.divIcon({ className: 'pw-vertex-marker', iconSize: [12, 12], iconAnchor: [6, 6] }) })
        .bindTooltip(label, { direction: 'top', offset: [0, -6] })
        .addTo(vertexLayer))
    }
    for (const [key, m] of vertexMarkers) if (!next.has(key)) vertexLayer.removeLayer(m)
    vertexMarkers = next
  }

  function updateLand(marks: ChartLandMark[]) {
    if (!marks.length && !landLayer.getLayers().length) return
    landLayer.clearLayers()
    for (const m of marks) {
      const label = m.kind === 'crossing' ? `Leg ${m.legIndex + 1} crosses land here` : `Leg ${m.legIndex + 1} passes ${m.closestNm.toFixed(1)} nm from this coast`
      L.marker([m.lat, m.lon], { keyboard: false, zIndexOffset: -1000, title: label, icon: L.divIcon({ className: `pw-land-mark pw-land-mark--${m.kind}`, html: m.kind === 'crossing' ? '✕' : '!', iconSize: [16, 16], iconAnchor: [8, 8] }) })
        .bindTooltip(label, { direction: 'top', offset: [0, -8] })
        .addTo(landLayer)
    }
  }

  function update(g: ChartGeometry, state: ChartMarkerState) {
    track.setLatLngs(ll(g.track))
    halo.setLatLngs(ll(g.track))
    rhumb.setLatLngs(g.rhumbAlternatives.map(ll))
    ellipse.setLatLngs(g.greatEllipses.map(ll))
    corridor.setLatLngs(g.corridors.map(r => [ll(r)]))
    limit.setLatLngs(g.limitParallel ? ll(g.limitParallel) : [])
    updateVertices(g)
    updateMarkers(g.waypoints, state)
  }

  function fit(g: ChartGeometry) {
    if (!g.bounds) return
    const { south, west, north, east } = g.bounds
    map.fitBounds([[south, west], [north, east]], { padding: [28, 28], maxZoom: 7 })
  }

  return { update, updateLand, fit }
}
