/**
 * Where the sign-in page goes once signed in: the `next` page it was sent from when that is a path
 * of this site, else the board. `//host` and `/\host` are other sites to a browser, so they are not taken.
 */
export function signInNext(next: unknown): string {
  if (typeof next !== 'string' || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return '/'
  if (/[\u0000-\u001f]/.test(next) || next === '/login' || next.startsWith('/login?')) return '/'
  return next
}
