import { z } from 'zod'
import { REMARKS_MAX } from '../utils/signoffRules'
import { versionSchema } from './fields'

const remarksField = z.string({ error: 'remarks are required' }).trim()
  .min(1, 'remarks are required').max(REMARKS_MAX, `remarks are at most ${REMARKS_MAX} characters`)
  // PostgreSQL text cannot hold NUL, and no other control character belongs in a remark (tabs and line breaks do).
  .refine(s => !/[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/.test(s), 'remarks may not contain control characters')

/** Optional `version`: when the caller sends the version it looked at, a plan changed since then is refused (409). */
const versionField = versionSchema.optional()

export const signoffStepSchema = z.object({ version: versionField }).optional()
export type SignoffStepInput = z.infer<typeof signoffStepSchema>

export const returnPlanSchema = z.object({ remarks: remarksField, version: versionField })
export type ReturnPlanInput = z.infer<typeof returnPlanSchema>

export const remarkSchema = z.object({ remarks: remarksField })
export type RemarkInput = z.infer<typeof remarkSchema>
