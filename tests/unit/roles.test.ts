import { describe, expect, it } from 'vitest'
import type { Role } from '../../shared/types/auth'
import {
  canAdminister, canBuildTables, canEditFuel, canEditPlaces, canEditPlan, canSendBrief, canSignPlan, hasRole,
} from '../../shared/utils/roles'

// Expected abilities written out from the product brief's roles table (product.md, "People and
// roles"), not read from the module: planner and master edit plans, only a master signs, the shore
// desk (shore, admin) keeps places, fuel data and distance tables, only an admin administers.
const expected: Record<string, [(u: { role: Role }) => boolean, Role[]]> = {
  canEditPlan: [canEditPlan, ['planner', 'master']],
  canSignPlan: [canSignPlan, ['master']],
  canSendBrief: [canSendBrief, ['planner', 'master', 'shore']],
  canEditPlaces: [canEditPlaces, ['shore', 'admin']],
  canEditFuel: [canEditFuel, ['shore', 'admin']],
  canBuildTables: [canBuildTables, ['shore', 'admin']],
  canAdminister: [canAdminister, ['admin']],
}
const everyone: Role[] = ['planner', 'master', 'shore', 'admin']

describe('abilities by role', () => {
  for (const [name, [ability, allowed]] of Object.entries(expected)) {
    it(`${name}: ${allowed.join(', ')} and no one else`, () => {
      expect(everyone.filter(role => ability({ role }))).toEqual(allowed)
    })
  }

  it('a signed-out visitor may do nothing', () => {
    expect(hasRole(null, everyone)).toBe(false)
    expect(canEditPlan(undefined)).toBe(false)
  })
})
