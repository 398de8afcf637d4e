// Raw HTTP for tests of what a request carries: chunked bodies that keep coming until the server
// answers, and the server process's memory.
import { request } from 'node:http'
import { readFileSync } from 'node:fs'

export interface StreamedAnswer { status: number, body: string, sentBytes: number }

/**
 * Sends `chunk` again and again with chunked framing (no Content-Length) until the server answers
 * or `maxBytes` have gone out, then ends the body. Tells how much was sent before the answer came.
 */
export function streamUntilAnswered(target: string, headers: Record<string, string>, chunk: Buffer, maxBytes: number, head?: Buffer): Promise<StreamedAnswer> {
  return new Promise((resolve, reject) => {
    const u = new URL(target)
    let sent = 0
    let answered = false
    const req = request({ host: u.hostname, port: u.port, path: `${u.pathname}${u.search}`, method: 'POST', headers: { ...headers, 'transfer-encoding': 'chunked' } }, (res) => {
      answered = true
      const parts: Buffer[] = []
      res.on('data', (c: Buffer) => parts.push(c))
      res.on('end', () => {
        resolve({ status: res.statusCode ?? 0, body: Buffer.concat(parts).toString('utf8'), sentBytes: sent })
        req.destroy()
      })
    })
    req.on('error', (error) => { if (!answered) reject(error) })
    if (head) { sent += head.length; req.write(head) }
    const pump = () => {
      while (!answered && sent < maxBytes) {
        sent += chunk.length
        if (!req.write(chunk)) return void req.once('drain', pump)
      }
      if (!answered) req.end()
    }
    pump()
  })
}

/** Resident memory of a process, in MB (Linux /proc). */
export function residentMb(pid: number): number {
  const line = readFileSync(`/proc/${pid}/status`, 'utf8').split('\n').find(l => l.startsWith('VmRSS:'))!
  return Number(line.replace(/\D+/g, '')) / 1024
}
