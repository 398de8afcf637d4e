import {
  formatRouteDecimal, formatRouteQuantity, MAX_ROUTE_FILE_WAYPOINTS, normaliseRouteLongitude, readRouteDecimal,
  RouteFileError, takeRouteQuantity, tooManyRouteWaypoints, validateRouteWaypoints,
} from './common'
import type { ParsedRouteFile, RawRouteWaypoint, RouteFileIssue, RouteFilePlan, RouteFileWaypoint } from './common'
import {
  escapeRouteXmlText, parseRouteXml, routeXmlAttr, routeXmlChild, routeXmlChildren, routeXmlChildText,
} from './xml'
import type { RouteXmlDocument, RouteXmlNode } from './xml'

// GPX 1.1 (www.topografix.com/GPX/1/1/gpx.xsd): gpx/rte/rtept with lat and lon attributes,
// then name, cmt, desc … extensions in that order. Leg data has no GPX element: it goes in
// our own extension element <pw:leg> (namespace below), which other programs ignore.
export const GPX_ROUTE_NAMESPACE = 'http://www.topografix.com/GPX/1/1'
export const GPX_ROUTE_LEG_NAMESPACE = 'urn:passagewright:gpx-leg:1'

const gpxArrays = new Set(['gpx.rte', 'gpx.rte.rtept', 'gpx.trk', 'gpx.trk.trkseg', 'gpx.trk.trkseg.trkpt'])

function pointToRaw(point: RouteXmlNode, element: string, doc: RouteXmlDocument): RawRouteWaypoint {
  const raw: RawRouteWaypoint = { where: { element, line: doc.lineOf(point) }, fields: {}, problems: [] }
  for (const key of ['lat', 'lon'] as const) {
    const text = routeXmlAttr(point, key)
    const value = readRouteDecimal(text)
    const label = key === 'lat' ? 'latitude' : 'longitude'
    if (value === undefined) raw.problems.push(`${label} attribute '${key}' is missing`)
    else if (Number.isNaN(value)) raw.problems.push(`${label} '${text}' is not a decimal number`)
    else raw.fields[key] = value
  }
  const name = routeXmlChildText(point, 'name')?.trim()
  if (name) raw.fields.name = name
  const notes = (routeXmlChildText(point, 'desc') ?? routeXmlChildText(point, 'cmt'))?.trim()
  if (notes) raw.fields.notes = notes

  const leg = routeXmlChild(routeXmlChild(point, 'extensions'), 'leg')
  if (leg) {
    const method = routeXmlAttr(leg, 'method')
    if (method === 'geodesic' || method === 'rhumb') raw.fields.method = method
    else if (method !== undefined) raw.problems.push(`leg method '${method}' must be geodesic or rhumb`)
    takeRouteQuantity(raw, 'speedKn', routeXmlAttr(leg, 'speedKn'))
    takeRouteQuantity(raw, 'xteNm', routeXmlAttr(leg, 'xteNm'))
    takeRouteQuantity(raw, 'turnRadiusNm', routeXmlAttr(leg, 'turnRadiusNm'))
  }
  return raw
}

/** The route to read: the first rte; a file with no route but one single-segment track is read from its track points. */
function pickPoints(gpx: RouteXmlNode, doc: RouteXmlDocument, warnings: RouteFileIssue[]) {
  const routes = routeXmlChildren(gpx, 'rte')
  if (routes.length > 0) {
    const route = routes[0]!
    const routeName = routeXmlChildText(route, 'name')?.trim() || undefined
    if (routes.length > 1)
      warnings.push({ element: 'rte #1', line: doc.lineOf(route), message: `the file holds ${routes.length} routes; only the first${routeName ? ` ('${routeName}')` : ''} was read` })
    return { routeName, points: routeXmlChildren(route, 'rtept'), pointName: 'rtept' }
  }
  const tracks = routeXmlChildren(gpx, 'trk')
  const segments = tracks.length === 1 ? routeXmlChildren(tracks[0], 'trkseg') : []
  if (tracks.length === 1 && segments.length === 1) {
    warnings.push({ element: 'trk #1', line: doc.lineOf(tracks[0]), message: 'the file holds no route (rte); its track was read as one: check the waypoints' })
    return { routeName: routeXmlChildText(tracks[0], 'name')?.trim() || undefined, points: routeXmlChildren(segments[0], 'trkpt'), pointName: 'trkpt' }
  }
  throw new RouteFileError('no-route', tracks.length > 0
    ? `the GPX file holds no route (rte) and ${tracks.length === 1 ? `a track of ${segments.length} segments` : `${tracks.length} tracks`}; export a route (rte) instead`
    : 'the GPX file holds no route (rte)')
}

/** A GPX 1.1 route (`gpx/rte/rtept`); problems are placed at `rtept #n` and its line. */
export function parseRouteGpx(text: string): ParsedRouteFile {
  const doc = parseRouteXml(text, gpxArrays)
  if (doc.rootName !== 'gpx')
    throw new RouteFileError('no-route', `this is not a GPX file: the root element is <${doc.rootName}>, not <gpx>`)
  const warnings: RouteFileIssue[] = []
  const { routeName, points, pointName } = pickPoints(doc.root, doc, warnings)
  if (points.length > MAX_ROUTE_FILE_WAYPOINTS) throw tooManyRouteWaypoints(points.length)
  const raws = points.map((p, i) => pointToRaw(p, `${pointName} #${i + 1}`, doc))
  const { waypoints, errors } = validateRouteWaypoints(raws)
  return { format: 'gpx', routeName, waypoints, errors, warnings }
}

function legExtension(w: RouteFileWaypoint): string {
  const attrs = [`method="${w.method ?? 'rhumb'}"`]
  if (w.speedKn != null) attrs.push(`speedKn="${formatRouteQuantity(w.speedKn)}"`)
  if (w.xteNm != null) attrs.push(`xteNm="${formatRouteQuantity(w.xteNm)}"`)
  if (w.turnRadiusNm != null) attrs.push(`turnRadiusNm="${formatRouteQuantity(w.turnRadiusNm)}"`)
  return `<extensions><pw:leg ${attrs.join(' ')}/></extensions>`
}

/** Writes a GPX 1.1 file with one route; leg data in the `pw:leg` extension of each route point. */
export function writeRouteGpx(plan: RouteFilePlan, waypoints: readonly RouteFileWaypoint[]): string {
  const title = plan.title?.trim()
  const lines = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<gpx version="1.1" creator="Passagewright" xmlns="${GPX_ROUTE_NAMESPACE}" xmlns:pw="${GPX_ROUTE_LEG_NAMESPACE}">`,
  ]
  if (title) lines.push(`  <metadata><name>${escapeRouteXmlText(title)}</name></metadata>`)
  lines.push('  <rte>')
  if (title) lines.push(`    <name>${escapeRouteXmlText(title)}</name>`)
  for (const w of waypoints) {
    const lat = formatRouteDecimal(w.lat)
    const lon = formatRouteDecimal(normaliseRouteLongitude(w.lon))
    const name = w.name ? `<name>${escapeRouteXmlText(w.name)}</name>` : ''
    const desc = w.notes ? `<desc>${escapeRouteXmlText(w.notes)}</desc>` : ''
    lines.push(`    <rtept lat="${lat}" lon="${lon}">${name}${desc}${legExtension(w)}</rtept>`)
  }
  lines.push('  </rte>', '</gpx>', '')
  return lines.join('\n')
}
