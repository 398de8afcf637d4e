// Areas to avoid or to weight (zones: no-go, risk, emission control), turned into what the search
// and the smoothing use: a cost factor per node, blocked edges that cut a blocked area between two
// outside nodes, and a cost for any straight leg (sampled every few nm, planar membership).
import type { RouteArea } from '#shared/types/routing'
import { normaliseLongitude } from '#shared/utils/position'
import { nodesWithin } from './graphBuild'
import type { SeaGraph } from './seaGraph'

export interface PreparedAreas {
  nodeFactor?: Float32Array
  blockedEdges: number[]
  /** Factor at a point: 1 outside every area, the largest factor inside, Infinity inside a blocked area. */
  factorAt(lat: number, lon: number): number
  /** Whether a planar lon/lat segment crosses a blocked area's boundary. */
  cutsBlocked(lat1: number, lon1: number, lat2: number, lon2: number): boolean
  any: boolean
}

interface Ring { xy: [number, number][], minX: number, minY: number, maxX: number, maxY: number }
interface Area { rings: Ring[], factor: number, minX: number, minY: number, maxX: number, maxY: number }

function prepareArea(a: RouteArea): Area {
  const rings = a.rings.filter(r => r.length >= 3).map((xy) => {
    const xs = xy.map(p => p[0]), ys = xy.map(p => p[1])
    return { xy, minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) }
  })
  const factor = a.mode === 'block' ? Infinity : Math.max(1, a.factor)
  return {
    rings, factor,
    minX: Math.min(...rings.map(r => r.minX)), minY: Math.min(...rings.map(r => r.minY)),
    maxX: Math.max(...rings.map(r => r.maxX)), maxY: Math.max(...rings.map(r => r.maxY)),
  }
}

/** Even-odd point in polygon (ray crossing), the longitude taken the way round that falls inside the area's box. */
function inside(area: Area, lat: number, lon: number): boolean {
  let x = lon
  if (x < area.minX) x += 360 * Math.ceil((area.minX - x) / 360)
  if (x > area.maxX || lat < area.minY || lat > area.maxY) return false
  let odd = false
  for (const r of area.rings) {
    if (x < r.minX || x > r.maxX || lat < r.minY || lat > r.maxY) continue
    for (let i = 0, j = r.xy.length - 1; i < r.xy.length; j = i++) {
      const [xi, yi] = r.xy[i]!, [xj, yj] = r.xy[j]!
      if ((yi > lat) !== (yj > lat) && x < ((xj - xi) * (lat - yi)) / (yj - yi) + xi) odd = !odd
    }
  }
  return odd
}

function cross(ax: number, ay: number, bx: number, by: number, cx: number, cy: number, dx: number, dy: number): boolean {
  const o = (px: number, py: number, qx: number, qy: number, rx: number, ry: number) => (qx - px) * (ry - py) - (qy - py) * (rx - px)
  return (o(ax, ay, bx, by, cx, cy) > 0) !== (o(ax, ay, bx, by, dx, dy) > 0) && (o(cx, cy, dx, dy, ax, ay) > 0) !== (o(cx, cy, dx, dy, bx, by) > 0)
}

function cutsArea(area: Area, lat1: number, lon1: number, lat2: number, lon2: number): boolean {
  let x1 = lon1
  if (x1 < area.minX - 180) x1 += 360
  const x2 = x1 + normaliseLongitude(lon2 - lon1)
  if (Math.max(x1, x2) < area.minX || Math.min(x1, x2) > area.maxX || Math.max(lat1, lat2) < area.minY || Math.min(lat1, lat2) > area.maxY) return false
  for (const r of area.rings) {
    for (let i = 0, j = r.xy.length - 1; i < r.xy.length; j = i++) {
      if (cross(x1, lat1, x2, lat2, r.xy[j]![0], r.xy[j]![1], r.xy[i]![0], r.xy[i]![1])) return true
    }
  }
  return false
}

export function prepareAreas(g: SeaGraph, list: RouteArea[] = []): PreparedAreas {
  const areas = list.map(prepareArea).filter(a => a.rings.length)
  const factorAt = (lat: number, lon: number) => {
    let f = 1
    for (const a of areas) if (a.factor > f && inside(a, lat, lon)) f = a.factor
    return f
  }
  const cutsBlocked = (lat1: number, lon1: number, lat2: number, lon2: number) =>
    areas.some(a => a.factor === Infinity && cutsArea(a, lat1, lon1, lat2, lon2))
  if (!areas.length) return { blockedEdges: [], factorAt, cutsBlocked, any: false }
  const nodeFactor = new Float32Array(g.nodeCount).fill(1)
  const blockedEdges: number[] = []
  for (const a of areas) {
    const midLat = (a.minY + a.maxY) / 2, midLon = (a.minX + a.maxX) / 2
    const reachNm = Math.hypot((a.maxY - a.minY) * 60, (a.maxX - a.minX) * 60 * Math.cos((midLat * Math.PI) / 180)) / 2 + 300
    for (const u of nodesWithin(g.index, midLat, midLon, reachNm)) {
      if (inside(a, g.lat[u]!, g.lon[u]!)) nodeFactor[u] = Math.max(nodeFactor[u]!, a.factor)
      if (a.factor !== Infinity) continue
      for (let k = g.offsets[u]!; k < g.offsets[u + 1]!; k++) {
        const v = g.targets[k]!
        if (cutsArea(a, g.lat[u]!, g.lon[u]!, g.lat[v]!, g.lon[v]!)) blockedEdges.push(k)
      }
    }
  }
  return { nodeFactor, blockedEdges, factorAt, cutsBlocked, any: true }
}
