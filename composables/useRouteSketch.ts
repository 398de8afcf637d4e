// A still picture of a route for the import preview and the print: the app's own chart tiles
// (Web Mercator, 256 px, zoom 1–8) laid out under the densified track, all in one SVG viewBox.
import type { LatLon, LegMethod } from '#shared/types/geo'
import { densifyRoute, unwrapLongitudes } from '#shared/utils/track'
import { wrapLongitude } from '#shared/utils/position'

const TILE = 256
const MAX_LAT = 85.0511287798066

export interface SketchOptions { width: number, height: number, maxZoom?: number }
export interface SketchTile { href: string, x: number, y: number }
export interface SketchLabel { text: string, x: number, y: number }

/** Web Mercator world pixels at zoom z (EPSG:3857, spherical, as the tiles are drawn). */
function project(p: LatLon, z: number) {
  const phi = (Math.max(-MAX_LAT, Math.min(MAX_LAT, p.lat)) * Math.PI) / 180
  const size = TILE * 2 ** z
  return { x: ((p.lon + 180) / 360) * size, y: ((1 - Math.log(Math.tan(Math.PI / 4 + phi / 2)) / Math.PI) / 2) * size }
}
function unprojectLat(y: number, z: number) {
  return (Math.atan(Math.sinh(Math.PI - (2 * Math.PI * y) / (TILE * 2 ** z))) * 180) / Math.PI
}

/** Degrees between labels: on the tiles' own graticule lines (server/utils/tiles.ts graticuleStep), at least ~60 output px apart. */
function labelStep(z: number, scale: number) {
  const lineStep = z <= 1 ? 30 : z <= 3 ? 10 : z <= 5 ? 5 : 1
  const pxPerDeg = ((TILE * 2 ** z) / 360) * scale
  return [1, 5, 10, 20, 30, 60, 90].find(s => s % lineStep === 0 && s * pxPerDeg >= 60) ?? 90
}

function labelFor(value: number, axis: 'lat' | 'lon') {
  const v = axis === 'lon' ? wrapLongitude(value) : value
  const hemi = axis === 'lat' ? (v > 0 ? 'N' : v < 0 ? 'S' : '') : (v > 0 && v < 180 ? 'E' : v < 0 && v > -180 ? 'W' : '')
  return `${Math.abs(Math.round(v))}°${hemi}`
}

export function buildRouteSketch(waypoints: readonly (LatLon & { method?: LegMethod })[], o: SketchOptions) {
  if (waypoints.length < 2) return null
  const track = unwrapLongitudes(densifyRoute(waypoints, 25))
  const marks = unwrapLongitudes(waypoints.map(w => ({ lat: w.lat, lon: w.lon })))
  // The marks are unwrapped on their own; shift them onto the track's copy of the world.
  const shift = Math.round((track[0]!.lon - marks[0]!.lon) / 360) * 360
  const box0 = track.map(p => project(p, 0))
  const [minX, maxX] = [Math.min(...box0.map(p => p.x)), Math.max(...box0.map(p => p.x))]
  const [minY, maxY] = [Math.min(...box0.map(p => p.y)), Math.max(...box0.map(p => p.y))]
  // Output pixels per zoom-0 pixel so the track fills the picture with a margin; the nearest tile
  // zoom is then scaled by at most √2 either way.
  const fit = Math.min(o.width / Math.max(maxX - minX, 0.02), o.height / Math.max(maxY - minY, 0.02)) / 1.2
  const z = Math.max(1, Math.min(o.maxZoom ?? 8, Math.round(Math.log2(fit))))
  const k = 2 ** z
  const scale = Math.min(fit, k * 1.42) / k
  const [w, h] = [o.width / scale, Math.min(o.height / scale, TILE * k)]
  const cx = ((minX + maxX) / 2) * k, cy = ((minY + maxY) / 2) * k
  const vb = { x: cx - w / 2, y: Math.max(0, Math.min(TILE * k - h, cy - h / 2)), w, h }
  const tiles: SketchTile[] = []
  for (let ty = Math.max(0, Math.floor(vb.y / TILE)); ty <= Math.min(k - 1, Math.floor((vb.y + vb.h) / TILE)); ty++) {
    for (let tx = Math.floor(vb.x / TILE); tx <= Math.floor((vb.x + vb.w) / TILE); tx++)
      tiles.push({ href: `/tiles/${z}/${((tx % k) + k) % k}/${ty}.png`, x: tx * TILE, y: ty * TILE })
  }
  const line = track.map(p => project(p, z)).map(p => `${p.x.toFixed(1)},${p.y.toFixed(1)}`).join(' ')
  const points = marks.map(m => project({ lat: m.lat, lon: m.lon + shift }, z))
  return { viewBox: `${vb.x.toFixed(1)} ${vb.y.toFixed(1)} ${vb.w.toFixed(1)} ${vb.h.toFixed(1)}`, scale, vb, zoom: z, tiles, line, points, labels: gridLabels(vb, z, scale) }
}

/** Latitude labels down the left edge and longitude labels along the bottom, at round degrees. */
function gridLabels(vb: { x: number, y: number, w: number, h: number }, z: number, scale: number): SketchLabel[] {
  const size = TILE * 2 ** z
  const west = (vb.x / size) * 360 - 180, east = ((vb.x + vb.w) / size) * 360 - 180
  const north = unprojectLat(vb.y, z), south = unprojectLat(vb.y + vb.h, z)
  const step = labelStep(z, scale)
  const labels: SketchLabel[] = []
  for (let lon = Math.ceil(west / step) * step; lon <= east; lon += step)
    labels.push({ text: labelFor(lon, 'lon'), x: project({ lat: 0, lon }, z).x, y: vb.y + vb.h - 4 / scale })
  for (let lat = Math.ceil(south / step) * step; lat <= north; lat += step) {
    const y = project({ lat, lon: 0 }, z).y - 3 / scale
    // Clear of the longitude labels along the bottom edge and of the top edge.
    if (y < vb.y + vb.h - 16 / scale && y > vb.y + 10 / scale) labels.push({ text: labelFor(lat, 'lat'), x: vb.x + 4 / scale, y })
  }
  return labels
}

export function useRouteSketch(waypoints: MaybeRefOrGetter<readonly (LatLon & { method?: LegMethod })[]>, options: SketchOptions) {
  return computed(() => buildRouteSketch(toValue(waypoints), options))
}
