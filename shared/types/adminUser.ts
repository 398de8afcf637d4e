import { z } from 'zod'
import { roleSchema } from './auth'
import { emailSchema } from './fields'

/** A new user of the company, created by its admin. */
export const userCreateSchema = z.object({
  name: z.string({ error: 'name is required' }).trim().min(1, 'name is required').max(120, 'name is at most 120 characters'),
  email: emailSchema,
  role: z.enum(roleSchema.options, { error: 'role must be planner, master, shore or admin' }),
  password: z.string({ error: 'password is required' }).min(10, 'password must be at least 10 characters').max(200, 'password is at most 200 characters'),
})
export type UserCreateInput = z.infer<typeof userCreateSchema>

export interface CompanyUser { id: number, name: string, email: string, role: z.infer<typeof roleSchema>, createdAt: string }
