import {
  formatRouteDecimal, formatRouteQuantity, MAX_ROUTE_FILE_WAYPOINTS, normaliseRouteLongitude, readRouteDecimal,
  RouteFileError, takeRouteQuantity, tooManyRouteWaypoints, validateRouteWaypoints,
} from './common'
import type { ParsedRouteFile, RawRouteWaypoint, RouteFileIssue, RouteFilePlan, RouteFileWaypoint } from './common'
import { escapeRouteXmlAttr, parseRouteXml, routeXmlAttr, routeXmlChild, routeXmlChildren } from './xml'
import type { RouteXmlDocument, RouteXmlNode } from './xml'

// IEC 61174 route exchange (RTZ) schema versions 1.0 and 1.1: route/routeInfo@routeName;
// waypoints/defaultWaypoint and waypoints/waypoint (@id, @name, @radius nm) with position@lat/@lon
// and leg (@geometryType Loxodrome | Orthodrome, @portsideXTD/@starboardXTD nm, @speedMin/@speedMax kn)
// describing the leg from the previous waypoint; schedules/schedule/manual|calculated/scheduleElement
// (1.0 spells it "sheduleElement") with @waypointId and @speed.
export const RTZ_ROUTE_NAMESPACE = 'http://www.cirm.org/RTZ/1/1'

const rtzArrays = new Set([
  'route.waypoints.waypoint', 'route.schedules.schedule',
  'route.schedules.schedule.manual.scheduleElement', 'route.schedules.schedule.manual.sheduleElement',
  'route.schedules.schedule.calculated.scheduleElement', 'route.schedules.schedule.calculated.sheduleElement',
])

const geometryMethods: Record<string, 'geodesic' | 'rhumb'> = { Orthodrome: 'geodesic', Loxodrome: 'rhumb' }

/** Planned speed per waypoint id from the schedules: manual values first, then calculated ones. */
function scheduleSpeeds(route: RouteXmlNode): Map<string, string> {
  const speeds = new Map<string, string>()
  for (const part of ['calculated', 'manual']) {
    for (const schedule of routeXmlChildren(routeXmlChild(route, 'schedules'), 'schedule')) {
      const container = routeXmlChild(schedule, part)
      for (const element of [...routeXmlChildren(container, 'scheduleElement'), ...routeXmlChildren(container, 'sheduleElement')]) {
        const id = routeXmlAttr(element, 'waypointId')
        const speed = routeXmlAttr(element, 'speed')
        if (id !== undefined && speed !== undefined && readRouteDecimal(speed)) speeds.set(id.trim(), speed)
      }
    }
  }
  return speeds
}

/** The departure time the schedules give the first waypoint (manual before calculated). */
function scheduleDeparture(route: RouteXmlNode, firstId: string | undefined): string | undefined {
  if (firstId === undefined) return undefined
  for (const part of ['manual', 'calculated']) {
    for (const schedule of routeXmlChildren(routeXmlChild(route, 'schedules'), 'schedule')) {
      const container = routeXmlChild(schedule, part)
      for (const element of [...routeXmlChildren(container, 'scheduleElement'), ...routeXmlChildren(container, 'sheduleElement')]) {
        const etd = routeXmlAttr(element, 'etd')?.trim()
        if (routeXmlAttr(element, 'waypointId')?.trim() !== firstId || !etd) continue
        const ms = Date.parse(/(?:Z|[+-]\d\d:?\d\d)$/i.test(etd) ? etd : `${etd}Z`)
        if (Number.isFinite(ms)) return new Date(ms).toISOString()
      }
    }
  }
  return undefined
}

/** The speed most legs are planned at (the earliest such on a tie), or undefined when no leg has one. */
function commonSpeed(waypoints: readonly { speedKn?: number | null }[]): number | undefined {
  const counts = new Map<number, number>()
  for (const w of waypoints.slice(1)) if (w.speedKn != null) counts.set(w.speedKn, (counts.get(w.speedKn) ?? 0) + 1)
  let best: number | undefined
  for (const [speed, n] of counts) if (best === undefined || n > counts.get(best)!) best = speed
  return best
}

function legAttr(leg: RouteXmlNode | undefined, fallback: RouteXmlNode | undefined, name: string) {
  return routeXmlAttr(leg, name) ?? routeXmlAttr(fallback, name)
}

/** One cross-track limit from the two sides: the narrower, so that the corridor keeps within both. */
function readXtd(raw: RawRouteWaypoint, port: string | undefined, starboard: string | undefined, warnings: RouteFileIssue[]) {
  const p = readRouteDecimal(port)
  const s = readRouteDecimal(starboard)
  const sides = [p, s].filter((v): v is number => v !== undefined && !Number.isNaN(v) && v > 0)
  if (sides.length === 2 && sides[0] !== sides[1])
    warnings.push({ ...raw.where, message: `portside XTD ${p} nm and starboard XTD ${s} nm differ; the narrower, ${Math.min(...sides)} nm, was taken for both sides` })
  for (const [label, text, value] of [['portsideXTD', port, p], ['starboardXTD', starboard, s]] as const) {
    if (value !== undefined && Number.isNaN(value)) raw.problems.push(`leg ${label} '${text}' is not a number`)
    else if (value !== undefined && value < 0) raw.problems.push(`leg ${label} ${value} must not be negative`)
  }
  if (sides.length > 0) raw.fields.xteNm = Math.min(...sides)
}

function waypointToRaw(
  node: RouteXmlNode, index: number, doc: RouteXmlDocument, defaults: RouteXmlNode | undefined,
  speeds: Map<string, string>, warnings: RouteFileIssue[],
): RawRouteWaypoint {
  const raw: RawRouteWaypoint = { where: { element: `waypoint #${index + 1}`, line: doc.lineOf(node) }, fields: {}, problems: [] }
  const position = routeXmlChild(node, 'position')
  if (!position) raw.problems.push('position element is missing')
  else {
    for (const key of ['lat', 'lon'] as const) {
      const text = routeXmlAttr(position, key)
      const value = readRouteDecimal(text)
      const label = key === 'lat' ? 'latitude' : 'longitude'
      if (value === undefined) raw.problems.push(`position ${key} attribute is missing`)
      else if (Number.isNaN(value)) raw.problems.push(`${label} '${text}' is not a decimal number`)
      else raw.fields[key] = value
    }
  }
  const name = routeXmlAttr(node, 'name')?.trim()
  if (name) raw.fields.name = name
  takeRouteQuantity(raw, 'turnRadiusNm', routeXmlAttr(node, 'radius') ?? routeXmlAttr(defaults, 'radius'), 'radius')

  const leg = routeXmlChild(node, 'leg')
  const defaultLeg = routeXmlChild(defaults, 'leg')
  const geometry = legAttr(leg, defaultLeg, 'geometryType')?.trim()
  if (geometry !== undefined && geometry !== '') {
    const method = geometryMethods[geometry]
    if (method) raw.fields.method = method
    else raw.problems.push(`leg geometryType '${geometry}' must be Loxodrome or Orthodrome`)
  }
  readXtd(raw, legAttr(leg, defaultLeg, 'portsideXTD'), legAttr(leg, defaultLeg, 'starboardXTD'), warnings)
  const id = routeXmlAttr(node, 'id')?.trim()
  const speed = (id === undefined ? undefined : speeds.get(id))
    ?? ['speedMax', 'planSpeedMax', 'speedMin', 'planSpeedMin'].map(a => legAttr(leg, defaultLeg, a)).find(v => v !== undefined && v.trim() !== '')
  takeRouteQuantity(raw, 'speedKn', speed, 'speed')
  const notes = routeXmlAttr(leg, 'legInfo')?.trim()
  if (notes) raw.fields.notes = notes
  return raw
}

/** An RTZ route (IEC 61174, versions 1.0 and 1.1); problems are placed at `waypoint #n` and its line. */
export function parseRouteRtz(text: string): ParsedRouteFile {
  const doc = parseRouteXml(text, rtzArrays)
  if (doc.rootName !== 'route')
    throw new RouteFileError('no-route', `this is not an RTZ route: the root element is <${doc.rootName}>, not <route>`)
  const route = doc.root
  const warnings: RouteFileIssue[] = []
  const version = routeXmlAttr(route, 'version')
  if (version !== undefined && !['1.0', '1.1', '1.2'].includes(version.trim()))
    warnings.push({ line: doc.lineOf(route), message: `RTZ version ${version} is not one this reader knows (1.0, 1.1); read as 1.1` })
  const info = routeXmlChild(route, 'routeInfo')
  const routeName = routeXmlAttr(info, 'routeName')?.trim() || undefined
  const vesselName = routeXmlAttr(info, 'vesselName')?.trim() || undefined
  const list = routeXmlChild(route, 'waypoints')
  if (!list) throw new RouteFileError('no-route', 'the RTZ file has no waypoints element')
  const nodes = routeXmlChildren(list, 'waypoint')
  if (nodes.length > MAX_ROUTE_FILE_WAYPOINTS) throw tooManyRouteWaypoints(nodes.length)

  const defaults = routeXmlChild(list, 'defaultWaypoint')
  const speeds = scheduleSpeeds(route)
  const seen = new Set<string>()
  const raws = nodes.map((node, i) => {
    const raw = waypointToRaw(node, i, doc, defaults, speeds, warnings)
    const id = routeXmlAttr(node, 'id')?.trim()
    if (id === undefined) warnings.push({ ...raw.where, message: 'waypoint id is missing' })
    else if (seen.has(id)) warnings.push({ ...raw.where, message: `waypoint id ${id} is used twice; schedule speeds for it may belong to the other` })
    else seen.add(id)
    return raw
  })
  const { waypoints, errors } = validateRouteWaypoints(raws)
  const departureUtc = scheduleDeparture(route, nodes[0] ? routeXmlAttr(nodes[0], 'id')?.trim() : undefined)
  return { format: 'rtz', routeName, vesselName, departureUtc, speedKn: commonSpeed(waypoints), waypoints, errors, warnings }
}

function attrs(pairs: [string, string | number | null | undefined][]): string {
  return pairs.filter(([, v]) => v !== undefined && v !== null && v !== '')
    .map(([k, v]) => ` ${k}="${typeof v === 'number' ? formatRouteQuantity(v) : escapeRouteXmlAttr(v!)}"`).join('')
}

/**
 * Names as ECDIS route tables take them: degree, minute and second signs and typographic dashes and
 * quotes written in ASCII (48°45′N → 48 45'N), which many of them cannot show.
 */
export function rtzRouteName(text: string | null | undefined): string {
  return (text ?? '').replace(/°/g, ' ').replace(/[′’‘`´]/g, '\'').replace(/[″“”]/g, '"').replace(/[‐‑‒–—―−]/g, '-')
    .replace(/ {2,}/g, ' ').trim()
}

function departureText(value: RouteFilePlan['departureUtc']): string | undefined {
  if (!value) return undefined
  const date = value instanceof Date ? value : new Date(value)
  return Number.isNaN(date.getTime()) ? undefined : date.toISOString().replace(/\.000Z$/, 'Z')
}

/**
 * Writes RTZ 1.1. Each waypoint after the first carries the leg arriving at it: Orthodrome for a
 * geodesic leg, Loxodrome for a rhumb line, the cross-track limit on both sides, and its speed (its
 * own, else the plan's) as speedMax. The manual schedule holds the departure time and the speeds
 * the planner set on single legs; the calculated one the time at every waypoint (etd leaving, eta
 * arriving) and every leg's speed, from the leg table.
 */
export function writeRouteRtz(plan: RouteFilePlan, waypoints: readonly RouteFileWaypoint[]): string {
  const lines = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<route xmlns="${RTZ_ROUTE_NAMESPACE}" version="1.1">`,
    `  <routeInfo${attrs([['routeName', rtzRouteName(plan.title) || 'Route'], ['vesselName', plan.vesselName]])}/>`,
    '  <waypoints>',
  ]
  const legSpeed = (w: RouteFileWaypoint, i: number) => (i === 0 ? undefined : w.speedKn ?? plan.speedKn ?? undefined)
  waypoints.forEach((w, i) => {
    lines.push(`    <waypoint${attrs([['id', String(i + 1)], ['name', w.name == null ? w.name : rtzRouteName(w.name)], ['radius', w.turnRadiusNm]])}>`)
    lines.push(`      <position lat="${formatRouteDecimal(w.lat)}" lon="${formatRouteDecimal(normaliseRouteLongitude(w.lon))}"/>`)
    const leg = attrs([
      ['starboardXTD', w.xteNm], ['portsideXTD', w.xteNm],
      ['geometryType', i === 0 && !w.method ? undefined : w.method === 'geodesic' ? 'Orthodrome' : 'Loxodrome'],
      ['speedMax', legSpeed(w, i)], ['legInfo', w.notes],
    ])
    if (leg) lines.push(`      <leg${leg}/>`)
    lines.push('    </waypoint>')
  })
  lines.push('  </waypoints>')

  const departure = departureText(plan.departureUtc)
  const schedule = waypoints.flatMap((w, i) => {
    const etd = i === 0 ? departure : undefined
    return w.speedKn != null || etd ? [`        <scheduleElement${attrs([['waypointId', String(i + 1)], ['etd', etd], ['speed', w.speedKn]])}/>`] : []
  })
  const times = plan.times?.length === waypoints.length ? plan.times : null
  const calculated = times
    ? waypoints.map((w, i) => `        <scheduleElement${attrs([['waypointId', String(i + 1)], ['etd', i < waypoints.length - 1 ? departureText(times[i]) : undefined], ['eta', i > 0 ? departureText(times[i]) : undefined], ['speed', legSpeed(w, i)]])}/>`)
    : []
  if (schedule.length > 0 || calculated.length > 0) {
    lines.push('  <schedules>', '    <schedule id="1" name="Plan">')
    if (schedule.length > 0) lines.push('      <manual>', ...schedule, '      </manual>')
    if (calculated.length > 0) lines.push('      <calculated>', ...calculated, '      </calculated>')
    lines.push('    </schedule>', '  </schedules>')
  }
  lines.push('</route>', '')
  return lines.join('\n')
}
