// Geometric checks of a zone's rings before it is stored: no edge half way round the globe, no
// ring round a pole, no edge crossing another (geodesic intersections by the zone engine, with the
// sub-edge index, so the check is not quadratic), holes inside their outer ring.
import type { ZonePolygons } from './types'
import { prepareZones, searchWrapped } from './prepare'
import { legCurve, type GeodesicCurve } from './legCurve'
import { geodesicCrossings } from './crossings'
import { pointInZone } from './inside'
import { wrap180 } from './geometry'

export interface RingIssue { line: number, message: string }

const ringName = (p: number, r: number) => `polygon ${p + 1}, ${r === 0 ? 'outer ring' : `hole ${r}`}`

function longitudeIssues(polygons: ZonePolygons, lines: number[][][]): RingIssue[] {
  const issues: RingIssue[] = []
  polygons.forEach((rings, p) => rings.forEach((ring, r) => {
    let sweep = 0
    const distinct = new Set(ring.map(([lon, lat]) => `${lon},${lat}`))
    if (distinct.size < 3) issues.push({ line: lines[p]![r]![0]!, message: `${ringName(p, r)} has fewer than 3 distinct positions` })
    for (let i = 1; i < ring.length; i++) {
      const d = wrap180(ring[i]![0] - ring[i - 1]![0])
      if (Math.abs(d) >= 179.9) issues.push({ line: lines[p]![r]![i]!, message: `${ringName(p, r)}, position ${i + 1}: the edge to it spans ${Math.abs(d).toFixed(1)}° of longitude; add positions so each edge spans less than 180°` })
      sweep += d
    }
    if (Math.abs(sweep) > 180) issues.push({ line: lines[p]![r]![0]!, message: `${ringName(p, r)} goes round a pole; split the zone into parts that do not enclose a pole` })
  }))
  return issues
}

/** Problems with the rings' geometry, each with the line of the position where it starts. */
export function checkZoneRings(polygons: ZonePolygons, lines: number[][][]): RingIssue[] {
  const issues = longitudeIssues(polygons, lines)
  if (issues.length) return issues
  const prepared = prepareZones(polygons.map((rings, p) => ({ id: p, name: '', kind: 'custom', polygons: [rings] })))
  const reported = new Set<string>()
  prepared.edges.forEach((a, i) => {
    if (issues.length >= 20) return
    const curve = legCurve({ from: { lat: a.lat1, lon: a.lon1 }, to: { lat: a.lat2, lon: a.lon2 }, method: 'geodesic' }) as GeodesicCurve
    searchWrapped(prepared.edgeIndex, Math.min(a.lon1, a.lon2), a.latMin, Math.max(a.lon1, a.lon2), a.latMax, (j) => {
      const b = prepared.edges[j]!
      if (j <= i || b.zone !== a.zone || issues.length >= 20) return
      const edges = polygons[a.zone]![b.ring]!.length - 1
      if (a.ring === b.ring && (a.edge === b.edge || Math.abs(a.edge - b.edge) === 1 || Math.abs(a.edge - b.edge) === edges - 1)) return
      const key = `${a.zone}/${a.ring}/${a.edge}/${b.ring}/${b.edge}`
      const out: number[] = []
      geodesicCrossings(curve, b, out)
      if (!out.length || reported.has(key)) return
      reported.add(key)
      const lineA = lines[a.zone]![a.ring]![a.edge]!
      const lineB = lines[a.zone]![b.ring]![b.edge]!
      issues.push({ line: lineA, message: `${ringName(a.zone, a.ring)}: the edge from position ${a.edge + 1} crosses ${a.ring === b.ring ? 'the edge' : `${ringName(a.zone, b.ring)}'s edge`} from position ${b.edge + 1} (line ${lineB}); a ring must not cross itself or another ring` })
    })
  })
  if (issues.length) return issues
  polygons.forEach((rings, p) => {
    if (rings.length < 2) return
    const outer = prepareZones([{ id: 0, name: '', kind: 'custom', polygons: [[rings[0]!]] }])
    rings.slice(1).forEach((hole, h) => {
      if (!pointInZone(outer, 0, hole[0]![1], hole[0]![0])) issues.push({ line: lines[p]![h + 1]![0]!, message: `${ringName(p, h + 1)} lies outside its polygon's outer ring` })
    })
  })
  return issues
}
