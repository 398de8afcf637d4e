// The crew brief composer on its own: approval stated prominently, local times, escaping.
import { describe, expect, it } from 'vitest'
import { composeCrewBrief } from '../../server/utils/crewBrief'
import { computeLegTable } from '#shared/utils/legTable'
import { ALL_CAUTIONS } from '#shared/utils/cautions'

const waypoints = [
  { name: 'Off <Harbour> & Co', lat: 35.0, lon: 139.9, method: 'rhumb' as const, speedKn: null, xteNm: null, turnRadiusNm: null, notes: null },
  { name: 'Mid-ocean', lat: 40.0, lon: 170.0, method: 'geodesic' as const, speedKn: null, xteNm: null, turnRadiusNm: null, notes: null },
  { name: 'Landfall', lat: 48.5, lon: -124.8, method: 'geodesic' as const, speedKn: null, xteNm: null, turnRadiusNm: null, notes: null },
]
const vessel = { name: 'Test Kittiwake', imoNumber: '9381201', callSign: 'T3ST' }

function view(status: 'draft' | 'approved') {
  const plan = {
    id: 7, title: 'Invented <b>crossing</b>', vesselId: 1, vesselName: vessel.name, status, revision: 2, version: 5,
    departureUtc: '2026-12-10T02:00:00.000Z', speedKn: 14, limitLat: null, totalNm: null, arrivalUtc: null, updatedAt: '2026-12-01T00:00:00.000Z',
    companyId: 1, departurePlaceId: 1, arrivalPlaceId: 2, departureTimeZone: 'Asia/Tokyo', arrivalTimeZone: 'America/Vancouver', revisionOfPlanId: 6,
    approvedByName: status === 'approved' ? 'Capt. Invented Person' : null, approvedAt: status === 'approved' ? '2026-12-08T09:15:00.000Z' : null,
    createdByName: 'Planner', masterUserId: 3,
  }
  const { legs, totals } = computeLegTable(waypoints, plan.departureUtc, plan.speedKn)
  return { plan, waypoints, legs, totals, events: [] } as any
}

describe('crew brief', () => {
  it('says NOT YET APPROVED in the subject, the text and the HTML of a plan the master has not approved', () => {
    const brief = composeCrewBrief(view('draft'), vessel)
    expect(brief.subject).toMatch(/NOT YET APPROVED/)
    expect(brief.text.split('\n')[0]).toMatch(/NOT YET APPROVED: this plan is draft/)
    expect(brief.html).toMatch(/NOT YET APPROVED/)
  })

  it('names the approving master and time, the legs, totals, local times and every caution', () => {
    const v = view('approved')
    const brief = composeCrewBrief(v, vessel)
    expect(brief.subject).toMatch(/approved$/)
    expect(brief.text).toContain('APPROVED by Capt. Invented Person on 2026-12-08 09:15Z (revision 2)')
    expect(brief.text).toContain('2026-12-10 02:00Z; 2026-12-10 11:00 port time (Asia/Tokyo)')
    expect(brief.text).toMatch(/\d,\d{3}\.\d nm in 2 legs/) // grouped, one decimal, as on screen
    expect(brief.text).toContain('America/Vancouver')
    for (const c of ALL_CAUTIONS) expect(brief.text).toContain(c)
    expect(brief.text.match(/^[12] {2,}/gm)).toHaveLength(2)
  })

  it('escapes plan and waypoint names in the HTML', () => {
    const { html, text } = composeCrewBrief(view('draft'), vessel)
    expect(html).not.toContain('<b>crossing</b>')
    expect(html).toContain('Invented &lt;b&gt;crossing&lt;/b&gt;')
    expect(html).toContain('Off &lt;Harbour&gt; &amp; Co')
    expect(text).toContain('Off <Harbour> & Co')
  })
})
