import { describe, expect, it } from 'vitest'
import { MAX_TRACK_LINES, parseLogTime, readTrackLog, sampleFixes, thinTrack, TrackLogError } from '../../shared/utils/monitoring/trackLog'

// The sample RMC and GGA sentences published with the NMEA 0183 descriptions (gpsd's "NMEA Revealed";
// quoted from memory): 12:35:19 UTC on 23 March 1994 at 48°07.038′N 011°31.000′E, 22.4 kn.
const RMC = '$GPRMC,123519,A,4807.038,N,01131.000,E,022.4,084.4,230394,003.1,W*6A'
const GGA = '$GPGGA,123519,4807.038,N,01131.000,E,1,08,0.9,545.4,M,46.9,M,,*47'

/** NMEA 0183 checksum: XOR of the characters between $ and * (IEC 61162-1), as two hex digits. */
function withChecksum(body: string) {
  let x = 0
  for (const ch of body) x ^= ch.charCodeAt(0)
  return `$${body}*${x.toString(16).toUpperCase().padStart(2, '0')}`
}
/** An RMC sentence for a time and position (degrees and decimal minutes, as the standard writes them). */
function rmc(date: Date, lat: number, lon: number, status = 'A') {
  const hh = (n: number, w = 2) => String(n).padStart(w, '0')
  const time = `${hh(date.getUTCHours())}${hh(date.getUTCMinutes())}${hh(date.getUTCSeconds())}`
  const day = `${hh(date.getUTCDate())}${hh(date.getUTCMonth() + 1)}${hh(date.getUTCFullYear() % 100)}`
  const dm = (v: number, w: number) => `${hh(Math.floor(Math.abs(v)), w)}${(Math.abs(v) % 1 * 60).toFixed(4).padStart(7, '0')}`
  return withChecksum(`GPRMC,${time},${status},${dm(lat, 2)},${lat < 0 ? 'S' : 'N'},${dm(lon, 3)},${lon < 0 ? 'W' : 'E'},14.5,090.0,${day},,`)
}

describe('NMEA 0183 track logs', () => {
  it('reads the published RMC sample: time, position and speed', () => {
    const log = readTrackLog(`${RMC}\n`)
    expect(log.format).toBe('nmea')
    expect(log.problems).toEqual([])
    expect(log.fixes).toHaveLength(1)
    const [fix] = log.fixes
    expect(fix!.timeUtc).toBe('1994-03-23T12:35:19.000Z')
    expect(fix!.lat).toBeCloseTo(48 + 7.038 / 60, 9) // 48°07.038′N
    expect(fix!.lon).toBeCloseTo(11 + 31 / 60, 9) // 011°31.000′E
    expect(fix!.speedKn).toBe(22.4)
  })

  it('the GGA of the same second is the same fix; a GGA is dated by the RMC before it', () => {
    const log = readTrackLog([RMC, GGA, GGA.replace('123519', '123520').replace('*47', '*4D')].join('\r\n'))
    expect(log.problems).toEqual([])
    expect(log.fixes.map(f => f.timeUtc)).toEqual(['1994-03-23T12:35:19.000Z', '1994-03-23T12:35:20.000Z'])
  })

  it('reports a corrupt checksum, a missing checksum, a void fix and a line that is no sentence, by line number', () => {
    const t = new Date('2026-11-24T06:00:00Z')
    const good = rmc(t, -34.55, 18.45)
    const corrupt = good.replace('GPRMC,060000', 'GPRMC,060001') // one digit changed, checksum kept
    const lines = [good, corrupt, good.split('*')[0], rmc(new Date(t.getTime() + 60_000), -34.6, 18.5, 'V'), 'hello', '$GPGSV,3,1,11,03,03,111,00*74']
    const log = readTrackLog(lines.join('\n'))
    expect(log.fixes).toHaveLength(1)
    expect(log.problems).toEqual([
      'line 2: RMC checksum does not match the sentence',
      'line 3: RMC has no checksum',
      'line 4: RMC marks its fix as not valid (status V); left out',
      'line 5: not an NMEA sentence (expected $…*hh)',
    ])
    expect(log.ignoredSentences).toBe(1) // the GSV sentence
  })

  it('a log running backwards in time reports the line', () => {
    const t = Date.parse('2026-11-24T06:00:00Z')
    const log = readTrackLog([rmc(new Date(t), -34.55, 18.45), rmc(new Date(t + 120_000), -34.56, 18.46), rmc(new Date(t + 60_000), -34.57, 18.47)].join('\n'))
    expect(log.fixes).toHaveLength(2)
    expect(log.problems[0]).toMatch(/^line 3: time 2026-11-24T06:01:00.000Z is before line 2/)
  })

  it('refuses more than 50,000 lines', () => {
    const line = rmc(new Date('2026-11-24T06:00:00Z'), -34.55, 18.45)
    expect(() => readTrackLog(Array.from({ length: MAX_TRACK_LINES + 1 }, () => line).join('\n'))).toThrow(TrackLogError)
    expect(() => readTrackLog(Array.from({ length: MAX_TRACK_LINES }, () => line).join('\n'))).not.toThrow()
  })
})

describe('CSV track logs', () => {
  it('reads a header row in any order, navigators\' notation and decimal degrees, and reports bad lines', () => {
    const log = readTrackLog('lat,lon,time\n34°33.0′S,018°27.0′E,2026-11-24T06:00:00Z\n-34.6,18.5,2026-11-24 07:00\n-34.7,18.6,tomorrow\n95,18.6,2026-11-24T08:00:00Z\n')
    expect(log.format).toBe('csv')
    expect(log.fixes.map(f => [f.line, f.timeUtc, f.lat, f.lon])).toEqual([
      [2, '2026-11-24T06:00:00.000Z', -34.55, 18.45],
      [3, '2026-11-24T07:00:00.000Z', -34.6, 18.5],
    ])
    expect(log.problems).toHaveLength(2)
    expect(log.problems[0]).toMatch(/^line 4: time must be/)
    expect(log.problems[1]).toMatch(/^line 5: /)
  })

  it('reads a file without a header as time, lat, lon', () => {
    expect(readTrackLog('2026-11-24T06:00:00Z,-34.55,18.45\n').fixes).toHaveLength(1)
    expect(parseLogTime('2026-11-24T06:00:00+02:00')).toBe(Date.parse('2026-11-24T04:00:00Z'))
  })
})

describe('sampling', () => {
  it('keeps the first fix of each hour of the clock', () => {
    const start = Date.parse('2026-11-24T06:50:00Z')
    const fixes = Array.from({ length: 25 }, (_, i) => ({ line: i + 1, t: start + i * 10 * 60_000, timeUtc: new Date(start + i * 10 * 60_000).toISOString(), lat: 0, lon: 0, speedKn: null }))
    // 06:50 … 10:50 every 10 min: 06:50, 07:00, 08:00, 09:00, 10:00 (common practice: hourly reports on the hour)
    expect(sampleFixes(fixes, 60).map(f => f.timeUtc.slice(11, 16))).toEqual(['06:50', '07:00', '08:00', '09:00', '10:00'])
    expect(thinTrack(fixes, 3).map(f => f.line)).toEqual([1, 13, 25])
  })
})
