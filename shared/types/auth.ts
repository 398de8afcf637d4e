import { z } from 'zod'
import { emailSchema } from './fields'

export const roles = ['planner', 'master', 'shore', 'admin'] as const
export const roleSchema = z.enum(roles)
export type Role = z.infer<typeof roleSchema>

export const loginSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'password is required' }).min(1, 'password is required').max(200),
})
export type LoginInput = z.infer<typeof loginSchema>

export interface SessionUser {
  id: number
  email: string
  name: string
  role: Role
  companyId: number
  companyName: string
}
