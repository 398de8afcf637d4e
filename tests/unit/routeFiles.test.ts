import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { XMLParser, XMLValidator } from 'fast-xml-parser'
import { describe, expect, it, vi } from 'vitest'
import { detectRouteFileFormat, parseRouteFile, writeRouteFile } from '~~/server/utils/routeFiles/index'
import { MAX_ROUTE_FILE_BYTES, RouteFileError } from '~~/server/utils/routeFiles/common'
import type { ParsedRouteFile, RouteFileFormat, RouteFileWaypoint } from '~~/server/utils/routeFiles/common'
import { writeRouteCsv } from '~~/server/utils/routeFiles/csv'
import { writeRouteGpx } from '~~/server/utils/routeFiles/gpx'
import { writeRouteRtz } from '~~/server/utils/routeFiles/rtz'

// The fixture routes in tests/fixtures/routes are invented for these tests (real sea areas,
// positions rounded). Expected decimal degrees are the fixtures' own values converted by the
// sexagesimal definition: degrees + minutes/60 + seconds/3600.
const dm = (deg: number, min: number, sec = 0) => deg + min / 60 + sec / 3600

function fixture(name: string): Buffer {
  return readFileSync(fileURLToPath(new URL(`../fixtures/routes/${name}`, import.meta.url)))
}

function read(name: string, contentType?: string): ParsedRouteFile {
  return parseRouteFile(name, contentType, fixture(name))
}

function rejection(run: () => unknown): RouteFileError {
  try {
    run()
  }
  catch (error) {
    expect(error).toBeInstanceOf(RouteFileError)
    return error as RouteFileError
  }
  throw new Error('expected a RouteFileError')
}

describe('CSV import', () => {
  const file = read('north-atlantic.csv', 'text/csv')

  it('reads every row, in order, without errors', () => {
    expect(file.format).toBe('csv')
    expect(file.errors).toEqual([])
    expect(file.waypoints.map(w => w.name)).toEqual(['Maas Centre', 'Dover Strait SW lane', 'Lizard offing', 'Mid-ocean', 'Nantucket approach', 'Ambrose approach'])
  })

  it('reads positions in each of the navigators\' notations of the fixture', () => {
    const positions = file.waypoints.map(w => [w.lat, w.lon])
    const expected = [
      [dm(52, 1.5), dm(3, 53)], // 52°01.5'N 003°53.0'E
      [dm(51, 1), dm(1, 24)], // 51 01.0 N 001 24.0 E
      [dm(49, 50), -dm(5, 30)], // 49-50.0N 005-30.0W
      [49, -20], // decimal
      [dm(40, 30, 0), -dm(69, 0, 0)], // N40°30'00" W069°00'00"
      [dm(40, 27.5), -dm(73, 49.9)], // 40°27.5'N 073°49.9'W
    ]
    positions.forEach(([lat, lon], i) => {
      expect(lat).toBeCloseTo(expected[i]![0]!, 10)
      expect(lon).toBeCloseTo(expected[i]![1]!, 10)
    })
  })

  it('maps method words (empty → rhumb, RL, GC, great circle), speed, XTE and notes', () => {
    expect(file.waypoints.map(w => w.method)).toEqual(['rhumb', 'rhumb', 'rhumb', 'geodesic', 'geodesic', 'rhumb'])
    expect(file.waypoints.map(w => w.speedKn)).toEqual([undefined, 12.5, 14, 14.5, 14.5, 10])
    expect(file.waypoints.map(w => w.xteNm)).toEqual([undefined, 0.5, 1, 2, 2, 0.3])
    expect(file.waypoints[3]!.notes).toBe('Geodesic leg, check vertex')
  })

  it('reads semicolon-separated files with decimal commas', () => {
    const text = 'name;lat;lon;speed\nA;52,025;3,8833;\nB;51,0167;1,4;12,5\n'
    const parsed = parseRouteFile('route.csv', undefined, Buffer.from(text))
    expect(parsed.errors).toEqual([])
    expect(parsed.waypoints[0]!.lat).toBe(52.025)
    expect(parsed.waypoints[1]!.speedKn).toBe(12.5)
  })

  it('reads a Windows-1252 file (degree sign 0xB0) and says so', () => {
    const bytes = Buffer.from('name,lat,lon\nA,52\xB001.5\'N,3\xB053.0\'E\nB,51\xB001.0\'N,1\xB024.0\'E\n', 'latin1')
    const parsed = parseRouteFile('old-export.csv', 'text/csv', bytes)
    expect(parsed.errors).toEqual([])
    expect(parsed.waypoints[0]!.lat).toBeCloseTo(dm(52, 1.5), 10)
    expect(parsed.warnings.map(w => w.message).join()).toMatch(/Windows-1252/)
  })
})

describe('GPX import (GPX 1.1 schema: gpx/rte/rtept @lat @lon, name, desc, cmt, extensions)', () => {
  const file = read('north-pacific.gpx')

  it('reads the route name and route points, decoding &amp; and &lt; &gt;', () => {
    expect(file.format).toBe('gpx')
    expect(file.errors).toEqual([])
    expect(file.routeName).toBe('Uraga & Nojima to Juan de Fuca')
    expect(file.waypoints.map(w => w.name)).toEqual(['Nojima-zaki S', 'Kuroshio extension', 'Limit 47.5N <west>', 'Limit 47.5N east', 'Juan de Fuca J buoy'])
    expect(file.waypoints.map(w => [w.lat, w.lon])).toEqual([[34.85, 139.9], [40, 155], [47.5, -175], [47.5, -140], [48.4933, -124.9983]])
  })

  it('reads leg data from the extension, notes from desc or else cmt', () => {
    expect(file.waypoints.map(w => w.method)).toEqual(['rhumb', 'geodesic', 'geodesic', 'rhumb', 'geodesic'])
    expect(file.waypoints.map(w => w.speedKn)).toEqual([undefined, 15, 15, 14.5, 12])
    expect(file.waypoints[2]!.turnRadiusNm).toBe(2)
    expect(file.waypoints[1]!.xteNm).toBe(5)
    expect(file.waypoints[0]!.notes).toBe('Leave Tokyo Bay TSS')
    expect(file.waypoints[4]!.notes).toBe('Pilot boarding to the east')
  })

  it('falls back to a single one-segment track, with a warning', () => {
    const track = read('track-only.gpx')
    expect(track.errors).toEqual([])
    expect(track.routeName).toBe('Recorded approach')
    expect(track.waypoints.map(w => [w.lat, w.lon])).toEqual([[51.95, 4.05], [51.98, 4], [52.01, 3.95]])
    expect(track.warnings[0]!.message).toMatch(/no route \(rte\)/)
  })

  it('refuses a file with several tracks and no route', () => {
    const two = '<gpx version="1.1" creator="t"><trk><trkseg/></trk><trk><trkseg/></trk></gpx>'
    const error = rejection(() => parseRouteFile('tracks.gpx', undefined, Buffer.from(two)))
    expect(error.statusCode).toBe(400)
    expect(error.message).toMatch(/no route \(rte\) and 2 tracks/)
  })
})

describe('RTZ import (IEC 61174 RTZ schema 1.0 / 1.1 element and attribute names)', () => {
  it('reads RTZ 1.1: routeInfo@routeName, character references, legs, defaults and schedules', () => {
    const file = read('indian-ocean-1-1.rtz')
    expect(file.format).toBe('rtz')
    expect(file.errors).toEqual([])
    expect(file.routeName).toBe('Cape of Good Hope → Fremantle (40°S)')
    expect(file.waypoints.map(w => w.name)).toEqual(['Cape Point offing', 'Agulhas & 40S', '40S 100E', 'Fremantle approach'])
    expect(file.waypoints.map(w => [w.lat, w.lon])).toEqual([[-34.5, 18.3333333], [-40, 25], [-40, 100], [-32.05, 115.6666667]])
    // Orthodrome = great circle (geodesic), Loxodrome = rhumb line; defaultWaypoint leg gives Loxodrome to the first
    expect(file.waypoints.map(w => w.method)).toEqual(['rhumb', 'geodesic', 'rhumb', 'geodesic'])
    // XTD: leg values, else the defaultWaypoint leg's 2 nm
    expect(file.waypoints.map(w => w.xteNm)).toEqual([2, 5, 2, 1])
    // radius: waypoint's own, else defaultWaypoint@radius 1.5
    expect(file.waypoints.map(w => w.turnRadiusNm)).toEqual([1.5, 2, 1.5, 0.5])
    // speed: manual schedule speed first (14.2 over speedMax 14), else leg speedMax (13.5)
    expect(file.waypoints.map(w => w.speedKn)).toEqual([undefined, 13.5, 14.2, 12])
    expect(file.waypoints[2]!.notes).toBe('Along the parallel')
    // The voyage besides the waypoints: routeInfo@vesselName, the manual schedule's etd at the first waypoint,
    // and the speed most legs are planned at (13.5, 14.2 and 12 once each: the first of them).
    expect(file.vesselName).toBe('Kestrel Tern')
    expect(file.departureUtc).toBe('2026-03-01T06:00:00.000Z')
    expect(file.speedKn).toBe(13.5)
  })

  it('reads RTZ 1.0 with its "sheduleElement" spelling; unequal XTD sides give the narrower, with a warning', () => {
    const file = read('north-sea-1-0.rtz')
    expect(file.errors).toEqual([])
    expect(file.waypoints.map(w => w.speedKn)).toEqual([undefined, 12, 11.5])
    expect(file.waypoints.map(w => w.xteNm)).toEqual([undefined, 0.5, 0.4])
    expect(file.warnings).toHaveLength(1)
    expect(file.warnings[0]).toMatchObject({ element: 'waypoint #2', line: 9 })
    expect(file.warnings[0]!.message).toMatch(/portside XTD 0.5 nm and starboard XTD 1 nm differ/)
  })

  it('places leg and position problems at their waypoint element and line', () => {
    const file = read('bad-leg.rtz')
    expect(file.errors).toEqual([
      { element: 'waypoint #2', line: 8, message: 'leg geometryType \'GreatCircle\' must be Loxodrome or Orthodrome' },
      { element: 'waypoint #3', line: 12, message: 'latitude: must be between -90 and 90 (found -91.5)' },
    ])
  })
})

describe('bad files', () => {
  it('malformed XML: 400 with the line of the fault', () => {
    const error = rejection(() => read('malformed.gpx'))
    expect(error.statusCode).toBe(400)
    expect(error.kind).toBe('malformed')
    expect(error.issue?.line).toBe(5) // <name>End</rtept> on line 5 of the fixture
    expect(error.message).toMatch(/^line 5: the XML is not well formed/)
  })

  it('entity expansion bomb ("billion laughs"): refused at once, before any expansion', () => {
    // Refused at the declaration: the XML validator and parser (which could expand it) never see the text.
    const parse = vi.spyOn(XMLParser.prototype, 'parse')
    const validate = vi.spyOn(XMLValidator, 'validate')
    const error = rejection(() => read('billion-laughs.gpx'))
    expect(parse).not.toHaveBeenCalled()
    expect(validate).not.toHaveBeenCalled()
    read('north-pacific.gpx') // the spies do see a file that is parsed
    expect(validate).toHaveBeenCalledOnce()
    expect(parse).toHaveBeenCalledOnce()
    parse.mockRestore()
    validate.mockRestore()
    expect(error.statusCode).toBe(400)
    expect(error.kind).toBe('unsafe-xml')
    expect(error.message).toMatch(/line 2: the file declares a DOCTYPE/)
  })

  it('external entity: refused, nothing read from disk', () => {
    const error = rejection(() => read('external-entity.rtz'))
    expect(error.kind).toBe('unsafe-xml')
    expect(error.message).not.toMatch(/root:/)
  })

  it('XML nested deeper than a route ever is: 400, not a crash', () => {
    const text = `<gpx version="1.1" creator="t">${'<x>'.repeat(50_000)}${'</x>'.repeat(50_000)}</gpx>`
    const error = rejection(() => parseRouteFile('deep.gpx', undefined, Buffer.from(text)))
    expect(error.statusCode).toBe(400)
  })

  it('an ENTITY declaration without DOCTYPE is refused as well', () => {
    const text = '<route version="1.1"><!ENTITY a "b"><routeInfo routeName="x"/></route>'
    expect(rejection(() => parseRouteFile('x.rtz', undefined, Buffer.from(text))).kind).toBe('unsafe-xml')
  })

  it('a 3 MB file: 413, not read', () => {
    const row = 'Padding waypoint,10.0,20.0\n'
    const bytes = Buffer.from(`name,lat,lon\n${row.repeat(Math.ceil(3 * 1024 * 1024 / row.length))}`)
    expect(bytes.length).toBeGreaterThan(MAX_ROUTE_FILE_BYTES)
    const error = rejection(() => parseRouteFile('big.csv', 'text/csv', bytes))
    expect(error.statusCode).toBe(413)
    expect(error.kind).toBe('too-large')
    expect(error.message).toMatch(/at most 2 MB/)
  })

  it('wrong columns: 400 naming line 1 and what is needed', () => {
    const error = rejection(() => read('wrong-columns.csv'))
    expect(error.statusCode).toBe(400)
    expect(error.kind).toBe('bad-columns')
    expect(error.issue?.line).toBe(1)
    expect(error.message).toMatch(/latitude.*longitude/)
    expect(error.message).toMatch(/'Position'/)
  })

  it('latitude 95: one error, on line 4, naming the latitude and its limit; the other rows are read', () => {
    const file = read('latitude-95.csv')
    expect(file.errors).toHaveLength(1)
    expect(file.errors[0]!.line).toBe(4)
    expect(file.errors[0]!.message).toMatch(/^latitude '95': .*95.*90/)
    expect(file.waypoints.map(w => w.name)).toEqual(['Start', 'Turn', 'End'])
  })

  it('line numbers stay right after blank lines and quoted line breaks', () => {
    const text = 'name,lat,lon,notes\nA,10,20,"two\nlines"\n\nB,11,21,\nC,abc,22,\n'
    const file = parseRouteFile('r.csv', undefined, Buffer.from(text))
    expect(file.errors).toHaveLength(1)
    expect(file.errors[0]!.line).toBe(6)
  })

  it('a row with more fields than the header is an error on its line', () => {
    const file = parseRouteFile('r.csv', undefined, Buffer.from('name,lat,lon\nA,10,20\nB,11,21,extra\n'))
    expect(file.errors).toEqual([{ line: 3, message: '4 fields, but the header names 3' }])
  })

  it('an unknown method is an error on its line', () => {
    const file = parseRouteFile('r.csv', undefined, Buffer.from('name,lat,lon,method\nA,10,20,\nB,11,21,zigzag\n'))
    expect(file.errors[0]).toMatchObject({ line: 3 })
    expect(file.errors[0]!.message).toMatch(/method 'zigzag'/)
  })

  it('a repeated position is placed at its line (shared waypoint list schema)', () => {
    const file = parseRouteFile('r.csv', undefined, Buffer.from('name,lat,lon\nA,10,20\nB,10,20\n'))
    expect(file.errors).toEqual([{ line: 3, message: 'waypoint 2 repeats the position of waypoint 1' }])
  })

  it('one waypoint is not a route', () => {
    const file = parseRouteFile('r.csv', undefined, Buffer.from('name,lat,lon\nA,10,20\n'))
    expect(file.errors[0]!.message).toMatch(/the route has 1 waypoint; a plan needs at least 2/)
  })

  const many = 5001
  const lat = (i: number) => (i / 1000).toFixed(3)
  it.each([
    ['csv', () => ['name,lat,lon', ...Array.from({ length: many }, (_, i) => `W${i},${lat(i)},1`)].join('\n')],
    ['gpx', () => `<gpx version="1.1" creator="t"><rte>${Array.from({ length: many }, (_, i) => `<rtept lat="${lat(i)}" lon="1"/>`).join('')}</rte></gpx>`],
    ['rtz', () => `<route version="1.1"><routeInfo routeName="x"/><waypoints>${Array.from({ length: many }, (_, i) => `<waypoint id="${i}"><position lat="${lat(i)}" lon="1"/></waypoint>`).join('')}</waypoints></route>`],
  ] as const)('more than 5,000 waypoints (%s): 400', (format, build) => {
    const error = rejection(() => parseRouteFile(`many.${format}`, undefined, Buffer.from(build())))
    expect(error.statusCode).toBe(400)
    expect(error.kind).toBe('too-many-waypoints')
    expect(error.message).toMatch(/at most 5,000/)
  })

  it('exactly 5,000 waypoints are read', () => {
    const text = ['name,lat,lon', ...Array.from({ length: 5000 }, (_, i) => `W${i},${lat(i)},1`)].join('\n')
    const file = parseRouteFile('many.csv', undefined, Buffer.from(text))
    expect(file.errors).toEqual([])
    expect(file.waypoints).toHaveLength(5000)
  })

  it('other types: .rtzp, .json, binary, empty, XML of another kind', () => {
    expect(rejection(() => parseRouteFile('r.rtzp', undefined, Buffer.from('PK\u0003\u0004'))).message).toMatch(/unzip/)
    expect(rejection(() => parseRouteFile('r.json', 'application/json', Buffer.from('{}'))).message).toMatch(/'\.json' files are not route files/)
    expect(rejection(() => parseRouteFile('r.csv', undefined, Buffer.from([0x50, 0x4B, 0x03, 0x04, 0x00, 0x00]))).message).toMatch(/not a text file/)
    expect(rejection(() => parseRouteFile('r.csv', undefined, Buffer.from('  \n'))).kind).toBe('empty')
    expect(rejection(() => parseRouteFile('r.xml', undefined, Buffer.from('<kml><Document/></kml>'))).message).toMatch(/root <kml>/)
    expect(rejection(() => parseRouteFile('r.gpx', undefined, Buffer.from('name,lat,lon'))).kind).toBe('malformed')
  })
})

describe('format detection', () => {
  it('goes by the XML root element, then the extension', () => {
    expect(detectRouteFileFormat('route.xml', 'application/xml', '<?xml version="1.0"?><gpx/>')).toBe('gpx')
    expect(detectRouteFileFormat('route.xml', undefined, '<!-- c --><rtz:route xmlns:rtz="x"/>')).toBe('rtz')
    expect(detectRouteFileFormat('export.txt', 'text/plain', '<route version="1.1"/>')).toBe('rtz')
    expect(detectRouteFileFormat('route', undefined, 'name,lat,lon')).toBe('csv')
  })
})

// Round trips: a route with every leg field and awkward text; written in each format and read back.
const awkward: RouteFileWaypoint[] = [
  { name: 'Start & "quoted" <pier>', lat: 52.025, lon: 3.8833333, method: 'rhumb', notes: 'Pilot, then\nTSS' },
  { name: '=SUM(A1)', lat: 51.0166667, lon: 1.4, method: 'rhumb', speedKn: 12.5, xteNm: 0.5, turnRadiusNm: 0.8 },
  { name: 'Øresund \'west\' — ÆØÅ', lat: -0.00000004, lon: -5.5, method: 'geodesic', speedKn: 14, xteNm: 2, notes: '-5 kn current' },
  { name: 'Date line', lat: 47.123456789, lon: 180, method: 'geodesic', speedKn: 15.25, xteNm: 5, turnRadiusNm: 2 },
  { name: '', lat: 48.4933, lon: -124.9983, method: 'rhumb', speedKn: 9.75 },
  { name: '\'=already quoted', lat: 48.5, lon: -123.5, method: 'rhumb', notes: '@ berth 3' },
]

describe.each(['csv', 'gpx', 'rtz'] as const)('export → import round trip (%s)', (format: RouteFileFormat) => {
  const plan = { title: 'Kestrel Bight: test & round trip', vesselName: 'Kestrel Tern', departureUtc: '2026-03-01T06:00:00Z' }
  const file = writeRouteFile(format, plan, awkward)
  const back = parseRouteFile(file.fileName, file.contentType, Buffer.from(file.body, 'utf8'))

  it('reads back the same waypoints', () => {
    expect(back.format).toBe(format)
    expect(back.errors).toEqual([])
    expect(back.waypoints).toHaveLength(awkward.length)
    back.waypoints.forEach((w, i) => {
      const sent = awkward[i]!
      // RTZ names are written in ASCII where ECDIS cannot show the sign: the em dash becomes a hyphen.
      expect(w.name).toBe(format === 'rtz' ? sent.name!.replace('—', '-') : sent.name)
      expect(Math.abs(w.lat - sent.lat)).toBeLessThan(1e-7)
      // longitudes are written in −180 ≤ λ < 180 (GPX 1.1 and RTZ longitude types): compare modulo 360
      expect(Math.abs(((w.lon - sent.lon + 540) % 360) - 180)).toBeLessThan(1e-7)
      expect(w.method).toBe(sent.method)
      expect(w.speedKn ?? null).toBe(sent.speedKn ?? null)
      expect(w.xteNm ?? null).toBe(sent.xteNm ?? null)
      expect(w.turnRadiusNm ?? null).toBe(sent.turnRadiusNm ?? null)
      expect(w.notes ?? null).toBe(sent.notes ?? null)
    })
  })

  it('names the file after the plan and carries the route name where the format has one', () => {
    expect(file.fileName).toBe(`Kestrel-Bight-test-round-trip.${format}`)
    if (format !== 'csv') expect(back.routeName).toBe(plan.title)
  })
})

describe('writers', () => {
  it('RTZ 1.1: namespace, version, Orthodrome for geodesic and Loxodrome for rhumb legs, schedule with the departure', () => {
    const text = writeRouteRtz({ title: 'T', departureUtc: new Date('2026-03-01T06:00:00Z') }, awkward)
    expect(text).toContain('<route xmlns="http://www.cirm.org/RTZ/1/1" version="1.1">')
    expect(text).toContain('geometryType="Orthodrome"')
    expect(text).toContain('geometryType="Loxodrome"')
    expect(text).toContain('<scheduleElement waypointId="1" etd="2026-03-01T06:00:00Z"/>')
    expect(text).toContain('lon="-180"') // 180° written as −180°: RTZ LongitudeType is −180 ≤ λ < 180
    expect(text).toContain('lat="-0.00000004"') // never in exponent form (xsd:decimal)
    expect(text).not.toMatch(/="[^"]*[<&](?!amp;|lt;|gt;|quot;|apos;|#\d+;)/) // no raw < or bare & inside an attribute value
    expect(text).toContain('name="Start &amp; &quot;quoted&quot; &lt;pier&gt;"')
    expect(text).toContain('legInfo="Pilot, then&#10;TSS"') // line end kept through attribute normalisation (XML 1.0 §3.3.3)
  })

  it('RTZ: every leg carries its speed, the plan\'s where it has none, and a calculated schedule the time at every waypoint', () => {
    const route: RouteFileWaypoint[] = [
      { name: '48°45′N 166°39′W', lat: 48.75, lon: -166.65, method: 'rhumb' },
      { name: 'Unimak – “north”', lat: 54.5, lon: -165, method: 'geodesic' },
      { name: 'Own speed', lat: 55, lon: -160, method: 'rhumb', speedKn: 11 },
    ]
    const times = ['2027-01-10T08:00:00.000Z', '2027-01-11T20:30:00.000Z', '2027-01-12T09:15:00.000Z']
    const text = writeRouteRtz({ title: 'Hold 48°45′N', speedKn: 14.5, departureUtc: times[0], times }, route)
    expect(text).toContain('<routeInfo routeName="Hold 48 45&apos;N"/>')
    expect(text).toContain('name="48 45&apos;N 166 39&apos;W"')
    expect(text).toContain('name="Unimak - &quot;north&quot;"')
    expect(text).not.toMatch(/[°′″–“”]/)
    expect(text.match(/speedMax="[^"]+"/g)).toEqual(['speedMax="14.5"', 'speedMax="11"'])
    expect(text).toContain('<manual>\n        <scheduleElement waypointId="1" etd="2027-01-10T08:00:00Z"/>\n        <scheduleElement waypointId="3" speed="11"/>\n      </manual>')
    expect(text).toContain([
      '      <calculated>',
      '        <scheduleElement waypointId="1" etd="2027-01-10T08:00:00Z"/>',
      '        <scheduleElement waypointId="2" etd="2027-01-11T20:30:00Z" eta="2027-01-11T20:30:00Z" speed="14.5"/>',
      '        <scheduleElement waypointId="3" eta="2027-01-12T09:15:00Z" speed="11"/>',
      '      </calculated>',
    ].join('\n'))
    // Read back: every leg's speed, the departure from the schedule, the plan's speed as the common one.
    const back = parseRouteFile('r.rtz', undefined, Buffer.from(text))
    expect(back.waypoints.map(w => w.speedKn)).toEqual([undefined, 14.5, 11])
    expect(back.departureUtc).toBe('2027-01-10T08:00:00.000Z')
  })

  it('GPX 1.1: root attributes the schema requires and escaped text', () => {
    const text = writeRouteGpx({ title: 'T' }, awkward)
    expect(text).toContain('<gpx version="1.1" creator="Passagewright" xmlns="http://www.topografix.com/GPX/1/1"')
    expect(text).toContain('<name>Start &amp; "quoted" &lt;pier&gt;</name>')
  })

  it('CSV: a name that starts like a formula is written with a leading apostrophe', () => {
    const text = writeRouteCsv({}, awkward)
    expect(text.split('\r\n')[0]).toBe('name,latitude,longitude,method,speed_kn,xte_nm,turn_radius_nm,notes')
    expect(text).toContain('\'=SUM(A1),51.0166667,1.4,rhumb,12.5,0.5,0.8,')
    expect(text).toContain(',\'-5 kn current')
  })
})
