import type { SessionUser } from '#shared/types/auth'
import type { CompanyUser, UserCreateInput } from '#shared/types/adminUser'

export async function listCompanyUsers(user: SessionUser): Promise<CompanyUser[]> {
  const rows = await useDb()('users').where({ company_id: user.companyId }).orderBy(['role', 'name'])
    .select('id', 'name', 'email', 'role', 'created_at as createdAt')
  return rows.map(r => ({ ...r, createdAt: new Date(r.createdAt).toISOString() }))
}

/** A new user in the admin's company; the password is stored only as a scrypt hash. */
export async function createCompanyUser(user: SessionUser, input: UserCreateInput): Promise<CompanyUser> {
  const db = useDb()
  if (await db('users').where({ email: input.email }).first('id'))
    throw createError({ statusCode: 409, statusMessage: 'email: a user with this address already exists' })
  const [row] = await db('users').insert({
    company_id: user.companyId, name: input.name, email: input.email, role: input.role, password_hash: await hashPassword(input.password),
  }).returning(['id', 'name', 'email', 'role', 'created_at as createdAt'])
  return { ...row, createdAt: new Date(row.createdAt).toISOString() }
}
