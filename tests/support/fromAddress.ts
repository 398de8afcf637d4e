// Requests from another loopback address (Linux answers all of 127.0.0.0/8), so a test that runs
// up the sign-in counts of "its" client address leaves 127.0.0.1, which every other file signs in
// from, as it was: the counts live in the shared database.
import { request } from 'node:http'

export interface AddressedAnswer { status: number, headers: Record<string, string | string[] | undefined>, body: any }

export function postJsonFrom(localAddress: string, target: string, body: unknown): Promise<AddressedAnswer> {
  return new Promise((resolve, reject) => {
    const u = new URL(target)
    const text = JSON.stringify(body)
    const req = request({ host: u.hostname, port: u.port, path: `${u.pathname}${u.search}`, method: 'POST', localAddress, headers: { 'content-type': 'application/json', 'content-length': Buffer.byteLength(text) } }, (res) => {
      const parts: Buffer[] = []
      res.on('data', (c: Buffer) => parts.push(c))
      res.on('end', () => {
        const raw = Buffer.concat(parts).toString('utf8')
        let parsed: any = raw
        try { parsed = JSON.parse(raw) }
        catch {}
        resolve({ status: res.statusCode ?? 0, headers: res.headers, body: parsed })
      })
    })
    req.on('error', reject)
    req.end(text)
  })
}
