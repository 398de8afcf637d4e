import type { SessionUser } from './auth'

declare module '#auth-utils' {
  interface User extends SessionUser {}
}

export {}
