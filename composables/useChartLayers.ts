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

/** Markers closer than this on screen are fanned out round their common place, each on a leader to its position. */
const OVERLAP_PX = 18

/**
 * Screen offsets for markers that would hide each other at this zoom: each group of overlapping
 * markers is spread on a circle round the first one's place (Leaflet moves the icon by its anchor,
 * the marker's position stays the waypoint's).
 */
export function fanOffsets(at: Map<number, { x: number, y: number }>): Map<number, { dx: number, dy: number, r: number, deg: number }> {
  const groups: { x: number, y: number, members: number[] }[] = []
  for (const [i, p] of at) {
    const g = groups.find(g => Math.hypot(g.x - p.x, g.y - p.y) < OVERLAP_PX)
    if (g) g.members.push(i)
    else groups.push({ x: p.x, y: p.y, members: [i] })
  }
  const out = new Map<number, { dx: number, dy: number, r: number, deg: number }>()
  for (const g of groups) {
    const n = g.members.length
    if (n < 2) continue
    const r = Math.max(14, (26 * n) / (2 * Math.PI))
    g.members.forEach((i, k) => {
      // The first to the west, the rest round clockwise: two side by side on the track.
      const deg = 180 + (360 * k) / n
      const p = at.get(i)!
      // Offsets from each marker's own place to its slot round the group's centre.
      const dx = g.x + r * Math.cos((deg * Math.PI) / 180) - p.x, dy = g.y + r * Math.sin((deg * Math.PI) / 180) - p.y
      out.set(i, { dx, dy, r: Math.hypot(dx, dy), deg: (Math.atan2(-dy, -dx) * 180) / Math.PI })
    })
  }
  return out
}

/** Leaflet's scale bar in nautical miles (its imperial bar, re-labelled; Leaflet 1.9 Control.Scale). */
export function nauticalScale(L: typeof Leaflet): Leaflet.Control {
  const Scale = (L.Control.Scale as unknown as { extend: (p: object) => new (o: Leaflet.Control.ScaleOptions) => Leaflet.Control }).extend({
    _updateImperial(this: { _getRoundNum: (n: number) => number, _updateScale: (el: unknown, text: string, ratio: number) => void, _iScale: unknown }, maxMeters: number) {
      const maxNm = maxMeters / 1852
      const nm = this._getRoundNum(maxNm)
      this._updateScale(this._iScale, `${nm} nm`, nm / maxNm)
    },
  })
  return new Scale({ metric: false, imperial: true, position: 'bottomleft', maxWidth: 120 })
}

const ll = (points: LatLon[]) => points.map(p => [p.lat, p.lon] as [number, number])

/**
 * Waypoint markers drawn at most: beyond this, only the waypoints in view get one, every k-th of
 * them (and always the ends and the selected one). Thousands overlap into one bead string at an
 * ocean's scale and slow every frame; zooming in shows each one.
 */
const MAX_MARKERS = 400

/** Legs per drawn path: a long plan is drawn in pieces so that an edit redraws only the pieces it touches. */
const LEGS_PER_PATH = 200

/** Each line of the chart as one path per run of LEGS_PER_PATH legs, in its own pane so the runs stack like one line. */
function chunkedLine(map: Leaflet.Map, pane: string, zIndex: number, make: (pane: string) => Leaflet.Polyline<any>) {
  map.createPane(pane).style.zIndex = String(zIndex)
  const paths: Leaflet.Polyline<any>[] = []
  const drawn: unknown[][] = []
  /** Sets run c's lines from its parts, unless they are the very objects it shows already. */
  function update(c: number, parts: unknown[], latlngs: () => Leaflet.LatLngExpression[] | Leaflet.LatLngExpression[][] | Leaflet.LatLngExpression[][][]) {
    const before = drawn[c]
    if (paths[c] && before && before.length === parts.length && before.every((p, k) => p === parts[k])) return
    if (!paths[c]) paths[c] = make(pane).addTo(map)
    paths[c]!.setLatLngs(latlngs())
    drawn[c] = parts
  }
  function trim(runs: number) {
    while (paths.length > Math.max(runs, 1)) { paths.pop()!.remove(); drawn.pop() }
    if (!paths.length) paths.push(make(pane).addTo(map))
    if (runs === 0) { paths[0]!.setLatLngs([]); drawn.length = 0 }
  }
  return { update, trim }
}

export function useChartLayers(L: typeof Leaflet, map: Leaflet.Map, on: ChartLayerHandlers) {
  const C = CHART_COLOURS
  // Leaflet simplifies paths to 1 px by default, which shows as kinks on a long geodesic's curve.
  const smoothFactor = 0.25
  const corridor = chunkedLine(map, 'pwCorridor', 401, pane => L.polygon([], { pane, color: C.corridor, weight: 1, opacity: 0.45, fillColor: C.corridor, fillOpacity: 0.2, interactive: false, className: 'pw-corridor', smoothFactor }))
  map.createPane('pwLimit').style.zIndex = '402'
  const limit = L.polyline([], { pane: 'pwLimit', color: C.limit, weight: 1.5, dashArray: '10 4 2 4', interactive: false, className: 'pw-limit-parallel' }).addTo(map)
  const rhumb = chunkedLine(map, 'pwRhumb', 403, pane => L.polyline([], { pane, color: C.rhumb, weight: 2, dashArray: '9 6', interactive: false, className: 'pw-rhumb-alternative' }))
  const halo = chunkedLine(map, 'pwHalo', 404, pane => L.polyline([], { pane, color: C.halo, weight: 7, opacity: 0.75, interactive: false, smoothFactor }))
  const track = chunkedLine(map, 'pwTrack', 405, pane => L.polyline([], { pane, color: C.track, weight: 3, interactive: false, className: 'pw-track', smoothFactor }))
  // Above the track: the great ellipse runs within a few miles of a geodesic and would hide under it.
  map.createPane('pwEllipse').style.zIndex = '406'
  const ellipse = L.polyline([], { pane: 'pwEllipse', color: C.ellipse, weight: 3, dashArray: '0.5 8', lineCap: 'round', interactive: false, className: 'pw-great-ellipse', smoothFactor }).addTo(map)
  const vertexLayer = L.layerGroup().addTo(map)
  const landLayer = L.layerGroup().addTo(map)
  const markers = new Map<number, { marker: Leaflet.Marker, selected: boolean | null, name: string, lat: number, lon: number, fan: string }>()
  let vertexMarkers = new Map<string, Leaflet.Marker>()
  let dragging = -1
  let shown: { points: LatLon[], state: ChartMarkerState } | null = null

  function makeMarker(i: number) {
    const marker = L.marker([0, 0], { keyboard: false, autoPan: true })
    const at = (): LatLon => { const p = marker.getLatLng(); return { lat: Math.max(-89, Math.min(89, p.lat)), lon: p.lng } }
    marker.on('dragstart', () => { dragging = i; on.dragStart(i) })
    marker.on('drag', () => on.drag(i, at()))
    marker.on('dragend', () => { dragging = -1; on.dragEnd(i, at()) })
    marker.on('click', () => on.select(i))
    return { marker: marker.addTo(map), selected: null as boolean | null, name: '', lat: Number.NaN, lon: Number.NaN, fan: '' }
  }

  /** Which waypoints get a marker: all of them, or in a long plan those in view, thinned to MAX_MARKERS. */
  function markedIndices(points: LatLon[], state: ChartMarkerState): Iterable<number> {
    if (points.length <= MAX_MARKERS) return points.keys()
    const view = map.getBounds().pad(0.25)
    const inView: number[] = []
    points.forEach((p, i) => { if (view.contains([p.lat, p.lon])) inView.push(i) })
    const step = Math.ceil(inView.length / MAX_MARKERS)
    const out = new Set(step > 1 ? inView.filter((_, k) => k % step === 0) : inView)
    for (const i of [0, points.length - 1, state.selected ?? -1, dragging]) if (i >= 0 && i < points.length) out.add(i)
    return out
  }

  function updateMarkers(points: LatLon[], state: ChartMarkerState) {
    shown = { points, state }
    const wanted = new Set(markedIndices(points, state))
    for (const [i, m] of markers) if (!wanted.has(i)) { m.marker.remove(); markers.delete(i) }
    const fans = fanOffsets(new Map([...wanted].map(i => [i, map.latLngToLayerPoint([points[i]!.lat, points[i]!.lon])])))
    for (const i of wanted) {
      const p = points[i]!
      let m = markers.get(i)
      if (!m) markers.set(i, m = makeMarker(i))
      // Only markers that moved touch the DOM: a 500-waypoint plan redraws within a frame.
      if (i !== dragging && (m.lat !== p.lat || m.lon !== p.lon)) { m.marker.setLatLng([p.lat, p.lon]); m.lat = p.lat; m.lon = p.lon }
      const selected = state.selected === i
      const name = state.names[i] ?? ''
      const f = fans.get(i)
      const fan = f ? `${Math.round(f.dx)},${Math.round(f.dy)}` : ''
      if ((m.selected !== selected || m.name !== name || m.fan !== fan) && i !== dragging) {
        const cls = `pw-waypoint-marker${selected ? ' pw-waypoint-marker--selected' : ''}${f ? ' pw-waypoint-marker--fanned' : ''}`
        // A fanned marker keeps a leader line back to where the waypoint is.
        const leader = f ? `<i class="pw-fan-leader" style="width:${Math.max(0, f.r - 11).toFixed(1)}px;transform:rotate(${f.deg.toFixed(1)}deg) translateX(11px)"></i>` : ''
        m.marker.setIcon(L.divIcon({ className: cls, html: `${leader}<span>${i + 1}</span>`, iconSize: [22, 22], iconAnchor: [11 - Math.round(f?.dx ?? 0), 11 - Math.round(f?.dy ?? 0)] }))
        m.marker.getElement()?.setAttribute('title', `${i + 1}${name ? ` ${name}` : ''}`)
        m.marker.getElement()?.setAttribute('data-index', String(i))
        if (f) m.marker.getElement()?.setAttribute('data-fanned', '')
        else m.marker.getElement()?.removeAttribute('data-fanned')
        m.selected = selected
        m.name = name
        m.fan = fan
      }
      if (m.marker.dragging && m.marker.dragging.enabled() !== state.editable) (state.editable ? m.marker.dragging.enable() : m.marker.dragging.disable())
    }
  }
  // Panning or zooming a long plan brings other waypoints into view.
  map.on('moveend', () => { if (shown && shown.points.length > MAX_MARKERS) updateMarkers(shown.points, shown.state) })
  // Markers that overlap at one zoom stand apart at another: fan them anew.
  map.on('zoomend', () => { if (shown) updateMarkers(shown.points, shown.state) })

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

  /** The track (with its halo), rhumb alternatives and corridors, redrawn only in the runs of legs that changed. */
  function updateLines(g: ChartGeometry) {
    const runs = Math.ceil(g.pieces.length / LEGS_PER_PATH)
    for (const line of [track, halo, rhumb, corridor]) line.trim(runs)
    for (let c = 0; c < runs; c++) {
      const parts = g.pieces.slice(c * LEGS_PER_PATH, (c + 1) * LEGS_PER_PATH)
      const joined = () => ll([parts[0]!.track[0]!, ...parts.flatMap(p => p.track.slice(1))])
      track.update(c, parts, joined)
      halo.update(c, parts, joined)
      const rhumbs = parts.map(p => p.rhumb).filter(r => r != null)
      rhumb.update(c, rhumbs, () => rhumbs.map(ll))
      const rings = parts.map(p => p.corridor).filter(r => r != null)
      corridor.update(c, rings, () => rings.map(r => [ll(r)]))
    }
  }

  function update(g: ChartGeometry, state: ChartMarkerState) {
    updateLines(g)
    ellipse.setLatLngs(g.greatEllipses.map(ll))
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
