import type { Waypoint } from '#shared/types/waypoint'
import type { LatLon } from '#shared/types/geo'

// Intermediate waypoints are named by their position in whole minutes, as they would be written on the chart: 48°45′N 166°39′W.
function angleName(value: number, pos: string, neg: string): string {
  const minutes = Math.round(Math.abs(value) * 60)
  return `${Math.floor(minutes / 60)}°${String(minutes % 60).padStart(2, '0')}′${value < 0 && minutes > 0 ? neg : pos}`
}
const positionName = (p: LatLon) => `${angleName(p.lat, 'N', 'S')} ${angleName(normaliseLongitude(p.lon), 'E', 'W')}`

/** Leg numbers as 3, 5–9, 12. */
function rangeText(legs: number[]): string {
  const parts: string[] = []
  for (let i = 0; i < legs.length;) {
    let j = i
    while (j + 1 < legs.length && legs[j + 1] === legs[j]! + 1) j++
    parts.push(j > i ? `${legs[i]}–${legs[j]}` : String(legs[i]))
    i = j + 1
  }
  return parts.join(', ')
}

/** Track tools over the draft: each replaces the waypoint list in one undoable step. */
export function useTrackTools() {
  const store = usePlanDraftStore()

  /** Split geodesic leg `leg` (waypoint leg → leg + 1) into rhumb-line legs every N° of longitude or N nm. */
  function splitLeg(leg: number, every: number, unit: 'deg' | 'nm'): string {
    const from = store.waypoints[leg]
    const to = store.waypoints[leg + 1]
    if (!from || !to) return 'Choose a leg to split.'
    if (!(every > 0)) return 'The interval must be greater than 0.'
    let points: LatLon[]
    try { points = unit === 'deg' ? intermediateAtMeridians(from, to, every) : intermediateEveryNm(from, to, every) }
    catch (e) { return (e as Error).message }
    if (!points.length) return 'The leg is shorter than one interval: nothing to split.'
    const added: Waypoint[] = points.map(p => ({ name: positionName(p), lat: p.lat, lon: p.lon, method: 'rhumb', speedKn: to.speedKn ?? null, xteNm: to.xteNm ?? null, turnRadiusNm: null, notes: null }))
    const list = [...store.waypoints]
    list.splice(leg + 1, 1, ...added, { ...to, method: 'rhumb' })
    store.replaceWaypoints(list, `split leg ${leg + 1}`)
    return `Leg ${leg + 1} split into ${added.length + 1} rhumb-line legs.`
  }

  /** Replace every geodesic leg whose vertex lies poleward of the limit with the composite track. */
  function applyLimit(limitLat: number): string {
    const limit = Math.abs(limitLat)
    if (!(limit > 0 && limit < 90)) return 'Set a limiting latitude between 0° and 90°.'
    const shown = formatLimitLatitude(limit)
    const src = store.waypoints
    const list: Waypoint[] = [src[0]!]
    const endsBeyond: number[] = []
    let replaced = 0
    let geodesicLegs = 0
    for (let i = 1; i < src.length; i++) {
      const from = src[i - 1]!
      const to = src[i]!
      if (to.method === 'geodesic') {
        geodesicLegs++
        const r = compositeSailing(from, to, limit)
        if (r.kind === 'composite') {
          const [, p1, p2] = r.points
          const base = { speedKn: to.speedKn ?? null, xteNm: to.xteNm ?? null, turnRadiusNm: null, notes: null }
          list.push({ ...base, name: positionName(p1!), lat: p1!.lat, lon: p1!.lon, method: 'geodesic' }, { ...base, name: positionName(p2!), lat: p2!.lat, lon: p2!.lon, method: 'rhumb' })
          list.push({ ...to, method: 'geodesic' })
          replaced++
          continue
        }
        if (r.kind === 'end-beyond-limit') endsBeyond.push(i)
      }
      list.push(to)
    }
    if (replaced) store.replaceWaypoints(list, `hold ${shown}`)
    const out: string[] = [replaced
      ? `${replaced} leg${replaced === 1 ? '' : 's'} replaced by the composite track at ${shown}.`
      : geodesicLegs
        ? `No leg changed: ${endsBeyond.length ? 'the other geodesic legs stay' : 'every geodesic leg stays'} within ${shown}.`
        : 'No leg changed: the plan has no geodesic legs (the limit applies to geodesic legs; undo a split, apply the limit, then split).']
    if (endsBeyond.length)
      out.push(`Leg${endsBeyond.length === 1 ? '' : 's'} ${endsBeyond.join(', ')} left as ${endsBeyond.length === 1 ? 'it is' : 'they are'}: an end lies poleward of ${shown}, so the limit cannot be kept there.`)
    const rhumbBeyond = list.slice(1).map((w, k) => ({ w, leg: k + 1 })).filter(({ w, leg }) => w.method === 'rhumb' && (Math.abs(w.lat) > limit + 1e-6 || Math.abs(list[leg - 1]!.lat) > limit + 1e-6)).map(x => x.leg)
    if (rhumbBeyond.length)
      out.push(`Rhumb-line leg${rhumbBeyond.length === 1 ? '' : 's'} ${rangeText(rhumbBeyond)} reach${rhumbBeyond.length === 1 ? 'es' : ''} beyond ${shown} and ${rhumbBeyond.length === 1 ? 'is' : 'are'} not changed: move ${rhumbBeyond.length === 1 ? 'its waypoints' : 'their waypoints'} by hand, or undo the split and apply the limit first.`)
    return out.join(' ')
  }

  return { splitLeg, applyLimit }
}
