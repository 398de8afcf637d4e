// Track log import (POST /api/plans/:id/reports/import): a preview that writes nothing, then the
// same reading made into one position report per interval and the track kept for the chart, in one
// transaction with the reports.
import type { SessionUser } from '#shared/types/auth'
import type { TrackImportResult } from '#shared/types/voyage'
import { readTrackLog, sampleFixes, TrackLogError } from '#shared/utils/monitoring/trackLog'

export const DEFAULT_INTERVAL_MIN = 60
/** Reported speeds beyond what a report stores (numeric(5,2), 0–60 kn) are left out rather than refused. */
const MAX_REPORT_SPEED_KN = 60

export interface TrackImportOptions { mode: 'preview' | 'create', intervalMin?: number, skipProblems?: 'true' | 'false' }

export async function importTrackLog(user: SessionUser, planId: number, text: string, options: TrackImportOptions): Promise<TrackImportResult> {
  const { plan, latestMs } = await assertCanReport(user, planId)
  let log
  try { log = readTrackLog(text) }
  catch (e) {
    if (e instanceof TrackLogError) throw createError({ statusCode: 400, statusMessage: `file: ${e.message}` })
    throw e
  }
  const intervalMin = options.intervalMin ?? DEFAULT_INTERVAL_MIN
  const departure = Date.parse(plan.departureUtc)
  const sampled = sampleFixes(log.fixes, intervalMin)
  const usable = sampled.filter(f => f.t >= departure && (latestMs === null || f.t > latestMs) && f.t <= Date.now())
  const reports = usable.map(f => ({ line: f.line, timeUtc: f.timeUtc, lat: f.lat, lon: f.lon, speedKn: f.speedKn != null && f.speedKn <= MAX_REPORT_SPEED_KN ? Math.round(f.speedKn * 100) / 100 : null }))
  const result: TrackImportResult = {
    mode: options.mode, format: log.format, lineCount: log.lineCount, fixCount: log.fixes.length, problems: log.problems, problemCount: log.problemCount,
    ignoredSentences: log.ignoredSentences, firstUtc: log.fixes[0]?.timeUtc ?? null, lastUtc: log.fixes.at(-1)?.timeUtc ?? null, intervalMin,
    reports, leftOut: sampled.length - usable.length, created: 0,
  }
  if (options.mode === 'preview') return result
  if (log.problemCount > 0 && options.skipProblems !== 'true')
    throw createError({ statusCode: 400, statusMessage: `file: ${log.problemCount} line(s) cannot be used (${log.problems[0]}); correct them, or import with skipProblems=true to leave them out`, data: result })
  if (!reports.length)
    throw createError({ statusCode: 400, statusMessage: 'file: no fix in the log falls after the departure and the latest report, up to now; nothing to import' })
  const points = log.fixes.filter(f => f.t >= departure).map(f => [f.t, f.lat, f.lon])
  await addReports(user, planId, reports.map(r => ({ ...r, fuelRobT: null, remarks: `Imported track log (${log.format.toUpperCase()}), line ${r.line}`, source: 'import' as const })), async (trx) => {
    await trx('voyage_tracks').insert({
      plan_id: planId, format: log.format, point_count: points.length, first_utc: new Date(points[0]![0]!), last_utc: new Date(points.at(-1)![0]!),
      points_json: JSON.stringify(points), created_by: user.id, created_by_name: user.name,
    })
  })
  return { ...result, created: reports.length }
}
