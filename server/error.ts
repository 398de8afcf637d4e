import type { NitroErrorHandler } from 'nitropack'

// h3's default reason phrases; when one of these is all we have, the error's own message says more.
const GENERIC_REASONS = new Set(['Bad Request', 'Validation Error', 'Unsupported Media Type', 'Payload Too Large', 'Not Found', 'Method Not Allowed'])

interface Issue { path?: PropertyKey[], message: string }

function issueText(issues: Issue[]) {
  return issues.slice(0, 5).map(i => (i.path?.length ? `${i.path.join('.')}: ${i.message}` : i.message)).join('; ')
}

/**
 * API errors as JSON with a message a person can act on: validation issues name their field,
 * an unreachable database answers 503. Pages fall through to Nuxt's own error page.
 */
const apiErrorHandler: NitroErrorHandler = (error, event) => {
  if (!event.path.startsWith('/api/')) return
  const anyError = error as any
  let statusCode: number = anyError.statusCode || 500
  let message: string = anyError.statusMessage || (statusCode < 500 && anyError.message) || 'Server error'
  const issues: Issue[] | undefined = anyError.data?.issues ?? anyError.cause?.issues
  const conflict = statusCode >= 500 ? databaseConflict(error) : null
  if (statusCode === 400 && Array.isArray(issues)) message = issueText(issues)
  else if (conflict) ({ statusCode, message } = conflict)
  else if (isDatabaseUnavailable(error)) { statusCode = 503; message = 'The database is not reachable at the moment; try again shortly' }
  else if (statusCode >= 500) {
    console.error(`[api error] ${event.method} ${event.path}`, error)
    message = 'Server error'
  }
  else if (GENERIC_REASONS.has(message) && anyError.message && !anyError.unhandled) message = anyError.message
  setResponseStatus(event, statusCode)
  setResponseHeader(event, 'content-type', 'application/json')
  if (statusCode === 503) setResponseHeader(event, 'retry-after', 5)
  if (statusCode === 429 && Number.isFinite(anyError.data?.retryAfterS)) setResponseHeader(event, 'retry-after', anyError.data.retryAfterS)
  const data = statusCode < 500 ? (Array.isArray(issues) ? { issues: issues.map(i => ({ path: i.path, message: i.message })) } : anyError.data) : undefined
  return send(event, JSON.stringify({ statusCode, statusMessage: message, message, data }))
}

export default apiErrorHandler
