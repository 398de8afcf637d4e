// The page the sign-in form goes to afterwards: only paths of this site (an open redirect would
// send a signed-in user to someone else's page). Browsers read `//host` and `/\host` as other
// hosts (WHATWG URL Standard, "special authority slashes" state: a backslash counts as a slash
// in http(s) URLs).
import { describe, expect, it } from 'vitest'
import { signInNext } from '../../shared/utils/signInNext'

describe('signInNext', () => {
  it.each(['/plans/12', '/plans/12?tab=legs#leg-3', '/places'])('keeps the path %s', (next) => {
    expect(signInNext(next)).toBe(next)
  })

  it.each([
    ['//evil.example/plans', 'protocol-relative URL'], ['/\\evil.example', 'backslash after the slash'], ['https://evil.example/', 'absolute URL'],
    ['javascript:alert(1)', 'script URL'], ['plans/12', 'not a path'], ['/\u0009/evil.example', 'control character'], ['/login', 'the sign-in page itself'],
    [undefined, 'missing'], [['/a', '/b'], 'given twice'],
  ])('goes to the board for %j (%s)', (next: unknown, _why: string) => {
    expect(signInNext(next)).toBe('/')
  })
})
