// One typed cell of the waypoint sheet, and a row of them, mounted in a Nuxt environment with the
// draft store. Positions as navigators write them (domain.md); 47.5′ = 47.5/60° by definition.
import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import PlanCell from '~/components/plan/PlanCell.vue'
import PlanWaypointRow from '~/components/plan/PlanWaypointRow.vue'
import { usePlanDraftStore } from '~/stores/planDraft'

const parseKnots = (text: string) => (/^\d+(\.\d+)?$/.test(text.trim()) ? { value: Number(text) } : { error: 'must be a number' })

describe('PlanCell', () => {
  it('reads typed text on Enter and hands the value on', async () => {
    const cell = await mountSuspended(PlanCell, { props: { shown: '12', parse: parseKnots, label: 'Leg speed (kn)' } })
    await cell.find('input').setValue('14.5')
    await cell.find('input').trigger('keydown', { key: 'Enter' })
    expect(cell.emitted('commit')).toEqual([[14.5]])
    expect(cell.find('[data-testid="cell-error"]').exists()).toBe(false)
  })

  it('keeps text it cannot read, says why, and holds the draft back from saving', async () => {
    const store = usePlanDraftStore()
    const cell = await mountSuspended(PlanCell, { props: { shown: '12', parse: parseKnots, label: 'Leg speed (kn)' } })
    await cell.find('input').setValue('fast')
    await cell.find('input').trigger('blur')
    expect(cell.emitted('commit')).toBeUndefined()
    expect((cell.find('input').element as HTMLInputElement).value).toBe('fast')
    expect(cell.find('[data-testid="cell-error"]').text()).toBe('must be a number')
    expect(cell.find('input').attributes('aria-invalid')).toBe('true')
    expect(store.hasCellErrors).toBe(true)
    await cell.find('input').trigger('keydown', { key: 'Escape' })
    expect((cell.find('input').element as HTMLInputElement).value).toBe('12')
    expect(store.hasCellErrors).toBe(false)
  })

  it('commits nothing when read-only', async () => {
    const cell = await mountSuspended(PlanCell, { props: { shown: '12', parse: parseKnots, label: 'Leg speed (kn)', readonly: true } })
    await cell.find('input').setValue('15')
    await cell.find('input').trigger('blur')
    expect(cell.emitted('commit')).toBeUndefined()
  })
})

describe('PlanWaypointRow', () => {
  const waypoint = (name: string, lat: number, lon: number) => ({ name, lat, lon, method: 'rhumb' as const, speedKn: null, xteNm: null, turnRadiusNm: null, notes: null })

  it('moves the waypoint in the draft when a position is typed the way navigators write it', async () => {
    const store = usePlanDraftStore()
    store.waypoints = [waypoint('Off Golden Gate', 37.5, -122.8), waypoint('Farallones', 37.7, -123)]
    const row = await mountSuspended(PlanWaypointRow, { props: { index: 1, waypoint: store.waypoints[1]!, count: 2 } })
    const position = row.find('[data-cell="position"] input')
    await position.setValue('37 47.5N 122 28W')
    await position.trigger('keydown', { key: 'Enter' })
    expect(store.waypoints[1]!.lat).toBeCloseTo(37 + 47.5 / 60, 9)
    expect(store.waypoints[1]!.lon).toBeCloseTo(-(122 + 28 / 60), 9)
    expect(store.undoStack.at(-1)?.label).toBe('edit waypoint')
  })

  it('offers no moving or deleting to someone who may not edit', async () => {
    const store = usePlanDraftStore()
    store.waypoints = [waypoint('A', 1, 1), waypoint('B', 2, 2)]
    store.roleMayEdit = false
    const row = await mountSuspended(PlanWaypointRow, { props: { index: 0, waypoint: store.waypoints[0]!, count: 2 } })
    expect(row.find('[aria-label="Delete waypoint"]').exists()).toBe(false)
    expect(row.find('[data-cell="position"] input').attributes('readonly')).toBeDefined()
    store.roleMayEdit = true
  })
})
