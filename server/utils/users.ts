import type { SessionUser } from '#shared/types/auth'

interface UserRow { id: number, email: string, name: string, role: SessionUser['role'], company_id: number, company_name: string, password_hash: string }

export async function findUserForLogin(email: string) {
  return useDb()('users')
    .join('companies', 'companies.id', 'users.company_id')
    .where('users.email', email)
    .first<UserRow | undefined>('users.id', 'users.email', 'users.name', 'users.role', 'users.company_id', 'companies.name as company_name', 'users.password_hash')
}

export function toSessionUser(row: UserRow): SessionUser {
  return { id: row.id, email: row.email, name: row.name, role: row.role, companyId: row.company_id, companyName: row.company_name }
}
