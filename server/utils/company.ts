import type { SessionUser } from '#shared/types/auth'
import { companySettingsSchema, type CompanySettings } from '#shared/types/company'

const DEFAULTS: CompanySettings = { reserve: { kind: 'percent', value: 10 }, helmDelayS: 10 }

/** The company's settings; anything missing or unreadable in the stored JSON falls back to the defaults. */
export async function getCompanySettings(companyId: number): Promise<CompanySettings> {
  const row = await useDb()('companies').where({ id: companyId }).first('settings')
  const stored = { ...DEFAULTS, ...(row?.settings ?? {}) }
  const parsed = companySettingsSchema.safeParse(stored)
  return parsed.success ? parsed.data : DEFAULTS
}

export async function updateCompanySettings(user: SessionUser, settings: CompanySettings) {
  await useDb()('companies').where({ id: user.companyId })
    .update({ settings: useDb().raw('settings || ?::jsonb', [JSON.stringify(settings)]) })
  return getCompanySettings(user.companyId)
}
