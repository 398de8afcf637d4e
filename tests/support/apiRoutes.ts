// The API routes as Nitro sees them, read from the server/api tree (file-based routing), so a
// new route file shows up in the access and fuzz tests without anyone remembering to add it.
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { rootDir } from './server'

export interface ApiRoute { method: string, pattern: string, key: string }

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = join(dir, name)
    return statSync(full).isDirectory() ? walk(full) : [full]
  })
}

export function listApiRoutes(): ApiRoute[] {
  const apiDir = join(rootDir, 'server/api')
  return walk(apiDir).filter(f => f.endsWith('.ts')).map((file) => {
    const rel = relative(apiDir, file).replace(/\.ts$/, '')
    const match = rel.match(/^(.*?)(?:\.(get|post|put|patch|delete))$/)
    const method = (match?.[2] ?? 'get').toUpperCase()
    const pattern = `/api/${(match?.[1] ?? rel).replace(/(^|\/)index$/, '').replace(/\[(\w+)\]/g, ':$1')}`.replace(/\/$/, '')
    return { method, pattern, key: `${method} ${pattern}` }
  }).sort((a, b) => a.key.localeCompare(b.key))
}

/** Fills each `:param` with its id: one id for all, or one per parameter name. */
export function routePath(route: ApiRoute, ids: number | string | Record<string, number>) {
  return route.pattern.replace(/:(\w+)/g, (_m, name: string) => String(typeof ids === 'object' ? ids[name] : ids))
}
