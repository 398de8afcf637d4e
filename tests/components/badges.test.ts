// The plan and crew-brief state badges: each state reads by a mark and its word, not by colour alone.
import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import BoardStatusBadge from '~/components/board/BoardStatusBadge.vue'
import OutboxStateBadge from '~/components/outbox/OutboxStateBadge.vue'

describe('BoardStatusBadge', () => {
  it.each([['draft', '○'], ['submitted', '◐'], ['approved', '●'], ['returned', '↩']])('%s shows its own mark and word', async (status, mark) => {
    const badge = await mountSuspended(BoardStatusBadge, { props: { status } })
    expect(badge.text()).toBe(`${mark}${status}`)
    expect(badge.attributes('data-status')).toBe(status)
    expect(badge.find('[aria-hidden="true"]').text()).toBe(mark)
  })

  it('gives the four states four different marks', async () => {
    const marks = await Promise.all(['draft', 'submitted', 'approved', 'returned'].map(async status =>
      (await mountSuspended(BoardStatusBadge, { props: { status } })).find('[aria-hidden="true"]').text()))
    expect(new Set(marks).size).toBe(4)
  })
})

describe('OutboxStateBadge', () => {
  it.each([['queued', '…'], ['sending', '➚'], ['sent', '✓'], ['failed', '!']] as const)('%s shows its own mark and word', async (state, mark) => {
    const badge = await mountSuspended(OutboxStateBadge, { props: { state } })
    expect(badge.text()).toBe(`${mark}${state}`)
    expect(badge.attributes('data-state')).toBe(state)
  })
})
