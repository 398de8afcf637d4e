import { describe, expect, it } from 'vitest'
import { allowedPlanActions } from '#shared/utils/signoffRules'

const MASTER_ID = 3
const plan = (status: 'draft' | 'submitted' | 'approved' | 'returned') => ({ status, masterUserId: MASTER_ID })

describe('actions the workspace offers', () => {
  it.each([
    ['planner', 1, 'draft', ['submit', 'remark']],
    ['planner', 1, 'submitted', ['remark']],
    ['planner', 1, 'approved', ['revise', 'brief', 'remark']],
    ['planner', 1, 'returned', ['submit', 'remark']],
    ['master', MASTER_ID, 'submitted', ['approve', 'return', 'remark']],
    ['master', 4, 'submitted', ['remark']],
    ['master', MASTER_ID, 'approved', ['revise', 'brief', 'remark']],
    ['shore', 5, 'submitted', ['remark']],
    ['shore', 5, 'approved', ['brief', 'remark']],
    ['admin', 6, 'draft', ['remark']],
    ['admin', 6, 'approved', ['remark']],
  ] as const)('%s (user %i) on a %s plan: %j', (role, id, status, expected) => {
    expect(allowedPlanActions(plan(status), { id, role })).toEqual(expected)
  })

  it('offers no sign-off to a master when the vessel has none assigned', () => {
    expect(allowedPlanActions({ status: 'submitted', masterUserId: null }, { id: MASTER_ID, role: 'master' })).toEqual(['remark'])
  })
})
