// An independent measure of the distance a leg runs inside a polygon with geodesic edges, for
// checking the zone engine: positions every 0.1 nm along the leg from Debian's GeodSolve/RhumbSolve
// (GeographicLib 2.1.2), each classified by its winding number (the sum, edge by edge, of the
// turn of the azimuth from the position to the ring's vertices; a geodesic edge seen from a point
// off it sweeps less than 180°), and every in/out change refined by a second pass at 0.001 nm.
import geodesic from 'geographiclib-geodesic'
import { fmt, runOracle } from './oracle'

const G = geodesic.Geodesic
const geod = G.WGS84
const NM = 1852

type Ring = [number, number][]

const turn = (a: number, b: number) => ((((b - a) % 360) + 540) % 360) - 180

/** Winding number of a ring about (lat, lon): ±1 inside, 0 outside. */
function winding(ring: Ring, lat: number, lon: number): number {
  let sum = 0
  let prev = geod.Inverse(lat, lon, ring[0]![1], ring[0]![0], G.AZIMUTH).azi1!
  for (let i = 1; i < ring.length; i++) {
    const az = geod.Inverse(lat, lon, ring[i]![1], ring[i]![0], G.AZIMUTH).azi1!
    sum += turn(prev, az)
    prev = az
  }
  return Math.round(sum / 360)
}

/** Inside one polygon of the zone: inside its outer ring and outside all its holes. */
export function insideByWinding(polygons: Ring[][], lat: number, lon: number): boolean {
  return polygons.some(([outer, ...holes]) => winding(outer!, lat, lon) !== 0 && holes.every(h => winding(h, lat, lon) === 0))
}

export interface SampledLeg { lat1: number, lon1: number, course: number, lengthM: number, method: 'geodesic' | 'rhumb' }

function positions(leg: SampledLeg, distances: number[]): [number, number][] {
  const tool = leg.method === 'geodesic' ? 'GeodSolve' : 'RhumbSolve'
  const out = runOracle(tool, ['-L', fmt(leg.lat1), fmt(leg.lon1), fmt(leg.course), '-p', '9'], distances.map(d => fmt(d, 6)))
  return out.map(r => [r[0]!, r[1]!])
}

/** Distance inside the zone along the leg, nautical miles, by dense sampling (0.1 nm, refined to 0.001 nm). */
export function sampledInsideNm(leg: SampledLeg, polygons: Ring[][]): number {
  const step = 0.1 * NM
  const n = Math.max(1, Math.ceil(leg.lengthM / step))
  const s = Array.from({ length: n + 1 }, (_, k) => Math.min(leg.lengthM, k * step))
  const inside = positions(leg, s).map(([lat, lon]) => insideByWinding(polygons, lat, lon))
  const changes: number[] = []
  let total = 0
  for (let k = 0; k < n; k++) {
    if (inside[k] === inside[k + 1]) { if (inside[k]) total += s[k + 1]! - s[k]! }
    else changes.push(k)
  }
  if (changes.length) {
    const fine = changes.flatMap(k => Array.from({ length: 101 }, (_, j) => s[k]! + (s[k + 1]! - s[k]!) * j / 100))
    const flags = positions(leg, fine).map(([lat, lon]) => insideByWinding(polygons, lat, lon))
    changes.forEach((_, c) => {
      for (let j = 0; j < 100; j++) {
        const a = flags[c * 101 + j]!
        const b = flags[c * 101 + j + 1]!
        const ds = fine[c * 101 + j + 1]! - fine[c * 101 + j]!
        total += a && b ? ds : a !== b ? ds / 2 : 0
      }
    })
  }
  return total / NM
}
