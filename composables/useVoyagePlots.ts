import type { Voyage } from '#shared/types/voyage'

export interface PlotSeries { label: string, points: { t: number, v: number }[], tone: 'plan' | 'actual', dots?: boolean }
export interface PlotBand { label: string, points: { t: number, lo: number, hi: number }[] }

/** The voyage's two plots: cross-track against time (with each report's corridor), and distance along the plan against time, planned and made. */
export function useVoyagePlots(voyage: MaybeRefOrGetter<Voyage>) {
  const range = computed(() => {
    const v = toValue(voyage)
    const t0 = Date.parse(v.departureUtc)
    const lastReport = v.reports.at(-1)
    return { t0, t1: Math.max(Date.parse(v.plannedArrivalUtc), lastReport ? Date.parse(lastReport.timeUtc) : t0) }
  })
  const crossTrack = computed(() => {
    const v = toValue(voyage)
    const points = v.reports.map(r => ({ t: Date.parse(r.timeUtc), v: r.crossTrackNm }))
    const band: PlotBand = { label: 'corridor', points: v.reports.map(r => ({ t: Date.parse(r.timeUtc), lo: -r.xteLimitNm, hi: r.xteLimitNm })) }
    return { series: [{ label: 'reported (+ starboard)', points, tone: 'actual', dots: true }] as PlotSeries[], bands: band.points.length > 1 ? [band] : [] }
  })
  const distance = computed(() => {
    const v = toValue(voyage)
    const planned = [{ t: Date.parse(v.departureUtc), v: 0 }, ...v.legs.map(l => ({ t: Date.parse(l.etaUtc), v: l.cumulativeNm }))]
    const made = [{ t: Date.parse(v.departureUtc), v: 0 }, ...v.reports.map(r => ({ t: Date.parse(r.timeUtc), v: r.alongTrackNm }))]
    return [{ label: 'planned', points: planned, tone: 'plan' }, { label: 'made good', points: made, tone: 'actual', dots: true }] as PlotSeries[]
  })
  return { range, crossTrack, distance }
}
